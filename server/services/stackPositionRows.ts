// Reading the further positions of typical columns (docs/typical-columns.md).
import type { Knex } from 'knex';
import { gridRef, positionOverridesKey, type BuildingModel } from '../../shared/schema/building.ts';
import type { StackPosition } from '../../shared/schema/stackPositions.ts';

export interface PositionRow {
  id: number;
  stack_id: number;
  building_id: number;
  grid_x: string;
  grid_y: string;
  web_along: string;
}

const COLUMNS = ['id', 'stack_id', 'building_id', 'grid_x', 'grid_y', 'web_along'] as const;

/** Every further position of the building's stacks, by stack id, in the order they were added. */
export async function positionsByStack(db: Knex, buildingId: number): Promise<Map<number, PositionRow[]>> {
  const rows = await db<PositionRow>('stack_positions')
    .where({ building_id: buildingId })
    .orderBy('id')
    .select<PositionRow[]>(...COLUMNS);
  const out = new Map<number, PositionRow[]>();
  for (const r of rows) out.set(r.stack_id, [...(out.get(r.stack_id) ?? []), r]);
  return out;
}

export async function positionsOf(db: Knex, stackId: number): Promise<PositionRow[]> {
  return db<PositionRow>('stack_positions')
    .where({ stack_id: stackId })
    .orderBy('id')
    .select<PositionRow[]>(...COLUMNS);
}

export function toStackPosition(model: BuildingModel, row: PositionRow): StackPosition {
  const { grid } = model;
  return {
    id: row.id,
    stackId: row.stack_id,
    gridX: row.grid_x,
    gridY: row.grid_y,
    webAlong: row.web_along === 'y' ? 'y' : 'x',
    name: gridRef(grid, row.grid_x, row.grid_y) ?? `${row.grid_x}/${row.grid_y}`,
    overrides: model.overrides[positionOverridesKey(row.id)] ?? [],
  };
}
