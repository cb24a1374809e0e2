// The face reactions of a restraint (simple construction) and the combined column of the results table.
import { afterEach, describe, expect, it } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import RestraintFacesForm from '@/components/stack/RestraintFacesForm.vue';
import { liftRows } from '@/components/stack/liftRows.ts';
import { analyseStack } from '@shared/engine/stack/analyseStack.ts';
import type { StackDocument } from '@shared/schema/stack.ts';

const restraint = { elevation: 4, axes: 'both', fixity: 'pinned', Gk: 100, Qk: 40, category: 'B' };

async function typeInto(w: ReturnType<typeof mount>, field: string, text: string) {
  const input = w.find(`input[data-field="${field}"]`);
  await input.setValue(text);
  await input.trigger('change');
  await flushPromises();
}

afterEach(() => {
  document.body.innerHTML = '';
});

describe('restraint face reactions form', () => {
  it('sends the faces that have a value, an empty partner field counting as 0 kN', async () => {
    const w = mount(RestraintFacesForm, { props: { value: restraint, readOnly: false } });
    await typeInto(w, 'faces.yPlus.Gk', '60');
    expect(w.emitted('change')).toEqual([[{ faces: { yPlus: { Gk: 60, Qk: 0 } } }]]);
  });

  it('refuses a negative reaction and sends nothing', async () => {
    const w = mount(RestraintFacesForm, { props: { value: restraint, readOnly: false } });
    await typeInto(w, 'faces.zMinus.Qk', '-3');
    expect(w.text()).toContain('Reactions must not be negative');
    expect(w.emitted('change')).toBeUndefined();
  });

  it('shows a viewer only the faces that carry a reaction, without advice on filling them in', () => {
    const w = mount(RestraintFacesForm, { props: { value: { ...restraint, faces: { zPlus: { Gk: 30, Qk: 20 } } }, readOnly: true } });
    expect(w.findAll('input').map((i) => i.attributes('data-field'))).toEqual(['faces.zPlus.Gk', 'faces.zPlus.Qk']);
    expect(w.find('[data-test="faces-caption"]').text()).not.toContain('Leave a face empty');
    const none = mount(RestraintFacesForm, { props: { value: restraint, readOnly: true } });
    expect(none.findAll('input')).toHaveLength(0);
    expect(none.find('[data-test="faces-caption"]').text()).toContain('No beam reaction is given on any face');
  });

  it('shows the stored faces and sends nothing when they did not change', async () => {
    const w = mount(RestraintFacesForm, { props: { value: { ...restraint, faces: { zPlus: { Gk: 30, Qk: 20 } } }, readOnly: false } });
    expect((w.find('input[data-field="faces.zPlus.Qk"]').element as HTMLInputElement).value).toBe('20');
    await typeInto(w, 'faces.zPlus.Gk', '30');
    expect(w.emitted('change')).toBeUndefined();
  });
});

describe('results rows', () => {
  const doc = (faces?: object): StackDocument => ({
    nodes: [
      { id: 's', kind: 'support', data: { elevation: 0, fixity: 'pinned' } },
      { id: 'l1', kind: 'lift', data: { section: 'UKC 254x254x73', grade: 'S355' } },
      { id: 'c', kind: 'cap', data: { elevation: 9, fixity: 'pinned', Gk: 100, Qk: 40, category: 'H' } },
      { id: 'r1', kind: 'restraint', data: { elevation: 4.5, axes: 'both', fixity: 'pinned', Gk: 150, Qk: 60, category: 'A', ...(faces ? { faces } : {}) } },
    ],
    edges: [
      { id: 'e1', source: 's', target: 'l1' },
      { id: 'e2', source: 'l1', target: 'c' },
      { id: 'e3', source: 'r1', target: 'l1' },
    ],
  });

  it('carry the combined check of a lift under nominal moments, and none without them', () => {
    const [plain] = liftRows(analyseStack(doc()), doc());
    expect(plain.combined).toBeNull();
    const faced = doc({ yPlus: { Gk: 60, Qk: 40 } });
    const result = analyseStack(faced);
    const [row] = liftRows(result, faced);
    const largest = Math.max(...result.lifts[0].pieces.map((p) => p.combined?.utilisation ?? 0));
    expect(row.combined).toBe(largest);
    expect(row.governing).toBe('combined');
  });
});
