// The review of a revision (docs/issue-workflow.md): prepared, checked, approved and issued, each step once with
// who and when. The review record the client reads, the sign-offs the package prints, the check and the approval.
// Where a revision stands: reviewState.ts; comments: reviewComments.ts.
import type { Knex } from 'knex';
import type { Role, User } from '../../shared/schema/api.ts';
import type { ApproveBody, CheckBody, RevisionReview, SignOff } from '../../shared/schema/reviews.ts';
import { now } from '../db.ts';
import { unprocessable } from '../errors.ts';
import { reviewActions } from './accessPolicy.ts';
import { recordAudit } from './audit.ts';
import { commentRows, toComment } from './reviewComments.ts';
import { allow, factsOf, recordOf, recordStep, summaryOf } from './reviewState.ts';

export { recordStep, reviewSummaries } from './reviewState.ts';

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
