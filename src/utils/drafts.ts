// Small helpers of editors that keep a draft of a list and save it whole (grid, build-ups).
import type { z } from 'zod';

/** The first problem zod finds, as words: the named fields on its path, then the message. `skip` leaves out
 *  list names that only say where the item sits ("lines", "buildups"). */
export function firstProblem(error: z.ZodError, skip: string): string {
  const issue = error.issues[0];
  return `${issue.path.filter((p) => typeof p === 'string' && p !== skip).join(' ')} ${issue.message}`.trim();
}

/** `prefix` followed by the first number from `from` up that no id in `taken` uses. */
export function freshId(prefix: string, taken: Iterable<string>, from: number): string {
  const ids = new Set(taken);
  let n = from;
  while (ids.has(`${prefix}${n}`)) n += 1;
  return `${prefix}${n}`;
}
