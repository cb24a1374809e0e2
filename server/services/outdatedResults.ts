// Results stored by an older version of the rules (ENGINE_VERSION) are analysed again when the server starts
// and before a revision is frozen, so neither the screens nor a package show, under the current engine
// version, numbers that older rules produced.
// Each such stack gets a new version with an empty ops list, as a change of the building's options does.
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import type { ServerContext } from '../context.ts';
import { HttpError } from '../errors.ts';
import { analysisInputs } from './analysis.ts';
import { broadcastChanges, commitDoc, type CommittedChange } from './stackOps.ts';
import { parseDoc, storedEngineVersion, type StackRow } from './stackRows.ts';

/** Returns how many stacks were analysed again. */
export async function reanalyseOutdated(ctx: ServerContext, buildingId: number, user: User): Promise<number> {
  const changes = await ctx.db.transaction(async (trx) => {
    // Packed results name their engine version in the row: only rows stored before are opened.
    const rows = await trx<StackRow>('stacks').where({ building_id: buildingId });
    const outdated = rows.filter((r) => storedEngineVersion(r) !== ENGINE_VERSION);
    const done: CommittedChange[] = [];
    if (outdated.length === 0) return done;
    const inputs = await analysisInputs(trx, buildingId);
    for (const stack of outdated) {
      done.push(
        await commitDoc(
          trx,
          stack,
          {
            doc: parseDoc(stack.doc),
            ops: [],
            touched: new Set<string>(),
            userId: user.id,
            action: 'engine.reanalyse',
          },
          inputs,
        ),
      );
    }
    return done;
  });
  broadcastChanges(ctx, changes, { userId: user.id, name: user.name });
  return changes.length;
}

/**
 * At start-up: every stack whose stored results another engine version produced is analysed again, one
 * transaction each, so the screens show the current rules' figures without waiting for an edit. With
 * several processes starting together a stack another one got to first (409 on its version) is left to it.
 */
export async function reanalyseOutdatedOnStart(db: Knex): Promise<number> {
  // Packed results name their engine version in a column; rows stored before as JSON text end with it as
  // their last key (analysis.ts; docs/contracts.md §Stored results).
  const marked = `%"engineVersion":"${ENGINE_VERSION}"}`;
  const rows = await db<StackRow>('stacks')
    .where((q) => q.whereNull('engine_version').whereNot('results', 'like', marked))
    .orWhereNot('engine_version', ENGINE_VERSION)
    .select<{ id: number; building_id: number }[]>('id', 'building_id');
  let done = 0;
  for (const { id, building_id: buildingId } of rows) {
    try {
      await db.transaction(async (trx) => {
        const row = await trx<StackRow>('stacks').where({ id }).first();
        if (!row || storedEngineVersion(row) === ENGINE_VERSION) return;
        const change = {
          doc: parseDoc(row.doc),
          ops: [],
          touched: new Set<string>(),
          userId: null,
          action: 'engine.reanalyse',
        };
        await commitDoc(trx, row, change, await analysisInputs(trx, buildingId));
        done++;
      });
    } catch (error) {
      if (!(error instanceof HttpError && error.status === 409)) throw error;
    }
  }
  return done;
}
