// The nominal moments a piece of column is checked for: the larger of the shares its storey takes from
// the floors at its ends. Moments are not carried past the next floor.
import type { FloorMoment } from './floorMoments.ts';

export interface PieceMoments {
  /** kN·m */
  My: number;
  Mz: number;
  /** Floors whose moments act on this storey (below and above). */
  floorBelow: FloorMoment | null;
  floorAbove: FloorMoment | null;
}

const EPS = 1e-6;

/**
 * `levels`: the levels that end storeys (storeyLevels: support, floors, cap; not ties or splices);
 * `moments`: the floors that carry moments. A floor's share acts at the end of the storey; every piece
 * of the storey, whichever lift it belongs to, is checked for that end moment in full. In a storey
 * pinned at its far end the moment falls linearly to nothing there, so a piece away from the floor is
 * checked for more than it carries: on the safe side (common practice for simple construction, no
 * source). With moments at both ends the larger is taken (the simplified method checks the moment of
 * each floor on its own, from memory).
 */
export function pieceMoments(
  from: number,
  to: number,
  levels: readonly number[],
  moments: readonly FloorMoment[],
): PieceMoments {
  const middle = (from + to) / 2;
  let lower = -Infinity;
  let upper = Infinity;
  for (const z of levels) {
    if (z <= middle && z > lower) lower = z;
    if (z >= middle && z < upper) upper = z;
  }
  const floorBelow = moments.find((m) => !m.cap && Math.abs(m.elevation - lower) <= EPS) ?? null;
  const floorAbove = moments.find((m) => Math.abs(m.elevation - upper) <= EPS) ?? null;
  // The floor below puts its 'above' share into this storey; the floor above its 'below' share.
  const My = Math.max(floorBelow?.y.share.above ?? 0, floorAbove?.y.share.below ?? 0);
  const Mz = Math.max(floorBelow?.z.share.above ?? 0, floorAbove?.z.share.below ?? 0);
  return { My, Mz, floorBelow, floorAbove };
}
