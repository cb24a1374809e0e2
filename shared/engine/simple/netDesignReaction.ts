// The out-of-balance design reaction at a floor, with the worst pattern of imposed load on two opposite faces.
import type { AnalysisOptions } from '../../schema/results.ts';
import type { Category, FaceReaction } from '../../schema/stack.ts';
import { GAMMA_G, GAMMA_Q, psi0, xi } from '../stack/combinationFactors.ts';

/** Factors on the permanent and the imposed reactions in one expression of EN 1990 6.4.3.2. */
export interface ReactionFactors {
  gammaG: number;
  gammaQ: number;
  expression: string;
}

/**
 * EN 1990 eq. 6.10 (γG, γQ), or eq. 6.10a (γG, ψ0·γQ) and eq. 6.10b (ξ·γG, γQ), Table A1.2(B). The floor's
 * imposed load leads in 6.10b; it is not reduced by αn, which applies to the take-down over several storeys.
 */
export function reactionFactors(
  options: Pick<AnalysisOptions, 'combination' | 'annex'>,
  category: Category,
): ReactionFactors[] {
  if (options.combination === '6.10') return [{ gammaG: GAMMA_G, gammaQ: GAMMA_Q, expression: 'EN 1990 eq. 6.10' }];
  return [
    { gammaG: GAMMA_G, gammaQ: psi0(category, options.annex) * GAMMA_Q, expression: 'EN 1990 eq. 6.10a' },
    { gammaG: xi(options.annex) * GAMMA_G, gammaQ: GAMMA_Q, expression: 'EN 1990 eq. 6.10b' },
  ];
}

export interface NetReaction {
  /** |R+ − R−| at its worst, kN. */
  value: number;
  expression: string;
  /** The face carrying the imposed load in the worst pattern. */
  loadedFace: 'plus' | 'minus' | 'none';
}

const NONE: FaceReaction = { Gk: 0, Qk: 0 };

/**
 * Worst |R+ − R−|: permanent load on both faces, full imposed load on one face and none on the other
 * (common practice for simple construction, SCI P358/P360 method, from memory).
 */
export function netDesignReaction(
  plus: FaceReaction | undefined,
  minus: FaceReaction | undefined,
  factors: readonly ReactionFactors[],
): NetReaction {
  const p = plus ?? NONE;
  const m = minus ?? NONE;
  let worst: NetReaction = { value: 0, expression: factors[0]?.expression ?? '', loadedFace: 'none' };
  for (const f of factors) {
    const permanent = f.gammaG * (p.Gk - m.Gk);
    const plusLoaded = Math.abs(permanent + f.gammaQ * p.Qk);
    const minusLoaded = Math.abs(permanent - f.gammaQ * m.Qk);
    if (plusLoaded > worst.value) worst = { value: plusLoaded, expression: f.expression, loadedFace: 'plus' };
    if (minusLoaded > worst.value) worst = { value: minusLoaded, expression: f.expression, loadedFace: 'minus' };
  }
  return worst;
}
