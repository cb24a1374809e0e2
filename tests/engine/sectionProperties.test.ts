import { describe, expect, it } from 'vitest';
import { findSection } from '../../shared/catalogue/index.ts';
import { EngineError } from '../../shared/engine/errors.ts';
import { sectionProperties } from '../../shared/engine/sectionProperties.ts';
import type { SectionDims } from '../../shared/schema/stack.ts';

const within = (actual: number, expected: number, tolerance = 0.01) => Math.abs(actual / expected - 1) <= tolerance;

function propsOf(designation: string) {
  const entry = findSection(designation);
  if (!entry) throw new Error(`${designation} missing from the catalogue`);
  return sectionProperties(entry.dims);
}

describe('sectionProperties against handbook section tables (within 1%)', () => {
  // [designation, A cm², Iy cm⁴, Iz cm⁴, iy cm, iz cm]
  // UK sections and hollow sections: SCI P363 (steel building design: design data) property tables;
  // HE and IPE: EN 10365 product tables. All values from memory.
  const HANDBOOK: ReadonlyArray<readonly [string, number, number, number, number, number]> = [
    ['UKC 203x203x46', 58.7, 4568, 1548, 8.82, 5.13],
    ['UKC 254x254x89', 113, 14270, 4857, 11.2, 6.55],
    ['UKC 305x305x97', 123, 22250, 7308, 13.4, 7.69],
    ['UKC 356x368x129', 164, 40250, 14610, 15.6, 9.43],
    ['UKC 152x152x23', 29.2, 1250, 400, 6.54, 3.7],
    ['UKC 356x406x634', 808, 274800, 98130, 18.4, 11.0],
    ['UKB 457x191x67', 85.5, 29380, 1452, 18.5, 4.12],
    ['UKB 533x210x92', 117, 55230, 2389, 21.7, 4.51],
    ['UKB 305x165x40', 51.3, 8503, 764, 12.9, 3.86],
    ['UKB 254x146x31', 39.7, 4413, 448, 10.5, 3.36],
    ['HE 300 B', 149.1, 25170, 8563, 12.99, 7.58],
    ['HE 200 A', 53.8, 3692, 1336, 8.28, 4.98],
    ['IPE 300', 53.8, 8356, 603.8, 12.46, 3.35],
    ['IPE 200', 28.5, 1943, 142.4, 8.26, 2.24],
    ['SHS 200x200x10', 74.9, 4470, 4470, 7.73, 7.73],
    ['RHS 200x100x8', 44.8, 2234, 739, 7.06, 4.06],
    ['CHS 219.1x8.0', 53.1, 2960, 2960, 7.47, 7.47],
  ];

  for (const [designation, A, Iy, Iz, iy, iz] of HANDBOOK) {
    it(`${designation}: A, Iy, Iz, iy, iz agree with the published table`, () => {
      const p = propsOf(designation);
      const got = { A: p.A / 1e2, Iy: p.Iy / 1e4, Iz: p.Iz / 1e4, iy: p.iy / 10, iz: p.iz / 10 };
      const published = { A, Iy, Iz, iy, iz };
      for (const key of Object.keys(published) as Array<keyof typeof published>) {
        expect(
          within(got[key], published[key]),
          `${key}: computed ${got[key].toFixed(2)}, published ${published[key]}`,
        ).toBe(true);
      }
    });
  }

  it('UKC 203x203x46: plastic and elastic moduli, It and Iw agree with SCI P363 (from memory)', () => {
    const p = propsOf('UKC 203x203x46');
    // SCI P363: Wel,y 450 cm³, Wel,z 152 cm³, Wpl,y 497 cm³, Wpl,z 231 cm³, It 22.2 cm⁴, Iw 0.143 dm⁶ (from memory)
    expect(within(p.WelY / 1e3, 450)).toBe(true);
    expect(within(p.WelZ / 1e3, 152)).toBe(true);
    expect(within(p.WplY / 1e3, 497)).toBe(true);
    expect(within(p.WplZ / 1e3, 231)).toBe(true);
    expect(within(p.It / 1e4, 22.2, 0.02)).toBe(true);
    expect(within(p.Iw! / 1e12, 0.143)).toBe(true);
  });

  it('a circular hollow section matches the closed-form ring formulas exactly', () => {
    // Ring: A = π(d² − di²)/4, I = π(d⁴ − di⁴)/64, Wpl = (d³ − di³)/6, It = 2I (EN 10210-2 Annex B)
    const p = sectionProperties({ shape: 'CHS', make: 'hot-finished', d: 100, t: 10 });
    expect(p.A).toBeCloseTo((Math.PI * (100 ** 2 - 80 ** 2)) / 4, 6);
    expect(p.Iy).toBeCloseTo((Math.PI * (100 ** 4 - 80 ** 4)) / 64, 3);
    expect(p.WplY).toBeCloseTo((100 ** 3 - 80 ** 3) / 6, 6);
    expect(p.It).toBeCloseTo(2 * p.Iy, 6);
  });

  it('a welded I without root radii equals the sum of its three plates', () => {
    // Plates 400×20 flanges and a 460×10 web: A = 2·8000 + 4600 = 20 600 mm²;
    // Iy = (400·500³ − 390·460³)/12 = 1 003 658 333 mm⁴ (parallel axes, hand arithmetic)
    const p = sectionProperties({ shape: 'I', make: 'welded', h: 500, b: 400, tw: 10, tf: 20, r: 0 });
    expect(p.A).toBeCloseTo(20600, 6);
    expect(p.Iy).toBeCloseTo((400 * 500 ** 3 - 390 * 460 ** 3) / 12, 3);
    expect(p.tMax).toBe(20);
  });

  it('cold-formed corners (EN 10219-2 radii 2t to 3t) give less area than hot-finished corners (1.5t)', () => {
    const hot = sectionProperties({ shape: 'RHS', make: 'hot-finished', h: 200, b: 200, t: 8 });
    const cold = sectionProperties({ shape: 'RHS', make: 'cold-formed', h: 200, b: 200, t: 8 });
    expect(cold.A).toBeLessThan(hot.A);
    // SCI P363 cold-formed SHS 200x200x8: A 59.2 cm² against hot-finished 60.8 cm² (from memory)
    expect(within(cold.A / 100, 59.2)).toBe(true);
    expect(within(hot.A / 100, 60.8)).toBe(true);
  });

  it('mass per metre is the area times 7850 kg/m³', () => {
    const p = propsOf('HE 300 B');
    expect(p.massPerMetre).toBeCloseTo((p.A / 1e6) * 7850, 9);
  });
});

describe('sectionProperties refuses impossible dimensions', () => {
  const cases: ReadonlyArray<readonly [string, unknown]> = [
    ['a zero thickness', { shape: 'RHS', make: 'hot-finished', h: 200, b: 200, t: 0 }],
    ['a negative depth', { shape: 'I', make: 'rolled', h: -300, b: 300, tw: 10, tf: 19, r: 27 }],
    ['NaN', { shape: 'CHS', make: 'hot-finished', d: Number.NaN, t: 8 }],
    ['infinity', { shape: 'CHS', make: 'hot-finished', d: Number.POSITIVE_INFINITY, t: 8 }],
    ['flanges thicker than half the depth', { shape: 'I', make: 'welded', h: 300, b: 300, tw: 10, tf: 160, r: 0 }],
    ['a web wider than the flange', { shape: 'I', make: 'rolled', h: 300, b: 50, tw: 30, tf: 10, r: 15 }],
    ['a tube wall thicker than its radius', { shape: 'CHS', make: 'hot-finished', d: 50, t: 30 }],
    ['an unknown shape', { shape: 'T', make: 'rolled', h: 100 }],
  ];
  for (const [what, dims] of cases) {
    it(`throws invalid_input for ${what}`, () => {
      expect(() => sectionProperties(dims as SectionDims)).toThrow(EngineError);
      expect(() => sectionProperties(dims as SectionDims)).toThrow(expect.objectContaining({ code: 'invalid_input' }));
    });
  }
});

describe('welded I sections', () => {
  it('ignore any root radius given: the plates alone make the section (Table 5.2, weld size 0)', () => {
    const plain = sectionProperties({ shape: 'I', make: 'welded', h: 500, b: 400, tw: 10, tf: 20, r: 0 });
    const withR = sectionProperties({ shape: 'I', make: 'welded', h: 500, b: 400, tw: 10, tf: 20, r: 12 });
    expect(withR).toEqual(plain);
  });
});
