// Points of a flexural buckling curve, χ against λ̄ (EN 1993-1-1 6.3.1.2, Figure 6.4), computed with
// the engine's reductionFactor so the plot shows the same χ the check used.
import type { BucklingCurve } from '@shared/schema/results.ts';
import { reductionFactor } from '@shared/engine/index.ts';

export interface CurvePoint {
  lambdaBar: number;
  chi: number;
}

/** χ(λ̄) from 0 to `maxLambda` in `steps` equal steps. */
export function bucklingCurvePoints(curve: BucklingCurve, maxLambda = 3, steps = 120): CurvePoint[] {
  return Array.from({ length: steps + 1 }, (_, i) => {
    const lambdaBar = (maxLambda * i) / steps;
    return { lambdaBar, chi: reductionFactor(lambdaBar, curve) };
  });
}
