// Sizing previews (docs/analysis-rules.md §Sizing): the engine's proposal for a stored stack or for every stack of a
// building, with the building's analysis options and levels. Nothing is stored; accepting goes
// through the ordinary edit path (ops), from the client.
import type { Knex } from 'knex';
import { isEngineError, sizeStack } from '../../shared/engine/index.ts';
import type { BuildingSizingPreview, SizingRequest, StackSizingPreview } from '../../shared/schema/sizing.ts';
import type { ServerContext } from '../context.ts';
import { unprocessable } from '../errors.ts';
import { analysisInputs, withDerivedLoads } from './analysis.ts';
import { loadStackRow, parseDoc, placeOf, type StackRow } from './stackRows.ts';

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
  const doc = withDerivedLoads(parseDoc(row.doc), inputs, placeOf(row));
  const sizing = engineRefusal(() =>
    sizeStack(doc, request, inputs.options, { levels: inputs.levels, sections: inputs.sections }),
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
  const { model, ...inputs } = await analysisInputs(ctx.db, buildingId);
  const stacks = rows.map((r) => ({
    stackId: r.id,
    name: r.name,
    version: r.version,
    doc: withDerivedLoads(parseDoc(r.doc), { model, ...inputs }, placeOf(r)),
  }));
  const outcome = await ctx.offThread.sizeBuilding({ stacks, request, ...inputs }, `building:${buildingId}`);
  if ('refused' in outcome) throw unprocessable(outcome.refused.message, { code: outcome.refused.code });
  return { buildingId, ...outcome.sizing };
}
