// The checking engineer's second, independent working of docs/analysis-rules.md on invented stacks: the take-down by
// EN 1990 eq. 6.10 / 6.10a / 6.10b (Table A1.1 ψ0, Table A1.2(B) γ and ξ; UK NA Table NA.A1.1 and
// NA.A1.2(B)), αn on the leading action only (EN 1991-1-1 eq. 6.2; UK NA to EN 1991-1-1 NA.2.6), the
// buckling-length factors of docs/analysis-rules.md §Buckling-length factors over segments that cross splices, and
// the piece rule of docs/analysis-rules.md §Pieces. It is written from the clauses, not from the engine's modules;
// only the member check is shared.
import { describe, expect, it } from 'vitest';
import { findSection } from '../../shared/catalogue/index.ts';
import { checkCompression } from '../../shared/engine/checkCompression.ts';
import { sectionProperties } from '../../shared/engine/sectionProperties.ts';
import { analyseStack } from '../../shared/engine/stack/index.ts';
import type { AnalysisOptions } from '../../shared/schema/results.ts';
import type { Axes, Category, Fixity, Grade } from '../../shared/schema/stack.ts';
import { buildStack, type FloorSpec, type LiftSpec } from './stack-builder.ts';

type Annex = AnalysisOptions['annex'];
interface Entry {
  elevation: number;
  Gk: number;
  Qk: number;
  category: Category;
}
interface Point {
  elevation: number;
  fixity: Fixity | 'free';
}

/** EN 1990 Table A1.1; UK NA Table NA.A1.1 gives roofs 0.7. */
const psi0 = (c: Category, annex: Annex) => (c === 'E' ? 1.0 : c === 'H' ? (annex === 'UK' ? 0.7 : 0) : 0.7);

/** EN 1991-1-1 eq. 6.2 (n > 2), UK NA NA.2.6 steps. */
function alphaN(n: number, annex: Annex): number {
  if (annex === 'UK') return n <= 5 ? 1.1 - n / 10 : n <= 10 ? 0.6 : 0.5;
  return n > 2 ? (2 + (n - 2) * 0.7) / n : 1;
}

/** docs/analysis-rules.md §Buckling-length factors (design-office values, BS 5950-1 Table 22, EN 1993 design aids). */
function kFactor(lower: Fixity | 'free', upper: Fixity | 'free'): number {
  if (upper === 'free') return 2.0;
  const ends = [lower, upper].sort().join('–');
  const table: Record<string, number> = {
    'pinned–pinned': 1.0,
    'partial–pinned': 1.0,
    'partial–partial': 0.85,
    'fixed–pinned': 0.85,
    'fixed–partial': 0.85,
    'fixed–fixed': 0.7,
  };
  return table[ends]!;
}

/** Design force just above elevation z (loads entering at z excluded), kN. */
function designForce(z: number, entries: readonly Entry[], weightAbove: number, o: AnalysisOptions): number {
  let G = weightAbove;
  const Q = new Map<Category, number>();
  const n = new Map<Category, number>();
  for (const e of entries) {
    if (e.elevation <= z + 1e-9) continue;
    G += e.Gk;
    if (e.Qk > 0) {
      Q.set(e.category, (Q.get(e.category) ?? 0) + e.Qk);
      n.set(e.category, (n.get(e.category) ?? 0) + 1);
    }
  }
  const reduced = (c: Category) => (o.imposedReduction && 'ABCD'.includes(c) ? alphaN(n.get(c)!, o.annex) : 1);
  const withLeading = (permanent: number) => {
    let best = permanent;
    for (const [lead, q] of Q) {
      let value = permanent + 1.5 * reduced(lead) * q;
      for (const [c, other] of Q) if (c !== lead) value += 1.5 * psi0(c, o.annex) * other;
      best = Math.max(best, value);
    }
    return best;
  };
  if (o.combination === '6.10') return withLeading(1.35 * G); // EN 1990 eq. 6.10
  let a = 1.35 * G; // EN 1990 eq. 6.10a
  for (const [c, q] of Q) a += 1.5 * psi0(c, o.annex) * q;
  return Math.max(a, withLeading((o.annex === 'UK' ? 0.925 : 0.85) * 1.35 * G)); // EN 1990 eq. 6.10b
}

// Small deterministic generator so that the invented stacks are the same on every run.
function generator(seed: number) {
  let s = seed;
  const next = () => (s = (s * 1103515245 + 12345) % 2147483648) / 2147483648;
  return { next, pick: <T>(items: readonly T[]): T => items[Math.floor(next() * items.length)]! };
}

const SECTIONS = [
  'UKC 203x203x46',
  'UKC 254x254x89',
  'UKC 305x305x118',
  'HE 300 B',
  'SHS 200x200x10',
  'UKC 356x368x129',
];
const FIXITIES: readonly Fixity[] = ['pinned', 'partial', 'fixed'];

describe('analyseStack against an independent hand working of the analysis rules (invented stacks)', () => {
  it('gives the same NEd, buckling lengths, segment forces and utilisation on every piece of 150 stacks', () => {
    const g = generator(20251201);
    let compared = 0;
    for (let trial = 0; trial < 150; trial++) {
      const storeys = 2 + Math.floor(g.next() * 12);
      const h = 3 + Math.round(g.next() * 20) / 10;
      const top = +(storeys * h).toFixed(3);
      const floors: FloorSpec[] = [];
      for (let i = 1; i < storeys; i++) {
        floors.push({
          elevation: +(i * h).toFixed(3),
          Gk: Math.round(g.next() * 200),
          Qk: g.next() < 0.2 ? 0 : Math.round(g.next() * 100),
          category: g.pick<Category>(['A', 'B', 'C', 'D', 'E', 'A', 'B']),
          axes: g.pick<Axes>(['both', 'both', 'both', 'y', 'z']),
          fixity: g.pick(FIXITIES),
        });
      }
      const liftCount = 1 + Math.floor(g.next() * 3);
      const lifts: LiftSpec[] = [];
      for (let i = 1; i <= liftCount; i++) {
        const liftTop = i === liftCount ? top : +(Math.round((storeys * i) / liftCount) * h + 0.6).toFixed(3);
        if (liftTop >= top - 0.1 && i !== liftCount) continue;
        if (lifts.length && liftTop <= lifts[lifts.length - 1]!.top + 0.1) continue;
        lifts.push({ top: liftTop, section: g.pick(SECTIONS), grade: g.pick<Grade>(['S275', 'S355', 'S460']) });
      }
      const baseFixity = g.pick(FIXITIES);
      const capFixity: Fixity | 'free' = g.next() < 0.15 ? 'free' : g.pick(FIXITIES);
      const cap = {
        fixity: capFixity,
        Gk: Math.round(g.next() * 100),
        Qk: Math.round(g.next() * 30),
        category: g.pick<Category>(['H', 'H', 'A']),
      };
      const options: AnalysisOptions = {
        annex: g.pick<Annex>(['UK', 'EN']),
        combination: g.pick<AnalysisOptions['combination']>(['6.10', '6.10ab']),
        imposedReduction: g.next() < 0.8,
        selfWeight: g.next() < 0.7,
      };
      const result = analyseStack(buildStack({ base: { fixity: baseFixity }, lifts, floors, cap }), options);
      if (result.errors.length) {
        // Only a free cap above a lower end that is not fixed may be refused
        // (docs/analysis-rules.md §Buckling-length factors)
        expect(capFixity).toBe('free');
        continue;
      }

      const entries: Entry[] = [
        ...floors.map((f) => ({ elevation: f.elevation, Gk: f.Gk ?? 0, Qk: f.Qk ?? 0, category: f.category ?? 'A' })),
        { elevation: top, Gk: cap.Gk, Qk: cap.Qk, category: cap.category },
      ];
      // Self-weight: section mass × 9.81 N/kg on the column below (docs/analysis-rules.md §Take-down)
      let bottom = 0;
      const weights = lifts.map((l) => {
        const perMetre = options.selfWeight
          ? (sectionProperties(findSection(l.section as string)!.dims).massPerMetre * 9.81) / 1000
          : 0;
        const w = { bottom, top: l.top, perMetre };
        bottom = l.top;
        return w;
      });
      const weightAbove = (z: number) =>
        weights.reduce((s, w) => s + (w.top > z ? w.perMetre * (w.top - Math.max(z, w.bottom)) : 0), 0);
      // The force below a floor is never less than above it (DEVELOPERS.md, engine conventions: αn steps)
      const NEdAt = (z: number) =>
        Math.max(
          designForce(z, entries, weightAbove(z), options),
          ...entries
            .filter((e) => e.elevation > z)
            .map((e) => designForce(e.elevation + 1e-7, entries, weightAbove(e.elevation), options)),
        );
      const points = (axis: 'y' | 'z'): Point[] => [
        { elevation: 0, fixity: baseFixity },
        ...floors
          .filter((f) => f.axes === 'both' || f.axes === axis)
          .map((f) => ({ elevation: f.elevation, fixity: f.fixity ?? 'pinned' })),
        { elevation: top, fixity: capFixity },
      ];
      const segmentOf = (axis: 'y' | 'z', middle: number) => {
        const p = points(axis);
        const i = p.findIndex((q, j) => j > 0 && q.elevation >= middle);
        return { lower: p[i - 1]!, upper: p[i]! };
      };

      result.lifts.forEach((lift, i) => {
        const spec = lifts[i]!;
        for (const piece of lift.pieces) {
          const middle = (piece.from + piece.to) / 2;
          const sy = segmentOf('y', middle);
          const sz = segmentOf('z', middle);
          const LcrY = kFactor(sy.lower.fixity, sy.upper.fixity) * (sy.upper.elevation - sy.lower.elevation);
          const LcrZ = kFactor(sz.lower.fixity, sz.upper.fixity) * (sz.upper.elevation - sz.lower.elevation);
          // docs/analysis-rules.md §Pieces: the largest NEd of the lift's pieces inside the same segment
          const inSegment = (s: { lower: Point; upper: Point }) =>
            Math.max(
              ...lift.pieces
                .filter((q) => (q.from + q.to) / 2 > s.lower.elevation && (q.from + q.to) / 2 < s.upper.elevation)
                .map((q) => NEdAt(q.from)),
            );
          const NEd = NEdAt(piece.from);
          const NEdY = inSegment(sy);
          const NEdZ = inSegment(sz);
          const check = checkCompression(
            {
              section: spec.section!,
              grade: spec.grade!,
              LcrY: LcrY * 1000,
              LcrZ: LcrZ * 1000,
              NEd: Math.max(NEdY, NEdZ) * 1000,
              annex: options.annex,
            },
            { steps: false },
          );
          const utilisation = Math.max(
            (NEd * 1000) / check.NcRd,
            (NEdY * 1000) / check.NbRdY,
            (NEdZ * 1000) / check.NbRdZ,
          );
          expect(piece.NEd).toBeCloseTo(NEd, 6);
          expect(piece.NEdY).toBeCloseTo(NEdY, 6);
          expect(piece.NEdZ).toBeCloseTo(NEdZ, 6);
          expect(piece.LcrY).toBeCloseTo(LcrY, 9);
          expect(piece.LcrZ).toBeCloseTo(LcrZ, 9);
          expect(piece.utilisation).toBeCloseTo(utilisation, 9);
          compared++;
        }
      });
    }
    expect(compared).toBeGreaterThan(500);
  });
});
