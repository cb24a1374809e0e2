// Pieces of a lift (docs/analysis-rules.md §Pieces): the lift cut at every restraint, splice and level elevation.
import { SAME_ELEVATION_M } from './context.ts';

/** Ascending cut elevations from the lift's bottom to its top, without repeats. */
export function cutElevations(bottom: number, top: number, inside: Iterable<number>): number[] {
  const cuts = [bottom, top];
  for (const e of inside) if (e > bottom + SAME_ELEVATION_M && e < top - SAME_ELEVATION_M) cuts.push(e);
  cuts.sort((a, b) => a - b);
  const unique = [cuts[0]];
  for (const e of cuts) if (e - unique[unique.length - 1] > SAME_ELEVATION_M) unique.push(e);
  return unique;
}
