// The checking engineer's spot checks of the member-check inputs against the standards and the handbook
// tables: yield strength bands, Table 6.2 curve selection and catalogue rows. Each value is read from the
// source named beside it (or recalled, where it says "from memory"), not from the engine.
import { describe, expect, it } from 'vitest';
import { findSection } from '../../shared/catalogue/index.ts';
import { bucklingCurve } from '../../shared/engine/bucklingCurve.ts';
import { sectionProperties } from '../../shared/engine/sectionProperties.ts';
import { yieldStrength, type Product } from '../../shared/engine/yieldStrength.ts';
import type { Grade, SectionDims } from '../../shared/schema/stack.ts';

const dimsOf = (designation: string): SectionDims => {
  const entry = findSection(designation);
  if (!entry) throw new Error(`${designation} is not in the catalogue`);
  return entry.dims;
};

describe('yield strength by thickness, every band', () => {
  it('annex UK follows EN 10025-2 Table 7 in all six bands for S235, S275 and S355', () => {
    // EN 10025-2:2004 Table 7, ReH for t ≤ 16, ≤ 40, ≤ 63, ≤ 80, ≤ 100, ≤ 150 mm (from memory)
    const table: Record<'S235' | 'S275' | 'S355', number[]> = {
      S235: [235, 225, 215, 215, 215, 195],
      S275: [275, 265, 255, 245, 235, 225],
      S355: [355, 345, 335, 325, 315, 295],
    };
    const inBand = [10, 30, 50, 70, 90, 120];
    for (const [grade, values] of Object.entries(table)) {
      expect(inBand.map((t) => yieldStrength(grade as Grade, t, 'rolled'))).toEqual(values);
    }
  });

  it('annex UK takes S420 and S460 above 63 mm as the lower of EN 10025-3 and EN 10025-4', () => {
    // EN 10025-3 Table 5 (N): S420 370/360, S460 410/400 at 63–80/80–100 mm; EN 10025-4 Table 4 (M):
    // S420 380/370, S460 410/400 (from memory). The lower governs when the delivery condition is not known.
    expect([70, 90].map((t) => yieldStrength('S420', t, 'rolled'))).toEqual([370, 360]);
    expect([70, 90].map((t) => yieldStrength('S460', t, 'rolled'))).toEqual([410, 400]);
    expect([12, 30, 50].map((t) => yieldStrength('S420', t, 'welded'))).toEqual([420, 400, 390]);
  });

  it('annex UK reads EN 10210-1 (hot-finished) and EN 10219-1 (cold-formed) for hollow sections', () => {
    // EN 10210-1:2006 Table A.3 / B.3 and EN 10219-1:2006 Table A.3 / B.3 (from memory)
    const hot = (g: Grade) => [12.5, 20, 50].map((t) => yieldStrength(g, t, 'hot-finished'));
    expect(hot('S275')).toEqual([275, 265, 255]);
    expect(hot('S355')).toEqual([355, 345, 335]);
    expect(hot('S460')).toEqual([460, 440, 430]);
    const cold = (g: Grade) => [12.5, 20].map((t) => yieldStrength(g, t, 'cold-formed'));
    expect(cold('S355')).toEqual([355, 345]);
    expect(cold('S420')).toEqual([420, 400]);
  });

  it('annex EN reads EN 1993-1-1 Table 3.1: one value up to 40 mm, one above, and cold-formed only to 40 mm', () => {
    // EN 1993-1-1 Table 3.1 (from memory)
    const products: Product[] = ['rolled', 'welded', 'hot-finished'];
    for (const p of products) {
      expect([20, 40, 60].map((t) => yieldStrength('S355', t, p, 'EN'))).toEqual([355, 355, 335]);
      expect([20, 60].map((t) => yieldStrength('S235', t, p, 'EN'))).toEqual([235, 215]);
      expect([20, 60].map((t) => yieldStrength('S420', t, p, 'EN'))).toEqual([420, 390]);
    }
    expect(yieldStrength('S460', 40, 'cold-formed', 'EN')).toBe(460);
    expect(() => yieldStrength('S460', 41, 'cold-formed', 'EN')).toThrow();
  });
});

describe('EN 1993-1-1 Table 6.2: the curve row for each kind of section', () => {
  const curves = (d: string | SectionDims, grade: Grade = 'S355') => {
    const c = bucklingCurve(typeof d === 'string' ? dimsOf(d) : d, grade);
    return [c.y, c.z];
  };

  it('rolled I with h/b > 1.2 and tf ≤ 40 mm: a about y, b about z; a0 and a0 in S460', () => {
    // UKB 457x191x67: h/b = 453.4/189.9 = 2.39, tf 12.7 mm
    expect(curves('UKB 457x191x67')).toEqual(['a', 'b']);
    expect(curves('UKB 457x191x67', 'S420')).toEqual(['a', 'b']);
    expect(curves('UKB 457x191x67', 'S460')).toEqual(['a0', 'a0']);
  });

  it('rolled I with h/b > 1.2 and 40 < tf ≤ 100 mm: b and c; a and a in S460', () => {
    // Invented rolled I: h 600, b 300 (h/b 2.0), tf 45 mm
    const deep: SectionDims = { shape: 'I', make: 'rolled', h: 600, b: 300, tw: 25, tf: 45, r: 27 };
    expect(curves(deep)).toEqual(['b', 'c']);
    expect(curves(deep, 'S460')).toEqual(['a', 'a']);
  });

  it('rolled I with h/b ≤ 1.2 and tf ≤ 100 mm: b and c; a and a in S460', () => {
    // UKC 305x305x97: h/b = 1.01; UKC 356x406x634: h/b = 474.6/424.0 = 1.12, tf 77 mm
    expect(curves('UKC 305x305x97')).toEqual(['b', 'c']);
    expect(curves('UKC 356x406x634')).toEqual(['b', 'c']);
    expect(curves('UKC 356x406x634', 'S460')).toEqual(['a', 'a']);
  });

  it('rolled I with h/b ≤ 1.2 and tf > 100 mm: d and d; c and c in S460', () => {
    // Invented rolled I: h 520, b 450 (h/b 1.16), tf 105 mm
    const heavy: SectionDims = { shape: 'I', make: 'rolled', h: 520, b: 450, tw: 60, tf: 105, r: 15 };
    expect(curves(heavy)).toEqual(['d', 'd']);
    expect(curves(heavy, 'S460')).toEqual(['c', 'c']);
  });

  it('welded I: b and c up to tf 40 mm, c and d above, in every grade', () => {
    const plate = (tf: number): SectionDims => ({ shape: 'I', make: 'welded', h: 500, b: 400, tw: 15, tf, r: 0 });
    expect(curves(plate(40))).toEqual(['b', 'c']);
    expect(curves(plate(41))).toEqual(['c', 'd']);
    expect(curves(plate(41), 'S460')).toEqual(['c', 'd']);
  });

  it('hollow sections: hot-finished a (a0 in S460), cold-formed c in every grade', () => {
    expect(curves('SHS 200x200x10')).toEqual(['a', 'a']);
    expect(curves('CHS 168.3x10.0', 'S460')).toEqual(['a0', 'a0']);
    expect(curves({ shape: 'RHS', make: 'cold-formed', h: 200, b: 100, t: 8 }, 'S460')).toEqual(['c', 'c']);
  });
});

describe('catalogue rows against the handbook tables', () => {
  // [designation, h, b, tw, tf, r] — UKC/UKB: SCI P363 (steel building design: design data), BS 4-1;
  // HE/IPE: EN 10365. All from memory.
  const ROWS: ReadonlyArray<readonly [string, number, number, number, number, number]> = [
    ['UKC 152x152x23', 152.4, 152.2, 5.8, 6.8, 7.6],
    ['UKC 203x203x46', 203.2, 203.6, 7.2, 11.0, 10.2],
    ['UKC 203x203x86', 222.2, 209.1, 12.7, 20.5, 10.2],
    ['UKC 254x254x73', 254.1, 254.6, 8.6, 14.2, 12.7],
    ['UKC 254x254x167', 289.1, 265.2, 19.2, 31.7, 12.7],
    ['UKC 305x305x118', 314.5, 307.4, 12.0, 18.7, 15.2],
    ['UKC 356x368x129', 355.6, 368.6, 10.4, 17.5, 15.2],
    ['UKC 356x406x393', 419.0, 407.0, 30.6, 49.2, 15.2],
    ['UKB 533x210x82', 528.3, 208.8, 9.6, 13.2, 12.7],
    ['UKB 457x191x67', 453.4, 189.9, 8.5, 12.7, 10.2],
    ['UKB 305x165x40', 303.4, 165.0, 6.0, 10.2, 8.9],
    ['HE 200 A', 190, 200, 6.5, 10.0, 18],
    ['HE 300 B', 300, 300, 11.0, 19.0, 27],
    ['HE 300 M', 340, 310, 21.0, 39.0, 27],
    ['IPE 300', 300, 150, 7.1, 10.7, 15],
    ['IPE 400', 400, 180, 8.6, 13.5, 21],
  ];

  for (const [designation, h, b, tw, tf, r] of ROWS) {
    it(`${designation} has h ${h}, b ${b}, tw ${tw}, tf ${tf}, r ${r} mm`, () => {
      expect(dimsOf(designation)).toEqual({ shape: 'I', make: 'rolled', h, b, tw, tf, r });
    });
  }

  // [designation, A cm², I cm⁴ (y), Wpl cm³ (y), It cm⁴] — SCI P363 hot-finished hollow section tables, from memory
  const HOLLOW: ReadonlyArray<readonly [string, number, number, number, number]> = [
    ['SHS 100x100x5', 18.7, 279, 66.4, 439],
    ['SHS 200x200x10', 74.9, 4470, 531, 7031],
    ['RHS 200x100x8', 44.8, 2234, 282, 1804],
    ['CHS 168.3x10.0', 49.7, 1564, 251, 3128],
  ];

  for (const [designation, A, I, Wpl, It] of HOLLOW) {
    it(`${designation} (EN 10210-2 corners 1.5t / 1.0t) gives A, I, Wpl and It within 1% of the table`, () => {
      const p = sectionProperties(dimsOf(designation));
      const within = (actual: number, expected: number) =>
        expect(Math.abs(actual / expected - 1)).toBeLessThanOrEqual(0.01);
      within(p.A / 1e2, A);
      within(p.Iy / 1e4, I);
      within(p.WplY / 1e3, Wpl);
      within(p.It / 1e4, It);
    });
  }
});
