// The review of a revision (docs/issue-workflow.md): prepared, checked, approved and issued, each step once with
// who and when (revision_steps, rows only added), and the checker's comments on stacks and lifts. Where a
// revision stands is read from its steps; who may take a step is the access policy's reviewRefusal.
import type { Knex } from 'knex';
import type { Role, User } from '../../shared/schema/api.ts';
import type {
  ApproveBody,
  CheckBody,
  ResolveBody,
  RevisionReview,
  ReviewComment,
  ReviewState,
  ReviewSummary,
  Signature,
  SignOff,
} from '../../shared/schema/reviews.ts';
import type { RevisionPurpose } from '../../shared/schema/revisions.ts';
import { now } from '../db.ts';
import { onUniqueViolation } from '../dbErrors.ts';
import { conflict, notFound, unprocessable } from '../errors.ts';
import { reviewActions, reviewRefusal, type ReviewAction, type ReviewFacts } from './accessPolicy.ts';
import { recordAudit } from './audit.ts';
import { loadSnapshot } from './revisions.ts';

export type Step = 'prepared' | 'checked' | 'approved';

interface StepRow {
  revision_id: number;
  step: Step;
  user_id: number;
  user_name: string;
  at: string;
  unchecked: boolean | number;
  note: string;
}

interface CommentRow {
  id: number;
  revision_id: number;
  stack_id: number;
  stack_name: string;
  lift_id: string | null;
  lift_label: string | null;
  text: string;
  author_name: string;
  created_at: string;
  resolved_by_name: string | null;
  resolved_at: string | null;
  resolution: string | null;
}

interface RevisionHead {
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
interface ReviewRecord {
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

function summaryOf(r: ReviewRecord): ReviewSummary {
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

async function recordOf(db: Knex, revisionId: number): Promise<ReviewRecord> {
  const head = await db('revisions')
    .where({ id: revisionId })
    .first<RevisionHead | undefined>(...HEAD_COLUMNS);
  if (!head) throw notFound('Revision');
  const r = (await records(db, [head])).get(revisionId);
  if (!r) throw notFound('Revision');
  return r;
}

const factsOf = (r: ReviewRecord): ReviewFacts => ({
  state: r.state,
  purpose: r.head.purpose,
  code: r.head.code,
  preparedBy: r.steps.get('prepared')?.user_id ?? r.head.frozen_by,
});

function allow(action: ReviewAction, role: Role | null, user: User, r: ReviewRecord): void {
  const refusal = reviewRefusal(action, role, user.id, factsOf(r));
  if (refusal) throw refusal;
}

const toComment = (c: CommentRow): ReviewComment => ({
  id: c.id,
  stackId: c.stack_id,
  stack: c.stack_name,
  liftId: c.lift_id,
  lift: c.lift_label,
  text: c.text,
  by: { name: c.author_name, at: c.created_at },
  resolved:
    c.resolved_at !== null ? { name: c.resolved_by_name ?? '', at: c.resolved_at, note: c.resolution ?? '' } : null,
});

const commentRows = (db: Knex, revisionId: number) =>
  db<CommentRow>('revision_comments').where({ revision_id: revisionId }).orderBy('id');

export async function getReview(db: Knex, revisionId: number, user: User, role: Role | null): Promise<RevisionReview> {
  const r = await recordOf(db, revisionId);
  const sum = summaryOf(r);
  return {
    revisionId,
    code: r.head.code,
    state: r.state,
    prepared: sum.prepared,
    checked: sum.checked,
    approved: sum.approved,
    unchecked: sum.unchecked,
    openCommentsReason: r.steps.get('approved')?.note || null,
    comments: (await commentRows(db, revisionId)).map(toComment),
    actions: reviewActions(role, user.id, factsOf(r)),
  };
}

/** What the package prints; null for a revision frozen before checking existed (its cover says "Frozen by"). */
export async function loadSignOff(db: Knex, revisionId: number): Promise<SignOff | null> {
  const r = await recordOf(db, revisionId);
  if (r.steps.size === 0) return null;
  const sum = summaryOf(r);
  const reason = r.steps.get('approved')?.note || null;
  const open = reason ? (await commentRows(db, revisionId)).filter((c) => c.resolved_at === null) : [];
  return {
    prepared: sum.prepared,
    checked: sum.checked,
    approved: sum.approved,
    unchecked: sum.unchecked,
    openCommentsReason: reason,
    openComments: open.map((c) => ({ stack: c.stack_name, lift: c.lift_label, text: c.text, by: c.author_name })),
  };
}

/** Whether the revision is issued (its package is the stored, immutable one). */
export async function isIssued(db: Knex, revisionId: number): Promise<boolean> {
  return (await recordOf(db, revisionId)).state === 'issued';
}

export async function checkRevision(
  db: Knex,
  revisionId: number,
  body: Required<CheckBody>,
  user: User,
  role: Role | null,
): Promise<void> {
  await db.transaction(async (trx) => {
    const r = await recordOf(trx, revisionId);
    allow('check', role, user, r);
    await recordStep(trx, revisionId, 'checked', user, now(), { note: body.note });
    await recordAudit(trx, {
      userId: user.id,
      buildingId: r.head.building_id,
      action: 'revision.check',
      detail: { revisionId, code: r.head.code },
    });
  });
}

export async function addComment(
  db: Knex,
  revisionId: number,
  body: { stackId: number; liftId: string | null; text: string },
  user: User,
  role: Role | null,
): Promise<ReviewComment> {
  const { snapshot } = await loadSnapshot(db, revisionId);
  const stack = snapshot.stacks.find((s) => s.id === body.stackId);
  if (!stack) throw unprocessable(`Stack ${body.stackId} is not in revision ${snapshot.code}`);
  let liftLabel: string | null = null;
  if (body.liftId !== null) {
    const lift = stack.results.lifts.find((l) => l.liftId === body.liftId);
    if (!lift) throw unprocessable(`Stack ${stack.name} has no lift ${body.liftId} in revision ${snapshot.code}`);
    liftLabel = lift.label ?? lift.liftId;
  }
  return db.transaction(async (trx) => {
    const r = await recordOf(trx, revisionId);
    allow('comment', role, user, r);
    const [row] = await trx('revision_comments')
      .insert({
        revision_id: revisionId,
        stack_id: stack.id,
        stack_name: stack.name,
        lift_id: body.liftId,
        lift_label: liftLabel,
        text: body.text,
        author_id: user.id,
        author_name: user.name,
        created_at: now(),
      })
      .returning<{ id: number }[]>('id');
    await recordAudit(trx, {
      userId: user.id,
      buildingId: r.head.building_id,
      action: 'revision.comment',
      detail: { revisionId, commentId: row.id },
    });
    return toComment((await trx<CommentRow>('revision_comments').where({ id: row.id }).first()) as CommentRow);
  });
}

export async function resolveComment(
  db: Knex,
  revisionId: number,
  commentId: number,
  body: Required<ResolveBody>,
  user: User,
  role: Role | null,
): Promise<ReviewComment> {
  return db.transaction(async (trx) => {
    const r = await recordOf(trx, revisionId);
    allow('resolve', role, user, r);
    const found = await trx<CommentRow>('revision_comments').where({ id: commentId, revision_id: revisionId }).first();
    if (!found) throw notFound('Comment');
    const n = await trx('revision_comments')
      .where({ id: commentId })
      .whereNull('resolved_at')
      .update({ resolved_by: user.id, resolved_by_name: user.name, resolved_at: now(), resolution: body.note });
    if (n === 0) throw conflict('This comment is resolved already');
    await recordAudit(trx, {
      userId: user.id,
      buildingId: r.head.building_id,
      action: 'revision.resolve',
      detail: { revisionId, commentId },
    });
    return toComment((await trx<CommentRow>('revision_comments').where({ id: commentId }).first()) as CommentRow);
  });
}

/**
 * Refuses the approval, or records it (in the caller's transaction) and returns what the issue needs. A
 * lead approves a checked revision, or a preliminary one without a check (the cover says so); open
 * comments stop it unless the lead gives the reason, which is stored and printed.
 */
export async function recordApproval(
  trx: Knex,
  revisionId: number,
  body: Required<ApproveBody>,
  user: User,
  role: Role | null,
  at: string,
): Promise<{ buildingId: number; code: string; unchecked: boolean }> {
  const r = await recordOf(trx, revisionId);
  allow('approve', role, user, r);
  if (r.openComments > 0 && body.openCommentsReason === '')
    throw unprocessable(
      `${r.openComments} comment${r.openComments === 1 ? ' is' : 's are'} still open: resolve ${r.openComments === 1 ? 'it' : 'them'}, or say why revision ${r.head.code} is approved with ${r.openComments === 1 ? 'it' : 'them'} open`,
      { openComments: r.openComments },
    );
  const unchecked = r.state === 'prepared';
  await recordStep(trx, revisionId, 'approved', user, at, {
    unchecked,
    note: r.openComments > 0 ? body.openCommentsReason : '',
  });
  return { buildingId: r.head.building_id, code: r.head.code, unchecked };
}
