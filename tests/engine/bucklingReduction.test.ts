import { describe, expect, it } from 'vitest';
import { bucklingCurve } from '../../shared/engine/bucklingCurve.ts';
import { EngineError } from '../../shared/engine/errors.ts';
import { imperfectionFactor } from '../../shared/engine/imperfectionFactor.ts';
import { reductionFactor } from '../../shared/engine/reductionFactor.ts';
import type { BucklingCurve } from '../../shared/schema/results.ts';
import type { SectionDims } from '../../shared/schema/stack.ts';

const CURVES: readonly BucklingCurve[] = ['a0', 'a', 'b', 'c', 'd'];

describe('imperfectionFactor', () => {
  it('gives the α of EN 1993-1-1 Table 6.1 for every curve', () => {
    // Source: EN 1993-1-1 Table 6.1
    expect(CURVES.map(imperfectionFactor)).toEqual([0.13, 0.21, 0.34, 0.49, 0.76]);
  });

  it('refuses an unknown curve with an engine error', () => {
    expect(() => imperfectionFactor('e' as BucklingCurve)).toThrow(EngineError);
  });
});

describe('reductionFactor', () => {
  // Source: the published tabulation of χ against λ̄ for the EN 1993-1-1 buckling curves
  // (Figure 6.4 / eq. 6.49), values to four decimals; from memory.
  const TABLE: ReadonlyArray<readonly [number, readonly [number, number, number, number, number]]> = [
    [0.3, [0.9859, 0.9775, 0.9641, 0.9491, 0.9235]],
    [0.4, [0.9701, 0.9528, 0.9261, 0.8973, 0.8504]],
    [0.5, [0.9513, 0.9243, 0.8842, 0.843, 0.7793]],
    [0.6, [0.9276, 0.89, 0.8371, 0.7854, 0.71]],
    [0.7, [0.8961, 0.8477, 0.7837, 0.7247, 0.6431]],
    [0.8, [0.8533, 0.7957, 0.7245, 0.6622, 0.5797]],
    [0.9, [0.7961, 0.7339, 0.6612, 0.5998, 0.5208]],
    [1.0, [0.7253, 0.6656, 0.597, 0.5399, 0.4671]],
  ];

  for (const [lambda, row] of TABLE) {
    it(`matches the published χ for curves a0, a, b, c, d at λ̄ = ${lambda}`, () => {
      CURVES.forEach((curve, i) => {
        expect(Math.abs(reductionFactor(lambda, curve) - row[i]!)).toBeLessThanOrEqual(0.00006);
      });
    });
  }

  it('reductionFactor(0.2, c) is exactly 1 on every curve (plateau, EN 1993-1-1 6.3.1.2)', () => {
    for (const curve of CURVES) expect(reductionFactor(0.2, curve)).toBe(1);
  });

  it('never exceeds 1 below the plateau', () => {
    for (const curve of CURVES) for (const l of [0, 0.05, 0.1, 0.19]) expect(reductionFactor(l, curve)).toBe(1);
  });

  it('stays below the elastic limit 1/λ̄² so that Nb,Rd never exceeds Ncr (Euler bound, common practice, no source)', () => {
    for (const curve of CURVES)
      for (const l of [1.2, 1.5, 2, 3, 4]) expect(reductionFactor(l, curve)).toBeLessThan(1 / (l * l));
  });

  it('orders the curves: a0 ≥ a ≥ b ≥ c ≥ d at any slenderness (EN 1993-1-1 Figure 6.4)', () => {
    for (const l of [0.3, 0.7, 1.1, 1.8, 2.6]) {
      const chis = CURVES.map((c) => reductionFactor(l, c));
      for (let i = 1; i < chis.length; i++) expect(chis[i]!).toBeLessThan(chis[i - 1]!);
    }
  });

  it('refuses a negative or non-finite slenderness with an engine error', () => {
    for (const bad of [-0.1, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => reductionFactor(bad, 'b')).toThrow(EngineError);
    }
  });
});

describe('bucklingCurve (EN 1993-1-1 Table 6.2)', () => {
  const rolled = (h: number, b: number, tf: number): SectionDims => ({
    shape: 'I',
    make: 'rolled',
    h,
    b,
    tw: 10,
    tf,
    r: 10,
  });

  it('rolled I with h/b > 1.2 and tf ≤ 40: a about y, b about z; a0 and a0 in S460', () => {
    expect(bucklingCurve(rolled(450, 190, 14.6), 'S355')).toMatchObject({ y: 'a', z: 'b' });
    expect(bucklingCurve(rolled(450, 190, 14.6), 'S420')).toMatchObject({ y: 'a', z: 'b' });
    expect(bucklingCurve(rolled(450, 190, 14.6), 'S460')).toMatchObject({ y: 'a0', z: 'a0' });
  });

  it('rolled I with h/b > 1.2 and 40 < tf ≤ 100: b and c; a and a in S460', () => {
    expect(bucklingCurve(rolled(1000, 300, 54), 'S275')).toMatchObject({ y: 'b', z: 'c' });
    expect(bucklingCurve(rolled(1000, 300, 54), 'S460')).toMatchObject({ y: 'a', z: 'a' });
  });

  it('rolled I with h/b ≤ 1.2 and tf ≤ 100: b and c; a and a in S460', () => {
    expect(bucklingCurve(rolled(203.2, 203.6, 11), 'S355')).toMatchObject({ y: 'b', z: 'c' });
    expect(bucklingCurve(rolled(474.6, 424, 77), 'S235')).toMatchObject({ y: 'b', z: 'c' });
    expect(bucklingCurve(rolled(203.2, 203.6, 11), 'S460')).toMatchObject({ y: 'a', z: 'a' });
  });

  it('rolled I with h/b ≤ 1.2 and tf > 100: d and d; c and c in S460', () => {
    expect(bucklingCurve(rolled(600, 500, 120), 'S355')).toMatchObject({ y: 'd', z: 'd' });
    expect(bucklingCurve(rolled(600, 500, 120), 'S460')).toMatchObject({ y: 'c', z: 'c' });
  });

  it('rolled I with h/b > 1.2 and tf > 100 has no row and is refused as unsupported', () => {
    expect(() => bucklingCurve(rolled(1200, 400, 110), 'S355')).toThrow(
      expect.objectContaining({ code: 'unsupported' }),
    );
  });

  it('welded I: b and c up to tf = 40, c and d above, for every grade', () => {
    const welded = (tf: number): SectionDims => ({ shape: 'I', make: 'welded', h: 500, b: 400, tw: 12, tf, r: 0 });
    expect(bucklingCurve(welded(40), 'S460')).toMatchObject({ y: 'b', z: 'c' });
    expect(bucklingCurve(welded(45), 'S355')).toMatchObject({ y: 'c', z: 'd' });
  });

  it('hollow sections: hot-finished a (a0 in S460), cold-formed c', () => {
    const shs = (make: 'hot-finished' | 'cold-formed'): SectionDims => ({ shape: 'RHS', make, h: 200, b: 200, t: 8 });
    const chs = (make: 'hot-finished' | 'cold-formed'): SectionDims => ({ shape: 'CHS', make, d: 219.1, t: 8 });
    expect(bucklingCurve(shs('hot-finished'), 'S355')).toMatchObject({ y: 'a', z: 'a' });
    expect(bucklingCurve(chs('hot-finished'), 'S460')).toMatchObject({ y: 'a0', z: 'a0' });
    expect(bucklingCurve(shs('cold-formed'), 'S460')).toMatchObject({ y: 'c', z: 'c' });
    expect(bucklingCurve(chs('cold-formed'), 'S275')).toMatchObject({ y: 'c', z: 'c' });
  });
});
