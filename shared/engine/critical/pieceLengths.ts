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
  const lengthY = span.segmentY.top - span.segmentY.bottom;
  const lengthZ = span.segmentZ.top - span.segmentZ.bottom;
  const out: PieceLengths = { LcrY: 0, LcrZ: 0, kY: 0, kZ: 0 };
  if (lift.data.kY !== undefined || !(NEdY > 0)) {
    out.kY = lift.data.kY ?? span.segmentY.k;
    out.LcrY = out.kY * lengthY;
  } else {
    out.LcrY = equivalentLength(critical.EI.y, critical.alphaCr.y, NEdY);
    out.kY = out.LcrY / lengthY;
    out.tableKY = span.segmentY.k;
  }
  if (lift.data.kZ !== undefined || !(NEdZ > 0)) {
    out.kZ = lift.data.kZ ?? span.segmentZ.k;
    out.LcrZ = out.kZ * lengthZ;
  } else {
    out.LcrZ = equivalentLength(critical.EI.z, critical.alphaCr.z, NEdZ);
    out.kZ = out.LcrZ / lengthZ;
    out.tableKZ = span.segmentZ.k;
  }
  return out;
}
