// Renaming a building or changing its analysis options. New options re-analyse every stack in the
// same transaction, so no stack shows results computed with the old options; each re-analysed stack
// gets a new version with an empty ops list, which live rooms apply like any other change. Alike columns are
// analysed once (storeReanalyses) unless the critical buckling analysis has run on the worker beforehand.
import type { Building, User } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { now } from '../db.ts';
import { analysisInputs } from './analysis.ts';
import { recordAudit } from './audit.ts';
import { getBuilding, parseOptions, type BuildingInput } from './buildings.ts';
import { broadcastChanges, commitDoc, type CommittedChange } from './stackOps.ts';
import { precomputedFor, precomputeReanalysis } from './reanalysis.ts';
import { parseDoc, type StackRow } from './stackRows.ts';
import { storeReanalyses } from './storeReanalyses.ts';

export async function updateBuilding(
  ctx: ServerContext,
  id: number,
  input: Partial<BuildingInput>,
  user: User,
): Promise<Building> {
  // The heavy analysis (critical buckling of every stack) runs on the worker thread, outside the transaction.
  const precomputed = await precomputeReanalysis(ctx, id, input.options);
  const changes = await ctx.db.transaction(async (trx) => {
    const row = await trx('buildings').where({ id }).first<{ options: string }>('options');
    const patch: Record<string, string> = { updated_at: now() };
    if (input.name !== undefined) patch.name = input.name;
    if (input.reference !== undefined) patch.reference = input.reference;
    const before = parseOptions(row.options);
    const after = { ...before, ...input.options };
    const optionsChanged = JSON.stringify(before) !== JSON.stringify(after);
    if (optionsChanged) patch.options = JSON.stringify(after);
    await trx('buildings').where({ id }).update(patch);
    await recordAudit(trx, { userId: user.id, buildingId: id, action: 'building.update', detail: { ...input } });
    const changes: CommittedChange[] = [];
    if (!optionsChanged) return changes;
    const inputs = await analysisInputs(trx, id);
    const stacks = await trx<StackRow>('stacks').where({ building_id: id });
    const by = { userId: user.id, action: 'building.reanalyse' };
    // Without worker results, alike columns are analysed and stored once, as for a change of the building model.
    if (!precomputed) return storeReanalyses(trx, stacks, inputs, by);
    for (const stack of stacks) {
      const change = {
        doc: parseDoc(stack.doc),
        ops: [],
        touched: new Set<string>(),
        ...by,
      };
      changes.push(await commitDoc(trx, stack, change, inputs, precomputedFor(precomputed, inputs, stack)));
    }
    return changes;
  });
  broadcastChanges(ctx, changes, { userId: user.id, name: user.name });
  return getBuilding(ctx.db, id, 'lead');
}
