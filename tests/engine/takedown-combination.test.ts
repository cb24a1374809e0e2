import { describe, expect, it } from 'vitest';
import { designAxialForce } from '../../shared/engine/stack/combination.ts';
import { psi0, xi } from '../../shared/engine/stack/combinationFactors.ts';
import { alphaN } from '../../shared/engine/stack/imposedReduction.ts';

describe('alphaN (reduction of imposed load for storeys)', () => {
  it('follows the UK National Annex steps: 1.1 − n/10 up to 5, 0.6 for 6 to 10, 0.5 above 10', () => {
    // UK National Annex to EN 1991-1-1, NA.2.6 (clause number from memory): 1.0, 0.9, 0.8, 0.7, 0.6, then 0.6 and 0.5
    const values = [1, 2, 3, 4, 5, 6, 10, 11, 40].map((n) => alphaN(n, 'UK', 'A'));
    expect(values[0]).toBe(1);
    expect(values.slice(1)).toEqual([0.9, 0.8, 0.7, 0.6, 0.6, 0.6, 0.5, 0.5].map((v) => expect.closeTo(v, 12)));
  });

  it('follows EN 1991-1-1 eq. 6.2, αn = (2 + (n − 2)ψ0)/n, and is 1 for two storeys or fewer', () => {
    // EN 1991-1-1 6.3.1.2(11), eq. 6.2 with ψ0 = 0.7 (EN 1990 Table A1.1)
    expect(alphaN(1, 'EN', 'B')).toBe(1);
    expect(alphaN(2, 'EN', 'B')).toBe(1);
    expect(alphaN(3, 'EN', 'B')).toBeCloseTo((2 + 1 * 0.7) / 3, 12); // 0.9
    expect(alphaN(5, 'EN', 'B')).toBeCloseTo((2 + 3 * 0.7) / 5, 12); // 0.82
    expect(alphaN(10, 'EN', 'B')).toBeCloseTo(0.76, 12); // (2 + 8 × 0.7)/10
  });

  it('refuses a storey count that is not a whole number', () => {
    expect(() => alphaN(2.5, 'UK', 'A')).toThrow(RangeError);
  });
});

describe('combination factors', () => {
  it('ψ0 is 0.7 for A–D, 1.0 for E, and for roofs 0 (EN) or 0.7 (UK)', () => {
    // EN 1990 Table A1.1; UK National Annex to EN 1990 Table NA.A1.1 for category H
    expect(['A', 'B', 'C', 'D'].map((c) => psi0(c as 'A', 'EN'))).toEqual([0.7, 0.7, 0.7, 0.7]);
    expect(psi0('E', 'UK')).toBe(1.0);
    expect(psi0('H', 'EN')).toBe(0);
    expect(psi0('H', 'UK')).toBe(0.7);
  });

  it('ξ is 0.85 recommended and 0.925 in the UK', () => {
    // EN 1990 Table A1.2(B) note; UK National Annex to EN 1990 Table NA.A1.2(B)
    expect(xi('EN')).toBe(0.85);
    expect(xi('UK')).toBe(0.925);
  });
});

describe('designAxialForce', () => {
  // ΣGk = 1000 kN; category A 400 kN from 4 loaded floors; roof (H) 50 kN from 1 level. γG 1.35, γQ 1.5
  // (EN 1990 Table A1.2(B)).
  const state = { sumGk: 1000, sumQk: { A: 400, H: 50 }, loadedLevels: { A: 4, H: 1 } };

  it('6.10a governs 6.10a/b with the UK annex', () => {
    // 6.10a  = 1.35·1000 + 1.5·0.7·400 + 1.5·0.7·50            = 1350 + 420 + 52.5      = 1822.5
    // 6.10b A = 0.925·1350 + 1.5·(0.7·400) + 1.5·0.7·50  (αn,UK(4) = 0.7) = 1248.75 + 420 + 52.5 = 1721.25
    // 6.10b H = 0.925·1350 + 1.5·50 + 1.5·0.7·400                = 1248.75 + 75 + 420     = 1743.75
    const force = designAxialForce(state, { combination: '6.10ab', annex: 'UK', imposedReduction: true });
    expect(force.NEd).toBeCloseTo(1822.5, 9);
    expect(force.combination).toBe('6.10a');
  });

  it('6.10 with the UK annex is led by the roof, because αn reduces a leading floor load', () => {
    // lead A: 1350 + 1.5·0.7·400 + 1.5·0.7·50 = 1822.5; lead H: 1350 + 1.5·50 + 1.5·0.7·400 = 1845
    const force = designAxialForce(state, { combination: '6.10', annex: 'UK', imposedReduction: true });
    expect(force.NEd).toBeCloseTo(1845, 9);
    expect(force.combination).toBe('6.10, leading H');
  });

  it('6.10 with the EN annex is led by the floors, the roof accompanying with ψ0 = 0', () => {
    // αn,EN(4) = (2 + 2·0.7)/4 = 0.85. lead A: 1350 + 1.5·0.85·400 + 0 = 1860; lead H: 1350 + 75 + 420 = 1845
    const force = designAxialForce(state, { combination: '6.10', annex: 'EN', imposedReduction: true });
    expect(force.NEd).toBeCloseTo(1860, 9);
    expect(force.leading).toBe('A');
  });

  it('6.10a/b with the EN annex takes ξ = 0.85 and roof ψ0 = 0', () => {
    // 6.10a = 1350 + 420 + 0 = 1770; 6.10b A = 0.85·1350 + 510 = 1657.5; 6.10b H = 1147.5 + 75 + 420 = 1642.5
    const force = designAxialForce(state, { combination: '6.10ab', annex: 'EN', imposedReduction: true });
    expect(force.NEd).toBeCloseTo(1770, 9);
  });

  it('without the reduction the leading floor load is taken in full', () => {
    // 6.10 UK, lead A: 1350 + 1.5·400 + 1.5·0.7·50 = 2002.5
    const force = designAxialForce(state, { combination: '6.10', annex: 'UK', imposedReduction: false });
    expect(force.NEd).toBeCloseTo(2002.5, 9);
  });

  it('never reduces a category E load, which is not in A–D', () => {
    // EN 1991-1-1 6.3.1.2(11) applies to A–D only: 6.10, lead E = 1.35·100 + 1.5·200 = 435 even with 3 levels
    const force = designAxialForce(
      { sumGk: 100, sumQk: { E: 200 }, loadedLevels: { E: 3 } },
      { combination: '6.10', annex: 'UK', imposedReduction: true },
    );
    expect(force.NEd).toBeCloseTo(435, 9);
  });

  it('takes only γG·Gk when no imposed load is present', () => {
    // EN 1990 eq. 6.10: 1.35·200 = 270; 6.10a = 270 and 6.10b = 0.925·270 so 6.10a governs
    expect(
      designAxialForce(
        { sumGk: 200, sumQk: {}, loadedLevels: {} },
        { combination: '6.10', annex: 'UK', imposedReduction: true },
      ).NEd,
    ).toBeCloseTo(270, 9);
    const ab = designAxialForce(
      { sumGk: 200, sumQk: {}, loadedLevels: {} },
      { combination: '6.10ab', annex: 'UK', imposedReduction: true },
    );
    expect(ab).toMatchObject({ NEd: expect.closeTo(270, 9), combination: '6.10a' });
  });

  it('treats each category as its own variable action, never applying αn to an accompanying one', () => {
    // UK 6.10, A 300 kN on 6 floors (αn 0.6), B 100 kN on 2 floors (αn 0.9), G 500:
    // lead A = 675 + 1.5·0.6·300 + 1.5·0.7·100 = 675 + 270 + 105 = 1050
    // lead B = 675 + 1.5·0.9·100 + 1.5·0.7·300 = 675 + 135 + 315 = 1125  → governs
    const force = designAxialForce(
      { sumGk: 500, sumQk: { A: 300, B: 100 }, loadedLevels: { A: 6, B: 2 } },
      { combination: '6.10', annex: 'UK', imposedReduction: true },
    );
    expect(force.NEd).toBeCloseTo(1125, 9);
    expect(force.leading).toBe('B');
  });
});
