// The loads each floor brings into one column: tributary area × area load, plus line load × the length
// of the line the column carries, split between the column's faces by the bays each side (see
// docs/building-model.md for how plan sides map to the faces of the section).
import type { BuildingModel, FloorSpan, StackPlacement } from '../../schema/building.ts';
import type { Category, FaceName, FaceReaction, RestraintFaces } from '../../schema/stack.ts';
import { areaLoads } from './floorLoad.ts';
import { tributaryArea, type PlanWidths, type TributaryArea } from './tributaryArea.ts';

type Side = 'xMinus' | 'xPlus' | 'yMinus' | 'yPlus';
const SIDES: readonly Side[] = ['xMinus', 'xPlus', 'yMinus', 'yPlus'];

/** What a floor brings into one column at one level (m², kN). */
export interface DerivedLevelLoad {
  levelId: string;
  area: number;
  gridArea: number;
  Gk: number;
  Qk: number;
  category: Category;
  /** The same loads by the face of the section they arrive on. */
  faces: RestraintFaces;
  /** Line loads taken, kN, for the working. */
  lineGk: number;
  lineQk: number;
  overrideReason?: string;
}

/** Flanges face along the web: a web along plan x puts the flange (y) faces towards ±x. */
function faceOf(side: Side, webAlong: 'x' | 'y'): FaceName {
  const alongWeb = webAlong === 'x' ? side.startsWith('x') : side.startsWith('y');
  const plus = side.endsWith('Plus');
  if (alongWeb) return plus ? 'yPlus' : 'yMinus';
  return plus ? 'zPlus' : 'zMinus';
}

/** Share of the tributary area that reaches the column from each side, by the way the floor spans (m²). */
function areaBySide(w: PlanWidths, span: FloorSpan, scale: number): Record<Side, number> {
  const alongX = {
    xMinus: w.xMinus * (w.yMinus + w.yPlus),
    xPlus: w.xPlus * (w.yMinus + w.yPlus),
    yMinus: 0,
    yPlus: 0,
  };
  const alongY = {
    xMinus: 0,
    xPlus: 0,
    yMinus: w.yMinus * (w.xMinus + w.xPlus),
    yPlus: w.yPlus * (w.xMinus + w.xPlus),
  };
  const share = span === 'x' ? [1, 0] : span === 'y' ? [0, 1] : [0.5, 0.5];
  const out = {} as Record<Side, number>;
  for (const s of SIDES) out[s] = (share[0] * alongX[s] + share[1] * alongY[s]) * scale;
  return out;
}

function emptySides(): Record<Side, number> {
  return { xMinus: 0, xPlus: 0, yMinus: 0, yPlus: 0 };
}

function levelLoad(
  model: BuildingModel,
  placement: Required<Pick<StackPlacement, 'webAlong'>> & { gridX: string; gridY: string },
  trib: TributaryArea,
  floor: BuildingModel['floors'][number],
): DerivedLevelLoad | null {
  const buildup = model.buildups.find((b) => b.id === floor.buildupId);
  if (!buildup) return null;
  const { gk, qk, category } = areaLoads(buildup);
  const w = trib.widths;
  // With no grid area to share (a column on a line of zero bays), an override's area is shared evenly.
  const bySide =
    trib.gridArea > 0
      ? areaBySide(w, floor.span, trib.area / trib.gridArea)
      : { xMinus: trib.area / 4, xPlus: trib.area / 4, yMinus: trib.area / 4, yPlus: trib.area / 4 };
  const G = emptySides();
  const Q = emptySides();
  for (const s of SIDES) {
    G[s] += gk * bySide[s];
    Q[s] += qk * bySide[s];
  }
  let lineGk = 0;
  let lineQk = 0;
  for (const line of floor.lines) {
    // A line along an x line runs in plan y: its beam frames in from ±y over the column's width of floor in y.
    const onX = line.gridLineId === placement.gridX;
    const onY = line.gridLineId === placement.gridY;
    if (!onX && !onY) continue;
    const parts: [Side, number][] = onX
      ? [
          ['yMinus', w.yMinus],
          ['yPlus', w.yPlus],
        ]
      : [
          ['xMinus', w.xMinus],
          ['xPlus', w.xPlus],
        ];
    for (const [side, length] of parts) {
      G[side] += line.gk * length;
      Q[side] += line.qk * length;
      lineGk += line.gk * length;
      lineQk += line.qk * length;
    }
  }
  const faces: RestraintFaces = {};
  for (const s of SIDES) {
    if (G[s] === 0 && Q[s] === 0) continue;
    const face = faceOf(s, placement.webAlong);
    const prior: FaceReaction = faces[face] ?? { Gk: 0, Qk: 0 };
    faces[face] = { Gk: prior.Gk + G[s], Qk: prior.Qk + Q[s] };
  }
  return {
    levelId: floor.levelId,
    area: trib.area,
    gridArea: trib.gridArea,
    Gk: gk * trib.area + lineGk,
    Qk: qk * trib.area + lineQk,
    category,
    faces,
    lineGk,
    lineQk,
    ...(trib.override ? { overrideReason: trib.override.reason } : {}),
  };
}

/** Every level's load on the column at `placement`, by level id; empty off the grid. */
export function stackFloorLoads(
  model: BuildingModel,
  placement: StackPlacement,
  stackId: string | number,
): Map<string, DerivedLevelLoad> {
  const out = new Map<string, DerivedLevelLoad>();
  const { gridX, gridY } = placement;
  if (gridX === null || gridY === null) return out;
  const overrides = model.overrides[String(stackId)] ?? [];
  // The grid's share is the same on every floor; only a level with an area set by hand needs its own.
  const fromGrid = tributaryArea(model.grid, gridX, gridY);
  if (!fromGrid) return out;
  for (const floor of model.floors) {
    const override = overrides.find((o) => o.levelId === floor.levelId);
    const trib = override ? tributaryArea(model.grid, gridX, gridY, override) : fromGrid;
    if (!trib) return out;
    const load = levelLoad(model, { gridX, gridY, webAlong: placement.webAlong }, trib, floor);
    if (load) out.set(floor.levelId, load);
  }
  return out;
}

/**
 * A key for the floor loads of a column at `placement`: two places with the same key get the same loads from
 * `stackFloorLoads` (tests/engine/building-model.test.ts checks this over whole grids). It names all that function
 * reads of the place: the tributary area from the grid, the areas set by hand under `overridesKey`, the way the
 * web runs, and which of the place's two lines carry a line load. A building-wide re-analysis uses it to find
 * the columns that come out the same without deriving and comparing every column's loads (docs/building-model.md).
 */
export function floorLoadsKey(model: BuildingModel, placement: StackPlacement, overridesKey: string | number): string {
  const { gridX, gridY } = placement;
  if (gridX === null || gridY === null) return 'off the grid';
  const loaded = new Set(model.floors.flatMap((f) => f.lines.map((l) => l.gridLineId)));
  return JSON.stringify([
    tributaryArea(model.grid, gridX, gridY),
    model.overrides[String(overridesKey)] ?? [],
    placement.webAlong,
    loaded.has(gridX) ? gridX : null,
    loaded.has(gridY) ? gridY : null,
  ]);
}
