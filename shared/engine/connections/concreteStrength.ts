// Design compressive strength of the foundation concrete (EN 1992-1-1 3.1.6), N/mm².
import type { Annex } from '../../schema/results.ts';
import type { ConcreteClass } from '../../schema/stack.ts';

/** γc for persistent and transient situations: EN 1992-1-1 Table 2.1N (UK NA the same). */
export const GAMMA_C = 1.5;

/** fck from the class name "Cfck/fck,cube": EN 1992-1-1 Table 3.1. */
export function characteristicStrength(concrete: ConcreteClass): number {
  return Number(concrete.slice(1, concrete.indexOf('/')));
}

/** αcc: EN 1992-1-1 3.1.6(1) recommends 1.0; the UK National Annex takes 0.85 for compression. */
export function alphaCC(annex: Annex): number {
  return annex === 'UK' ? 0.85 : 1.0;
}

/** fcd = αcc·fck/γc: EN 1992-1-1 eq. 3.15. */
export function designCompressiveStrength(concrete: ConcreteClass, annex: Annex): number {
  return (alphaCC(annex) * characteristicStrength(concrete)) / GAMMA_C;
}
