// The nominal moments a piece of column is checked for: the larger end moment of the column length
// between floors that holds it. Moments are not carried past the next floor.
import type { FloorMoment } from './floorMoments.ts';

export interface PieceMoments {
  /** kN·m */
  My: number;
  Mz: number;
  /** Floors whose moments act on this length (below and above). */
  floorBelow: FloorMoment | null;
  floorAbove: FloorMoment | null;
}

const EPS = 1e-6;

/** `floorElevations`: every floor of the stack; `moments`: the floors that carry moments. */
export function pieceMoments(from: number, to: number, floorElevations: readonly number[], moments: readonly FloorMoment[]): PieceMoments {
  const middle = (from + to) / 2;
  let lower = -Infinity;
  let upper = Infinity;
  for (const z of floorElevations) {
    if (z <= middle && z > lower) lower = z;
    if (z >= middle && z < upper) upper = z;
  }
  const floorBelow = moments.find((m) => Math.abs(m.elevation - lower) <= EPS) ?? null;
  const floorAbove = moments.find((m) => Math.abs(m.elevation - upper) <= EPS) ?? null;
  // The floor below puts its 'above' share into this length; the floor above its 'below' share.
  const My = Math.max(floorBelow?.y.share.above ?? 0, floorAbove?.y.share.below ?? 0);
  const Mz = Math.max(floorBelow?.z.share.above ?? 0, floorAbove?.z.share.below ?? 0);
  return { My, Mz, floorBelow, floorAbove };
}
