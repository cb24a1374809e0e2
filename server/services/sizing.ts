// Sizing previews (docs/analysis-rules.md §Sizing): the engine's proposal for a stored stack or for every stack of a
// building, with the building's analysis options and levels. Nothing is stored; accepting goes
// through the ordinary edit path (ops), from the client.
import type { Knex } from 'knex';
import { isEngineError, sizeTypicalColumn } from '../../shared/engine/index.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import type { BuildingSizingPreview, SizingRequest, StackSizingPreview } from '../../shared/schema/sizing.ts';
import type { ServerContext } from '../context.ts';
import { unprocessable } from '../errors.ts';
import { analysisInputs, positionPlaces, withDerivedLoads, type AnalysisInputs, type StackPlace } from './analysis.ts';
import { loadStackRow, parseDoc, placeOf, type StackRow } from './stackRows.ts';

/** The document with the loads of each place the stack stands at: its own first, then a typical column's others. */
function positionDocs(doc: StackDocument, inputs: AnalysisInputs, place: StackPlace): StackDocument[] {
  return [place, ...positionPlaces(inputs, place).map((p) => p.place)].map((at) => withDerivedLoads(doc, inputs, at));
}

/** The engine refuses a request (an allowed name not in the series) with EngineError: a 422 here. */
function engineRefusal<T>(run: () => T): T {
  try {
    return run();
  } catch (error) {
    if (isEngineError(error)) throw unprocessable(error.message, { code: error.code });
    throw error;
  }
}

export async function stackSizingPreview(
  db: Knex,
  stackId: number,
  request: SizingRequest,
): Promise<StackSizingPreview> {
  const row = await loadStackRow(db, stackId);
  const inputs = await analysisInputs(db, row.building_id);
  // A typical column is sized for every position it stands at (docs/typical-columns.md).
  const docs = positionDocs(parseDoc(row.doc), inputs, placeOf(row));
  const sizing = engineRefusal(() =>
    sizeTypicalColumn(docs, request, inputs.options, { levels: inputs.levels, sections: inputs.sections }),
  );
  return { stackId: row.id, name: row.name, version: row.version, ...sizing };
}

/** Every stack of a building, sized on the worker thread (a large building takes seconds). */
export async function buildingSizingPreview(
  ctx: ServerContext,
  buildingId: number,
  request: SizingRequest,
): Promise<BuildingSizingPreview> {
  const rows = await ctx
    .db<StackRow>('stacks')
    .where({ building_id: buildingId })
    .orderBy('name')
    .orderBy('id')
    .select('id', 'name', 'version', 'doc', 'grid_x', 'grid_y', 'web_along');
  const { model, positions, ...inputs } = await analysisInputs(ctx.db, buildingId);
  const stacks = rows.map((r) => {
    const [doc, ...others] = positionDocs(parseDoc(r.doc), { model, positions, ...inputs }, placeOf(r));
    return {
      stackId: r.id,
      name: r.name,
      version: r.version,
      doc: doc!,
      ...(others.length ? { positionDocs: others } : {}),
    };
  });
  const outcome = await ctx.offThread.sizeBuilding({ stacks, request, ...inputs }, `building:${buildingId}`);
  if ('refused' in outcome) throw unprocessable(outcome.refused.message, { code: outcome.refused.code });
  return { buildingId, ...outcome.sizing };
}
