// Effective area of a base plate around a column's footprint (EN 1993-1-8 6.2.5(4), Figure 6.4), mm and mm².
import type { SectionDims } from '../../schema/stack.ts';

export interface PlateSize {
  /** Across the flanges (the section's b). */
  b: number;
  /** Along the depth (the section's h). */
  l: number;
}

/**
 * The bearing area within c of the section's walls, clipped to the plate. I section: two flange strips and a web strip,
 * which merge into one rectangle once c reaches the clear depth between the flanges. RHS: the ring within c of the
 * walls; CHS: the annulus. Out-of-plate parts are clipped by taking the outer size no larger than the plate.
 */
export function effectiveBearingArea(dims: SectionDims, c: number, plate: PlateSize): number {
  if (dims.shape === 'I') {
    const B = Math.min(dims.b + 2 * c, plate.b);
    const L = Math.min(dims.h + 2 * c, plate.l);
    const overhang = (L - dims.h) / 2;
    const flangeStrip = dims.tf + c + overhang;
    const webLength = dims.h - 2 * dims.tf - 2 * c;
    if (webLength <= 0) return B * L;
    return 2 * B * flangeStrip + webLength * Math.min(dims.tw + 2 * c, B);
  }
  if (dims.shape === 'RHS') {
    const B = Math.min(dims.b + 2 * c, plate.b);
    const L = Math.min(dims.h + 2 * c, plate.l);
    const innerB = dims.b - 2 * dims.t - 2 * c;
    const innerL = dims.h - 2 * dims.t - 2 * c;
    return innerB > 0 && innerL > 0 ? B * L - innerB * innerL : B * L;
  }
  const outer = Math.min(dims.d / 2 + c, Math.min(plate.b, plate.l) / 2);
  const inner = dims.d / 2 - dims.t - c;
  return Math.PI * (outer * outer - (inner > 0 ? inner * inner : 0));
}

/** The smallest c whose effective area reaches `area`, by bisection (the area rises with c); null if the plate cannot. */
export function widthForArea(dims: SectionDims, area: number, plate: PlateSize): number | null {
  const most = Math.max(plate.b, plate.l);
  if (effectiveBearingArea(dims, most, plate) < area) return null;
  let lo = 0;
  let hi = most;
  if (effectiveBearingArea(dims, 0, plate) >= area) return 0;
  for (let i = 0; i < 80 && hi - lo > 1e-6; i++) {
    const mid = (lo + hi) / 2;
    if (effectiveBearingArea(dims, mid, plate) >= area) hi = mid;
    else lo = mid;
  }
  return hi;
}
