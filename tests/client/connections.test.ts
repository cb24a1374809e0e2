// Splice and base checks on screen: listed with their working, "not given" until detailed, and proposed details
// entered through the properties pane as one edit.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { robustnessSummary } from '@shared/engine/connections/robustnessSummary.ts';
import { analyseBuilding } from '@shared/engine/stack/analyseBuilding.ts';
import { analyseStack } from '@shared/engine/stack/analyseStack.ts';
import type { Op } from '@shared/schema/ops.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import AnalysisOptionsDialog from '@/components/building/AnalysisOptionsDialog.vue';
import RobustnessSummary from '@/components/building/RobustnessSummary.vue';
import { optionsSummary } from '@/components/building/optionsSummary.ts';
import ConnectionChecks from '@/components/connections/ConnectionChecks.vue';
import { mockFetch } from './fetchMock.ts';
import { QSelect } from 'quasar';
import { spliceDetailSchema, type SpliceDetail } from '@shared/schema/stack.ts';
import DetailForm from '@/components/connections/DetailForm.vue';
import { SPLICE_FIELDS } from '@/utils/detailFields.ts';
import PropertiesPanel from '@/components/stack/PropertiesPanel.vue';
import ResultsPanel from '@/components/stack/ResultsPanel.vue';

// Two lifts with a splice at +5, a floor at +4 with 120/80 kN and a roof of 60/20 kN (invented).
const doc: StackDocument = {
  nodes: [
    { id: 's', kind: 'support', data: { elevation: 0, fixity: 'pinned' } },
    { id: 'l1', kind: 'lift', data: { section: 'UKC 254x254x89', grade: 'S355' } },
    { id: 'p1', kind: 'splice', data: { elevation: 5 } },
    { id: 'l2', kind: 'lift', data: { section: 'UKC 254x254x73', grade: 'S355' } },
    { id: 'c', kind: 'cap', data: { elevation: 9, fixity: 'pinned', Gk: 60, Qk: 20, category: 'H' } },
    {
      id: 'r1',
      kind: 'restraint',
      data: { elevation: 4, axes: 'both', fixity: 'pinned', Gk: 120, Qk: 80, category: 'A' },
    },
  ],
  edges: [
    { id: 'e1', source: 's', target: 'l1' },
    { id: 'e2', source: 'l1', target: 'p1' },
    { id: 'e3', source: 'p1', target: 'l2' },
    { id: 'e4', source: 'l2', target: 'c' },
    { id: 'e5', source: 'r1', target: 'l1' },
  ],
};

afterEach(() => {
  document.body.innerHTML = '';
});

describe('splice and base checks in the results', () => {
  it('shows both as not given for a document without details', () => {
    const w = mount(ConnectionChecks, { props: { results: analyseStack(doc) } });
    const statuses = w.findAll('[data-status]').map((c) => c.attributes('data-status'));
    expect(statuses).toEqual(['not-given', 'not-given']);
    expect(w.text()).toContain('Same serial size: flange cover plates with 3.1 mm packs');
  });

  it('opens the working of a detailed splice with its clauses', async () => {
    const detailed = structuredClone(doc);
    const splice = detailed.nodes.find((n) => n.id === 'p1');
    if (splice?.kind === 'splice')
      splice.data.detail = {
        plate: { width: 250, thickness: 12, grade: 'S275' },
        bolts: { number: 4, diameter: 20, class: '8.8' },
      };
    const w = mount(ConnectionChecks, { props: { results: analyseStack(detailed, { consequenceClass: '2b' }) } });
    expect(w.find('[data-connection="p1"] [data-status]').attributes('data-status')).toBe('passes');
    expect(w.find('[data-connection="p1"]').text()).toContain('meets the tie');
    await w.find('[data-connection="p1"]').trigger('click');
    const clauses = w.findAll('[data-test="connection-working"] [data-clause]').map((r) => r.attributes('data-clause'));
    expect(clauses).toContain('EN 1991-1-7 A.6(2), EN 1990 eq. 6.11b');
    expect(clauses).toContain('EN 1993-1-8 Table 3.4');
    // T = 120 + 0.5 × 80 = 160 kN (EN 1991-1-7 A.6, ψ1 = 0.5)
    expect(
      w.find('[data-test="connection-working"] [data-clause="EN 1991-1-7 A.6(2), EN 1990 eq. 6.11b"]').text(),
    ).toContain('160');
  });
});

describe('splices on the elevation', () => {
  it('mark a failing splice, so it is seen beside the lifts', () => {
    const weak = structuredClone(doc);
    const splice = weak.nodes.find((n) => n.id === 'p1');
    if (splice?.kind === 'splice')
      splice.data.detail = {
        plate: { width: 250, thickness: 12, grade: 'S275' },
        bolts: { number: 1, diameter: 12, class: '8.8' },
      };
    const results = analyseStack(weak, { consequenceClass: '2b' });
    const w = mount(ResultsPanel, { props: { results, doc: weak, selectedLiftId: null, stale: false } });
    expect(w.find('[data-splice-status]').attributes('data-splice-status')).toBe('fails');
    const plain = mount(ResultsPanel, {
      props: { results: analyseStack(doc), doc, selectedLiftId: null, stale: false },
    });
    expect(plain.find('[data-splice-status]').attributes('data-splice-status')).toBe('not-given');
  });
});

describe('splice and base details in the properties pane', () => {
  it('proposes a splice from the upper column in one edit', async () => {
    const w = mount(PropertiesPanel, { props: { doc, selection: ['p1'], results: null, readOnly: false } });
    await w.find('[data-test="splice-detail"] [data-test="propose-detail"]').trigger('click');
    const [ops] = w.emitted('edit')?.[0] as [Op[], string];
    // UKC 254x254x73: b = 254.6 → 250 mm plates; tf = 14.2 → at least 7.1 and 10 mm → 10 mm (common practice, no source)
    expect(ops).toEqual([
      {
        op: 'updateNode',
        id: 'p1',
        data: {
          detail: {
            plate: { width: 250, thickness: 10, grade: 'S275' },
            bolts: { number: 4, diameter: 20, class: '8.8' },
          },
        },
      },
    ]);
  });

  it('proposes a base plate 100 mm beyond the footprint, and offers nothing to a viewer', async () => {
    const w = mount(PropertiesPanel, { props: { doc, selection: ['s'], results: null, readOnly: false } });
    await w.find('[data-test="base-plate"] [data-test="propose-detail"]').trigger('click');
    const [ops] = w.emitted('edit')?.[0] as [Op[], string];
    // UKC 254x254x89: b 256.3, h 260.3 → 456.3, 460.3 → 475 × 475 (next 25 mm)
    expect(ops).toEqual([
      { op: 'updateNode', id: 's', data: { basePlate: { b: 475, l: 475, t: 25, grade: 'S275', grout: 25 } } },
    ]);
    const viewer = mount(PropertiesPanel, { props: { doc, selection: ['s'], results: null, readOnly: true } });
    expect(viewer.find('[data-test="propose-detail"]').exists()).toBe(false);
  });
});

describe('a detail form', () => {
  // Invented splice detail.
  const detail: SpliceDetail = {
    plate: { width: 250, thickness: 10, grade: 'S275' },
    bolts: { number: 4, diameter: 20, class: '8.8' },
  };
  const mountForm = () =>
    mount(DetailForm<SpliceDetail>, {
      props: {
        title: 'Splice',
        caption: '',
        proposeLabel: 'Propose',
        testId: 'splice-detail',
        fields: SPLICE_FIELDS,
        schema: spliceDetailSchema,
        value: detail,
        proposal: detail,
        readOnly: false,
      },
    });

  it('shows the stored bolt size by its name and sends a size chosen as a number', async () => {
    const w = mountForm();
    const size = w.findAllComponents(QSelect).find((s) => s.text().includes('Bolt size'))!;
    expect(size.text()).toContain('M20');
    size.vm.$emit('update:modelValue', '24');
    await flushPromises();
    expect(w.emitted('change')).toEqual([[{ ...detail, bolts: { ...detail.bolts, diameter: 24 } }]]);
  });

  it('sends a typed value when the field is left, and refuses one the schema does not take', async () => {
    const w = mountForm();
    const width = w.find('input[data-field="plate.width"]');
    await width.setValue('300');
    await width.trigger('change');
    expect(w.emitted('change')?.at(-1)).toEqual([{ ...detail, plate: { ...detail.plate, width: 300 } }]);
    const sent = w.emitted('change')?.length;
    await width.setValue('-5');
    await width.trigger('change');
    await flushPromises();
    expect(w.find('.q-field--error').exists()).toBe(true);
    expect(w.emitted('change')).toHaveLength(sent!);
  });
});

describe('robustness summary on the building page', () => {
  it('names each splice that does not meet the tie force and why', async () => {
    setActivePinia(createPinia());
    const summary = robustnessSummary(
      analyseBuilding([{ id: 7, name: 'C/3', doc }], undefined, { consequenceClass: '2b' }),
      '2b',
    );
    const requests = mockFetch({ 'GET /api/buildings/4/robustness': () => ({ status: 200, body: summary }) });
    const options = {
      combination: '6.10ab',
      annex: 'UK',
      imposedReduction: true,
      selfWeight: true,
      consequenceClass: '2b',
    } as const;
    const w = mount(RobustnessSummary, { props: { buildingId: 4, stacks: [], options } });
    await flushPromises();
    expect(requests.map((r) => r.url)).toEqual(['/api/buildings/4/robustness']);
    expect(w.find('[data-test="robustness-message"]').text()).toContain(
      '0 splice(s) meet the vertical tie force of EN 1991-1-7 A.6, 1 do not',
    );
    // Tie: 120 + 0.5 × 80 = 160 kN (EN 1991-1-7 A.6(2), accidental combination)
    expect(w.find('[data-test="robustness-unmet"]').text()).toContain(
      'C/3, splice +5.000: tie 160 kN, no detail given',
    );
    vi.unstubAllGlobals();
  });
});

describe('building classes', () => {
  it('are chosen in the analysis options and named in the summary on the building header', async () => {
    setActivePinia(createPinia());
    const w = mount(AnalysisOptionsDialog, { props: { modelValue: true, editable: true }, attachTo: document.body });
    await flushPromises();
    expect(document.querySelector('[data-test="consequence-class"]')).not.toBeNull();
    expect(document.querySelector('[data-test="concrete-class"]')).not.toBeNull();
    w.unmount();
    const base = { combination: '6.10ab', annex: 'UK', imposedReduction: true, selfWeight: true } as const;
    expect(optionsSummary(base)).toContain('consequence class not given');
    expect(optionsSummary({ ...base, consequenceClass: '2b', concreteClass: 'C30/37' })).toContain(
      'consequence class 2b · foundations C30/37',
    );
  });
});
