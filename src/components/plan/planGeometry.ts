// What the plan view draws, in metres of plan (x to the right, y upwards): the grid lines, the floor's
// outline, each placed stack at its crossing and the tributary area of a stack. The component flips y.
import { sideWidths } from '@shared/engine/building/tributaryArea.ts';
import type { Grid } from '@shared/schema/building.ts';
import type { PositionResult } from '@shared/schema/stackPositions.ts';

export interface PlanLine {
  id: string;
  name: string;
  direction: 'x' | 'y';
  position: number;
}

export interface PlanStack {
  /** Unique per marker: a typical column has one per position (docs/typical-columns.md). */
  key: string;
  id: number;
  name: string;
  gridX: string;
  gridY: string;
  x: number;
  y: number;
  utilisation: number | null;
  /** For a typical column: the position whose check governs the type. */
  governs?: boolean;
}

/** What a typical column's positions say, by stack id: each position's check and the governing one. */
export type TypicalPositions = ReadonlyMap<
  number,
  { results: readonly PositionResult[]; governingPosition: string | null }
>;

export interface PlanRect {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export interface PlanExtent extends PlanRect {
  /** Room around the floor for the line names, m. */
  margin: number;
}

export function planLines(grid: Grid): PlanLine[] {
  return [
    ...grid.x.lines.map((l) => ({ id: l.id, name: l.name, direction: 'x' as const, position: l.position })),
    ...grid.y.lines.map((l) => ({ id: l.id, name: l.name, direction: 'y' as const, position: l.position })),
  ];
}

/** The floor's outline: the outer lines and the slab beyond them; null without lines both ways. */
export function floorOutline(grid: Grid): PlanRect | null {
  if (grid.x.lines.length === 0 || grid.y.lines.length === 0) return null;
  const xs = grid.x.lines.map((l) => l.position);
  const ys = grid.y.lines.map((l) => l.position);
  return {
    x0: Math.min(...xs) - grid.x.edgeBefore,
    x1: Math.max(...xs) + grid.x.edgeAfter,
    y0: Math.min(...ys) - grid.y.edgeBefore,
    y1: Math.max(...ys) + grid.y.edgeAfter,
  };
}

export function planExtent(grid: Grid): PlanExtent | null {
  const outline = floorOutline(grid);
  if (!outline) return null;
  const span = Math.max(outline.x1 - outline.x0, outline.y1 - outline.y0, 1);
  return { ...outline, margin: Math.max(1.5, span * 0.08) };
}

interface Placed {
  id: number;
  name: string;
  gridX?: string | null;
  gridY?: string | null;
  utilisation: number | null;
}

/** A marker per placed stack, and per further position of a typical column, each in its own utilisation. */
export function planStacks(grid: Grid, stacks: readonly Placed[], typical: TypicalPositions = new Map()): PlanStack[] {
  const x = new Map(grid.x.lines.map((l) => [l.id, l.position]));
  const y = new Map(grid.y.lines.map((l) => [l.id, l.position]));
  const out: PlanStack[] = [];
  const at = (gridX: string | null | undefined, gridY: string | null | undefined) => {
    const px = gridX ? x.get(gridX) : undefined;
    const py = gridY ? y.get(gridY) : undefined;
    return px !== undefined && py !== undefined ? { x: px, y: py } : null;
  };
  for (const s of stacks) {
    const own = at(s.gridX, s.gridY);
    if (!own) continue;
    const positions = typical.get(s.id);
    if (!positions?.results.length) {
      out.push({
        key: `${s.id}`,
        id: s.id,
        name: s.name,
        gridX: s.gridX!,
        gridY: s.gridY!,
        ...own,
        utilisation: s.utilisation,
      });
      continue;
    }
    for (const p of positions.results) {
      const place = at(p.gridX, p.gridY);
      if (!place) continue;
      out.push({
        key: `${s.id}:${p.positionId ?? 'own'}`,
        id: s.id,
        name: p.positionId === null ? s.name : p.name,
        gridX: p.gridX,
        gridY: p.gridY,
        ...place,
        utilisation: p.utilisation,
        governs: p.name === positions.governingPosition,
      });
    }
  }
  return out;
}

/** The rectangle of floor a column at the crossing of lines gridX and gridY carries (half the bay each side). */
export function tributaryRect(grid: Grid, gridX: string, gridY: string): PlanRect | null {
  const wx = sideWidths(grid.x, gridX);
  const wy = sideWidths(grid.y, gridY);
  const px = grid.x.lines.find((l) => l.id === gridX)?.position;
  const py = grid.y.lines.find((l) => l.id === gridY)?.position;
  if (!wx || !wy || px === undefined || py === undefined) return null;
  return { x0: px - wx.before, x1: px + wx.after, y0: py - wy.before, y1: py + wy.after };
}

/** Crossings of the grid where no stack stands, at its own place or as a typical column. */
export function freeCrossings(
  grid: Grid,
  stacks: readonly Placed[],
  typical: TypicalPositions = new Map(),
): { gridX: string; gridY: string; x: number; y: number }[] {
  const taken = new Set(stacks.filter((s) => s.gridX && s.gridY).map((s) => `${s.gridX}|${s.gridY}`));
  for (const { results } of typical.values()) for (const p of results) taken.add(`${p.gridX}|${p.gridY}`);
  const out: { gridX: string; gridY: string; x: number; y: number }[] = [];
  for (const lx of grid.x.lines)
    for (const ly of grid.y.lines)
      if (!taken.has(`${lx.id}|${ly.id}`)) out.push({ gridX: lx.id, gridY: ly.id, x: lx.position, y: ly.position });
  return out;
}
