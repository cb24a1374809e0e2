// Results stored by an older version of the rules (ENGINE_VERSION) are analysed again before a revision is
// frozen, so a package never prints, under the current engine version, numbers that older rules produced.
// Each such stack gets a new version with an empty ops list, as a change of the building's options does.
import type { User } from '../../shared/schema/api.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import type { ServerContext } from '../context.ts';
import { analysisInputs } from './analysis.ts';
import { broadcastChange, commitDoc, type CommittedChange } from './stackOps.ts';
import { parseDoc, parseResults, type StackRow } from './stackRows.ts';

/** Returns how many stacks were analysed again. */
export async function reanalyseOutdated(ctx: ServerContext, buildingId: number, user: User): Promise<number> {
  const changes = await ctx.db.transaction(async (trx) => {
    const rows = await trx<StackRow>('stacks').where({ building_id: buildingId });
    const outdated = rows.filter((r) => parseResults(r.results).engineVersion !== ENGINE_VERSION);
    const done: CommittedChange[] = [];
    if (outdated.length === 0) return done;
    const inputs = await analysisInputs(trx, buildingId);
    for (const stack of outdated) {
      done.push(await commitDoc(trx, stack, { doc: parseDoc(stack.doc), ops: [], touched: new Set<string>(), userId: user.id, action: 'engine.reanalyse' }, inputs));
    }
    return done;
  });
  for (const c of changes) broadcastChange(ctx, c, { userId: user.id, name: user.name });
  return changes.length;
}
