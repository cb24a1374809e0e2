// Design axial forces of the pieces under one expression of EN 1990 6.4.3.2 alone, so that the combined
// check takes NEd and the beam reactions from the same combination.
import type { AnalysisOptions, LiftResult } from '../../schema/results.ts';
import type { Expression } from '../stack/combination.ts';
import type { StackModel } from '../stack/inspectStack.ts';
import type { Segment } from '../stack/segments.ts';
import { selfWeightPerMetre, takeDown } from '../stack/takeDown.ts';

/** The expressions the options ask for: eq. 6.10, or eq. 6.10a and eq. 6.10b each on its own. */
export function expressionsOf(options: Pick<AnalysisOptions, 'combination'>): Expression[] {
  return options.combination === '6.10' ? ['6.10'] : ['6.10a', '6.10b'];
}

/** Per piece of one lift, the force checked against buckling about each axis, kN. */
export interface PieceForces {
  NEdY: number[];
  NEdZ: number[];
}

function segmentIndex(segments: readonly Segment[], middle: number): number {
  const i = segments.findIndex((s) => s.bottom <= middle && middle <= s.top);
  return i < 0 ? segments.length - 1 : i;
}

/**
 * The take-down of the analysis run with one expression only (the same sweep, the same rule that a
 * section never carries less than the one above it), then, as the axial check does (SPEC §5.6), the
 * largest force of the lift's pieces in the same segment about each axis.
 */
export function forcesOfExpression(
  model: StackModel,
  lifts: readonly LiftResult[],
  options: AnalysisOptions,
  expression: Expression,
): PieceForces[] {
  const weights = model.lifts.map((l) => ({
    bottom: l.bottom,
    top: l.top,
    perMetre: options.selfWeight ? selfWeightPerMetre(l.section.massPerMetre) : 0,
  }));
  const bottoms = lifts.flatMap((l) => l.pieces.map((p) => p.from));
  const { sectionNEd } = takeDown(model.entries, weights, { ...options, expression }, bottoms);
  let first = 0;
  return lifts.map((lift) => {
    const NEd = sectionNEd.slice(first, first + lift.pieces.length);
    first += lift.pieces.length;
    const segY = lift.pieces.map((p) => segmentIndex(model.segments.y, (p.from + p.to) / 2));
    const segZ = lift.pieces.map((p) => segmentIndex(model.segments.z, (p.from + p.to) / 2));
    const largest = (seg: readonly number[]) =>
      seg.map((s) => NEd.reduce((max, f, j) => (seg[j] === s && f > max ? f : max), 0));
    return { NEdY: largest(segY), NEdZ: largest(segZ) };
  });
}
