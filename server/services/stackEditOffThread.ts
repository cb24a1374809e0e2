// Edits of large stacks computed on a worker thread (docs/access.md). Checking a stored 2,000-node document,
// applying the ops and analysing it take a few tenths of a second of CPU; ten such edits at once on the
// event loop would stall every request and live event of the process. The transaction, the conflict check
// and the write stay here; only the computing moves.
import type { Knex } from 'knex';
import type { ServerContext } from '../context.ts';
import { unprocessable } from '../errors.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import { analysisInputs, floorLoadsOf } from './analysis.ts';
import { assertNoOverlap, commitDoc, type CommittedChange, type OpsInput } from './stackOps.ts';
import { placeOf, type StackRow } from './stackRows.ts';

/** Stored documents longer than this (characters of JSON, about 150 nodes) are edited off the main thread. */
export const LARGE_DOC_CHARS = 20_000;

/** One turn of the event loop: long synchronous stretches are split so timers and I/O run between them. */
export const yieldToLoop = (): Promise<void> => new Promise((resolve) => setImmediate(resolve));

/** Longest stretch of work over many items without a turn of the event loop, ms (common practice, no source). */
const SLICE_MS = 20;

/** Runs `step` over `items` in order, letting the event loop turn whenever SLICE_MS have passed. */
export async function inTurns<T, R>(items: readonly T[], step: (item: T) => R): Promise<R[]> {
  const out: R[] = [];
  let slice = performance.now();
  for (const item of items) {
    out.push(step(item));
    if (performance.now() - slice > SLICE_MS) {
      await yieldToLoop();
      slice = performance.now();
    }
  }
  return out;
}

/** Stacks with more lifts than this have results large enough to be worth a turn of the loop before broadcasting. */
export const LARGE_STACK_LIFTS = 10;

export const isLarge = (row: Pick<StackRow, 'doc'>): boolean => row.doc.length > LARGE_DOC_CHARS;

export async function editOffThread(
  trx: Knex,
  row: StackRow,
  input: OpsInput,
  offThread: ServerContext['offThread'],
): Promise<CommittedChange> {
  const inputs = await analysisInputs(trx, row.building_id);
  const floorLoads = floorLoadsOf(inputs, placeOf(row));
  const outcome = await offThread.editLargeStack({
    docText: row.doc,
    ops: input.ops,
    options: inputs.options,
    levels: inputs.levels,
    sections: inputs.sections,
    floorLoads,
  });
  // The result arrives as one message: let the event loop turn before storing it.
  await yieldToLoop();
  const touched = new Set(outcome.touched);
  // As on the main thread: a clash with an edit since baseVersion (409) is reported before a bad op (422).
  await assertNoOverlap(trx, row, input.baseVersion, touched);
  if ('opError' in outcome)
    throw unprocessable(outcome.opError.message, { opIndex: outcome.opError.opIndex, id: outcome.opError.id });
  const results = { ...outcome.results, engineVersion: ENGINE_VERSION };
  return commitDoc(
    trx,
    row,
    { doc: outcome.doc, ops: input.ops, touched, userId: input.userId, action: 'stack.edit' },
    inputs,
    results,
  );
}
