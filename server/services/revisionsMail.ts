// Telling the team about a revision: one e-mail per member with a link and the calculation package
// attached. Runs after the freeze has committed, so a mail failure never loses the revision; every
// recipient's outcome is recorded and a lead can send again to those that failed.
import escapeHtml from 'escape-html';
import type { Knex } from 'knex';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import type { ServerContext } from '../context.ts';
import type { MailMessage } from '../mail/mailer.ts';
import { recipientRows, recordDelivery } from './revisionsRecipients.ts';

export const packageFilename = (s: Pick<RevisionSnapshot, 'building' | 'code'>) =>
  `${(s.building.reference || s.building.name).replace(/[^A-Za-z0-9._-]+/g, '-')}-${s.code}-calculations.pdf`;

export function revisionMessage(s: RevisionSnapshot, hash: string, to: string, link: string, pdf: Buffer): MailMessage {
  const purpose = s.purpose === 'construction' ? 'for construction' : 'preliminary';
  const issue = s.purpose === 'construction' ? 'for construction' : 'as a preliminary issue';
  const stacks = `${s.stacks.length} stack${s.stacks.length === 1 ? '' : 's'}`;
  const subject = `${s.building.name}: revision ${s.code} issued (${purpose})`;
  const note = s.note ? `\nNote: ${s.note}\n` : '';
  const ack = s.acknowledgement ? `\n${s.acknowledgement}\n` : '';
  const text =
    `${s.frozenBy.name} has frozen revision ${s.code} of "${s.building.name}" (${stacks}) ${issue}.\n` +
    note + ack +
    `\nThe calculation package is attached. Revisions of the building: ${link}\n` +
    `Snapshot SHA-256: ${hash}\n`;
  const html =
    `<p>${escapeHtml(s.frozenBy.name)} has frozen revision <b>${escapeHtml(s.code)}</b> of <b>${escapeHtml(s.building.name)}</b> (${stacks}) ${issue}.</p>` +
    (s.note ? `<p>Note: ${escapeHtml(s.note)}</p>` : '') +
    (s.acknowledgement ? `<p><b>${escapeHtml(s.acknowledgement)}</b></p>` : '') +
    `<p>The calculation package is attached. <a href="${escapeHtml(link)}">Open the revisions of the building</a>.</p>`;
  return { to, subject, text, html, attachments: [{ filename: packageFilename(s), content: pdf, contentType: 'application/pdf' }] };
}

/** The mailer logs the last SMTP error per message; it is shown to the lead beside the recipient. */
async function lastMailError(db: Knex, to: string, subject: string): Promise<string | null> {
  const row = await db('mail_log').where({ to, subject, status: 'failed' }).orderBy('id', 'desc').first<{ error: string | null } | undefined>('error');
  return row?.error ?? null;
}

/** Sends to every recipient not yet reached; returns how many were sent now. */
export async function sendRevisionMail(ctx: ServerContext, revisionId: number, snapshot: RevisionSnapshot, hash: string, link: string, pdf: Buffer): Promise<number> {
  const rows = (await recipientRows(ctx.db, revisionId)).filter((r) => r.status !== 'sent');
  const outcomes = await Promise.all(
    rows.map(async (row) => {
      const message = revisionMessage(snapshot, hash, row.email, link, pdf);
      const sent = await ctx.mailer.sendMail(message);
      await recordDelivery(ctx.db, row, sent, sent ? null : await lastMailError(ctx.db, row.email, message.subject));
      return sent;
    }),
  );
  return outcomes.filter(Boolean).length;
}
