export {
  criticalBuckling,
  bucklingAbout,
  equivalentLength,
  type AxisBuckling,
  type StackBuckling,
} from './criticalBuckling.ts';
export { lowestLoadFactor, type BeamColumn, type BucklingSolution } from './lowestLoadFactor.ts';
export { stackColumn, bendingStiffness, ELEMENTS_PER_PIECE, PARTIAL_SPRING_FACTOR } from './stackColumn.ts';
export { pieceLengths, type LiftCritical, type PieceLengths } from './pieceLengths.ts';
export { annotateCriticalSteps, longerThanTableWarnings, criticalBasisNote } from './criticalWorking.ts';
export { withCriticalBuckling, type CriticalForStack } from './withCriticalBuckling.ts';
