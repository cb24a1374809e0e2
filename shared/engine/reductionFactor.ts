import type { BucklingCurve } from '../schema/results.ts';
import { EngineError } from './errors.ts';
import { imperfectionFactor } from './imperfectionFactor.ts';

/** Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²] (EN 1993-1-1 6.3.1.2(1)). */
export function phiFactor(lambdaBar: number, alpha: number): number {
  return 0.5 * (1 + alpha * (lambdaBar - 0.2) + lambdaBar * lambdaBar);
}

/** χ from α directly, for hot paths that already hold α. No input checks. */
export function reductionFactorFromAlpha(lambdaBar: number, alpha: number): number {
  const phi = phiFactor(lambdaBar, alpha);
  // EN 1993-1-1 eq. 6.49
  const chi = 1 / (phi + Math.sqrt(phi * phi - lambdaBar * lambdaBar));
  return chi < 1 ? chi : 1;
}

/** Flexural buckling reduction factor χ (EN 1993-1-1 eq. 6.49), never above 1. */
export function reductionFactor(lambdaBar: number, curve: BucklingCurve): number {
  if (!Number.isFinite(lambdaBar) || lambdaBar < 0) {
    throw new EngineError(
      'invalid_input',
      `Non-dimensional slenderness must be a finite number ≥ 0, got ${lambdaBar}.`,
    );
  }
  return reductionFactorFromAlpha(lambdaBar, imperfectionFactor(curve));
}
