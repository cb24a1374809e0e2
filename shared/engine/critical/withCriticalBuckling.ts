// The critical buckling analysis as analyseStack uses it: solved once per stack, handed to each lift's
// check, then written into the result (αcr per axis, the buckled shapes, working and warnings).
import type { Issue, StackResult } from '../../schema/results.ts';
import type { SectionDims } from '../../schema/stack.ts';
import type { StackModel } from '../stack/inspectStack.ts';
import type { PieceSpan } from '../stack/stackPieces.ts';
import { criticalBuckling } from './criticalBuckling.ts';
import { annotateCriticalSteps, criticalBasisNote, longerThanTableWarnings } from './criticalWorking.ts';
import type { LiftCritical } from './pieceLengths.ts';
import { bendingStiffness } from './stackColumn.ts';

export interface CriticalForStack {
  errors: Issue[];
  result: NonNullable<StackResult['criticalBuckling']> | null;
  forLift(index: number): LiftCritical | undefined;
  /** Adds αcr, shapes, the working and the warnings to a finished result. */
  finish(result: StackResult): void;
}

export function withCriticalBuckling(
  model: StackModel,
  pieces: readonly (readonly PieceSpan[])[],
  NEd: readonly number[],
  sections?: ReadonlyMap<string, SectionDims>,
): CriticalForStack {
  const solved = criticalBuckling(model, pieces, NEd, sections);
  if (!('y' in solved))
    return { errors: solved.errors, result: null, forLift: () => undefined, finish: () => undefined };
  const alphaCr = { y: solved.y.alphaCr, z: solved.z.alphaCr };
  const result = { y: solved.y, z: solved.z };
  return {
    errors: [],
    result,
    forLift: (i) => {
      const lift = model.lifts[i];
      return { alphaCr, EI: { y: bendingStiffness(lift, 'y', sections), z: bendingStiffness(lift, 'z', sections) } };
    },
    finish: (out) => {
      annotateCriticalSteps(out.lifts, alphaCr);
      out.warnings.push(criticalBasisNote(result), ...longerThanTableWarnings(out.lifts));
      out.criticalBuckling = result;
    },
  };
}
