// Splice, base and tie checks against EN clauses and published tabulations, worked by hand below.
import { describe, expect, it } from 'vitest';
import {
  boltShearResistance,
  boltTensionResistance,
  holeDiameter,
  packingReduction,
} from '../../shared/engine/connections/boltResistance.ts';
import { checkBasePlate } from '../../shared/engine/connections/checkBasePlate.ts';
import { designCompressiveStrength } from '../../shared/engine/connections/concreteStrength.ts';
import { effectiveBearingArea, widthForArea } from '../../shared/engine/connections/effectiveBearingArea.ts';
import { plateTension } from '../../shared/engine/connections/plateTension.ts';
import { spliceTensionResistance } from '../../shared/engine/connections/checkSpliceTension.ts';
import { spliceFit } from '../../shared/engine/connections/spliceFit.ts';
import { needsVerticalTies, verticalTieForce } from '../../shared/engine/connections/tieForce.ts';
import { sectionData } from '../../shared/engine/sectionData.ts';
import { UKC_254_73 } from './stack-builder.ts';

describe('bolt resistance, EN 1993-1-8 Table 3.4', () => {
  it('gives Ft,Rd = k2·fub·As/γM2 with k2 = 0.9, γM2 = 1.25', () => {
    // M20 8.8: 0.9 × 800 × 245 / 1.25 = 141 120 N
    expect(boltTensionResistance(20, '8.8')).toBeCloseTo(141_120, 6);
    // M16 10.9: 0.9 × 1000 × 157 / 1.25 = 113 040 N
    expect(boltTensionResistance(16, '10.9')).toBeCloseTo(113_040, 6);
    // M36 8.8: 0.9 × 800 × 817 / 1.25 = 470 592 N
    expect(boltTensionResistance(36, '8.8')).toBeCloseTo(470_592, 6);
  });

  it('matches the published tabulation of bolt resistances for class 8.8 (SCI P363 bolt tables, from memory)', () => {
    // Tension resistance: M16 90.4 kN, M20 141 kN, M24 203 kN, M30 323 kN; single shear through the thread: M20 94.1 kN
    expect(boltTensionResistance(16, '8.8') / 1e3).toBeCloseTo(90.4, 1);
    expect(boltTensionResistance(20, '8.8') / 1e3).toBeCloseTo(141, 0);
    expect(boltTensionResistance(24, '8.8') / 1e3).toBeCloseTo(203, 0);
    expect(boltTensionResistance(30, '8.8') / 1e3).toBeCloseTo(323, 0);
    expect(boltShearResistance(20, '8.8') / 1e3).toBeCloseTo(94.1, 1);
  });

  it('gives Fv,Rd with αv = 0.6 for 8.8 and 0.5 for 10.9 through the thread', () => {
    // M24 10.9: 0.5 × 1000 × 353 / 1.25 = 141 200 N
    expect(boltShearResistance(24, '10.9')).toBeCloseTo(141_200, 6);
  });

  it('reduces bolts through packs thicker than d/3 by βp = 9d/(8d + 3tp) (EN 1993-1-8 eq. 3.3)', () => {
    // d = 20, tp = 10 > 6.67: 180 / (160 + 30) = 0.947368…
    expect(packingReduction(20, 10)).toBeCloseTo(180 / 190, 10);
    expect(packingReduction(20, 6)).toBe(1);
  });

  it('takes normal clearance holes (EN 1090-2 Table 11, from memory)', () => {
    expect([holeDiameter(12), holeDiameter(20), holeDiameter(24), holeDiameter(27)]).toEqual([13, 22, 26, 30]);
  });
});

describe('cover plates in tension, EN 1993-1-1 6.2.3', () => {
  it('takes the lesser of Npl,Rd = A·fy/γM0 and Nu,Rd = 0.9·Anet·fu/γM2', () => {
    // 250 × 15 S275 (UK: fy 275 N/mm² to 16 mm, fu 410 N/mm², EN 10025-2 Table 7), two 22 mm holes:
    // A = 3750 mm², Npl,Rd = 3750 × 275 = 1 031 250 N; Anet = (250 − 44) × 15 = 3090 mm²,
    // Nu,Rd = 0.9 × 3090 × 410 / 1.25 = 912 168 N
    const p = plateTension(250, 15, 'S275', 2, 22, 'UK');
    expect(p.NplRd).toBeCloseTo(1_031_250, 6);
    expect(p.NuRd).toBeCloseTo(912_168, 6);
    expect(p.NtRd).toBeCloseTo(912_168, 6);
    // EN 1993-1-1 Table 3.1: S275 fu = 430 N/mm² for t ≤ 40 mm: 0.9 × 3090 × 430 / 1.25 = 956 664 N
    expect(plateTension(250, 15, 'S275', 2, 22, 'EN').NuRd).toBeCloseTo(956_664, 6);
  });

  it('gives a splice the lesser of its bolt group and its two plates', () => {
    // 4 bolts M20 8.8 a flange, no packs: 2 × 4 × 94 080 = 752 640 N; plates 2 × 912 168 = 1 824 336 N
    const s = spliceTensionResistance(
      { plate: { width: 250, thickness: 15, grade: 'S275' }, bolts: { number: 4, diameter: 20, class: '8.8' } },
      0,
      'UK',
    );
    expect(s.boltGroup).toBeCloseTo(752_640, 6);
    expect(s.plates).toBeCloseTo(1_824_336, 6);
    expect(s.NtRd).toBeCloseTo(752_640, 6);
    // 10 mm packs: βp = 180/190, bolts 752 640 × 0.947368 = 713 027 N
    const packed = spliceTensionResistance(
      { plate: { width: 250, thickness: 15, grade: 'S275' }, bolts: { number: 4, diameter: 20, class: '8.8' } },
      10,
      'UK',
    );
    expect(packed.NtRd).toBeCloseTo((752_640 * 180) / 190, 3);
  });
});

describe('vertical tie force, EN 1991-1-7 A.6', () => {
  it('is the largest storey reaction on the column in the accidental combination Gk + ψ1·Qk (EN 1990 eq. 6.11b)', () => {
    // Floor: 100 + 0.5 × 80 (category A, ψ1 = 0.5, EN 1990 Table A1.1) = 140 kN; roof: 50 + 0 × 20 (H, ψ1 = 0) = 50 kN
    const tie = verticalTieForce([
      { nodeId: 'r1', elevation: 4, Gk: 100, Qk: { A: 80 } },
      { nodeId: 'r2', elevation: 8, Gk: 90, Qk: { C: 60 } },
      { nodeId: 'c', elevation: 12, Gk: 50, Qk: { H: 20 } },
    ]);
    // r2: 90 + 0.7 × 60 = 132 kN (category C, ψ1 = 0.7), less than r1
    expect(tie.T).toBeCloseTo(140_000, 6);
    expect(tie.nodeId).toBe('r1');
  });

  it('is asked for from consequence class 2b (EN 1991-1-7 A.4(1), A.6)', () => {
    expect([needsVerticalTies('1'), needsVerticalTies('2a'), needsVerticalTies('2b'), needsVerticalTies('3')]).toEqual([
      false,
      false,
      true,
      true,
    ]);
  });
});

describe('concrete and the base plate, EN 1992-1-1 3.1.6 and EN 1993-1-8 6.2.5', () => {
  it('gives fcd = αcc·fck/γc (EN 1992-1-1 eq. 3.15; αcc 0.85 UK NA, 1.0 recommended)', () => {
    // C30/37: 0.85 × 30 / 1.5 = 17.0; 1.0 × 30 / 1.5 = 20.0
    expect(designCompressiveStrength('C30/37', 'UK')).toBeCloseTo(17, 10);
    expect(designCompressiveStrength('C30/37', 'EN')).toBeCloseTo(20, 10);
    expect(designCompressiveStrength('C25/30', 'UK')).toBeCloseTo((0.85 * 25) / 1.5, 10);
  });

  it('matches the effective area 4c² + P·c + A of an I section whose strips do not meet (SCI P358 column bases, from memory)', () => {
    // UKC 254x254x73 without root radii: A = 2 × 254.6 × 14.2 + (254.1 − 28.4) × 8.6 = 7230.64 + 1941.02 = 9171.66 mm²;
    // P = 4b + 2h − 2tw = 1018.4 + 508.2 − 17.2 = 1509.4 mm; c = 40: 6400 + 60 376 + 9171.66 = 75 947.66 mm²
    expect(effectiveBearingArea(UKC_254_73, 40, { b: 600, l: 600 })).toBeCloseTo(75_947.66, 6);
  });

  it('gives c, the bearing resistance and the required thickness (EN 1993-1-8 eq. 6.5, 6.2.5(3))', () => {
    // C30/37 UK: fjd = 2/3 × 17 = 11.333 N/mm²; 400 × 400 × 20 S275 plate: fy = 265 N/mm² (16 < t ≤ 40, EN 10025-2)
    // c = 20 × √(265 / (3 × 11.333)) = 20 × √7.7941 = 55.836 mm
    // Aeff: B = 254.6 + 2c = 366.27, L = 254.1 + 2c = 365.77 (both within the plate), flange strips tf + 2c = 125.87,
    // web 254.1 − 28.4 − 2c = 114.03 long and 8.6 + 2c = 120.27 wide: 2 × 366.27 × 125.87 + 114.03 × 120.27 = 105 917 mm²
    // Nj,Rd = 105 917 × 11.333 = 1 200 400 N
    const check = checkBasePlate(
      800_000,
      UKC_254_73,
      { b: 400, l: 400, t: 20, grade: 'S275', grout: 30 },
      'C30/37',
      'UK',
    );
    expect(check.fjd).toBeCloseTo(34 / 3, 8);
    expect(check.c).toBeCloseTo(20 * Math.sqrt(265 / 34), 8);
    expect(check.c).toBeCloseTo(55.836, 2);
    expect(check.Aeff).toBeCloseTo(105_917, -1);
    expect(check.NjRd / 1e3).toBeCloseTo(1200.4, 0);
    expect(check.utilisation).toBeCloseTo(800_000 / check.NjRd, 10);
    // Required: Aeff(c) = 800 000 / 11.333 = 70 588 mm² → 4c² + 1509.4c − 61 416.6 = 0,
    // c = (√(1509.4² + 16 × 61 416.6) − 1509.4) / 8 = (1805.8 − 1509.4) / 8 = 37.05 mm;
    // t = 37.05 × √(3 × 11.333 / 265) = 37.05 × 0.35819 = 13.27 mm
    const cNeed = (-1509.4 + Math.sqrt(1509.4 ** 2 + 16 * (800_000 / (34 / 3) - 9171.66))) / 8;
    expect(cNeed).toBeCloseTo(37.05, 1);
    expect(check.tRequired).toBeCloseTo(13.27, 1);
    expect(check.tRequired).toBeCloseTo(cNeed * Math.sqrt(34 / 265), 3);
    expect(check.notes.some((n) => n.startsWith('The grout is thicker'))).toBe(false);
  });

  it('flags a grout joint thicker than 0.2·min(b, l) and a plate too small for the force', () => {
    // 0.2 × 300 = 60 mm < 70 mm of grout; 300 × 300 × 11.333 = 1 020 000 N < 1 500 000 N
    const check = checkBasePlate(
      1_500_000,
      UKC_254_73,
      { b: 300, l: 300, t: 40, grade: 'S355', grout: 70 },
      'C30/37',
      'UK',
    );
    expect(check.notes.some((n) => n.startsWith('The grout is thicker'))).toBe(true);
    expect(check.tRequired).toBeNull();
    expect(widthForArea(UKC_254_73, 300 * 300 + 1, { b: 300, l: 300 })).toBeNull();
  });
});

describe('the fit of a bearing splice (common practice, no source)', () => {
  const at = (designation: string) => ({ designation, dims: sectionData(designation).dims });
  it('packs the upper flanges out by half the difference in depth when the serial size is kept', () => {
    const above = at('UKC 254x254x73');
    const below = at('UKC 254x254x89');
    const fit = spliceFit(above, below);
    const h = (d: typeof above) => (d.dims.shape === 'I' ? d.dims.h : 0);
    expect(fit.sameSerialSize).toBe(true);
    expect(fit.divisionPlate).toBe(false);
    expect(fit.packThickness).toBeCloseTo((h(below) - h(above)) / 2, 1);
  });

  it('asks for a division plate when the serial size changes, and leaves hollow sections undetailed', () => {
    const fit = spliceFit(at('UKC 203x203x46'), at('UKC 254x254x73'));
    expect(fit).toMatchObject({ sameSerialSize: false, divisionPlate: true });
    expect(spliceFit(at('SHS 200x200x10'), at('SHS 200x200x12.5')).sameSerialSize).toBeNull();
  });
});
