import type { ChsDims, RhsDims, SectionProperties } from './sectionTypes.ts';
import { spandrel } from './spandrel.ts';
import { symmetricProperties } from './symmetricProperties.ts';

/** Outer and inner corner radii of a rectangular hollow section. */
export function cornerRadii({ make, t }: Pick<RhsDims, 'make' | 't'>): { outer: number; inner: number } {
  // EN 10210-2 (hot-finished): outer 1.5t, inner 1.0t, the values used for its property tables
  if (make === 'hot-finished') return { outer: 1.5 * t, inner: t };
  // EN 10219-2 (cold-formed) radii for calculating properties: 2t (t ≤ 6), 2.5t (6 < t ≤ 10), 3t (t > 10)
  const outer = t <= 6 ? 2 * t : t <= 10 ? 2.5 * t : 3 * t;
  return { outer, inner: outer - t };
}

/** Solid rectangle H × B with four corners rounded to radius r, about its centroidal axes. */
function roundedRectangle(H: number, B: number, r: number) {
  const s = spandrel(r);
  const armY = H / 2 - s.offset;
  const armZ = B / 2 - s.offset;
  return {
    A: B * H - 4 * s.area,
    Iy: (B * H ** 3) / 12 - 4 * (s.ownI + s.area * armY ** 2),
    Iz: (H * B ** 3) / 12 - 4 * (s.ownI + s.area * armZ ** 2),
    Sy: (B * H * H) / 4 - 4 * s.area * armY,
    Sz: (H * B * B) / 4 - 4 * s.area * armZ,
  };
}

/** Square or rectangular hollow section h × b × t with rounded corners (EN 10210-2 / EN 10219-2 Annex B). */
export function rhsProperties(dims: RhsDims): SectionProperties {
  const { h, b, t } = dims;
  const { outer, inner } = cornerRadii(dims);
  const o = roundedRectangle(h, b, outer);
  const i = roundedRectangle(h - 2 * t, b - 2 * t, inner);
  const A = o.A - i.A;
  const Iy = o.Iy - i.Iy;
  const Iz = o.Iz - i.Iz;
  // EN 10210-2 Annex B: torsion constant of a thin-walled closed section with mean corner radius Rc
  const Rc = (outer + inner) / 2;
  const perimeter = 2 * (b - t + (h - t)) - 2 * Rc * (4 - Math.PI);
  const enclosed = (b - t) * (h - t) - Rc * Rc * (4 - Math.PI);
  const K = (2 * t * enclosed) / perimeter;
  return {
    ...symmetricProperties(A, Iy, Iz, h, b),
    WplY: o.Sy - i.Sy,
    WplZ: o.Sz - i.Sz,
    It: (t ** 3 * perimeter) / 3 + 2 * K * enclosed,
    tMax: t,
  };
}

/** Circular hollow section d × t (EN 10210-2 Annex B). */
export function chsProperties({ d, t }: ChsDims): SectionProperties {
  const di = d - 2 * t;
  const A = (Math.PI * (d * d - di * di)) / 4;
  const I = (Math.PI * (d ** 4 - di ** 4)) / 64;
  const Wpl = (d ** 3 - di ** 3) / 6;
  return { ...symmetricProperties(A, I, I, d, d), WplY: Wpl, WplZ: Wpl, It: 2 * I, tMax: t };
}
