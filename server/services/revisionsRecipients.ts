// Per-recipient mail status of a revision: the one part of a revision that changes after freezing.
import type { Knex } from 'knex';
import type { MailStatus, RevisionRecipient } from '../../shared/schema/revisions.ts';
import { now } from '../db.ts';

export interface RecipientRow {
  id: number;
  revision_id: number;
  email: string;
  name: string;
  status: MailStatus;
  attempts: number;
  error: string | null;
  updated_at: string;
}

export async function recipientRows(db: Knex, revisionId: number): Promise<RecipientRow[]> {
  return db<RecipientRow>('revision_recipients').where({ revision_id: revisionId }).orderBy('email');
}

export async function listRecipients(db: Knex, revisionId: number): Promise<RevisionRecipient[]> {
  return (await recipientRows(db, revisionId)).map((r) => ({
    email: r.email,
    name: r.name,
    status: r.status,
    attempts: r.attempts,
    error: r.error,
    updatedAt: r.updated_at,
  }));
}

export async function recordDelivery(db: Knex, row: RecipientRow, sent: boolean, error: string | null): Promise<void> {
  await db('revision_recipients')
    .where({ id: row.id })
    .update({
      status: sent ? 'sent' : 'failed',
      attempts: row.attempts + 1,
      error: sent ? null : (error ?? 'The mail server did not accept the message'),
      updated_at: now(),
    });
}
