// Typical columns (docs/typical-columns.md): one design at several grid positions, each with its own floor loads.
// The governing position is checked against an independent hand take-down of both positions, and sizing a
// type against the lightest passing assignment found by brute force.
import { describe, expect, it } from 'vitest';
import { stackFloorLoads } from '../../shared/engine/building/stackFloorLoads.ts';
import { governingPosition, positionResult } from '../../shared/engine/building/typicalColumn.ts';
import { applyFloorLoads } from '../../shared/engine/building/applyFloorLoads.ts';
import { analyseStack, sizeStack, sizeTypicalColumn, sizingCandidates } from '../../shared/engine/index.ts';
import type { StackPlacement } from '../../shared/schema/building.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { officeModel } from './building-model-fixtures.ts';
import { buildStack } from './stack-builder.ts';
import { accepted, request, withSections } from './sizing-helpers.ts';

// Levels: L0 +0.000 (base), L1 +4.000 … L5 +18.000, roof L6 +21.500 (as the six-storey take-down test).
const LEVELS = { L0: 0, L1: 4, L2: 7.5, L3: 11, L4: 14.5, L5: 18, L6: 21.5 };
const FLOORS = ['L1', 'L2', 'L3', 'L4', 'L5'] as const;
const model = officeModel({ floors: [...FLOORS], roof: 'L6' });
const OPTIONS = {
  combination: '6.10ab',
  annex: 'UK',
  imposedReduction: true,
  selfWeight: false,
  nominalMoments: false,
} as const;

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

const EDGE: StackPlacement = { gridX: 'A', gridY: 'y2', webAlong: 'x' };
const INNER: StackPlacement = { gridX: 'B', gridY: 'y2', webAlong: 'x' };
const loadsAt = (place: StackPlacement, key: string) => stackFloorLoads(model, place, key);
const resultAt = (doc: StackDocument, place: StackPlacement, key: string) =>
  analyseStack(doc, OPTIONS, { levels: LEVELS, floorLoads: loadsAt(place, key), shapeChecked: false });

/**
 * Independent hand working, as the six-storey test (UK NA to EN 1990: 6.10a and 6.10b with ξ = 0.925, ψ0 = 0.7
 * for B and H; UK NA to EN 1991-1-1: αn = 1.1 − n/10, αA = 1 − A/1000 ≥ 0.75, the smaller on the leading
 * imposed load only), for a column carrying `area` m² on each of the five office floors and the roof.
 * Office: gk 5.5, qk 3.5 kN/m² (B); roof: gk 4.0, qk 0.6 kN/m² (H).
 */
function handNEd(area: number, floorsAbove: number): number {
  const G = 4.0 * area + floorsAbove * 5.5 * area;
  const QB = floorsAbove * 3.5 * area;
  const QH = 0.6 * area;
  const alpha = Math.min(1.1 - floorsAbove / 10, Math.max(0.75, 1 - (floorsAbove * area) / 1000));
  const a = 1.35 * G + 1.5 * 0.7 * QB + 1.5 * 0.7 * QH; // EN 1990 eq. 6.10a
  const bLeadB = 0.925 * 1.35 * G + 1.5 * alpha * QB + 1.5 * 0.7 * QH; // eq. 6.10b, B leading
  const bLeadH = 0.925 * 1.35 * G + 1.5 * QH + 1.5 * 0.7 * QB; // eq. 6.10b, roof leading
  return Math.max(a, bLeadB, bLeadH);
}

describe('a type of two positions: A/2 on the edge and B/2 inside', () => {
  // Hand figures (grid of the fixtures: A 0, B 6, C 13.5; the slab runs 0.3 m beyond A; y lines 0, 7.5, 15):
  // A/2 carries (0.3 + 6/2) × (7.5/2 + 7.5/2) = 3.3 × 7.5 = 24.75 m² per level;
  // B/2 carries (6/2 + 7.5/2) × (7.5/2 + 7.5/2) = 6.75 × 7.5 = 50.625 m² per level.
  const EDGE_AREA = 24.75;
  const INNER_AREA = 50.625;
  const doc = sixStoreys();
  const edge = positionResult({ positionId: null, gridX: 'A', gridY: 'y2', name: 'A/2' }, resultAt(doc, EDGE, 'a'));
  const inner = positionResult({ positionId: 7, gridX: 'B', gridY: 'y2', name: 'B/2' }, resultAt(doc, INNER, 'b'));

  it('takes each position its own tributary area: six levels of 24.75 and of 50.625 m²', () => {
    expect(edge.area).toBeCloseTo(6 * EDGE_AREA, 9);
    expect(inner.area).toBeCloseTo(6 * INNER_AREA, 9);
  });

  it('gives each position the NEd of its own hand take-down at the bottom of every lift', () => {
    // Lifts from the bottom carry 5, 3 and 1 office floors and the roof.
    for (const [position, area] of [
      [edge, EDGE_AREA],
      [inner, INNER_AREA],
    ] as const) {
      expect(position.lifts.map((l) => l.NEd)).toEqual([
        expect.closeTo(handNEd(area, 5), 6),
        expect.closeTo(handNEd(area, 3), 6),
        expect.closeTo(handNEd(area, 1), 6),
      ]);
    }
    // The hand figure at the foot of the edge column: G = 4.0·24.75 + 5·5.5·24.75 = 779.625 kN,
    // QB = 5·3.5·24.75 = 433.125 kN, QH = 0.6·24.75 = 14.85 kN, α = min(0.6, 0.87625) = 0.6.
    // 6.10a: 1.35·779.625 + 1.05·(433.125 + 14.85) = 1522.8675 kN governs over
    // 6.10b, B leading: 0.925·1.35·779.625 + 1.5·0.6·433.125 + 1.05·14.85 = 1378.97 kN.
    expect(handNEd(EDGE_AREA, 5)).toBeCloseTo(1522.8675, 9);
    expect(edge.lifts[0]!.NEd).toBeCloseTo(1522.8675, 6);
  });

  it('names the position with the larger tributary area as governing', () => {
    expect(inner.utilisation!).toBeGreaterThan(edge.utilisation!);
    expect(governingPosition([edge, inner])?.name).toBe('B/2');
    expect(governingPosition([inner, edge])?.name).toBe('B/2');
  });

  it('names a position the design cannot be checked at ahead of any utilisation', () => {
    const broken = { ...edge, name: 'C/2', utilisation: null, status: 'errors' as const };
    expect(governingPosition([inner, broken])?.name).toBe('C/2');
  });
});

describe('sizing a type', () => {
  const doc = sixStoreys();
  const at = (place: StackPlacement, key: string) => applyFloorLoads(doc, loadsAt(place, key)).doc;
  const context = { levels: LEVELS };
  const rq = request({ noUpwardIncrease: false });

  it('sizes for the worst position: B/2 governs every lift, so the type takes B/2 alone’s sections', () => {
    const type = sizeTypicalColumn([at(EDGE, 'a'), at(INNER, 'b')], rq, OPTIONS, context);
    const inner = sizeStack(at(INNER, 'b'), rq, OPTIONS, context);
    const edge = sizeStack(at(EDGE, 'a'), rq, OPTIONS, context);
    expect(type.complete).toBe(true);
    expect(type.lifts.map((l) => l.after?.section)).toEqual(inner.lifts.map((l) => l.after?.section));
    expect(type.massAfter!).toBeGreaterThan(edge.massAfter!);
    // The proposal passes at both positions, analysed whole.
    for (const d of [at(EDGE, 'a'), at(INNER, 'b')]) {
      const r = analyseStack(accepted(d, type), OPTIONS, context);
      expect(Math.max(...r.lifts.map((l) => l.utilisation))).toBeLessThanOrEqual(1);
    }
  });
});

// Two positions of a three-lift design where each governs a different lift: P has heavy floors, Q a heavy roof.
const ALLOWED = [
  'UKC 152x152x23',
  'UKC 152x152x30',
  'UKC 152x152x37',
  'UKC 152x152x44',
  'UKC 203x203x46',
  'UKC 203x203x52',
  'UKC 254x254x73',
];
const MASS = new Map(sizingCandidates('UKC', ALLOWED).map((c) => [c.designation, c.massPerMetre]));
const LENGTHS = [3, 3, 7];
const position = (floorG: number, roofG: number) =>
  buildStack({
    lifts: [{ top: 3 }, { top: 6 }, { top: 13 }],
    floors: [3, 6, 9.5].map((elevation) => ({ elevation, Gk: floorG, Qk: floorG / 2, category: 'B' as const })),
    cap: { Gk: roofG, Qk: roofG / 4, category: 'H' },
  });
// Alone, P takes 203x203x46 | 152x152x44 | 152x152x30 and Q 152x152x44 on every lift (bottom first).
const P = position(220, 50);
const Q = position(30, 500);

describe.each([false, true])('sizing a type by brute force, no upward increase %s', (noUpwardIncrease) => {
  const worstOf = (sections: string[]) =>
    Math.max(...[P, Q].flatMap((d) => analyseStack(withSections(d, sections)).lifts.map((l) => l.utilisation)));
  const mass = (sections: readonly string[]) => sections.reduce((s, d, i) => s + MASS.get(d)! * LENGTHS[i]!, 0);
  const keeps = (s: readonly string[]) =>
    !noUpwardIncrease || (MASS.get(s[1])! <= MASS.get(s[0])! && MASS.get(s[2])! <= MASS.get(s[1])!);
  let best: { sections: string[]; mass: number } | null = null;
  for (const a of ALLOWED)
    for (const b of ALLOWED)
      for (const c of ALLOWED) {
        const sections = [a, b, c];
        if (!keeps(sections) || worstOf(sections) > 1) continue;
        if (!best || mass(sections) < best.mass - 1e-9) best = { sections, mass: mass(sections) };
      }
  const sizing = sizeTypicalColumn([P, Q], request({ noUpwardIncrease, allowed: ALLOWED }));
  const proposed = sizing.lifts.map((l) => l.after?.section ?? '');

  it('is as light as the lightest assignment passing at both positions, and passes at both', () => {
    expect(best).not.toBeNull();
    expect(worstOf(proposed)).toBeLessThanOrEqual(1);
    expect(mass(proposed)).toBeCloseTo(best!.mass, 9);
  });

  it('is heavier than sizing either position alone, since each governs a lift', () => {
    const alone = [P, Q].map((d) => sizeStack(d, request({ noUpwardIncrease, allowed: ALLOWED })).massAfter!);
    expect(sizing.massAfter!).toBeGreaterThan(Math.max(...alone));
  });
});
