// The stack as one continuous beam-column about one axis: every piece split into equal elements, EI of
// the lift's section, the piece's design force, held laterally at the restraint points about that axis
// and restrained in rotation by the end fixities.
import { E_STEEL } from '../constants.ts';
import { sectionData } from '../sectionData.ts';
import type { SectionDims } from '../../schema/stack.ts';
import type { ModelLift } from '../stack/inspectStack.ts';
import type { Axis, RestraintPoint, Segment } from '../stack/segments.ts';
import type { PieceSpan } from '../stack/stackPieces.ts';
import type { BeamColumn } from './lowestLoadFactor.ts';

/** Elements per piece: 4 keeps a pinned–pinned Euler load within 0.05 % (cubic elements converge as h⁴). */
export const ELEMENTS_PER_PIECE = 4;

/**
 * A 'partial' fixity as a rotational spring: EI/L of the column segment on each side of the point
 * (averaged where there are two). A single segment with such springs at both ends buckles at
 * k ≈ 0.85, the tabulated partial–partial factor (slope-deflection check in the tests), so 'partial'
 * means the same in both methods. Common practice, no source.
 */
export const PARTIAL_SPRING_FACTOR = 1.0;

/** EI about the axis in kN·m²: E (N/mm², EN 1993-1-1 3.2.6(1)) × I (mm⁴) × 1e-9. */
export function bendingStiffness(lift: ModelLift, axis: Axis, sections?: ReadonlyMap<string, SectionDims>): number {
  const { props } = sectionData(lift.data.section, sections);
  return E_STEEL * (axis === 'y' ? props.Iy : props.Iz) * 1e-9;
}

function restraintPointsOf(segments: readonly Segment[]): RestraintPoint[] {
  return [segments[0].lower, ...segments.map((s) => s.upper)];
}

function nearestNode(nodes: readonly number[], elevation: number): number {
  let lo = 0;
  let hi = nodes.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (nodes[mid] <= elevation) lo = mid;
    else hi = mid;
  }
  return Math.abs(nodes[hi] - elevation) < Math.abs(nodes[lo] - elevation) ? hi : lo;
}

export interface StackColumnInput {
  axis: Axis;
  lifts: readonly ModelLift[];
  /** Each lift's pieces, bottom to top, as the member checks use them. */
  pieces: readonly (readonly PieceSpan[])[];
  /** Design force of each piece (kN, compression positive), in the order of pieces.flat(). */
  NEd: readonly number[];
  segments: readonly Segment[];
  sections?: ReadonlyMap<string, SectionDims>;
  elementsPerPiece?: number;
}

export function stackColumn(input: StackColumnInput): BeamColumn {
  const per = input.elementsPerPiece ?? ELEMENTS_PER_PIECE;
  const nodes: number[] = [];
  const EI: number[] = [];
  const N: number[] = [];
  let p = 0;
  for (const [i, lift] of input.lifts.entries()) {
    const stiffness = bendingStiffness(lift, input.axis, input.sections);
    for (const piece of input.pieces[i]) {
      for (let e = 0; e < per; e++) {
        if (nodes.length === 0 || e > 0) nodes.push(piece.from + ((piece.to - piece.from) * e) / per);
        else nodes[nodes.length - 1] = piece.from;
        EI.push(stiffness);
        N.push(input.NEd[p]);
      }
      nodes.push(piece.to);
      p++;
    }
  }
  const count = nodes.length;
  const column: BeamColumn = {
    nodes,
    EI,
    N,
    lateralFixed: new Array<boolean>(count).fill(false),
    rotationFixed: new Array<boolean>(count).fill(false),
    rotationSpring: new Array<number>(count).fill(0),
  };
  const points = restraintPointsOf(input.segments);
  for (const [j, point] of points.entries()) {
    const k = nearestNode(nodes, point.elevation);
    if (point.fixity !== 'free') column.lateralFixed[k] = true;
    if (point.fixity === 'fixed') column.rotationFixed[k] = true;
    if (point.fixity !== 'partial') continue;
    const sides: number[] = [];
    const below = input.segments[j - 1];
    const above = input.segments[j];
    if (below && k > 0) sides.push(EI[k - 1] / (below.top - below.bottom));
    if (above && k < EI.length) sides.push(EI[k] / (above.top - above.bottom));
    column.rotationSpring[k] = (PARTIAL_SPRING_FACTOR * sides.reduce((a, b) => a + b, 0)) / Math.max(1, sides.length);
  }
  return column;
}
