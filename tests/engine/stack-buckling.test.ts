import { describe, expect, it } from 'vitest';
import { analyseStack, bucklingLengthFactor } from '../../shared/engine/stack/index.ts';
import type { PieceCheck } from '../../shared/schema/results.ts';
import { buildStack } from './stack-builder.ts';

const pieces = (doc: Parameters<typeof analyseStack>[0], context = {}): PieceCheck[] => {
  const result = analyseStack(doc, {}, context);
  expect(result.errors).toEqual([]);
  return result.lifts.flatMap((l) => l.pieces);
};
const lengths = (list: PieceCheck[]) => list.map((p) => [p.from, p.to, p.LcrY, p.LcrZ]);

describe('bucklingLengthFactor', () => {
  // docs/analysis-rules.md §Buckling-length factors, after BS 5950-1 Table 22 (common design-office values for braced
  // columns; common practice)
  it.each([
    ['pinned', 'pinned', 1.0],
    ['pinned', 'partial', 1.0],
    ['partial', 'pinned', 1.0],
    ['partial', 'partial', 0.85],
    ['fixed', 'pinned', 0.85],
    ['pinned', 'fixed', 0.85],
    ['fixed', 'partial', 0.85],
    ['fixed', 'fixed', 0.7],
    ['fixed', 'free', 2.0],
  ] as const)('a segment from %s to %s has k = %d', (lower, upper, k) => {
    expect(bucklingLengthFactor(lower, upper)).toBe(k);
  });

  it('has no value for a free top above a lower end that is not fixed', () => {
    expect(bucklingLengthFactor('pinned', 'free')).toBeNull();
    expect(bucklingLengthFactor('partial', 'free')).toBeNull();
  });
});

describe('buckling lengths of a stack', () => {
  it('takes Lcr = 1.0 L between pinned ends', () => {
    expect(lengths(pieces(buildStack({ lifts: [{ top: 4 }], cap: { fixity: 'pinned' } })))).toEqual([[0, 4, 4, 4]]);
  });

  it('takes Lcr = 0.85 L with a fixed base and a pinned top, and 0.7 L with both ends fixed', () => {
    const fixedPinned = pieces(
      buildStack({ base: { fixity: 'fixed' }, lifts: [{ top: 4 }], cap: { fixity: 'pinned' } }),
    );
    expect(fixedPinned[0].LcrY).toBeCloseTo(3.4, 12); // 0.85 × 4
    const fixedFixed = pieces(buildStack({ base: { fixity: 'fixed' }, lifts: [{ top: 4 }], cap: { fixity: 'fixed' } }));
    expect(fixedFixed[0].LcrZ).toBeCloseTo(2.8, 12); // 0.7 × 4
  });

  it('takes Lcr = 0.85 L between partial ends and 1.0 L between a partial and a pinned end', () => {
    const doc = buildStack({
      base: { fixity: 'partial' },
      lifts: [{ top: 8 }],
      floors: [{ elevation: 4, fixity: 'partial' }],
      cap: { fixity: 'pinned' },
    });
    // 0–4: partial–partial 0.85 × 4 = 3.4; 4–8: partial–pinned 1.0 × 4 = 4
    expect(lengths(pieces(doc)).map((row) => row.map((v) => Math.round(v * 1e9) / 1e9))).toEqual([
      [0, 4, 3.4, 3.4],
      [4, 8, 4, 4],
    ]);
  });

  it('takes a free cap above a fixed base as a cantilever, Lcr = 2.0 L', () => {
    const doc = buildStack({ base: { fixity: 'fixed' }, lifts: [{ top: 3.5 }], cap: { fixity: 'free' } });
    expect(lengths(pieces(doc))).toEqual([[0, 3.5, 7, 7]]);
  });

  it('takes a free cap above a fixed restraint as a cantilever from that restraint', () => {
    const doc = buildStack({
      lifts: [{ top: 6 }],
      floors: [{ elevation: 4, fixity: 'fixed' }],
      cap: { fixity: 'free' },
    });
    // 0–4: pinned base to fixed restraint, 0.85 × 4 = 3.4; 4–6: cantilever 2.0 × 2 = 4
    const [low, top] = pieces(doc);
    expect(low.LcrY).toBeCloseTo(3.4, 12);
    expect(top).toMatchObject({ LcrY: 4, LcrZ: 4, kY: 2, kZ: 2 });
  });

  it('restrains only the minor axis at a restraint with axes z', () => {
    // Floors at +4.000 (z only) and +8.000 (both), pinned: y-y segment 0–8, z-z segments 0–4 and 4–8
    const doc = buildStack({ lifts: [{ top: 12 }], floors: [{ elevation: 4, axes: 'z', Gk: 200 }, { elevation: 8 }] });
    const list = pieces(doc);
    expect(lengths(list)).toEqual([
      [0, 4, 8, 4],
      [4, 8, 8, 4],
      [8, 12, 4, 4],
    ]);
    // About y the piece 4–8 is checked with the largest NEd of its y-y segment in the lift, the one at +0.000
    expect(list[1].NEdY).toBe(list[0].NEd);
    expect(list[1].NEdZ).toBe(list[1].NEd);
    expect(list[1].NEd).toBeLessThan(list[0].NEd);
  });

  it('restrains only the major axis at a restraint with axes y', () => {
    const doc = buildStack({ lifts: [{ top: 8 }], floors: [{ elevation: 4, axes: 'y' }] });
    expect(lengths(pieces(doc))).toEqual([
      [0, 4, 4, 8],
      [4, 8, 4, 8],
    ]);
  });

  it('lets a segment cross a splice, which is not a restraint point', () => {
    // Lifts 0–6 and 6–12 with restraints at +4.000 and +8.000: the segment 4–8 crosses the splice at +6.000
    const doc = buildStack({ lifts: [{ top: 6 }, { top: 12 }], floors: [{ elevation: 4 }, { elevation: 8 }] });
    const result = analyseStack(doc);
    const [l1, l2] = result.lifts;
    expect(lengths(l1.pieces)).toEqual([
      [0, 4, 4, 4],
      [4, 6, 4, 4],
    ]);
    expect(lengths(l2.pieces)).toEqual([
      [6, 8, 4, 4],
      [8, 12, 4, 4],
    ]);
    // Within each lift the segment's largest force is the one at that lift's part of it
    expect(l1.pieces[1].NEdY).toBe(l1.pieces[1].NEd);
    expect(l2.pieces[0].NEdY).toBe(l2.pieces[0].NEd);
    expect(l1.pieces[1].NEd).toBeGreaterThan(l2.pieces[0].NEd);
  });

  it('uses a lift override of k about one axis and keeps the table value about the other', () => {
    const doc = buildStack({ lifts: [{ top: 6, kY: 1.5 }, { top: 12 }], floors: [{ elevation: 4 }, { elevation: 8 }] });
    const [l1, l2] = analyseStack(doc).lifts;
    expect(l1.pieces.map((p) => [p.kY, p.LcrY, p.kZ, p.LcrZ])).toEqual([
      [1.5, 6, 1, 4],
      [1.5, 6, 1, 4],
    ]);
    // The lift above keeps k = 1.0 on the same segment
    expect(l2.pieces[0].LcrY).toBe(4);
  });

  it('cuts a lift at the building levels inside it', () => {
    const doc = buildStack({ lifts: [{ top: 8 }], floors: [{ elevation: 4 }] });
    const list = pieces(doc, { levels: { ground: 0, mezzanine: 2, first: 4, roof: 8 } });
    expect(list.map((p) => [p.from, p.to])).toEqual([
      [0, 2],
      [2, 4],
      [4, 8],
    ]);
    expect(list[1].LcrZ).toBe(4); // a level is not a restraint
  });
});
