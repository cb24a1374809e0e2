// Where a revision stands in its review (docs/issue-workflow.md): its sign-offs (revision_steps, rows only added),
// its open comments and whether a newer revision set it aside; and the access policy's word on each step.
import type { Knex } from 'knex';
import type { Role, User } from '../../shared/schema/api.ts';
import type { ReviewState, ReviewSummary, Signature } from '../../shared/schema/reviews.ts';
import type { RevisionPurpose } from '../../shared/schema/revisions.ts';
import { onUniqueViolation } from '../dbErrors.ts';
import { conflict, notFound } from '../errors.ts';
import { reviewRefusal, type ReviewAction, type ReviewFacts } from './accessPolicy.ts';

export type Step = 'prepared' | 'checked' | 'approved';

export interface StepRow {
  revision_id: number;
  step: Step;
  user_id: number;
  user_name: string;
  at: string;
  unchecked: boolean | number;
  note: string;
}

export interface RevisionHead {
  id: number;
  building_id: number;
  code: string;
  purpose: RevisionPurpose;
  frozen_by: number;
  frozen_by_name: string;
  frozen_at: string;
}

export async function recordStep(
  trx: Knex,
  revisionId: number,
  step: Step,
  user: Pick<User, 'id' | 'name'>,
  at: string,
  extra: { unchecked?: boolean; note?: string } = {},
): Promise<void> {
  await onUniqueViolation(
    () =>
      trx('revision_steps').insert({
        revision_id: revisionId,
        step,
        user_id: user.id,
        user_name: user.name,
        at,
        unchecked: extra.unchecked ?? false,
        note: extra.note ?? '',
      }),
    () => conflict(`This revision is ${step} already; reload it`),
  );
}

/** A revision's sign-offs and open comments, and where it stands. */
export interface ReviewRecord {
  head: RevisionHead;
  steps: Map<Step, StepRow>;
  state: ReviewState;
  openComments: number;
}

const sign = (row: StepRow | undefined): Signature | null => (row ? { name: row.user_name, at: row.at } : null);

function stateOf(steps: Map<Step, StepRow>, newer: boolean): ReviewState {
  // No steps: frozen and issued at once, before checking existed.
  if (steps.size === 0 || steps.has('approved')) return 'issued';
  if (newer) return 'superseded';
  return steps.has('checked') ? 'checked' : 'prepared';
}

async function records(db: Knex, heads: RevisionHead[]): Promise<Map<number, ReviewRecord>> {
  const ids = heads.map((h) => h.id);
  const out = new Map<number, ReviewRecord>();
  if (ids.length === 0) return out;
  const [steps, open, newest] = await Promise.all([
    db<StepRow>('revision_steps').whereIn('revision_id', ids),
    db('revision_comments')
      .whereIn('revision_id', ids)
      .whereNull('resolved_at')
      .groupBy('revision_id')
      .select<{ revision_id: number; n: number | string }[]>('revision_id', db.raw('count(*) as n')),
    db('revisions')
      .whereIn('building_id', [...new Set(heads.map((h) => h.building_id))])
      .groupBy('building_id')
      .select<{ building_id: number; m: number }[]>('building_id', db.raw('max(id) as m')),
  ]);
  const newestOf = new Map(newest.map((r) => [r.building_id, Number(r.m)]));
  for (const head of heads) {
    const mine = new Map(steps.filter((s) => s.revision_id === head.id).map((s) => [s.step, s]));
    out.set(head.id, {
      head,
      steps: mine,
      state: stateOf(mine, (newestOf.get(head.building_id) ?? head.id) > head.id),
      openComments: Number(open.find((o) => o.revision_id === head.id)?.n ?? 0),
    });
  }
  return out;
}

export function summaryOf(r: ReviewRecord): ReviewSummary {
  const legacy = r.steps.size === 0;
  const prepared = sign(r.steps.get('prepared')) ?? { name: r.head.frozen_by_name, at: r.head.frozen_at };
  const approved = legacy ? prepared : sign(r.steps.get('approved'));
  return {
    state: r.state,
    prepared,
    checked: sign(r.steps.get('checked')),
    approved,
    unchecked: legacy || Boolean(r.steps.get('approved')?.unchecked),
    openComments: r.openComments,
  };
}

/** The sign-offs of several revisions, for the revisions list. */
export async function reviewSummaries(db: Knex, heads: RevisionHead[]): Promise<Map<number, ReviewSummary>> {
  const all = await records(db, heads);
  return new Map([...all].map(([id, r]) => [id, summaryOf(r)]));
}

const HEAD_COLUMNS = ['id', 'building_id', 'code', 'purpose', 'frozen_by', 'frozen_by_name', 'frozen_at'];

export async function recordOf(db: Knex, revisionId: number): Promise<ReviewRecord> {
  const head = await db('revisions')
    .where({ id: revisionId })
    .first<RevisionHead | undefined>(...HEAD_COLUMNS);
  if (!head) throw notFound('Revision');
  const r = (await records(db, [head])).get(revisionId);
  if (!r) throw notFound('Revision');
  return r;
}

export const factsOf = (r: ReviewRecord): ReviewFacts => ({
  state: r.state,
  purpose: r.head.purpose,
  code: r.head.code,
  preparedBy: r.steps.get('prepared')?.user_id ?? r.head.frozen_by,
});

export function allow(action: ReviewAction, role: Role | null, user: User, r: ReviewRecord): void {
  const refusal = reviewRefusal(action, role, user.id, factsOf(r));
  if (refusal) throw refusal;
}
