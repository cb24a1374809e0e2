// Stacks re-analysed because something they read changed (the building model, docs/building-model.md), not
// their document: each is stored as its next version with an empty ops list, in the caller's transaction.
// Hundreds of stacks at a time, so the work is shared where it is the same: columns with the same document
// and the same floors' loads are analysed, encoded and stored once (the engine is a pure function of them),
// the unchanged document is not written again, and the ops and audit rows go in a few multi-row inserts.
import type { Knex } from 'knex';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { now } from '../db.ts';
import { conflict } from '../errors.ts';
import {
  analyse,
  analyseWithLoads,
  floorLoadsKeyOf,
  floorLoadsOf,
  positionPlaces,
  resultColumns,
  summariseResult,
  type AnalysisInputs,
} from './analysis.ts';
import { INSERT_CHUNK, recordAudits } from './audit.ts';
import { touchBuilding } from './buildings.ts';
import type { CommittedChange } from './stackOps.ts';
import { inTurns } from './stackEditOffThread.ts';
import { packResults, placeOf, storeResults, type PackedResults, type StackRow } from './stackRows.ts';

export type ReanalysedRow = Pick<
  StackRow,
  'id' | 'building_id' | 'doc' | 'version' | 'grid_x' | 'grid_y' | 'web_along'
>;

type Analysed = Pick<CommittedChange, 'doc' | 'results' | 'summary'> & {
  packed: PackedResults;
  columns: ReturnType<typeof resultColumns>;
};

/** Stored documents were validated on the way in; they are read as they are. */
const storedDoc = (text: string): StackDocument => JSON.parse(text) as StackDocument;

/** Analyses `rows` (all of one building) with `inputs` and stores each as its next version; 409 if one moved on meanwhile. */
export async function storeReanalyses(
  trx: Knex,
  rows: readonly ReanalysedRow[],
  inputs: AnalysisInputs,
  by: { userId: number | null; action: string },
): Promise<CommittedChange[]> {
  if (rows.length === 0) return [];
  // By document text, then by the key of the place's floor loads (the same key, the same loads): a column like
  // one already analysed is found without deriving its loads again.
  const same = new Map<string, Map<string, Analysed>>();
  // Hundreds of different stacks are seconds of work: other requests and live events are served meanwhile.
  const analysed = await inTurns(rows, (row): Analysed => {
    const place = placeOf(row);
    // A typical column's results hold every position's check (docs/typical-columns.md): analysed on its own.
    const typical = positionPlaces(inputs, place).length > 0;
    const loadsKey = typical ? '' : floorLoadsKeyOf(inputs, place);
    const sameDoc = typical ? undefined : (same.get(row.doc) ?? new Map<string, Analysed>());
    let found = sameDoc?.get(loadsKey);
    if (!found) {
      const doc = storedDoc(row.doc);
      const results = typical
        ? analyse(doc, inputs, place)
        : analyseWithLoads(doc, inputs, floorLoadsOf(inputs, place));
      const packed = packResults(results);
      found = {
        doc,
        results,
        packed,
        summary: summariseResult(doc, results),
        columns: resultColumns(doc, results, packed),
      };
      if (sameDoc) same.set(row.doc, sameDoc.set(loadsKey, found));
    }
    return found;
  });
  // Columns that came out the same share one stored copy of their results (docs/contracts.md §Stored results).
  await storeResults(
    trx,
    analysed.map((a) => a.packed),
  );
  const at = now();
  for (const [i, row] of rows.entries()) {
    const updated = await trx('stacks')
      .where({ id: row.id, version: row.version })
      .update({ version: row.version + 1, ...analysed[i].columns, updated_at: at });
    if (updated === 0)
      throw conflict('The stack was changed by someone else; reload and try again', { version: row.version });
  }
  const ops = rows.map((row) => ({
    stack_id: row.id,
    version: row.version + 1,
    ops: '[]',
    touched: '[]',
    user_id: by.userId,
    created_at: at,
  }));
  for (let i = 0; i < ops.length; i += INSERT_CHUNK) await trx('stack_ops').insert(ops.slice(i, i + INSERT_CHUNK));
  await recordAudits(
    trx,
    rows.map((row) => ({
      userId: by.userId,
      buildingId: row.building_id,
      stackId: row.id,
      action: by.action,
      version: row.version + 1,
      detail: { ops: 0 },
    })),
  );
  for (const buildingId of new Set(rows.map((r) => r.building_id))) await touchBuilding(trx, buildingId);
  return rows.map((row, i) => ({
    stackId: row.id,
    buildingId: row.building_id,
    version: row.version + 1,
    doc: analysed[i].doc,
    results: analysed[i].results,
    ops: [],
    summary: analysed[i].summary,
  }));
}
