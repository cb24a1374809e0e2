// Buckling lengths of one piece about both axes: the table's k·L (docs/analysis-rules.md §Buckling-length factors), a lift's own kY/kZ, or,
// with the critical buckling analysis, the equivalent length of the piece's critical force.
import type { ModelLift } from '../stack/inspectStack.ts';
import type { PieceSpan } from '../stack/stackPieces.ts';
import { equivalentLength } from './criticalBuckling.ts';

/** The analysis of the whole stack, for one lift: αcr per axis and the lift's EI (kN·m²). */
export interface LiftCritical {
  alphaCr: { y: number; z: number };
  EI: { y: number; z: number };
}

export interface PieceLengths {
  LcrY: number;
  LcrZ: number;
  kY: number;
  kZ: number;
  tableKY?: number;
  tableKZ?: number;
}

/**
 * `NEdY`/`NEdZ`: the forces the buckling checks about y and z use (the largest in the segment within the
 * lift, docs/analysis-rules.md §Pieces). Their critical force is αcr·NEd, the critical force of the piece that carries that
 * force, so the check is the one of that piece: Lcr = π√(EI/(αcr·NEd)) (EN 1993-1-1 6.3.1.2(1)).
 * A lift's kY/kZ set by hand still wins; a piece without compression about an axis keeps the table's
 * length (its buckling term is zero whatever the length).
 */
export function pieceLengths(
  lift: ModelLift,
  span: PieceSpan,
  NEdY: number,
  NEdZ: number,
  critical: LiftCritical,
): PieceLengths {
  const y = axisLength(lift.data.kY, span.segmentY, NEdY, critical.EI.y, critical.alphaCr.y);
  const z = axisLength(lift.data.kZ, span.segmentZ, NEdZ, critical.EI.z, critical.alphaCr.z);
  const out: PieceLengths = { LcrY: y.Lcr, LcrZ: z.Lcr, kY: y.k, kZ: z.k };
  if (y.tableK !== undefined) out.tableKY = y.tableK;
  if (z.tableK !== undefined) out.tableKZ = z.tableK;
  return out;
}

/** One axis: the lift's own k or the table's k times the segment's length, or the equivalent length of the
 *  critical force αcr·NEd (then `tableK` keeps the table's factor for the working). */
function axisLength(
  ownK: number | undefined,
  segment: { top: number; bottom: number; k: number },
  NEd: number,
  EI: number,
  alphaCr: number,
): { Lcr: number; k: number; tableK?: number } {
  const length = segment.top - segment.bottom;
  if (ownK !== undefined || !(NEd > 0)) {
    const k = ownK ?? segment.k;
    return { Lcr: k * length, k };
  }
  const Lcr = equivalentLength(EI, alphaCr, NEd);
  return { Lcr, k: Lcr / length, tableK: segment.k };
}
