import type { BucklingCurve } from '../schema/results.ts';
import type { Grade } from '../schema/stack.ts';
import { EngineError } from './errors.ts';
import type { SectionDims } from './sectionTypes.ts';

export interface CurvePair {
  y: BucklingCurve;
  z: BucklingCurve;
  /** The Table 6.2 row that applies, for the calculation sheet. */
  row: string;
}

/** Buckling curves about y-y and z-z for flexural buckling (EN 1993-1-1 Table 6.2). */
export function bucklingCurve(dims: SectionDims, grade: Grade): CurvePair {
  const s460 = grade === 'S460';
  if (dims.shape === 'I' && dims.make === 'rolled') {
    const { h, b, tf } = dims;
    if (h / b > 1.2) {
      if (tf <= 40)
        return s460
          ? { y: 'a0', z: 'a0', row: 'rolled I, h/b > 1.2, tf ≤ 40 mm, S460' }
          : { y: 'a', z: 'b', row: 'rolled I, h/b > 1.2, tf ≤ 40 mm' };
      if (tf > 100)
        throw new EngineError(
          'unsupported',
          `EN 1993-1-1 Table 6.2 has no row for a rolled I with h/b > 1.2 and tf = ${tf} mm > 100 mm.`,
        );
      return s460
        ? { y: 'a', z: 'a', row: 'rolled I, h/b > 1.2, 40 < tf ≤ 100 mm, S460' }
        : { y: 'b', z: 'c', row: 'rolled I, h/b > 1.2, 40 < tf ≤ 100 mm' };
    }
    if (tf <= 100)
      return s460
        ? { y: 'a', z: 'a', row: 'rolled I, h/b ≤ 1.2, tf ≤ 100 mm, S460' }
        : { y: 'b', z: 'c', row: 'rolled I, h/b ≤ 1.2, tf ≤ 100 mm' };
    return s460
      ? { y: 'c', z: 'c', row: 'rolled I, h/b ≤ 1.2, tf > 100 mm, S460' }
      : { y: 'd', z: 'd', row: 'rolled I, h/b ≤ 1.2, tf > 100 mm' };
  }
  if (dims.shape === 'I') {
    // Welded I: the same curves for every grade
    return dims.tf <= 40
      ? { y: 'b', z: 'c', row: 'welded I, tf ≤ 40 mm' }
      : { y: 'c', z: 'd', row: 'welded I, tf > 40 mm' };
  }
  if (dims.make === 'hot-finished')
    return s460
      ? { y: 'a0', z: 'a0', row: 'hot-finished hollow, S460' }
      : { y: 'a', z: 'a', row: 'hot-finished hollow' };
  return { y: 'c', z: 'c', row: 'cold-formed hollow' };
}
