// Reduction of imposed load for the area a member carries (EN 1991-1-1 6.3.1.2(10)).
import type { Annex } from '../../schema/results.ts';
import type { Category } from '../../schema/stack.ts';
import { psi0 } from '../stack/combinationFactors.ts';

/** EN 1991-1-1 6.3.1.2(10): A0 = 10 m². */
const A0 = 10;

/**
 * αA for a loaded area A (m²) of one category A–D.
 * 'EN': EN 1991-1-1 eq. 6.1, αA = 5/7·ψ0 + A0/A ≤ 1.0, and ≥ 0.6 for categories C and D.
 * 'UK': UK National Annex to EN 1991-1-1 NA.2.5 (eq. NA.1, from memory), αA = 1.0 − A/1000 ≥ 0.75.
 */
export function alphaA(area: number, annex: Annex, category: Category): number {
  if (!(area > 0)) return 1;
  if (annex === 'UK') return Math.max(0.75, 1 - area / 1000);
  const value = Math.min(1, (5 / 7) * psi0(category, annex) + A0 / area);
  return category === 'C' || category === 'D' ? Math.max(0.6, value) : value;
}
