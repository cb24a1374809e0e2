// Structural edits as single commands (shared/ops/structuralEdits.ts): each is one batch of ops that
// leaves a valid stack, and the analysis of the result agrees with the stack built that way directly.
import { describe, expect, it } from 'vitest';
import { applyOps } from '../../shared/ops/applyOps.ts';
import {
  addFloorRestraintOps,
  joinLiftsOps,
  moveSpliceOps,
  splitLiftOps,
  StructuralEditError,
  type NewId,
} from '../../shared/ops/structuralEdits.ts';
import { analyseStack } from '../../shared/engine/stack/analyseStack.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { buildStack } from './stack-builder.ts';

function ids(): NewId {
  let n = 0;
  return (prefix) => `${prefix}-n${++n}`;
}

// Three storeys of 4 m, one lift, floors at +4 and +8 (demo data, invented).
const oneLift = (): StackDocument =>
  buildStack({
    lifts: [{ top: 12 }],
    floors: [
      { elevation: 4, Gk: 200, Qk: 80 },
      { elevation: 8, Gk: 200, Qk: 80 },
    ],
    cap: { Gk: 150, Qk: 30 },
  });

const liftsOf = (doc: StackDocument) => analyseStack(doc).lifts;

describe('split a lift at an elevation', () => {
  it('adds the splice and the upper lift in one batch; the result analyses like the stack built with a splice there', () => {
    const doc = oneLift();
    const { ops, spliceId, upperId } = splitLiftOps(doc, 'l1', 8.5, ids());
    const split = applyOps(doc, ops);
    const result = analyseStack(split);
    expect(result.errors).toEqual([]);
    expect(result.lifts.map((l) => [l.bottom, l.top])).toEqual([
      [0, 8.5],
      [8.5, 12],
    ]);
    expect(split.nodes.find((n) => n.id === spliceId)?.data).toEqual({ elevation: 8.5 });
    // The copied section is checked but flagged until confirmed
    expect(split.nodes.find((n) => n.id === upperId)?.data).toMatchObject({
      section: (doc.nodes[1].data as { section: unknown }).section,
      grade: 'S355',
      sectionStatus: 'to-confirm',
    });
    expect(result.warnings.map((w) => w.message)).toContain(
      'Lift L2: section copied from the lift it was split from; confirm it or pick another',
    );
    // Same numbers as the same stack built with two lifts directly
    const direct = buildStack({
      lifts: [{ top: 8.5 }, { top: 12 }],
      floors: [
        { elevation: 4, Gk: 200, Qk: 80 },
        { elevation: 8, Gk: 200, Qk: 80 },
      ],
      cap: { Gk: 150, Qk: 30 },
    });
    expect(result.lifts.map((l) => l.utilisation)).toEqual(liftsOf(direct).map((l) => l.utilisation));
  });

  it('moves a restraint above the new splice onto the upper lift', () => {
    const doc = oneLift();
    const { ops, upperId } = splitLiftOps(doc, 'l1', 6, ids());
    const split = applyOps(doc, ops);
    expect(split.edges.find((e) => e.source === 'r2')?.target).toBe(upperId);
    expect(split.edges.find((e) => e.source === 'r1')?.target).toBe('l1');
  });

  it('refuses an elevation outside the lift, or closer than 0.3 m to its ends, saying where it may go', () => {
    const doc = oneLift();
    expect(() => splitLiftOps(doc, 'l1', 12, ids())).toThrow(StructuralEditError);
    expect(() => splitLiftOps(doc, 'l1', 0.1, ids())).toThrow('The splice must be between +0.300 and +11.700 m');
  });
});

describe('join two lifts', () => {
  it('removes the splice and the upper lift, keeping the lower section and every restraint', () => {
    const doc = buildStack({
      lifts: [{ top: 5 }, { top: 12 }],
      floors: [
        { elevation: 4, Gk: 200 },
        { elevation: 8, Gk: 200 },
      ],
    });
    const { ops, liftId } = joinLiftsOps(doc, 'p1', ids());
    const joined = applyOps(doc, ops);
    const result = analyseStack(joined);
    expect(result.errors).toEqual([]);
    expect(liftId).toBe('l1');
    expect(result.lifts.map((l) => [l.liftId, l.bottom, l.top])).toEqual([['l1', 0, 12]]);
    expect(joined.edges.find((e) => e.source === 'r2')?.target).toBe('l1');
    expect(liftsOf(joined)[0].utilisation).toBe(
      liftsOf(
        buildStack({
          lifts: [{ top: 12 }],
          floors: [
            { elevation: 4, Gk: 200 },
            { elevation: 8, Gk: 200 },
          ],
        }),
      )[0].utilisation,
    );
  });

  it('split then join gives back the original analysis', () => {
    const doc = oneLift();
    const make = ids();
    const split = splitLiftOps(doc, 'l1', 6, make);
    const back = applyOps(applyOps(doc, split.ops), joinLiftsOps(applyOps(doc, split.ops), split.spliceId, make).ops);
    expect(analyseStack(back).lifts.map((l) => l.utilisation)).toEqual(liftsOf(doc).map((l) => l.utilisation));
  });
});

describe('move a splice', () => {
  it('changes its elevation and re-attaches restraints that change lift', () => {
    const doc = buildStack({ lifts: [{ top: 5 }, { top: 12 }], floors: [{ elevation: 4 }, { elevation: 8 }] });
    const moved = applyOps(doc, moveSpliceOps(doc, 'p1', 3.5, ids()));
    expect(analyseStack(moved).errors).toEqual([]);
    expect(analyseStack(moved).lifts.map((l) => [l.bottom, l.top])).toEqual([
      [0, 3.5],
      [3.5, 12],
    ]);
    expect(moved.edges.find((e) => e.source === 'r1')?.target).toBe('l2');
  });

  it('refuses to pass the next splice or the cap', () => {
    const doc = buildStack({ lifts: [{ top: 5 }, { top: 12 }] });
    expect(() => moveSpliceOps(doc, 'p1', 12, ids())).toThrow(StructuralEditError);
  });
});

describe('add a floor restraint at a level', () => {
  it('ties a new restraint to the level and to the lift that spans it', () => {
    const doc = buildStack({ lifts: [{ top: 5 }, { top: 12 }] });
    const { ops, restraintId } = addFloorRestraintOps(doc, { id: 'lv-2', name: 'Level 2', elevation: 8 }, ids());
    const withFloor = applyOps(doc, ops);
    expect(withFloor.nodes.find((n) => n.id === restraintId)?.data).toMatchObject({
      elevation: 8,
      levelId: 'lv-2',
      axes: 'both',
    });
    expect(withFloor.edges.find((e) => e.source === restraintId)?.target).toBe('l2');
    expect(analyseStack(withFloor).errors).toEqual([]);
  });

  it('refuses a second restraint at the same level', () => {
    const doc = buildStack({ lifts: [{ top: 12 }], floors: [{ elevation: 4 }] });
    expect(() => addFloorRestraintOps(doc, { id: 'lv-1', name: 'Level 1', elevation: 4 }, ids())).toThrow(
      'There is already a restraint at Level 1',
    );
  });
});

describe('a lift whose section was not chosen', () => {
  it('is refused by the analysis with a message naming it, not checked with a placeholder', () => {
    const doc = oneLift();
    const lift = doc.nodes.find((n) => n.id === 'l1');
    if (lift?.kind === 'lift') lift.data.sectionStatus = 'not-chosen';
    const result = analyseStack(doc);
    expect(result.lifts).toEqual([]);
    expect(result.errors).toEqual([
      { nodeId: 'l1', message: 'Lift L1: section not chosen; pick its section in the properties pane' },
    ]);
  });
});
