// Segments about each axis between consecutive restraint points (docs/analysis-rules.md §Segments). A splice is not a
// restraint point, so a segment may cross splices.
import type { Issue } from '../../schema/results.ts';
import type { Fixity } from '../../schema/stack.ts';
import { bucklingLengthFactor } from './bucklingLengthFactor.ts';
import { formatElevation } from './formatElevation.ts';
import type { ModelRestraint } from './attachments.ts';

export type Axis = 'y' | 'z';

export interface RestraintPoint {
  nodeId: string;
  elevation: number;
  fixity: Fixity | 'free';
}

export interface Segment {
  axis: Axis;
  bottom: number;
  top: number;
  lower: RestraintPoint;
  upper: RestraintPoint;
  /** Buckling-length factor from the end fixities (docs/analysis-rules.md §Buckling-length factors). */
  k: number;
}

interface Ends {
  support: RestraintPoint;
  cap: RestraintPoint;
}

/** Support, every restraint acting about the axis, and the cap; ascending. A free cap ends the last segment. */
export function restraintPoints(axis: Axis, ends: Ends, restraints: readonly ModelRestraint[]): RestraintPoint[] {
  const points: RestraintPoint[] = [ends.support];
  for (const r of restraints) {
    if (r.axes === 'both' || r.axes === axis) points.push({ nodeId: r.id, elevation: r.elevation, fixity: r.fixity });
  }
  points.push(ends.cap);
  return points;
}

export function segmentsAbout(
  axis: Axis,
  ends: Ends,
  restraints: readonly ModelRestraint[],
): { segments: Segment[]; errors: Issue[] } {
  const points = restraintPoints(axis, ends, restraints);
  const segments: Segment[] = [];
  const errors: Issue[] = [];
  for (let i = 1; i < points.length; i++) {
    const lower = points[i - 1];
    const upper = points[i];
    // Only the cap can be free, and it is always the last point.
    const k = bucklingLengthFactor(lower.fixity as Fixity, upper.fixity);
    if (k === null) {
      const where =
        lower.nodeId === ends.support.nodeId ? 'the support' : `the restraint at ${formatElevation(lower.elevation)}`;
      errors.push({
        nodeId: upper.nodeId,
        message: `The free cap needs a fixed lower end about the ${axis}-${axis} axis, but ${where} is ${lower.fixity}`,
      });
      continue;
    }
    segments.push({ axis, bottom: lower.elevation, top: upper.elevation, lower, upper, k });
  }
  return { segments, errors };
}
