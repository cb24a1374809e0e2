export { sizeStack, sizeTypicalColumn } from './sizeStack.ts';
export { sizeBuilding, type BuildingSizing } from './sizeBuilding.ts';
export { serialSize } from './serialSize.ts';
export { sizingCandidates, checkableCandidates, type Candidate, type GradedCandidate } from './sizingCandidates.ts';
export { sizingModel, type SizingModel } from './sizingModel.ts';
export {
  liftUtilisation,
  liftWeight,
  liftForces,
  liftForceFloor,
  passDown,
  NOTHING_ABOVE,
  type LoadFromAbove,
} from './liftUtilisation.ts';
export { sizeLifts, sizeLiftsAcross, currentUtilisations, type LiftPick, type SizingRules } from './sizeLifts.ts';
