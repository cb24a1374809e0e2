// The plan view: the grid drawn to scale with each placed stack at its crossing in its utilisation colour, the
// floor a stack carries shaded under the pointer, and a click that opens the stack.
import { afterEach, describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { StackSummary } from '@shared/schema/api.ts';
import PlanView from '@/components/plan/PlanView.vue';
import { freeCrossings, planStacks, tributaryRect } from '@/components/plan/planGeometry.ts';
import { smallGrid } from '../engine/building-model-fixtures.ts';

// Invented grid: A 0, B 6, C 13.5 m by 1 0, 2 7.5 m; 0.5 m of slab beyond A.
const GRID = smallGrid(0.5);

const stack = (
  id: number,
  name: string,
  gridX: string | null,
  gridY: string | null,
  utilisation: number | null,
): StackSummary => ({
  id,
  buildingId: 1,
  name,
  version: 1,
  liftCount: 2,
  governingLiftId: null,
  governingLiftLabel: null,
  governingSection: null,
  utilisation,
  status: utilisation === null ? 'errors' : utilisation > 1 ? 'fails' : 'passes',
  updatedAt: '2026-12-02T00:00:00Z',
  gridX,
  gridY,
  webAlong: 'x',
});

const STACKS = [stack(1, 'B/2', 'B', 'y2', 0.62), stack(2, 'C/1', 'C', 'y1', 1.04), stack(3, 'Loose', null, null, 0.9)];

afterEach(() => {
  document.body.innerHTML = '';
});

describe('plan geometry', () => {
  it('puts placed stacks at their crossings and leaves the others out', () => {
    expect(planStacks(GRID, STACKS).map((s) => [s.name, s.x, s.y])).toEqual([
      ['B/2', 6, 7.5],
      ['C/1', 13.5, 0],
    ]);
  });
  it('gives the floor a column carries: A/1 runs from the slab edge 0.5 m before A to half-way to B, and half-way to 2', () => {
    expect(tributaryRect(GRID, 'A', 'y1')).toEqual({ x0: -0.5, x1: 3, y0: 0, y1: 3.75 });
  });
  it('lists the crossings where no stack stands', () => {
    expect(freeCrossings(GRID, STACKS)).toHaveLength(4);
  });
});

describe('a typical column on the plan', () => {
  const check = (positionId: number | null, name: string, gridX: string, gridY: string, utilisation: number) => ({
    positionId,
    gridX,
    gridY,
    name,
    area: 10,
    utilisation,
    status: 'passes' as const,
    governingLiftId: 'l1',
    governingLiftLabel: 'L1',
    governingSection: 'UKC 203x203x46',
    lifts: [],
    errors: [],
  });
  // Stack 1 (own place B/2) also stands at A/1 and A/2; A/2 carries the most and governs.
  const TYPICAL = new Map([
    [
      1,
      {
        results: [
          check(null, 'B/2', 'B', 'y2', 0.62),
          check(5, 'A/1', 'A', 'y1', 0.4),
          check(6, 'A/2', 'A', 'y2', 0.81),
        ],
        governingPosition: 'A/2',
      },
    ],
  ]);

  it('draws a marker at every position, each in its own utilisation, and marks the governing one', () => {
    expect(planStacks(GRID, STACKS, TYPICAL).map((m) => [m.key, m.name, m.x, m.y, m.utilisation, !!m.governs])).toEqual(
      [
        ['1:own', 'B/2', 6, 7.5, 0.62, false],
        ['1:5', 'A/1', 0, 0, 0.4, false],
        ['1:6', 'A/2', 0, 7.5, 0.81, true],
        ['2', 'C/1', 13.5, 0, 1.04, false],
      ],
    );
  });

  it('counts the positions of a typical column as taken crossings', () => {
    expect(freeCrossings(GRID, STACKS, TYPICAL).map((c) => `${c.gridX}/${c.gridY}`)).toEqual(['B/y1', 'C/y2']);
  });
});

describe('plan view', () => {
  function mountPlan() {
    setActivePinia(createPinia());
    return mount(PlanView, { props: { grid: GRID, stacks: STACKS, canPlace: true }, attachTo: document.body });
  }

  it('colours each stack by its utilisation band', () => {
    const w = mountPlan();
    expect(w.get('[data-test="plan-stack-B/2"]').attributes('data-band')).toBe('ok');
    expect(w.get('[data-test="plan-stack-C/1"]').attributes('data-band')).toBe('over');
    expect(w.find('[data-test="plan-stack-Loose"]').exists()).toBe(false);
    w.unmount();
  });

  it('shades the floor of the stack under the pointer and says its area', async () => {
    const w = mountPlan();
    expect(w.find('[data-test="plan-tributary"]').exists()).toBe(false);
    await w.get('[data-test="plan-stack-B/2"]').trigger('mouseenter');
    const rect = w.get('[data-test="plan-tributary"]');
    // B/2: x from 3 to 9.75, y from 3.75 to 7.5: 6.75 × 3.75 = 25.3125 m²
    expect(Number(rect.attributes('width'))).toBeCloseTo(6.75, 9);
    expect(Number(rect.attributes('height'))).toBeCloseTo(3.75, 9);
    expect(w.get('[data-test="plan-info"]').text()).toContain('25.31 m²');
    w.unmount();
  });

  it('opens a stack on click and offers a free crossing for placing', async () => {
    const w = mountPlan();
    await w.get('[data-test="plan-stack-C/1"]').trigger('click');
    expect(w.emitted('open')).toEqual([[2]]);
    await w.get('[data-test="plan-free"]').trigger('click');
    expect(w.emitted('place')?.[0]).toEqual([{ gridX: 'A', gridY: 'y1' }]);
    w.unmount();
  });
});
