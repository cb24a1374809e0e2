// Issuing a revision (docs/issue-workflow.md): in the transaction that approves it, the package becomes due
// (drawn once after commit with the sign-offs on its cover, then stored with its SHA-256: revisionPackages.ts)
// and every member's e-mail is queued (mailSender.ts attaches that stored package).
import type { Knex } from 'knex';
import type { User, Role } from '../../shared/schema/api.ts';
import type { ApproveBody, SignOff } from '../../shared/schema/reviews.ts';
import { isPostgres, now } from '../db.ts';
import { enqueueMail } from '../mail/mailQueue.ts';
import { recordAudit } from './audit.ts';
import { loadIssueHead } from './revisions.ts';
import { revisionMessage, type IssueHead } from './revisionsMail.ts';
import { loadSignOff, recordApproval } from './reviews.ts';

export interface IssueInput {
  revisionId: number;
  head: IssueHead;
  hash: string;
  /** Where the e-mail's link points (the revisions page of the building). */
  link: string;
  at: string;
  signOff: SignOff | null;
}

export async function queueIssue(trx: Knex, i: IssueInput): Promise<void> {
  const buildingId = i.head.building.id;
  await trx('revision_packages').insert({ revision_id: i.revisionId, copy: 0, created_at: i.at });
  const members = await trx('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.building_id', buildingId)
    .select<{ id: number; email: string; name: string }[]>('u.id', 'u.email', 'u.name');
  for (const m of members) {
    const [recipient] = await trx('revision_recipients')
      .insert({
        revision_id: i.revisionId,
        user_id: m.id,
        email: m.email,
        name: m.name,
        status: 'pending',
        attempts: 0,
        updated_at: i.at,
      })
      .returning<{ id: number }[]>('id');
    await enqueueMail(trx, [
      {
        kind: 'revision',
        message: revisionMessage(i.head, i.hash, m.email, i.link, i.signOff),
        attachRevisionId: i.revisionId,
        recipientId: recipient.id,
        buildingId,
      },
    ]);
  }
}

/** A lead approves and issues; refused while the review does not allow it (reviewRefusal, open comments). */
export async function approveRevision(
  db: Knex,
  revisionId: number,
  body: Required<ApproveBody>,
  user: User,
  role: Role | null,
  link: string,
): Promise<void> {
  const { head, hash } = await loadIssueHead(db, revisionId);
  await db.transaction(async (trx) => {
    // Approvals and freezes of one building wait for each other (PostgreSQL; SQLite has one writer).
    if (isPostgres(trx)) await trx('buildings').where({ id: head.building.id }).forUpdate().first('id');
    const at = now();
    const { code, unchecked } = await recordApproval(trx, revisionId, body, user, role, at);
    await queueIssue(trx, { revisionId, head, hash, link, at, signOff: await loadSignOff(trx, revisionId) });
    await recordAudit(trx, {
      userId: user.id,
      buildingId: head.building.id,
      action: 'revision.approve',
      detail: { revisionId, code, unchecked, openCommentsReason: body.openCommentsReason || null },
    });
  });
}
