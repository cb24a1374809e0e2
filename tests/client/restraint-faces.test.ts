// The face reactions of a restraint or the cap (simple construction) and the combined column of the results table.
import { afterEach, describe, expect, it } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import RestraintFacesForm from '@/components/stack/RestraintFacesForm.vue';
import PropertiesPanel from '@/components/stack/PropertiesPanel.vue';
import ResultsPanel from '@/components/stack/ResultsPanel.vue';
import ResultsTable from '@/components/stack/ResultsTable.vue';
import { facesText } from '@/utils/nodeWords.ts';
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
    const w = mount(RestraintFacesForm, {
      props: { value: { ...restraint, faces: { zPlus: { Gk: 30, Qk: 20 } } }, readOnly: true },
    });
    expect(w.findAll('input').map((i) => i.attributes('data-field'))).toEqual(['faces.zPlus.Gk', 'faces.zPlus.Qk']);
    expect(w.find('[data-test="faces-caption"]').text()).not.toContain('Leave a face empty');
    const none = mount(RestraintFacesForm, { props: { value: restraint, readOnly: true } });
    expect(none.findAll('input')).toHaveLength(0);
    expect(none.find('[data-test="faces-caption"]').text()).toContain('No beam reaction is given on any face');
  });

  it('shows the stored faces and sends nothing when they did not change', async () => {
    const w = mount(RestraintFacesForm, {
      props: { value: { ...restraint, faces: { zPlus: { Gk: 30, Qk: 20 } } }, readOnly: false },
    });
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
      {
        id: 'r1',
        kind: 'restraint',
        data: {
          elevation: 4.5,
          axes: 'both',
          fixity: 'pinned',
          Gk: 150,
          Qk: 60,
          category: 'A',
          ...(faces ? { faces } : {}),
        },
      },
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

describe('roof beams on the cap', () => {
  const capDoc: StackDocument = {
    nodes: [
      { id: 's', kind: 'support', data: { elevation: 0, fixity: 'pinned' } },
      { id: 'l1', kind: 'lift', data: { section: 'UKC 203x203x46', grade: 'S355' } },
      { id: 'c', kind: 'cap', data: { elevation: 4, fixity: 'pinned', Gk: 60, Qk: 20, category: 'H' } },
    ],
    edges: [
      { id: 'e1', source: 's', target: 'l1' },
      { id: 'e2', source: 'l1', target: 'c' },
    ],
  };

  it('offers the faces form for the cap, worded for roof beams, and sends an updateNode with the faces', async () => {
    const w = mount(PropertiesPanel, { props: { doc: capDoc, selection: ['c'], results: null, readOnly: false } });
    expect(w.find('[data-test="restraint-faces"]').text()).toContain('Roof beam reactions');
    expect(w.find('[data-test="faces-caption"]').text()).toContain('wholly into the top storey');
    await typeInto(w, 'faces.yPlus.Gk', '60');
    await typeInto(w, 'faces.yPlus.Qk', '20');
    const last = w.emitted('edit')?.at(-1) as [unknown[], string];
    expect(last[0]).toEqual([{ op: 'updateNode', id: 'c', data: { faces: { yPlus: { Gk: 60, Qk: 20 } } } }]);
  });

  it('writes the roof beams on the cap card in short form', () => {
    expect(facesText({ yPlus: { Gk: 60, Qk: 20 }, zMinus: { Gk: 12.5, Qk: 0 } })).toBe('y+ 60/20 · z− 12.5/0 kN');
    expect(facesText({ yPlus: { Gk: 0, Qk: 0 } })).toBe('');
    expect(facesText(undefined)).toBe('');
  });
});

describe('the note when nominal moments are on but no face reactions are given', () => {
  const plainDoc: StackDocument = {
    nodes: [
      { id: 's', kind: 'support', data: { elevation: 0, fixity: 'pinned' } },
      { id: 'l1', kind: 'lift', data: { section: 'UKC 254x254x73', grade: 'S355' } },
      { id: 'c', kind: 'cap', data: { elevation: 4, fixity: 'pinned', Gk: 100, Qk: 40, category: 'H' } },
    ],
    edges: [
      { id: 'e1', source: 's', target: 'l1' },
      { id: 'e2', source: 'l1', target: 'c' },
    ],
  };
  const mountPanel = (results: ReturnType<typeof analyseStack>) =>
    mount(ResultsPanel, { props: { results, doc: plainDoc, selectedLiftId: null, stale: false } });

  it('says so in the results header and in the combined column’s tooltip', async () => {
    const w = mountPanel(analyseStack(plainDoc));
    expect(w.find('[data-test="moments-note"]').text()).toContain('Axial only: no beam reactions given');
    expect(w.find('[data-test="moments-note"]').attributes('aria-label')).toContain(
      'no beam reactions are given on the column faces',
    );
    expect(w.find('[data-test="stack-warnings"]').exists()).toBe(false);
    const table = w.findComponent(ResultsTable);
    expect(table.props('combinedNote')).toContain('the combined check is not made');
  });

  it('is silent with the option off, and once a face reaction is given', () => {
    expect(
      mountPanel(analyseStack(plainDoc, { nominalMoments: false }))
        .find('[data-test="moments-note"]')
        .exists(),
    ).toBe(false);
    const faced: StackDocument = {
      ...plainDoc,
      nodes: plainDoc.nodes.map((n) =>
        n.kind === 'cap' ? { ...n, data: { ...n.data, faces: { yPlus: { Gk: 60, Qk: 20 } } } } : n,
      ),
    };
    const w = mountPanel(analyseStack(faced));
    expect(w.find('[data-test="moments-note"]').exists()).toBe(false);
    // The combined column names the combination that governs
    expect(w.find('tbody tr[data-row-key="l1"]').text()).toMatch(/\d\.\d\d \(6\.10[ab]\)/);
  });
});
