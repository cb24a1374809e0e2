// A checker's comments on the stacks and lifts of a revision (docs/issue-workflow.md): open until resolved; a
// resolved one may be reopened (the resolution it undoes stays in the audit log); who wrote each and when, who
// resolved it and when. Written only while the review is open.
import type { Knex } from 'knex';
import type { Role, User } from '../../shared/schema/api.ts';
import type { ResolveBody, ReviewComment } from '../../shared/schema/reviews.ts';
import { now } from '../db.ts';
import { conflict, notFound, unprocessable } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { allow, recordOf } from './reviewState.ts';
import { revisionOutline } from './revisions.ts';

export interface CommentRow {
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

export const toComment = (c: CommentRow): ReviewComment => ({
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

export const commentRows = (db: Knex, revisionId: number) =>
  db<CommentRow>('revision_comments').where({ revision_id: revisionId }).orderBy('id');

export async function addComment(
  db: Knex,
  revisionId: number,
  body: { stackId: number; liftId: string | null; text: string },
  user: User,
  role: Role | null,
): Promise<ReviewComment> {
  // The stack and lift as frozen, from the revision's outline (its snapshot is not parsed for a comment).
  const frozen = await revisionOutline(db, revisionId);
  const stack = frozen.stacks.find((s) => s.id === body.stackId);
  if (!stack) throw unprocessable(`Stack ${body.stackId} is not in revision ${frozen.code}`);
  let liftLabel: string | null = null;
  if (body.liftId !== null) {
    const lift = stack.lifts.find((l) => l.liftId === body.liftId);
    if (!lift) throw unprocessable(`Stack ${stack.name} has no lift ${body.liftId} in revision ${frozen.code}`);
    liftLabel = lift.label;
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

/**
 * Resolves an open comment (`resolved`), or opens a resolved one again (`open`), under the one rule for both;
 * 409 when it is so already. Reopening leaves the resolution it undoes in the audit log.
 */
export async function markComment(
  db: Knex,
  revisionId: number,
  commentId: number,
  to: 'resolved' | 'open',
  body: Required<ResolveBody>,
  user: User,
  role: Role | null,
): Promise<ReviewComment> {
  return db.transaction(async (trx) => {
    const r = await recordOf(trx, revisionId);
    allow('resolve', role, user, r);
    const found = await trx<CommentRow>('revision_comments').where({ id: commentId, revision_id: revisionId }).first();
    if (!found) throw notFound('Comment');
    const row = trx('revision_comments').where({ id: commentId });
    const n =
      to === 'resolved'
        ? await row
            .whereNull('resolved_at')
            .update({ resolved_by: user.id, resolved_by_name: user.name, resolved_at: now(), resolution: body.note })
        : await row
            .whereNotNull('resolved_at')
            .update({ resolved_by: null, resolved_by_name: null, resolved_at: null, resolution: null });
    if (n === 0) throw conflict(`This comment is ${to} already`);
    const undone = { by: found.resolved_by_name, at: found.resolved_at, note: found.resolution };
    await recordAudit(trx, {
      userId: user.id,
      buildingId: r.head.building_id,
      action: to === 'resolved' ? 'revision.resolve' : 'revision.reopen',
      detail:
        to === 'resolved' ? { revisionId, commentId } : { revisionId, commentId, note: body.note, resolved: undone },
    });
    return toComment((await trx<CommentRow>('revision_comments').where({ id: commentId }).first()) as CommentRow);
  });
}
