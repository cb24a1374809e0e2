// Reading stack rows and turning them into API shapes.
import { createHash } from 'node:crypto';
import { deflateRawSync, inflateRawSync } from 'node:zlib';
import type { Knex } from 'knex';
import type { StackDetail, StackSummary } from '../../shared/schema/api.ts';
import type { StackResult } from '../../shared/schema/results.ts';
import { stackDocumentSchema, type StackDocument } from '../../shared/schema/stack.ts';
import { isoTime, isPostgres, now } from '../db.ts';
import { notFound, unprocessable } from '../errors.ts';
import type { StackPlace, StackStatus } from './analysis.ts';

export interface StackRow {
  id: number;
  building_id: number;
  name: string;
  doc: string;
  version: number;
  /** The results as JSON text for rows stored before results were packed; empty since (`results_hash`). */
  results: string;
  /** The key of the row's results in `stack_results`; null for rows stored before results were packed. */
  results_hash: string | null;
  /** Joined from `stack_results` where a query reads results (`joinResults`); not a column of `stacks`. */
  results_packed?: Buffer | Uint8Array | null;
  /** ENGINE_VERSION of the rules that produced the results; null for rows stored before it was kept here. */
  engine_version: string | null;
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
  const query = stackRowsWithResults(db).where('stacks.id', id);
  if (opts.lock && isPostgres(db)) query.forUpdate('stacks');
  const row = await query.first<StackRow | undefined>();
  if (!row) throw notFound('Stack');
  return row;
}

/** Stored documents were validated on the way in; parsing again guards against a hand-edited database. */
export const parseDoc = (text: string): StackDocument => stackDocumentSchema.parse(JSON.parse(text));
/**
 * What a stack row is selected with wherever its results are read: its own text (rows stored before results
 * were packed) and the packed results it names, joined with `joinResults` (docs/contracts.md §Stored results).
 */
export const STORED_RESULTS = ['stacks.results', 'stack_results.packed as results_packed'] as const;
export type StoredResults = Pick<StackRow, 'results' | 'results_packed'>;

/** Joins stack rows to the packed results they name; select `STORED_RESULTS` (or `stacks.*` with the second). */
export function joinResults<Q extends Knex.QueryBuilder>(query: Q): Q {
  return query.leftJoin('stack_results', 'stack_results.hash', 'stacks.results_hash') as Q;
}

/** Whole stack rows with the packed results they name, ready for `parseResults`; add the where. */
export function stackRowsWithResults(db: Knex): Knex.QueryBuilder<StackRow, StackRow[]> {
  return joinResults(db<StackRow>('stacks')).select('stacks.*', STORED_RESULTS[1]) as Knex.QueryBuilder<
    StackRow,
    StackRow[]
  >;
}

/**
 * Results as stored: deflated JSON from `stack_results` (deflate level 1: a 40-storey stack's 340 kB of JSON
 * packs to about 25 kB in under a millisecond; the working's repeated shape is what it removes), or JSON text
 * in `results` for rows stored before. Written only by our engine; carried as they were stored.
 */
export function parseResults(row: StoredResults): StackResult {
  const text = row.results_packed ? inflateRawSync(row.results_packed).toString('utf8') : row.results;
  return JSON.parse(text) as StackResult;
}

/** The rules a row's results came from: named in the row where they are packed; read from the text before. */
export function storedEngineVersion(
  row: Pick<StackRow, 'results' | 'results_hash' | 'engine_version'>,
): string | undefined {
  if (row.results_hash !== null) return row.engine_version ?? undefined;
  return parseResults({ results: row.results, results_packed: null }).engineVersion;
}

/** One version's results ready to store: packed, and named by the SHA-256 of their JSON. */
export interface PackedResults {
  hash: string;
  packed: Buffer;
  engineVersion: string | null;
}

export function packResults(results: StackResult): PackedResults {
  const json = Buffer.from(JSON.stringify(results), 'utf8');
  return {
    hash: createHash('sha256').update(json).digest('hex'),
    packed: deflateRawSync(json, { level: 1 }),
    engineVersion: results.engineVersion ?? null,
  };
}

/** The stack row's columns that name its stored results. */
export function resultsRef(p: PackedResults): Pick<StackRow, 'results' | 'results_hash' | 'engine_version'> {
  return { results: '', results_hash: p.hash, engine_version: p.engineVersion };
}

/**
 * Stores packed results, each key once. Results already stored under a key are the same results (the key is
 * their digest): only their `used_at` is renewed, which also locks the row on PostgreSQL, so a sweep running
 * beside this transaction cannot remove what it is about to name (`sweepResults`).
 */
export async function storeResults(db: Knex, packs: readonly PackedResults[]): Promise<void> {
  const at = now();
  const rows = [...new Map(packs.map((p) => [p.hash, { hash: p.hash, packed: p.packed, used_at: at }])).values()];
  for (let i = 0; i < rows.length; i += RESULTS_CHUNK)
    await db('stack_results')
      .insert(rows.slice(i, i + RESULTS_CHUNK))
      .onConflict('hash')
      .merge(['used_at']);
}
/** Rows per insert: a few hundred bound values per statement (SQLite allows 32766). */
const RESULTS_CHUNK = 100;

/** How long results no stack names are kept: longer than any transaction that could be about to name them. */
const SWEEP_AFTER_MS = 60 * 60 * 1000;

/** Removes stored results that no stack names and none has taken for an hour; returns how many went. */
export async function sweepResults(db: Knex, at = Date.now()): Promise<number> {
  return db('stack_results')
    .where('used_at', '<', new Date(at - SWEEP_AFTER_MS).toISOString())
    .whereNotExists(db('stacks').whereRaw('stacks.results_hash = stack_results.hash').select(db.raw('1')))
    .delete();
}

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
    results: parseResults(row),
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
