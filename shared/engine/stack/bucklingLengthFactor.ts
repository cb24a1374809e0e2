// Buckling-length factor k of a segment of a braced column from its end fixities (docs/analysis-rules.md
// §Buckling-length factors).
import type { Fixity } from '../../schema/stack.ts';

/**
 * Where Lcr = k·L comes from, as the working prints it. The factors are not a clause of EN 1993-1-1 (which
 * leaves Lcr to the designer): they are common design-office practice for braced columns.
 */
export const BUCKLING_LENGTH_RULE =
  'Lcr = k·L; k: common practice for braced columns, after BS 5950-1 Table 22 and design aids (not an EN 1993-1-1 clause)';

/**
 * Common design-office values for braced columns, after BS 5950-1 Table 22 and EN 1993 design aids
 * (docs/analysis-rules.md §Buckling-length factors; common practice): pinned–pinned 1.0, pinned–partial 1.0,
 * partial–partial 0.85, fixed–pinned 0.85, fixed–partial 0.85, fixed–fixed 0.7. A free top is a cantilever, k = 2.0,
 * and only with a fixed lower end; with any other lower end it returns null (a mechanism, not a column).
 */
export function bucklingLengthFactor(lower: Fixity, upper: Fixity | 'free'): number | null {
  if (upper === 'free') return lower === 'fixed' ? 2.0 : null;
  const ends = new Set([lower, upper]);
  if (ends.has('fixed')) {
    if (ends.size === 1) return 0.7;
    return 0.85;
  }
  if (ends.has('pinned')) return 1.0;
  return 0.85;
}
