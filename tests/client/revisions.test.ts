import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia, type Pinia } from 'pinia';
import type { RevisionComparison, RevisionDetail, RevisionSummary } from '@shared/schema/revisions.ts';
import FreezeDialog from '@/components/revisions/FreezeDialog.vue';
import CompareView from '@/components/revisions/CompareView.vue';
import { useRevisionsStore } from '@/stores/revisions.ts';
import { mockFetch } from './fetchMock.ts';

// Invented demo revisions of an invented building (id 7).
const summary: RevisionSummary = {
  id: 11,
  buildingId: 7,
  code: 'P01',
  purpose: 'preliminary',
  note: 'First issue',
  frozenAt: '2026-03-14T09:05:00.000Z',
  frozenBy: { id: 1, name: 'Lead Engineer' },
  hash: 'a'.repeat(64),
  stackCount: 2,
  worstUtilisation: 0.81,
  failingLifts: 0,
  mail: { pending: 0, sent: 3, failed: 0 },
  review: {
    state: 'issued',
    prepared: { name: 'Lead Engineer', at: '2026-03-14T09:05:00.000Z' },
    checked: null,
    approved: { name: 'Lead Engineer', at: '2026-03-14T09:05:00.000Z' },
    unchecked: true,
    openComments: 0,
  },
};
const detail: RevisionDetail = {
  ...summary,
  engineVersion: '0.1.0',
  acknowledgement: null,
  options: { combination: '6.10ab', annex: 'UK', imposedReduction: true, selfWeight: true },
  levels: [],
  stacks: [],
  recipients: [],
};

let pinia: Pinia;
beforeEach(() => {
  pinia = createPinia();
  setActivePinia(pinia);
  useRevisionsStore().buildingId = 7;
});
afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const byTest = (name: string) => document.body.querySelector<HTMLElement>(`[data-test="${name}"]`);

describe('the freeze dialog', () => {
  it('keeps Freeze disabled while lifts fail until the acknowledgement is ticked, then sends it with the note', async () => {
    const requests = mockFetch({ 'POST /api/buildings/7/revisions': () => ({ status: 201, body: detail }) });
    const wrapper = mount(FreezeDialog, {
      props: { modelValue: true, failingStacks: ['C/3'] },
      attachTo: document.body,
      global: { plugins: [pinia] },
    });
    await flushPromises();
    expect(byTest('failing')?.textContent).toContain('C/3');
    expect(byTest('freeze')?.hasAttribute('disabled')).toBe(true);

    byTest('acknowledge')?.click();
    await flushPromises();
    expect(byTest('freeze')?.hasAttribute('disabled')).toBe(false);

    // QInput passes data-test through to its native textarea.
    const note = byTest('note') as HTMLTextAreaElement | null;
    if (!note) throw new Error('no note field');
    note.value = 'C/3 is being re-sized';
    note.dispatchEvent(new Event('input'));
    byTest('freeze')?.click();
    await flushPromises();
    expect(requests.filter((r) => r.method === 'POST')).toHaveLength(1);
    // afterRevisionId: the newest revision the page shows (none here), so a doubled request cannot freeze twice.
    expect(requests[0].body).toEqual({
      afterRevisionId: null,
      note: 'C/3 is being re-sized',
      purpose: 'preliminary',
      acknowledgeFailingLifts: true,
    });
    expect(wrapper.emitted('frozen')?.[0]).toEqual([detail]);
    wrapper.unmount();
  });

  it('does not send a failing-lifts freeze without a note saying why', async () => {
    const requests = mockFetch({});
    const wrapper = mount(FreezeDialog, {
      props: { modelValue: true, failingStacks: ['C/3'] },
      attachTo: document.body,
      global: { plugins: [pinia] },
    });
    await flushPromises();
    byTest('acknowledge')?.click();
    await flushPromises();
    byTest('freeze')?.click();
    await flushPromises();
    expect(requests).toHaveLength(0);
    expect(byTest('freeze-dialog')?.textContent).toContain('Say why the revision is issued with failing lifts');
    wrapper.unmount();
  });

  it('lists the reasons the server gives for refusing a freeze', async () => {
    mockFetch({
      'POST /api/buildings/7/revisions': () => ({
        status: 422,
        body: {
          error: {
            code: 'unprocessable',
            message: '1 problem must be fixed before freezing',
            details: { reasons: [{ stackId: 4, stack: 'D/4', message: 'Lift L2 has no node above it' }] },
          },
        },
      }),
    });
    const wrapper = mount(FreezeDialog, {
      props: { modelValue: true, failingStacks: [] },
      attachTo: document.body,
      global: { plugins: [pinia] },
    });
    await flushPromises();
    byTest('freeze')?.click();
    await flushPromises();
    const reasons = byTest('reasons')?.textContent ?? '';
    expect(reasons).toContain('1 problem must be fixed before freezing');
    expect(reasons).toContain('D/4: Lift L2 has no node above it');
    expect(wrapper.emitted('frozen')).toBeUndefined();
    wrapper.unmount();
  });
});

describe('the comparison view', () => {
  it('asks for the chosen revisions and shows the changed section and the signed change of utilisation', async () => {
    const comparison: RevisionComparison = {
      from: { id: 11, code: 'P01' },
      to: { id: null, code: 'current' },
      unchangedStacks: 1,
      levels: [],
      options: [],
      stacks: [
        {
          stackId: 3,
          name: 'B/2',
          change: 'changed',
          nodes: [
            {
              nodeId: 'lift-1',
              kind: 'lift',
              label: 'Lift L1',
              change: 'changed',
              fields: [{ field: 'section', from: 'UKC 254x254x73', to: 'UKC 305x305x97' }],
            },
          ],
          lifts: [
            {
              liftId: 'lift-1',
              label: 'L1',
              section: { from: 'UKC 254x254x73', to: 'UKC 305x305x97' },
              from: 0.84,
              to: 0.61,
            },
          ],
        },
      ],
    };
    const requests = mockFetch({
      'GET /api/buildings/7/revisions/compare?from=11&to=current': () => ({ status: 200, body: comparison }),
    });
    const wrapper = mount(CompareView, { props: { revisions: [summary] }, global: { plugins: [pinia] } });
    await wrapper.find('[data-test="run-compare"]').trigger('click');
    await flushPromises();
    expect(requests.map((r) => r.url)).toEqual(['/api/buildings/7/revisions/compare?from=11&to=current']);
    expect(wrapper.find('[data-test="node-change"]').text()).toContain('section: UKC 254x254x73 → UKC 305x305x97');
    const lift = wrapper.find('[data-test="lift-change"]').text();
    expect(lift).toContain('L1');
    expect(lift).not.toContain('lift-1');
    expect(lift).toContain('0.84 → 0.61');
    expect(lift).toContain('−0.23');
    expect(wrapper.find('[data-test="compare-result"]').text()).toContain('1 stack differs, 1 unchanged');
  });

  it('gives loads in kN, elevations to the millimetre and options in the words of the options dialog', async () => {
    const comparison: RevisionComparison = {
      from: { id: 11, code: 'P01' },
      to: { id: null, code: 'current' },
      unchangedStacks: 0,
      levels: [
        { field: 'Roof (id lv-9)', from: 26.6, to: 27 },
        { field: 'Level 3', from: 11.4, to: 11.5 },
      ],
      options: [{ field: 'selfWeight', from: 'true', to: 'false' }],
      stacks: [
        {
          stackId: 3,
          name: 'B/2',
          change: 'changed',
          nodes: [
            {
              nodeId: 'r5',
              kind: 'restraint',
              label: 'Restraint at +19.000',
              change: 'changed',
              fields: [
                { field: 'Gk', from: 240, to: 400 },
                { field: 'elevation', from: 19, to: 19.5 },
              ],
            },
          ],
          lifts: [],
        },
      ],
    };
    mockFetch({
      'GET /api/buildings/7/revisions/compare?from=11&to=current': () => ({ status: 200, body: comparison }),
    });
    const wrapper = mount(CompareView, { props: { revisions: [summary] }, global: { plugins: [pinia] } });
    await wrapper.find('[data-test="run-compare"]').trigger('click');
    await flushPromises();
    expect(wrapper.find('[data-test="node-change"]').text()).toContain(
      'Gk: 240 → 400 kN; elevation: +19.000 → +19.500 m',
    );
    expect(wrapper.find('[data-test="option-change"]').text()).toBe('Analysis option self-weight: on → off');
    // A level named "Level 3" reads "Level 3", never "Level Level 3"
    expect(wrapper.findAll('[data-test="level-change"]').map((w) => w.text())).toEqual([
      'Level Roof: +26.600 → +27.000 m',
      'Level 3: +11.400 → +11.500 m',
    ]);
  });
});
