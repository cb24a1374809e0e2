import { describe, expect, it } from 'vitest';
import { findSection } from '../../shared/catalogue/index.ts';
import { checkCompression } from '../../shared/engine/checkCompression.ts';
import { classifySection } from '../../shared/engine/classifySection.ts';
import { plateReduction } from '../../shared/engine/effectiveArea.ts';
import { yieldStrength } from '../../shared/engine/yieldStrength.ts';
import type { Grade, SectionDims } from '../../shared/schema/stack.ts';

const dimsOf = (d: string): SectionDims => findSection(d)!.dims;
const classIn = (designation: string, grade: Grade) =>
  checkCompression({ section: designation, grade, LcrY: 1000, LcrZ: 1000, NEd: 0 });

describe('yieldStrength by thickness', () => {
  it('annex UK reads EN 10025-2 Table 7 for rolled sections and plates', () => {
    // Source: EN 10025-2:2004 Table 7 (ReH minimum by nominal thickness)
    expect(yieldStrength('S355', 16, 'rolled')).toBe(355);
    expect(yieldStrength('S355', 16.1, 'rolled')).toBe(345);
    expect(yieldStrength('S355', 40, 'rolled')).toBe(345);
    expect(yieldStrength('S355', 41, 'rolled')).toBe(335);
    expect(yieldStrength('S355', 64, 'welded')).toBe(325);
    expect(yieldStrength('S355', 90, 'rolled')).toBe(315);
    expect(yieldStrength('S275', 17.3, 'rolled')).toBe(265);
    expect(yieldStrength('S235', 77, 'rolled')).toBe(215);
    // S460 thicker than 16 mm: EN 10025-4 (M/ML) / EN 10025-3 (N/NL)
    expect(yieldStrength('S460', 25, 'rolled')).toBe(440);
  });

  it('annex UK reads EN 10210-1 for hot-finished and EN 10219-1 for cold-formed hollow sections', () => {
    // Source: EN 10210-1:2006 Table A.3, EN 10219-1:2006 Table A.3
    expect(yieldStrength('S355', 16, 'hot-finished')).toBe(355);
    expect(yieldStrength('S355', 20, 'hot-finished')).toBe(345);
    expect(yieldStrength('S275', 12.5, 'cold-formed')).toBe(275);
  });

  it('annex EN reads EN 1993-1-1 Table 3.1: one value to 40 mm, another to 80 mm', () => {
    // Source: EN 1993-1-1 Table 3.1
    expect(yieldStrength('S355', 39, 'rolled', 'EN')).toBe(355);
    expect(yieldStrength('S355', 41, 'rolled', 'EN')).toBe(335);
    expect(yieldStrength('S275', 77, 'rolled', 'EN')).toBe(255);
    expect(yieldStrength('S460', 30, 'hot-finished', 'EN')).toBe(460);
  });

  it('refuses thicknesses outside the tables as unsupported', () => {
    expect(() => yieldStrength('S355', 81, 'rolled', 'EN')).toThrow(expect.objectContaining({ code: 'unsupported' }));
    expect(() => yieldStrength('S355', 41, 'cold-formed')).toThrow(expect.objectContaining({ code: 'unsupported' }));
    expect(() => yieldStrength('S460', 120, 'welded')).toThrow(expect.objectContaining({ code: 'unsupported' }));
    expect(() => yieldStrength('S355', 0, 'rolled')).toThrow(expect.objectContaining({ code: 'invalid_input' }));
  });
});

describe('classification in compression (EN 1993-1-1 Table 5.2): the class changes with the grade', () => {
  it('UKC 203x203x46 flange: c/t = 8.0 is class 1 in S275 (9ε = 8.32) and class 2 in S355 (10ε = 8.14)', () => {
    // c = (203.6 − 7.2 − 2·10.2)/2 = 88.0 mm, c/tf = 88.0/11.0 = 8.00 (Table 5.2 sheet 2, hand arithmetic)
    expect(classIn('UKC 203x203x46', 'S275')).toMatchObject({ sectionClass: 1 });
    expect(classIn('UKC 203x203x46', 'S355')).toMatchObject({
      sectionClass: 2,
      classGoverningElement: 'flange outstand',
    });
  });

  it('UKC 152x152x23 flange: c/t = 9.65 is class 2 in S235 and class 3 in S275', () => {
    // c = (152.2 − 5.8 − 15.2)/2 = 65.6 mm, c/tf = 65.6/6.8 = 9.65; S275: 10ε = 9.24 < 9.65 ≤ 14ε = 12.9
    expect(classIn('UKC 152x152x23', 'S235')).toMatchObject({ sectionClass: 2 });
    expect(classIn('UKC 152x152x23', 'S275')).toMatchObject({
      sectionClass: 3,
      classGoverningElement: 'flange outstand',
    });
  });

  it('UKB 254x146x43 web: c/t = 30.4 is class 1 in S275 (33ε = 30.5) and class 2 in S355 (38ε = 30.9)', () => {
    // c = 259.6 − 2·12.7 − 2·7.6 = 219.0 mm, c/tw = 219.0/7.2 = 30.42 (Table 5.2 sheet 1)
    expect(classIn('UKB 254x146x43', 'S275')).toMatchObject({ sectionClass: 1 });
    expect(classIn('UKB 254x146x43', 'S355')).toMatchObject({ sectionClass: 2, classGoverningElement: 'web' });
  });

  it('SHS 200x200x5 wall: c/t = 37 is class 3 in S275 (42ε = 38.8) and class 4 in S355 (42ε = 34.2)', () => {
    // c = h − 3t = 185 mm, c/t = 37.0 (Table 5.2 sheet 1, c = h − 3t for hollow sections)
    expect(classIn('SHS 200x200x5', 'S275')).toMatchObject({ sectionClass: 3, classGoverningElement: 'wall' });
    expect(classIn('SHS 200x200x5', 'S355')).toMatchObject({ sectionClass: 4, classGoverningElement: 'wall' });
  });

  it('CHS 508x10.0: d/t = 50.8 is class 2 in S275 (70ε² = 59.8) and class 3 in S355 (70ε² = 46.3)', () => {
    expect(classIn('CHS 508x10', 'S275')).toMatchObject({ sectionClass: 2, classGoverningElement: 'tube' });
    expect(classIn('CHS 508x10', 'S355')).toMatchObject({ sectionClass: 3 });
  });

  it('measures a welded outstand from the web face (weld size 0) and a rolled one from the root radius', () => {
    const e = Math.sqrt(235 / 355);
    const rolled = classifySection({ shape: 'I', make: 'rolled', h: 300, b: 300, tw: 10, tf: 10, r: 20 }, e);
    const welded = classifySection({ shape: 'I', make: 'welded', h: 300, b: 300, tw: 10, tf: 10, r: 20 }, e);
    expect(rolled.elements[0]!.c).toBeCloseTo((300 - 10 - 40) / 2, 9);
    expect(welded.elements[0]!.c).toBeCloseTo((300 - 10) / 2, 9);
    expect(welded.elements[1]!.c).toBeCloseTo(300 - 20, 9);
  });

  it('names the worse wall of a rectangular hollow section', () => {
    const c = classifySection(dimsOf('RHS 500x300x10'), Math.sqrt(235 / 355));
    // h side: (500 − 30)/10 = 47 > 42ε = 34.2 (class 4); b side: (300 − 30)/10 = 27 ≤ 38ε = 30.9 (class 2)
    expect(c.sectionClass).toBe(4);
    expect(c.governing.element).toBe('wall (h side)');
  });
});

describe('class 4 effective area (EN 1993-1-5 4.4)', () => {
  it('plateReduction follows eq. 4.2 for internal parts and eq. 4.3 for outstands, with ρ = 1 on the plateau', () => {
    // EN 1993-1-5 4.4(2): internal ψ = 1 → ρ = 1 for λ̄p ≤ 0.673; outstand → ρ = 1 for λ̄p ≤ 0.748
    const e = 1;
    expect(plateReduction(0.673 * 28.4 * 2, e, 'internal').rho).toBe(1);
    expect(plateReduction(0.748 * 28.4 * Math.sqrt(0.43), e, 'outstand').rho).toBe(1);
    // λ̄p = 1.0 exactly: internal ρ = (1 − 0.22)/1 = 0.78; outstand ρ = (1 − 0.188)/1 = 0.812
    expect(plateReduction(28.4 * 2, e, 'internal').rho).toBeCloseTo(0.78, 12);
    expect(plateReduction(28.4 * Math.sqrt(0.43), e, 'outstand').rho).toBeCloseTo(0.812, 12);
  });

  it('SHS 200x200x5 in S355 (hot-finished): Aeff worked by hand to EN 1993-1-5 4.4', () => {
    // Hand-worked to EN 1993-1-5 4.4 (no published worked example for this size was at hand):
    // fy = 355 (t = 5 ≤ 16, EN 10210-1), ε = √(235/355) = 0.8136; c = 200 − 3·5 = 185 mm, c/t = 37.0
    // λ̄p = 37.0/(28.4·0.8136·√4) = 0.8006; ρ = (0.8006 − 0.055·(3 + 1))/0.8006² = 0.9058   (eq. 4.2)
    // A = 38.7 cm² (SCI P363, from memory); Aeff = 3870 − 4·(1 − 0.9058)·185·5 = 3870 − 348.5 = 3521.5 mm²
    const r = checkCompression({ section: 'SHS 200x200x5', grade: 'S355', LcrY: 1000, LcrZ: 1000, NEd: 0 });
    expect(r.sectionClass).toBe(4);
    expect(Math.abs(r.Aeff / 3521.5 - 1)).toBeLessThan(0.005);
    expect(r.NcRd).toBeCloseTo(r.Aeff * 355, 6);
    expect(r.steps.find((s) => s.symbol === 'ρ wall')?.clause).toBe('EN 1993-1-5 eq. 4.2');
  });

  it('UKB 457x191x67 in S355: the class 4 web loses (1 − ρ)·c·tw', () => {
    // c = 453.4 − 2·12.7 − 2·10.2 = 407.6 mm; c/tw = 407.6/8.5 = 47.95 > 42ε = 34.2 (class 4)
    // λ̄p = 47.95/(28.4·0.8136·2) = 1.0376; ρ = (1.0376 − 0.22)/1.0376² = 0.7594   (EN 1993-1-5 eq. 4.2)
    // Aeff = 8550 − (1 − 0.7594)·407.6·8.5 = 8550 − 833.6 = 7716 mm² (A = 85.5 cm², SCI P363, from memory)
    const r = checkCompression({ section: 'UKB 457x191x67', grade: 'S355', LcrY: 1000, LcrZ: 1000, NEd: 0 });
    expect(r.sectionClass).toBe(4);
    expect(r.classGoverningElement).toBe('web');
    expect(Math.abs(r.Aeff / 7716 - 1)).toBeLessThan(0.005);
  });
});
