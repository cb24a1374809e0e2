// Reading stack rows and turning them into API shapes.
import type { Knex } from 'knex';
import type { StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { StackResult } from '../../shared/schema/results.ts';
import { stackDocumentSchema, type StackDocument } from '../../shared/schema/stack.ts';
import { isoTime, isPostgres } from '../db.ts';
import { notFound, unprocessable } from '../errors.ts';
import type { StackPlace, StackStatus } from './analysis.ts';

export interface StackRow {
  id: number;
  building_id: number;
  name: string;
  doc: string;
  version: number;
  results: string;
  utilisation: number | null;
  status: StackStatus;
  governing_lift_id: string | null;
  governing_lift_label: string | null;
  governing_section: string | null;
  lift_count: number;
  updated_at: unknown;
  /** Grid line ids (docs/building-model.md); null off the grid. */
  grid_x: string | null;
  grid_y: string | null;
  web_along: string | null;
}

/** Where a stored stack stands on the grid. */
export function placeOf(row: Pick<StackRow, 'id' | 'grid_x' | 'grid_y' | 'web_along'>): StackPlace {
  const onGrid = row.grid_x !== null && row.grid_y !== null;
  return {
    stackId: row.id,
    gridX: onGrid ? row.grid_x : null,
    gridY: onGrid ? row.grid_y : null,
    webAlong: row.web_along === 'y' ? 'y' : 'x',
  };
}

/**
 * Reads a stack row. Inside a transaction on PostgreSQL the row is locked until commit, so writers on
 * several processes queue instead of racing; SQLite has a single writer already.
 */
export async function loadStackRow(db: Knex, id: number, opts: { lock?: boolean } = {}): Promise<StackRow> {
  const query = db<StackRow>('stacks').where({ id });
  if (opts.lock && isPostgres(db)) query.forUpdate();
  const row = await query.first();
  if (!row) throw notFound('Stack');
  return row;
}

/** Stored documents were validated on the way in; parsing again guards against a hand-edited database. */
export const parseDoc = (text: string): StackDocument => stackDocumentSchema.parse(JSON.parse(text));
// Results are written only by our engine; they are carried as they were stored.
export const parseResults = (text: string): StackResult => JSON.parse(text) as StackResult;

export function toSummary(row: StackRow): StackSummary {
  return {
    id: row.id,
    buildingId: row.building_id,
    name: row.name,
    version: row.version,
    liftCount: row.lift_count,
    governingLiftId: row.governing_lift_id,
    governingLiftLabel: row.governing_lift_label,
    governingSection: row.governing_section,
    utilisation: row.utilisation === null ? null : Number(row.utilisation),
    status: row.status,
    updatedAt: isoTime(row.updated_at),
    ...placementFields(row),
  };
}

/** A stack's place on the grid, for stacks on it only: replies about other stacks keep their shape (SPEC §7). */
function placementFields(row: StackRow): { gridX?: string; gridY?: string; webAlong?: 'x' | 'y' } {
  const { gridX, gridY, webAlong } = placeOf(row);
  return gridX !== null && gridY !== null ? { gridX, gridY, webAlong } : {};
}

export function toDetail(row: StackRow): StackDetail {
  return {
    id: row.id,
    buildingId: row.building_id,
    name: row.name,
    doc: parseDoc(row.doc),
    version: row.version,
    results: parseResults(row.results),
    ...placementFields(row),
  };
}

/** Ops address nodes and edges by id, so a document must not use one id twice. */
export function assertUniqueIds(doc: StackDocument): void {
  const seen = new Set<string>();
  for (const item of [...doc.nodes, ...doc.edges]) {
    if (seen.has(item.id))
      throw unprocessable(`The id "${item.id}" is used more than once in the document`, { id: item.id });
    seen.add(item.id);
  }
}
