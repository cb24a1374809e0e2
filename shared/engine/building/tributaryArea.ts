// Tributary area of a column on a grid: half the bay to each side, and the floor's edge distance beyond the
// outermost lines (common practice, no source: the usual hand take-down of a braced frame with simple
// connections, where each beam reaction is half the load on the beam).
import type { AreaOverride, Grid, GridDirection } from '../../schema/building.ts';

/** Width of floor (m) each side of a grid line, in the line family's direction. */
export interface SideWidths {
  before: number;
  after: number;
}

/** The floor each side of a column in plan (m): along x (minus/plus) and along y. */
export interface PlanWidths {
  xMinus: number;
  xPlus: number;
  yMinus: number;
  yPlus: number;
}

export interface TributaryArea {
  widths: PlanWidths;
  /** From the grid alone: (xMinus + xPlus)(yMinus + yPlus), m². */
  gridArea: number;
  /** What the column carries: the grid's, or the override's. */
  area: number;
  override?: AreaOverride;
}

/** The floor each side of one line: half of each neighbouring bay, or the edge distance at the ends. */
export function sideWidths(direction: GridDirection, lineId: string): SideWidths | null {
  const lines = [...direction.lines].sort((a, b) => a.position - b.position);
  const i = lines.findIndex((l) => l.id === lineId);
  if (i < 0) return null;
  const before = i === 0 ? direction.edgeBefore : (lines[i].position - lines[i - 1].position) / 2;
  const after = i === lines.length - 1 ? direction.edgeAfter : (lines[i + 1].position - lines[i].position) / 2;
  return { before, after };
}

/** The tributary area of the column at the crossing of x line `gridX` and y line `gridY`; null off the grid. */
export function tributaryArea(grid: Grid, gridX: string, gridY: string, override?: AreaOverride): TributaryArea | null {
  const x = sideWidths(grid.x, gridX);
  const y = sideWidths(grid.y, gridY);
  if (!x || !y) return null;
  const widths = { xMinus: x.before, xPlus: x.after, yMinus: y.before, yPlus: y.after };
  const gridArea = (x.before + x.after) * (y.before + y.after);
  if (!override) return { widths, gridArea, area: gridArea };
  const area = override.area ?? gridArea * (override.factor ?? 1);
  return { widths, gridArea, area, override };
}
