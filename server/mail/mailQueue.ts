// The durable outbox (docs/faults.md): rows of mail_queue written in the transaction that makes the
// mail necessary, so a crash after commit cannot lose a send. The sender (mailSender.ts) claims a due
// row with one conditional UPDATE — only one process's UPDATE can match — and holds it for a lease;
// a process that dies mid-send leaves the row to be claimed again when the lease ends.
import type { Knex } from 'knex';
import { now } from '../db.ts';
import type { MailMessage } from './mailer.ts';

export type QueueStatus = 'pending' | 'sending' | 'sent' | 'failed';

export interface QueuedMail {
  id: number;
  kind: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  attach_revision_id: number | null;
  recipient_id: number | null;
  building_id: number | null;
  status: QueueStatus;
  attempts: number;
  last_error: string | null;
}

export interface NewMail {
  kind: 'revision' | 'invitation' | 'account';
  message: Omit<MailMessage, 'attachments'>;
  attachRevisionId?: number;
  recipientId?: number;
  buildingId?: number;
}

export async function enqueueMail(db: Knex, mails: NewMail[]): Promise<void> {
  if (mails.length === 0) return;
  const at = now();
  await db('mail_queue').insert(
    mails.map((m) => ({
      kind: m.kind,
      to: m.message.to,
      subject: m.message.subject,
      text: m.message.text,
      html: m.message.html ?? null,
      attach_revision_id: m.attachRevisionId ?? null,
      recipient_id: m.recipientId ?? null,
      building_id: m.buildingId ?? null,
      status: 'pending',
      attempts: 0,
      next_attempt_at: Date.now(),
      created_at: at,
      updated_at: at,
    })),
  );
}

/**
 * Claims up to `limit` due rows for `owner` until `leaseMs` from now (only rows of `kind` when given);
 * returns the rows it won.
 */
export async function claimDue(
  db: Knex,
  owner: string,
  leaseMs: number,
  limit: number,
  kind?: NewMail['kind'],
): Promise<QueuedMail[]> {
  const t = Date.now();
  const due = (q: Knex.QueryBuilder) =>
    q
      .where((d) =>
        d
          .where((w) => w.where({ status: 'pending' }).andWhere('next_attempt_at', '<=', t))
          .orWhere((w) => w.where({ status: 'sending' }).andWhere('claimed_until', '<', t)),
      )
      .modify((w) => {
        if (kind) w.andWhere({ kind });
      });
  const candidates = await db('mail_queue')
    .where(due)
    .orderBy('next_attempt_at')
    .orderBy('id')
    .limit(limit)
    .pluck<number[]>('id');
  const won: QueuedMail[] = [];
  for (const id of candidates) {
    // Re-checked in the UPDATE itself: of two processes racing for a row, one matches and one does not.
    const n = await db('mail_queue')
      .where({ id })
      .andWhere(due)
      .update({ status: 'sending', claimed_by: owner, claimed_until: t + leaseMs, updated_at: now() });
    if (n === 1)
      won.push(
        await db<QueuedMail>('mail_queue')
          .where({ id })
          .first()
          .then((r) => r as QueuedMail),
      );
  }
  return won;
}

/** Outcome of one attempt; a failure is retried after `retryInMs`, or given up (null). */
export async function recordAttempt(
  db: Knex,
  mail: QueuedMail,
  owner: string,
  error: string | null,
  retryInMs: number | null,
): Promise<QueueStatus> {
  const status: QueueStatus = error === null ? 'sent' : retryInMs === null ? 'failed' : 'pending';
  await db('mail_queue')
    .where({ id: mail.id, claimed_by: owner })
    .update({
      status,
      attempts: mail.attempts + 1,
      last_error: error,
      next_attempt_at: Date.now() + (retryInMs ?? 0),
      claimed_until: null,
      claimed_by: null,
      updated_at: now(),
    });
  return status;
}

/** Puts failed sends of one revision back in the queue with a fresh set of attempts (a lead's "send again"). */
export async function requeueFailed(db: Knex, revisionId: number): Promise<number> {
  return db('mail_queue')
    .where({ attach_revision_id: revisionId, status: 'failed' })
    .update({ status: 'pending', attempts: 0, next_attempt_at: Date.now(), updated_at: now() });
}

/**
 * Renews this owner's claim just before the SMTP exchange; false when the claim was lost (the lease
 * ran out while the message was being prepared and another process took the row): then do not send.
 */
export async function renewClaim(db: Knex, mail: QueuedMail, owner: string, leaseMs: number): Promise<boolean> {
  const n = await db('mail_queue')
    .where({ id: mail.id, claimed_by: owner, status: 'sending' })
    .update({ claimed_until: Date.now() + leaseMs, updated_at: now() });
  return n === 1;
}

/** Revisions whose packages due mail will attach: drawn before any row is claimed. */
export async function dueAttachments(db: Knex, limit: number): Promise<number[]> {
  const rows = await db('mail_queue')
    .where({ status: 'pending' })
    .andWhere('next_attempt_at', '<=', Date.now())
    .whereNotNull('attach_revision_id')
    .distinct('attach_revision_id')
    .limit(limit);
  return rows.map((r: { attach_revision_id: number }) => r.attach_revision_id);
}
