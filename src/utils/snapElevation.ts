// Where a node dragged up or down the graph lands: on a level, at the chosen offset above a level (where
// splices go), or to the nearest 50 mm. Drawing only; the elevation it gives is stored by the edit.
import type { Level } from '@shared/schema/api.ts';

/** How close (m) a drop must come to a level or to the offset above it to snap there (common practice, no source). */
export const SNAP_TOLERANCE_M = 0.25;
/** Splices usually sit a little above the floor so the joint clears the floor beams (common practice, no source). */
export const DEFAULT_SPLICE_OFFSET_M = 0.5;
const STEP_M = 0.05;

export function snapElevation(z: number, levels: readonly Level[], offset: number): number {
  let best: number | null = null;
  for (const l of levels) {
    for (const target of [l.elevation, l.elevation + offset]) {
      if (Math.abs(z - target) <= SNAP_TOLERANCE_M && (best === null || Math.abs(z - target) < Math.abs(z - best)))
        best = target;
    }
  }
  return best ?? Math.round(z / STEP_M) * STEP_M;
}
