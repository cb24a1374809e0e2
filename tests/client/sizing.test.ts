// Sizing in the client (docs/analysis-rules.md §Sizing): the preview rows and totals, the form, and accepting through
// the open stack's edit queue or, for a building, stack by stack over REST. Demo data, invented.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { LiftSizing, StackSizingPreview } from '@shared/schema/sizing.ts';
import SizingForm from '@/components/sizing/SizingForm.vue';
import SizingPreviewTable from '@/components/sizing/SizingPreviewTable.vue';
import { acceptOps, allSelectable, formatMass, massTotals, previewRows, rowKey } from '@/utils/sizingRows.ts';
import { useSizingStore } from '@/stores/sizing.ts';
import { useStackStore } from '@/stores/stack.ts';
import { mockFetch } from './fetchMock.ts';

function lift(
  id: string,
  name: string,
  bottom: number,
  top: number,
  before: [string, number],
  after: [string, number] | null,
  status: LiftSizing['status'],
): LiftSizing {
  return {
    liftId: id,
    name,
    bottom,
    top,
    before: { section: before[0], grade: 'S355', massPerMetre: before[1], utilisation: 0.5 },
    after: after ? { section: after[0], grade: 'S355', massPerMetre: after[1], utilisation: 0.9 } : null,
    status,
    ...(status === 'none'
      ? { message: 'No section passes: no UKC section in S355 has a utilisation at or below 1.00' }
      : {}),
  };
}

function preview(stackId: number, name: string, lifts: LiftSizing[], version = 3): StackSizingPreview {
  const mass = (pick: (l: LiftSizing) => number) => lifts.reduce((sum, l) => sum + pick(l) * (l.top - l.bottom), 0);
  return {
    stackId,
    name,
    version,
    errors: [],
    lifts,
    serialSize: null,
    complete: lifts.every((l) => l.after),
    massBefore: mass((l) => l.before.massPerMetre),
    massAfter: mass((l) => (l.after ?? l.before).massPerMetre),
  };
}

// Two 8 m lifts: the bottom one lighter (100 → 60 kg/m), the top one kept, and a second stack whose
// bottom lift has no passing section.
const A = preview(1, 'A/1', [
  lift('l1', 'L1', 0, 8, ['UKC 254x254x107', 100], ['UKC 203x203x60', 60], 'proposed'),
  lift('l2', 'L2', 8, 16, ['UKC 203x203x46', 46], ['UKC 203x203x46', 46], 'unchanged'),
]);
const B = preview(
  2,
  'B/1',
  [
    lift('l1', 'L1', 0, 4, ['UKC 152x152x23', 23], null, 'none'),
    lift('l2', 'L2', 4, 8, ['UKC 203x203x71', 71], ['UKC 152x152x30', 30], 'proposed'),
  ],
  7,
);

describe('sizing preview rows', () => {
  it('lists lifts from the top down and lets only changed sections be ticked', () => {
    const rows = previewRows([A]);
    expect(rows.map((r) => r.lift.name)).toEqual(['L2', 'L1']);
    expect(rows.map((r) => r.selectable)).toEqual([false, true]);
    expect([...allSelectable([A, B])].sort()).toEqual([rowKey(1, 'l1'), rowKey(2, 'l2')]);
  });

  it('totals mass from kg/m × length, taking the proposed section only where ticked', () => {
    // by hand: now 100·8 + 46·8 + 23·4 + 71·4 = 1544 kg
    expect(massTotals([A, B], new Set()).before).toBe(1544);
    expect(massTotals([A, B], new Set()).after).toBe(1544);
    // ticking A's L1 saves (100 − 60)·8 = 320 kg
    expect(massTotals([A, B], new Set([rowKey(1, 'l1')])).after).toBe(1224);
    // both ticked: also (71 − 30)·4 = 164 kg
    expect(massTotals([A, B], allSelectable([A, B])).after).toBe(1060);
  });

  it('builds updateNode ops with section and grade for the ticked lifts of one stack only', () => {
    expect(acceptOps(A, new Set([rowKey(1, 'l1'), rowKey(2, 'l2')]))).toEqual([
      { op: 'updateNode', id: 'l1', data: { section: 'UKC 203x203x60', grade: 'S355' } },
    ]);
    expect(acceptOps(A, new Set([rowKey(2, 'l1')]))).toEqual([]);
  });

  it('prints mass in kg below 10 t and in tonnes above', () => {
    expect(formatMass(1544)).toBe('1\u2009544 kg');
    expect(formatMass(12_345)).toBe('12.3 t');
  });
});

describe('sizing preview table', () => {
  it('shows old and new sections, says clearly when no section passes, and reports a tick', async () => {
    const chosen = allSelectable([A, B]);
    const wrapper = mount(SizingPreviewTable, {
      props: {
        rows: previewRows([A, B]),
        previews: [A, B],
        chosen,
        totals: massTotals([A, B], chosen),
        showStack: true,
      },
    });
    const first = wrapper.find(`[data-test="row-${rowKey(1, 'l1')}"]`);
    expect(first.text()).toContain('UKC 254x254x107');
    expect(first.text()).toContain('UKC 203x203x60');
    expect(wrapper.find(`[data-test="row-${rowKey(2, 'l1')}"] [data-test="no-proposal"]`).text()).toContain(
      'No section passes',
    );
    expect(wrapper.find(`[data-test="row-${rowKey(2, 'l1')}"] .q-checkbox`).exists()).toBe(false);
    expect(wrapper.find('[data-test="sizing-totals"]').text()).toContain('1\u2009544 kg');
    await first.find('.q-checkbox').trigger('click');
    expect(wrapper.emitted('choose')?.[0]).toEqual([rowKey(1, 'l1'), false]);
  });
});

describe('sizing preview notes', () => {
  it('shows beside a proposed section why lighter ones were passed over', () => {
    const note = 'Class 4 sections were not considered: this lift carries nominal moments.';
    const withNote = preview(3, 'C/1', [
      { ...lift('l1', 'L1', 0, 8, ['SHS 200x200x10', 57.8], ['SHS 180x180x6.3', 34], 'proposed'), message: note },
    ]);
    const chosen = allSelectable([withNote]);
    const wrapper = mount(SizingPreviewTable, {
      props: {
        rows: previewRows([withNote]),
        previews: [withNote],
        chosen,
        totals: massTotals([withNote], chosen),
        showStack: false,
      },
    });
    expect(wrapper.find(`[data-test="row-${rowKey(3, 'l1')}"] [data-test="proposal-note"]`).text()).toBe(note);
    expect(wrapper.find(`[data-test="row-${rowKey(3, 'l1')}"]`).text()).toContain('SHS 180x180x6.3');
  });
});

describe('sizing form', () => {
  it('sends the series, grade, target and rules, and refuses a target above 1', async () => {
    const wrapper = mount(SizingForm, { props: { busy: false } });
    await wrapper.find('input[data-test="target"]').setValue('0.9');
    await wrapper.find('form').trigger('submit');
    await flushPromises();
    expect(wrapper.emitted('propose')?.[0]).toEqual([
      { series: 'UKC', grade: 'S355', target: 0.9, noUpwardIncrease: true, sameSerialSize: false },
    ]);
    await wrapper.find('input[data-test="target"]').setValue('1.2');
    await wrapper.find('form').trigger('submit');
    await flushPromises();
    expect(wrapper.emitted('propose')).toHaveLength(1);
    expect(wrapper.text()).toContain('at most 1.00');
  });
});

describe('sizing store', () => {
  beforeEach(() => {
    setActivePinia(createPinia());
    localStorage.clear();
  });
  afterEach(() => vi.unstubAllGlobals());

  const request = { series: 'UKC', grade: 'S355', target: 1, noUpwardIncrease: true, sameSerialSize: false } as const;

  it('accepts a building stack by stack over REST on the previewed version, ticked lifts only', async () => {
    const requests = mockFetch({
      'POST /api/buildings/9/sizing': () => ({
        status: 200,
        body: { buildingId: 9, stacks: [A, B], massBefore: 1544, massAfter: 1060 },
      }),
      'POST /api/stacks/1/ops': () => ({ status: 200, body: { version: 4 } }),
      'POST /api/stacks/2/ops': () => ({ status: 200, body: { version: 8 } }),
    });
    const sizing = useSizingStore();
    await sizing.propose({ kind: 'building', id: 9 }, request);
    expect(sizing.state).toBe('ready');
    expect(requests[0].body).toEqual(request);
    sizing.choose(rowKey(2, 'l2'), false);
    expect(await sizing.accept()).toBe(true);
    const ops = requests.filter((r) => r.url.endsWith('/ops'));
    expect(ops.map((r) => r.url)).toEqual(['/api/stacks/1/ops']);
    expect(ops[0].body).toEqual({
      baseVersion: 3,
      ops: [{ op: 'updateNode', id: 'l1', data: { section: 'UKC 203x203x60', grade: 'S355' } }],
    });
  });

  it('reports a stack changed since the preview and shows a fresh preview', async () => {
    const requests = mockFetch({
      'POST /api/buildings/9/sizing': () => ({
        status: 200,
        body: { buildingId: 9, stacks: [A, B], massBefore: 1544, massAfter: 1060 },
      }),
      'POST /api/stacks/1/ops': () => ({
        status: 409,
        body: { error: { code: 'conflict', message: 'Someone else has changed l1 since version 3' } },
      }),
      'POST /api/stacks/2/ops': () => ({ status: 200, body: { version: 8 } }),
    });
    const sizing = useSizingStore();
    await sizing.propose({ kind: 'building', id: 9 }, request);
    expect(await sizing.accept()).toBe(false);
    await flushPromises();
    expect(requests.filter((r) => r.url === '/api/buildings/9/sizing')).toHaveLength(2);
    expect(sizing.state).toBe('ready');
  });

  it('accepts on the open stack through its edit queue as one undoable edit', async () => {
    mockFetch({ 'POST /api/stacks/1/sizing': () => ({ status: 200, body: A }) });
    const stack = useStackStore();
    stack.$patch({ stackId: 1 });
    const edit = vi.spyOn(stack, 'edit').mockReturnValue(true);
    const sizing = useSizingStore();
    await sizing.propose({ kind: 'stack', id: 1 }, request);
    expect(await sizing.accept()).toBe(true);
    expect(edit).toHaveBeenCalledTimes(1);
    expect(edit.mock.calls[0][0]).toEqual([
      { op: 'updateNode', id: 'l1', data: { section: 'UKC 203x203x60', grade: 'S355' } },
    ]);
    expect(edit.mock.calls[0][1]).toBe('Apply the proposed section');
  });

  it('shows the server’s refusal of a request', async () => {
    mockFetch({
      'POST /api/stacks/1/sizing': () => ({
        status: 422,
        body: { error: { code: 'unprocessable', message: 'Not in the UKC series: UKB 457x191x67' } },
      }),
    });
    const sizing = useSizingStore();
    await sizing.propose({ kind: 'stack', id: 1 }, { ...request, allowed: ['UKB 457x191x67'] });
    expect(sizing.state).toBe('error');
    expect(sizing.error).toContain('Not in the UKC series');
  });
});
