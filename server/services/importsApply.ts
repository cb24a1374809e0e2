// What applying an import does the same for every kind that edits stacks (level loads, company sections):
// refuse a file other than the one previewed or one with problems, commit each changed stack as one new
// version in the import's transaction, then tell the live rooms (docs/contracts.md §Imports).
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import type { ApplyResult, ImportProblem } from '../../shared/schema/imports.ts';
import type { Op } from '../../shared/schema/ops.ts';
import { applyOps as applyOpsToDoc, touchedIds } from '../../shared/ops/applyOps.ts';
import type { ServerContext } from '../context.ts';
import { conflict, unprocessable } from '../errors.ts';
import { analysisInputs } from './analysis.ts';
import { fileHash, problemCount } from './importsCsv.ts';
import { buildingStacks, type StackRef } from './importsLoadTargets.ts';
import { broadcastChanges, commitDoc, type CommittedChange } from './stackOps.ts';

/** A preview before any row is read: what a file that cannot be read at all answers, with its problems. */
export const nothingRead = (file: Buffer) => ({
  fileHash: fileHash(file),
  rows: 0,
  unchanged: 0,
  changes: [],
  problems: [] as ImportProblem[],
});

export const problemsMessage = (n: number): string =>
  `The file has ${n} problem${n === 1 ? '' : 's'}; nothing was changed`;

/** 409 for a file other than the one previewed (when the hash is given), then 422 with the problems. */
export function assertPreviewed(
  preview: { fileHash: string; problems: ImportProblem[]; problemsOmitted?: number },
  fileHash: string | undefined,
): void {
  if (fileHash && fileHash !== preview.fileHash)
    throw conflict('This is not the file that was previewed; preview it again');
  if (preview.problems.length > 0) throw unprocessable(problemsMessage(problemCount(preview)), preview);
}

/** Commits, in `trx`, the ops `opsOf` gives each stack of the building (none: the stack is left alone). */
export async function commitEachStack(
  trx: Knex,
  buildingId: number,
  user: User,
  action: string,
  opsOf: (stack: StackRef) => Op[] | undefined,
): Promise<CommittedChange[]> {
  const inputs = await analysisInputs(trx, buildingId);
  const done: CommittedChange[] = [];
  for (const stack of await buildingStacks(trx, buildingId)) {
    const ops = opsOf(stack);
    if (!ops?.length) continue;
    const doc = applyOpsToDoc(stack.doc, ops);
    done.push(
      await commitDoc(
        trx,
        stack.row,
        { doc, ops, touched: touchedIds(stack.doc, ops), userId: user.id, action },
        inputs,
      ),
    );
  }
  return done;
}

/** After commit: every changed stack goes to its live rooms; the answer lists their new versions. */
export function announceApplied(ctx: ServerContext, user: User, done: CommittedChange[], applied: number): ApplyResult {
  broadcastChanges(ctx, done, { userId: user.id, name: user.name });
  return { applied, stacks: done.map((c) => ({ stackId: c.stackId, version: c.version })) };
}
