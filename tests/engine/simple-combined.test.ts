import { describe, expect, it } from 'vitest';
import { checkCompression } from '../../shared/engine/checkCompression.ts';
import { EngineError } from '../../shared/engine/errors.ts';
import { reductionFactor } from '../../shared/engine/reductionFactor.ts';
import { sectionData } from '../../shared/engine/sectionData.ts';
import { checkSimpleColumn } from '../../shared/engine/simple/checkSimpleColumn.ts';
import { floorMoments } from '../../shared/engine/simple/floorMoments.ts';
import { lateralTorsionalReduction } from '../../shared/engine/simple/lateralTorsionalReduction.ts';
import { pieceMoments } from '../../shared/engine/simple/pieceMoments.ts';
import { DEFAULT_ANALYSIS_OPTIONS } from '../../shared/schema/results.ts';
import type { SectionDims } from '../../shared/schema/stack.ts';

const within = (actual: number, expected: number, tolerance = 0.01) =>
  expect(Math.abs(actual / expected - 1)).toBeLessThanOrEqual(tolerance);

// The method: NEd/Nb,min,Rd + My,Ed/Mb,Rd + 1.5·Mz,Ed/Mz,Rd ≤ 1 with λ̄LT = 0.9·λ̄z for rolled I/H columns and
// χLT by EN 1993-1-1 6.3.2.3 (NCCI SN048b, verification of columns in simple construction, a simplified
// interaction criterion; from memory).

describe('worked example: edge column in simple construction, UKC 254x254x73 S355 (within 1%)', () => {
  // Laid out as the column example of SCI P387 (steel building design: worked examples for students), from
  // memory; its published figures were not to hand, so the loads here are our own (invented) and every value
  // below is worked by hand with the EN 1993-1-1 formulas from the SCI P363 (steel building design: design
  // data) properties, from memory: A 93.1 cm², Iy 11 400 cm⁴, Iz 3 910 cm⁴, Wpl,y 992 cm³, Wpl,z 465 cm³,
  // h 254.1, tw 8.6 mm; fy 355 N/mm² (tf 14.2 ≤ 16, EN 10025-2); γM0 = γM1 = 1.0 (UK NA).
  // Storeys of 4.5 m either side of the floor, pinned: Lcr,y = Lcr,z = 4.5 m. NEd = 1500 kN below the floor.
  // Floor reactions, category A, EN 1990 6.10a/6.10b with ξ = 0.925 (UK NA):
  //   flange y+ (Gk 60, Qk 40), no beam on y−: Ry = 0.925·1.35·60 + 1.5·40 = 134.925 kN (6.10b)
  //   web z+ (Gk 30, Qk 20), z− (Gk 20, Qk 15): Rz = 0.925·1.35·10 + 1.5·20 = 42.4875 kN (6.10b)
  //   ey = 254.1/2 + 100 = 227.05 mm → My = 30.635 kN·m; ez = 8.6/2 + 100 = 104.3 mm → Mz = 4.4314 kN·m
  //   equal storeys and section above and below: ratio 1.0 ≤ 1.5 → My,Ed = 15.317, Mz,Ed = 2.2157 kN·m
  //   Ncr,z = π²·210000·3910e4/4500² = 4 001 942 N; λ̄z = √(9310·355/Ncr,z) = 0.9088; curve c:
  //   Φ = 1.0866, χz = 0.5945, Nb,z,Rd = 1964.7 kN (Nb,y,Rd = 2874.3 kN, curve b, λ̄y = 0.5322)
  //   λ̄LT = 0.9·0.9088 = 0.8179; curve b (h/b ≤ 2), λ̄LT,0 = 0.4, β = 0.75: ΦLT = 0.8219, χLT = 0.8072
  //   Mb,Rd = 0.8072·992e3·355 = 284.28 kN·m; Mz,Rd = 465e3·355 = 165.08 kN·m
  //   1500/1964.7 + 15.317/284.28 + 1.5·2.2157/165.08 = 0.7635 + 0.0539 + 0.0201 = 0.8375
  const section = 'UKC 254x254x73';
  const dims = sectionData(section).dims;
  const props = sectionData(section).props;
  const lifts = [{ bottom: 0, top: 9, dims, Iy: props.Iy, Iz: props.Iz }];
  const floors = [
    {
      nodeId: 'r1',
      elevation: 4.5,
      category: 'A' as const,
      faces: { yPlus: { Gk: 60, Qk: 40 }, zPlus: { Gk: 30, Qk: 20 }, zMinus: { Gk: 20, Qk: 15 } },
    },
  ];
  const [floor] = floorMoments(floors, lifts, 0, 9, DEFAULT_ANALYSIS_OPTIONS, '6.10b');
  const moments = pieceMoments(0, 4.5, [4.5], [floor]);
  const result = checkSimpleColumn({
    section,
    grade: 'S355',
    LcrY: 4500,
    LcrZ: 4500,
    NEdY: 1.5e6,
    NEdZ: 1.5e6,
    MyEd: moments.My * 1e6,
    MzEd: moments.Mz * 1e6,
  });

  it('finds the design reactions and the nominal moments at the floor', () => {
    within(floor.y.reaction.value, 134.925);
    within(floor.z.reaction.value, 42.4875);
    within(floor.y.M, 30.635);
    within(floor.z.M, 4.4314);
    expect(floor.y.share.rule).toBe('equal');
    within(moments.My, 15.317);
    within(moments.Mz, 2.2157);
  });

  it('finds Nb,z,Rd, χLT, Mb,Rd and Mz,Rd', () => {
    within(result.NbRdZ, 1_964_690);
    within(result.NbRdY, 2_874_273);
    within(result.lambdaBarLT, 0.8179);
    within(result.chiLT, 0.8072);
    within(result.MbRd, 284.28e6);
    within(result.MzRd, 165.08e6);
  });

  it('finds each term of the interaction and the utilisation', () => {
    within(result.axialTerm, 0.7635);
    within(result.majorTerm, 0.0539);
    within(result.minorTerm, 0.0201);
    within(result.utilisation, 0.8375);
  });

  it('writes every value into the working with a reference', () => {
    const symbols = result.steps.map((s) => s.symbol);
    for (const s of ['Nb,z,Rd', 'My,Ed', 'Mz,Ed', 'λ̄LT', 'χLT', 'Mb,Rd', 'Mz,Rd', 'utilisation'])
      expect(symbols).toContain(s);
    for (const step of result.steps) expect(step.clause.length).toBeGreaterThan(0);
    expect(result.steps.find((s) => s.symbol === 'Mb,Rd')?.clause).toBe('EN 1993-1-1 eq. 6.55');
  });
});

describe('checkSimpleColumn: handbook resistances and limits', () => {
  it('gives Mb,Rd = Mc,y,Rd when λ̄LT ≤ 0.4, matching the SCI P363 tabulation for UKC 254x254x73 S355', () => {
    // SCI P363 (steel building design: design data), from memory: Mc,y,Rd = 352 kN·m, Mc,z,Rd = 165 kN·m.
    // Lcr = 2.0 m: λ̄z = 0.404, λ̄LT = 0.364 ≤ 0.4 → χLT = 1 (EN 1993-1-1 6.3.2.3, 6.3.2.2(4))
    const r = checkSimpleColumn({
      section: 'UKC 254x254x73',
      grade: 'S355',
      LcrY: 2000,
      LcrZ: 2000,
      NEdY: 1e6,
      NEdZ: 1e6,
      MyEd: 0,
      MzEd: 0,
    });
    expect(r.chiLT).toBe(1);
    within(r.MbRd, 352e6, 0.005);
    within(r.MzRd, 165e6, 0.005);
  });

  it('reduces to NEd/Nb,min,Rd with no moments', () => {
    const c = checkCompression({ section: 'UKC 203x203x46', grade: 'S355', LcrY: 4000, LcrZ: 4000, NEd: 8e5 });
    const r = checkSimpleColumn({
      section: 'UKC 203x203x46',
      grade: 'S355',
      LcrY: 4000,
      LcrZ: 4000,
      NEdY: 8e5,
      NEdZ: 8e5,
      MyEd: 0,
      MzEd: 0,
    });
    expect(r.utilisation).toBeCloseTo(8e5 / Math.min(c.NbRdY, c.NbRdZ), 12);
  });

  it('uses Wel for a class 3 section (EN 1993-1-1 eq. 6.14)', () => {
    // UKC 305x305x97 is class 3 in S355 compression (flange c/tf = 8.6 > 10ε = 8.14); SCI P363 (from memory):
    // Wel,z = 479 cm³ → Mz,Rd = 479e3·355 = 170.0 kN·m
    const r = checkSimpleColumn({
      section: 'UKC 305x305x97',
      grade: 'S355',
      LcrY: 3000,
      LcrZ: 3000,
      NEdY: 1e6,
      NEdZ: 1e6,
      MyEd: 1e7,
      MzEd: 1e6,
    });
    within(r.MzRd, 170.0e6, 0.01);
  });

  it('refuses a class 4 section', () => {
    const slender: SectionDims = { shape: 'I', make: 'welded', h: 800, b: 300, tw: 8, tf: 20, r: 0 };
    expect(() =>
      checkSimpleColumn({
        section: slender,
        grade: 'S355',
        LcrY: 4000,
        LcrZ: 4000,
        NEdY: 1e6,
        NEdZ: 1e6,
        MyEd: 1e7,
        MzEd: 0,
      }),
    ).toThrow(/class 4/);
  });

  it('refuses a negative moment', () => {
    expect(() =>
      checkSimpleColumn({
        section: 'UKC 203x203x46',
        grade: 'S355',
        LcrY: 4000,
        LcrZ: 4000,
        NEdY: 1e5,
        NEdZ: 1e5,
        MyEd: -1,
        MzEd: 0,
      }),
    ).toThrow(EngineError);
  });
});

describe('lateralTorsionalReduction by section shape', () => {
  const ltbOf = (section: string, Lcr: number) => {
    const { dims, props } = sectionData(section);
    const c = checkCompression({ section, grade: 'S355', LcrY: Lcr, LcrZ: Lcr, NEd: 1e6 });
    return {
      ltb: lateralTorsionalReduction({
        dims,
        props,
        fy: c.fy,
        Wy: props.WplY,
        lambdaBarZ: c.lambdaBarZ,
        Lcr,
        annex: 'UK',
      }),
      c,
    };
  };

  it('takes χLT = 1 for square and circular hollow sections (EN 1993-1-1 6.3.2.1(2))', () => {
    expect(ltbOf('SHS 200x200x10', 8000).ltb.chiLT).toBe(1);
    expect(ltbOf('CHS 219.1x8.0', 8000).ltb.chiLT).toBe(1);
  });

  it('finds λ̄LT of a rectangular hollow section from Mcr of a closed section', () => {
    // RHS 300x200x10 (EN 10210-2, from memory: Iz 6 280 cm⁴, It 12 900 cm⁴, Wpl,y 956 cm³), L = 6.0 m, G = 80 769:
    // Mcr = (π/6000)·√(E·Iz·G·It) = 6137.7 kN·m; λ̄LT = √(956e3·355/Mcr) = 0.2351; Table 6.4 curve d (α 0.76):
    // ΦLT = 0.5[1 + 0.76·0.0351 + 0.0553] = 0.5410, χLT = 0.9725 (EN 1993-1-1 eq. 6.56)
    const { ltb } = ltbOf('RHS 300x200x10', 6000);
    within(ltb.lambdaBarLT, 0.2351);
    within(ltb.chiLT, 0.9725, 0.002);
  });

  it('keeps 0.9·λ̄z on the safe side of the elastic Mcr of a rolled column under uniform moment', () => {
    // EN 1993-1-1 6.3.2.2(2) with Mcr = π²EIz/L²·√(Iw/Iz + L²GIt/(π²EIz)), C1 = 1, SCI P363 properties for
    // UKC 254x254x73 (from memory: Iz 3 910 cm⁴, It 57.6 cm⁴, Iw 0.562 dm⁶): at 3.0, 4.5 and 6.0 m the elastic
    // λ̄LT is 0.529, 0.739 and 0.914 against 0.9·λ̄z = 0.545, 0.818 and 1.091
    for (const [L, elastic] of [
      [3000, 0.529],
      [4500, 0.739],
      [6000, 0.914],
    ] as const) {
      const { ltb } = ltbOf('UKC 254x254x73', L);
      expect(ltb.lambdaBarLT).toBeGreaterThan(elastic);
    }
  });

  it('uses λ̄LT = λ̄z and the general case with curve c for a welded I', () => {
    // EN 1993-1-1 6.3.2.2: with λ̄LT,0 = 0.2 and β = 1 eq. 6.56 is eq. 6.49 with αLT, Table 6.4 welded h/b ≤ 2: c
    const welded: SectionDims = { shape: 'I', make: 'welded', h: 400, b: 300, tw: 12, tf: 20, r: 0 };
    const { dims, props } = sectionData(welded);
    const c = checkCompression({ section: welded, grade: 'S355', LcrY: 5000, LcrZ: 5000, NEd: 1e6 });
    const ltb = lateralTorsionalReduction({
      dims,
      props,
      fy: c.fy,
      Wy: props.WplY,
      lambdaBarZ: c.lambdaBarZ,
      Lcr: 5000,
      annex: 'EN',
    });
    expect(ltb.lambdaBarLT).toBe(c.lambdaBarZ);
    expect(ltb.curve).toBe('c');
    expect(ltb.chiLT).toBeCloseTo(reductionFactor(c.lambdaBarZ, 'c'), 12);
  });
});
