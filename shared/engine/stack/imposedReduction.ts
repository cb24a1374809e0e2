// Reduction of imposed loads on a column carrying several storeys (EN 1991-1-1 6.3.1.2(11)).
import type { Annex } from '../../schema/results.ts';
import type { Category } from '../../schema/stack.ts';
import { psi0 } from './combinationFactors.ts';

/**
 * αn for n storeys above the member carrying imposed load of one category.
 * 'EN': EN 1991-1-1 eq. 6.2, αn = (2 + (n − 2)ψ0)/n, with 1 for n ≤ 2.
 * 'UK': UK National Annex to EN 1991-1-1 NA.2.6 (eq. NA.2): 1.1 − n/10 for 1 ≤ n ≤ 5, 0.6 for 6–10, 0.5 above 10.
 */
export function alphaN(n: number, annex: Annex, category: Category): number {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`alphaN needs a whole number of storeys, got ${n}`);
  if (n === 0) return 1;
  if (annex === 'UK') {
    if (n <= 5) return (11 - n) / 10; // 1.1 − n/10, written so that n = 1 gives exactly 1
    return n <= 10 ? 0.6 : 0.5;
  }
  if (n <= 2) return 1;
  return (2 + (n - 2) * psi0(category, annex)) / n;
}
