// Two people edit the same field at once: the one whose typing (or value just set) a colleague's change
// replaces is told so, with the colleague's name; their own changes and other fields raise no notice.
import { describe, expect, it } from 'vitest';
import { effectScope, nextTick, ref } from 'vue';
import { nodeDataSchemas } from '@shared/schema/stack.ts';
import { NODE_FIELDS } from '@/utils/nodeFields.ts';
import { useFieldDraft } from '@/composables/useFieldDraft.ts';

const base = { elevation: 4, axes: 'both', fixity: 'pinned', Gk: 100, Qk: 40, category: 'B' };

function form() {
  const value = ref<Record<string, unknown>>({ ...base });
  const changedBy = ref<string | null>(null);
  const notices: string[] = [];
  const sent: Record<string, unknown>[] = [];
  const scope = effectScope();
  const draft = scope.run(() =>
    useFieldDraft({
      value: () => value.value,
      schema: nodeDataSchemas.restraint,
      fields: NODE_FIELDS.restraint,
      onValid: (d) => sent.push(d),
      changedBy: () => changedBy.value,
      onOverwritten: (m) => notices.push(m),
    }),
  )!;
  return { value, changedBy, notices, sent, draft, scope };
}

describe('a field a colleague changed while it was being edited', () => {
  it('tells the person typing, naming the colleague and the value now stored', async () => {
    const f = form();
    f.draft.draft.Gk = '150';
    f.changedBy.value = 'Ana Example';
    f.value.value = { ...base, Gk: 120 };
    await nextTick();
    expect(f.notices).toHaveLength(1);
    expect(f.notices[0]).toMatch(
      /^Ana Example changed Permanent load Gk to 120(\.0+)? while you were editing it; what you typed \(150\) was replaced$/,
    );
    f.scope.stop();
  });

  it('tells the person whose value, just set, a colleague then replaced', async () => {
    const f = form();
    expect(f.draft.commit('Qk', '55')).toBe(true);
    f.value.value = { ...base, Qk: 55 }; // one's own edit comes back
    await nextTick();
    f.changedBy.value = 'Ben Sample';
    f.value.value = { ...base, Qk: 60 };
    await nextTick();
    expect(f.notices).toEqual([
      expect.stringMatching(
        /^Ben Sample changed Imposed load Qk to 60(\.0+)? while you were editing it; your 55(\.0+)? was replaced$/,
      ),
    ]);
    f.scope.stop();
  });

  it('says nothing for one’s own change, or for a colleague changing a field nobody was editing', async () => {
    const f = form();
    f.value.value = { ...base, Gk: 130 }; // own change (no colleague named)
    await nextTick();
    f.changedBy.value = 'Ana Example';
    f.value.value = { ...base, Gk: 130, Qk: 45 }; // a colleague, on a field this person was not editing
    await nextTick();
    expect(f.notices).toEqual([]);
    f.scope.stop();
  });
});
