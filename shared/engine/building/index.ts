export { sideWidths, tributaryArea, type PlanWidths, type SideWidths, type TributaryArea } from './tributaryArea.ts';
export { areaLoads, type AreaLoads } from './floorLoad.ts';
export { stackFloorLoads, type DerivedLevelLoad } from './stackFloorLoads.ts';
export { applyFloorLoads, type FloorLoadsApplied, type LoadedArea } from './applyFloorLoads.ts';
export { alphaA } from './alphaA.ts';
export { governingPosition, positionResult, withPositionResults, type PositionPlace } from './typicalColumn.ts';
