import type { BucklingCurve } from '../schema/results.ts';
import { EngineError } from './errors.ts';

// EN 1993-1-1 Table 6.1
const ALPHA: Readonly<Record<BucklingCurve, number>> = { a0: 0.13, a: 0.21, b: 0.34, c: 0.49, d: 0.76 };

/** Imperfection factor α of a buckling curve (EN 1993-1-1 Table 6.1). */
export function imperfectionFactor(curve: BucklingCurve): number {
  const alpha = ALPHA[curve];
  if (alpha === undefined)
    throw new EngineError('invalid_input', `Unknown buckling curve "${String(curve)}": expected a0, a, b, c or d.`);
  return alpha;
}
