import { describe, expect, it } from 'vitest';
import { analyseBuilding } from '../../shared/engine/stack/index.ts';
import { buildStack } from './stack-builder.ts';

// Invented building: levels at +0.000, +4.000 and +8.000; three stacks named by grid reference.
const levels = { ground: 0, first: 4, roof: 8 };
const stack = (capGk: number) =>
  buildStack({
    lifts: [{ top: 8, section: 'UKC 203x203x46' }],
    floors: [{ elevation: 4, levelId: 'first', Gk: 100, Qk: 40 }],
    cap: { Gk: capGk, Qk: 20 },
  });
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

  it('gives each stack its governing lift, utilisation and status', () => {
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

  it('takes the elevations of a cap and a support that sit on levels from the building levels', () => {
    const doc = stack(100);
    const tied = {
      edges: doc.edges,
      nodes: doc.nodes.map((n) =>
        n.kind === 'cap'
          ? { ...n, data: { ...n.data, levelId: 'roof' } }
          : n.kind === 'support'
            ? { ...n, data: { ...n.data, levelId: 'ground' } }
            : n,
      ),
    };
    const lifted = analyseBuilding([{ id: 'y', name: 'F/1', doc: tied }], { ...levels, ground: -0.5, roof: 8.6 }, {})
      .stacks[0].result;
    expect(lifted.errors).toEqual([]);
    expect(lifted.takeDown.map((r) => r.elevation)).toEqual([8.6, 4]);
    expect([lifted.lifts[0].bottom, lifted.lifts[0].top]).toEqual([-0.5, 8.6]);
    expect(lifted.lifts[0].pieces.map((p) => [p.from, p.to])).toEqual([
      [-0.5, 4],
      [4, 8.6],
    ]);
    // A level the building no longer has: the node keeps its own elevation, with a warning on it.
    const lost = analyseBuilding([{ id: 'z', name: 'G/1', doc: tied }], { first: 4 }, {}).stacks[0].result;
    expect(lost.lifts[0].top).toBe(8);
    expect(
      lost.warnings.filter((w) => /refers to a level the building no longer has/.test(w.message)).map((w) => w.message),
    ).toEqual([
      'Cap at +8.000 refers to a level the building no longer has; its own elevation is used',
      'Support at +0.000 refers to a level the building no longer has; its own elevation is used',
    ]);
  });

  it('has no worst stack when no stack has results', () => {
    expect(analyseBuilding([{ id: 9, name: 'E/1', doc: broken }], levels, {}).worstStackId).toBeNull();
    expect(analyseBuilding([], levels, {})).toEqual({ stacks: [], worstStackId: null });
  });
});
