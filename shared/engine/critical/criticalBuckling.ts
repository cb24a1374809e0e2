// Elastic critical buckling of the whole continuous stack about each axis (EN 1993-1-1 5.2.1(3) and
// 6.3.1.2(1): Ncr from an elastic critical buckling analysis). The design force of every piece is the
// take-down's envelope (each piece under the combination that governs it, as the member checks use):
// more force everywhere than any single combination, so its αcr is never higher than theirs.
import type { Issue } from '../../schema/results.ts';
import type { SectionDims } from '../../schema/stack.ts';
import { formatElevation } from '../stack/formatElevation.ts';
import type { StackModel } from '../stack/inspectStack.ts';
import type { Axis } from '../stack/segments.ts';
import type { PieceSpan } from '../stack/stackPieces.ts';
import { lowestLoadFactor } from './lowestLoadFactor.ts';
import { stackColumn } from './stackColumn.ts';

export interface AxisBuckling {
  /** Lowest load factor on the design forces. */
  alphaCr: number;
  /** The buckled shape: lateral displacement (largest 1) at each node elevation (m). */
  shape: { elevations: number[]; displacements: number[] };
}

export type StackBuckling = { y: AxisBuckling; z: AxisBuckling; errors: [] } | { errors: Issue[] };

const AXIS_NAME = { y: 'y-y', z: 'z-z' } as const;
const ROUND = 1e4;

export function bucklingAbout(
  axis: Axis,
  model: StackModel,
  pieces: readonly (readonly PieceSpan[])[],
  NEd: readonly number[],
  sections?: ReadonlyMap<string, SectionDims>,
): AxisBuckling | Issue {
  const column = stackColumn({ axis, lifts: model.lifts, pieces, NEd, segments: model.segments[axis], sections });
  const solution = lowestLoadFactor(column);
  const about = `The critical buckling analysis about the ${AXIS_NAME[axis]} axis`;
  if ('failure' in solution) {
    return solution.failure === 'mechanism'
      ? {
          message: `${about} cannot solve the stack: the column is a mechanism near ${formatElevation(column.nodes[solution.node])} (it needs more restraint)`,
        }
      : {
          message: `${about} found no buckling load: no piece of the column is in compression. Use tabulated factors for this building`,
        };
  }
  // + 0 turns a rounded −0 into 0
  return {
    alphaCr: solution.alphaCr,
    shape: {
      elevations: column.nodes.map((e) => Math.round(e * ROUND) / ROUND),
      displacements: solution.shape.map((v) => Math.round(v * ROUND) / ROUND + 0),
    },
  };
}

/** Both axes, or the reasons the analysis cannot be made (never throws for a valid model). */
export function criticalBuckling(
  model: StackModel,
  pieces: readonly (readonly PieceSpan[])[],
  NEd: readonly number[],
  sections?: ReadonlyMap<string, SectionDims>,
): StackBuckling {
  const y = bucklingAbout('y', model, pieces, NEd, sections);
  const z = bucklingAbout('z', model, pieces, NEd, sections);
  const errors = [y, z].filter((r): r is Issue => 'message' in r);
  if (errors.length) return { errors };
  return { y: y as AxisBuckling, z: z as AxisBuckling, errors: [] };
}

/** Equivalent buckling length of a piece, m: Lcr = π·√(EI/Ncr) with Ncr = αcr·NEd (EN 1993-1-1 6.3.1.2(1)). */
export function equivalentLength(EI: number, alphaCr: number, NEd: number): number {
  return Math.PI * Math.sqrt(EI / (alphaCr * NEd));
}
