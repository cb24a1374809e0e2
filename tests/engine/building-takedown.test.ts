// Acceptance: a six-storey stack loaded from the building's floors gives the NEd of an independent hand
// take-down from the same areas and loads, and the nominal-moment check runs from derived face reactions.
import { describe, expect, it } from 'vitest';
import { stackFloorLoads } from '../../shared/engine/building/stackFloorLoads.ts';
import { analyseStack } from '../../shared/engine/stack/analyseStack.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { officeModel } from './building-model-fixtures.ts';
import { buildStack } from './stack-builder.ts';

// Levels: L0 +0.000 (base), L1 +4.000, L2 +7.500, L3 +11.000, L4 +14.500, L5 +18.000, roof L6 +21.500.
const LEVELS = { L0: 0, L1: 4, L2: 7.5, L3: 11, L4: 14.5, L5: 18, L6: 21.5 };
const FLOORS = ['L1', 'L2', 'L3', 'L4', 'L5'] as const;

/** Three lifts spliced 0.5 m above L2 and L4; every floor and the cap sit on their levels; no load typed. */
function sixStoreys(): StackDocument {
  const doc = buildStack({
    lifts: [
      { top: 8, section: 'UKC 305x305x118' },
      { top: 15, section: 'UKC 254x254x89' },
      { top: 21.5, section: 'UKC 203x203x60' },
    ],
    floors: FLOORS.map((levelId, i) => ({ id: `r${i + 1}`, elevation: LEVELS[levelId], levelId, Gk: 0, Qk: 0 })),
  });
  return { ...doc, nodes: doc.nodes.map((n) => (n.kind === 'cap' ? { ...n, data: { ...n.data, levelId: 'L6' } } : n)) };
}

const model = officeModel({ floors: [...FLOORS], roof: 'L6' });
const OPTIONS = {
  combination: '6.10ab',
  annex: 'UK',
  imposedReduction: true,
  selfWeight: false,
  nominalMoments: false,
} as const;

/**
 * Independent hand working (UK NA to EN 1990: 6.10a and 6.10b with ξ = 0.925; ψ0 = 0.7 for B and for roofs H;
 * UK NA to EN 1991-1-1: αn = 1.1 − n/10 up to 5 storeys, αA = 1 − A/1000 ≥ 0.75, the smaller of the two on
 * the leading imposed load only). Area of B/2 on every level: (3 + 3.75)(3.75 + 3.75) = 50.625 m².
 * Each floor: Gk = 5.5 × 50.625 = 278.4375 kN, Qk(B) = 3.5 × 50.625 = 177.1875 kN.
 * Roof: Gk = 4.0 × 50.625 = 202.5 kN, Qk(H) = 0.6 × 50.625 = 30.375 kN.
 */
function handNEd(floorsAbove: number): number {
  const G = 202.5 + floorsAbove * 278.4375;
  const QB = floorsAbove * 177.1875;
  const QH = 30.375;
  const alphaN = 1.1 - floorsAbove / 10;
  const alphaA = Math.max(0.75, 1 - (floorsAbove * 50.625) / 1000);
  const alpha = Math.min(alphaN, alphaA);
  const a = 1.35 * G + 1.5 * 0.7 * QB + 1.5 * 0.7 * QH; // eq. 6.10a
  const bLeadB = 0.925 * 1.35 * G + 1.5 * alpha * QB + 1.5 * 0.7 * QH; // eq. 6.10b, B leading
  const bLeadH = 0.925 * 1.35 * G + 1.5 * QH + 1.5 * 0.7 * QB; // eq. 6.10b, roof leading
  return Math.max(a, bLeadB, bLeadH);
}

describe('a six-storey stack loaded from the floors', () => {
  const floorLoads = stackFloorLoads(model, { gridX: 'B', gridY: 'y2', webAlong: 'x' }, 1);
  const result = analyseStack(sixStoreys(), OPTIONS, { levels: LEVELS, floorLoads, shapeChecked: false });

  it('has no errors and reports the loads it took from each level', () => {
    expect(result.errors).toEqual([]);
    expect(result.floorLoads?.map((u) => [u.nodeId, u.levelId])).toEqual([
      ['c', 'L6'],
      ['r1', 'L1'],
      ['r2', 'L2'],
      ['r3', 'L3'],
      ['r4', 'L4'],
      ['r5', 'L5'],
    ]);
  });

  it('gives the hand take-down NEd at the bottom of every lift', () => {
    // Lift 3 (+15.000 to +21.500) carries the roof and L5: 1 floor, αA = 0.949375 < αn = 1.0 → 884.7905 kN
    // Lift 2 (+8.000 to +15.000) carries the roof, L5, L4, L3: 3 floors, αn = 0.8 < αA = 0.848125
    // Lift 1 (+0.000 to +8.000) carries the roof and all 5 floors: αn = 0.6 < αA = 0.75
    const [l1, l2, l3] = result.lifts;
    const bottomNEd = (lift: typeof l1) => Math.max(...lift.pieces.map((p) => p.NEd));
    expect(handNEd(1)).toBeCloseTo(884.79052734375, 9);
    expect(bottomNEd(l3)).toBeCloseTo(handNEd(1), 6);
    expect(bottomNEd(l2)).toBeCloseTo(handNEd(3), 6);
    expect(bottomNEd(l1)).toBeCloseTo(handNEd(5), 6);
  });

  it('leaves the stored document as it was: derived loads are not copied into it', () => {
    const doc = sixStoreys();
    analyseStack(doc, OPTIONS, { levels: LEVELS, floorLoads });
    expect(
      doc.nodes
        .filter((n) => n.kind === 'restraint')
        .every((n) => n.kind === 'restraint' && n.data.Gk === 0 && !n.data.faces),
    ).toBe(true);
  });

  it('keeps a restraint whose loads were set by hand, and says what the floor would give', () => {
    const doc = sixStoreys();
    const byHand: StackDocument = {
      ...doc,
      nodes: doc.nodes.map((n) =>
        n.id === 'r5' && n.kind === 'restraint' ? { ...n, data: { ...n.data, Gk: 500, Qk: 0, loadsByHand: true } } : n,
      ),
    };
    const r = analyseStack(byHand, OPTIONS, { levels: LEVELS, floorLoads });
    const row = r.takeDown.find((t) => t.nodeId === 'r5')!;
    expect(row.Gk).toBe(500);
    expect(r.floorLoads?.find((u) => u.nodeId === 'r5')).toMatchObject({
      byHand: true,
      Gk: expect.closeTo(278.4375, 9),
    });
  });
});

describe('nominal moments from derived face reactions', () => {
  // Edge column D/2 with cladding on D: more load on the web faces than balance, and the −x flange face
  // loaded with nothing on +x beyond the cantilever's share, so the faces are out of balance both ways.
  const edgeModel = officeModel({ floors: [...FLOORS], roof: 'L6' }, [
    { gridLineId: 'D', label: 'Cladding', gk: 8, qk: 0 },
  ]);
  const floorLoads = stackFloorLoads(edgeModel, { gridX: 'D', gridY: 'y2', webAlong: 'x' }, 2);
  const withMoments = { ...OPTIONS, nominalMoments: true };

  it('runs the combined check with no reaction typed by hand', () => {
    const r = analyseStack(sixStoreys(), withMoments, { levels: LEVELS, floorLoads });
    expect(r.errors).toEqual([]);
    // The derived faces add up to the derived totals, so no restraint is warned about its faces
    expect(r.warnings.filter((w) => w.message.includes('face reactions'))).toEqual([]);
    expect(r.lifts.some((l) => l.pieces.some((p) => p.combined && p.combined.MyEd > 0))).toBe(true);
  });

  it('gives exactly the results of the same faces typed on every restraint and the cap', () => {
    const typed = sixStoreys();
    const byLevel = (levelId: string | undefined) => (levelId ? floorLoads.get(levelId) : undefined);
    const handDoc: StackDocument = {
      ...typed,
      nodes: typed.nodes.map((n) => {
        if (n.kind !== 'restraint' && n.kind !== 'cap') return n;
        const f = byLevel(n.data.levelId)!;
        return {
          ...n,
          data: { ...n.data, Gk: f.Gk, Qk: f.Qk, category: f.category, faces: f.faces, loadsByHand: true },
        } as typeof n;
      }),
    };
    // Without imposed-load reduction: αA needs the floor area, which loads typed by hand do not carry.
    const plain = { ...withMoments, imposedReduction: false };
    const derived = analyseStack(typed, plain, { levels: LEVELS, floorLoads });
    const hand = analyseStack(handDoc, plain, { levels: LEVELS, floorLoads });
    expect(derived.lifts.some((l) => l.governing === 'combined')).toBe(true);
    expect(hand.lifts).toEqual(derived.lifts);
  });
});
