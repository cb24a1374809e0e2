import { describe, expect, it } from 'vitest';
import { analyseBuilding } from '../../shared/engine/stack/index.ts';
import { buildStack } from './stack-builder.ts';

// Invented building: levels at +0.000, +4.000 and +8.000; three stacks named by grid reference.
const levels = { ground: 0, first: 4, roof: 8 };
const stack = (capGk: number) =>
  buildStack({ lifts: [{ top: 8, section: 'UKC 203x203x46' }], floors: [{ elevation: 4, levelId: 'first', Gk: 100, Qk: 40 }], cap: { Gk: capGk, Qk: 20 } });
const broken = { nodes: stack(10).nodes.filter((n) => n.kind !== 'cap'), edges: stack(10).edges };

describe('analyseBuilding', () => {
  const result = analyseBuilding(
    [
      { id: 1, name: 'A/1', doc: stack(100) },
      { id: 2, name: 'B/1', doc: stack(2500) },
      { id: 3, name: 'C/1', doc: broken },
    ],
    levels,
    { combination: '6.10ab', annex: 'UK' },
  );

  it("gives each stack its governing lift, utilisation and status", () => {
    expect(result.stacks.map((s) => [s.id, s.name, s.governingLiftId, s.status])).toEqual([
      [1, 'A/1', 'l1', 'passes'],
      [2, 'B/1', 'l1', 'fails'],
      [3, 'C/1', null, 'errors'],
    ]);
    expect(result.stacks[0].utilisation).toBe(result.stacks[0].result.lifts[0].utilisation);
    expect(result.stacks[1].utilisation).toBeGreaterThan(1);
    expect(result.stacks[2].utilisation).toBeNull();
  });

  it('names the most utilised stack as the worst, ignoring stacks with errors', () => {
    expect(result.worstStackId).toBe(2);
  });

  it('takes the elevation of a restraint that refers to a level from the building levels', () => {
    const moved = analyseBuilding([{ id: 'x', name: 'D/1', doc: stack(100) }], { ...levels, first: 4.5 }, {});
    expect(moved.stacks[0].result.takeDown.map((r) => r.elevation)).toEqual([8, 4.5]);
    expect(moved.stacks[0].result.lifts[0].pieces.map((p) => p.to)).toEqual([4.5, 8]);
  });

  it('has no worst stack when no stack has results', () => {
    expect(analyseBuilding([{ id: 9, name: 'E/1', doc: broken }], levels, {}).worstStackId).toBeNull();
    expect(analyseBuilding([], levels, {})).toEqual({ stacks: [], worstStackId: null });
  });
});
