// Pieces of every lift (docs/analysis-rules.md §Pieces): each lift cut at every restraint, splice and level elevation,
// with the design force at each piece's bottom and the segment it lies in about each axis.
import { SAME_ELEVATION_M } from './context.ts';
import { cutElevations } from './cutLift.ts';
import type { StackModel } from './inspectStack.ts';
import type { Segment } from './segments.ts';

export interface PieceSpan {
  from: number;
  to: number;
  segmentY: Segment;
  segmentZ: Segment;
}

/** The segment holding each piece; pieces and segments both ascend, so one pointer walks both. */
function segmentsOf(pieces: readonly { from: number; to: number }[], segments: readonly Segment[]): Segment[] {
  let s = 0;
  return pieces.map((p) => {
    const middle = (p.from + p.to) / 2;
    while (s < segments.length - 1 && segments[s].top < middle) s++;
    return segments[s];
  });
}

/** Every lift's pieces, bottom to top. */
export function stackPieces(model: StackModel, levelElevations: readonly number[]): PieceSpan[][] {
  const bottom = model.lifts[0].bottom;
  const top = model.lifts[model.lifts.length - 1].top;
  const inside = [...model.restraints.map((r) => r.elevation), ...model.lifts.map((l) => l.top), ...levelElevations];
  const cuts = cutElevations(bottom, top, inside);
  const spans = cuts.slice(1).map((to, i) => ({ from: cuts[i], to }));
  const segY = segmentsOf(spans, model.segments.y);
  const segZ = segmentsOf(spans, model.segments.z);
  // Fields written out: an object spread here costs more than the rest of the take-down.
  const pieces = spans.map((span, i) => ({ from: span.from, to: span.to, segmentY: segY[i], segmentZ: segZ[i] }));
  // Lift ends are cuts, so the pieces of consecutive lifts are consecutive runs of the list.
  let next = 0;
  return model.lifts.map((lift) => {
    const first = next;
    while (next < pieces.length && pieces[next].to <= lift.top + SAME_ELEVATION_M) next++;
    return pieces.slice(first, next);
  });
}
