// Telling the team about a revision: one e-mail per member with a link and the stored calculation
// package attached. The freeze queues these in its own transaction (mailQueue.ts) and the background
// sender sends them (mailSender.ts), so a slow or dead mail server never holds the freeze and a crash
// after commit loses no mail. Each recipient's outcome is kept; a lead can send again to the failed.
import escapeHtml from 'escape-html';
import type { Knex } from 'knex';
import type { SignOff } from '../../shared/schema/reviews.ts';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import type { ServerContext } from '../context.ts';
import { now } from '../db.ts';
import { enqueueMail, requeueFailed } from '../mail/mailQueue.ts';
import type { MailMessage } from '../mail/mailer.ts';
import { recipientRows } from './revisionsRecipients.ts';
import { loadSignOff } from './reviews.ts';

export const packageFilename = (s: Pick<RevisionSnapshot, 'building' | 'code'>) =>
  `${(s.building.reference || s.building.name).replace(/[^A-Za-z0-9._-]+/g, '-')}-${s.code}-calculations.pdf`;

/** "Prepared by A on 2026-12-03; checked by B on …; approved by C on …", as the cover prints it. */
export function signOffWords(o: SignOff): string {
  const on = (at: string) => at.slice(0, 10);
  const checked = o.checked
    ? `checked by ${o.checked.name} on ${on(o.checked.at)}`
    : o.unchecked
      ? 'not checked (preliminary issue)'
      : 'not checked yet';
  const approved = o.approved ? `approved by ${o.approved.name} on ${on(o.approved.at)}` : 'not approved yet';
  return `Prepared by ${o.prepared.name} on ${on(o.prepared.at)}; ${checked}; ${approved}.`;
}

/** What an issue's e-mail says of a revision: its snapshot but the stacks, and how many stacks were frozen. */
export type IssueHead = Omit<RevisionSnapshot, 'stacks'> & { stackCount: number };

/** The message without its attachment: the sender attaches the stored package when it sends. */
export function revisionMessage(
  s: IssueHead,
  hash: string,
  to: string,
  link: string,
  signOff: SignOff | null = null,
): Omit<MailMessage, 'attachments'> {
  const purpose = s.purpose === 'construction' ? 'for construction' : 'preliminary';
  const issue = s.purpose === 'construction' ? 'for construction' : 'as a preliminary issue';
  const stacks = `${s.stackCount} stack${s.stackCount === 1 ? '' : 's'}`;
  const subject = `${s.building.name}: revision ${s.code} issued (${purpose})`;
  const note = s.note ? `\nNote: ${s.note}\n` : '';
  const ack = s.acknowledgement ? `\n${s.acknowledgement}\n` : '';
  const reason = signOff?.openCommentsReason
    ? `Approved with ${signOff.openComments.length} comment${signOff.openComments.length === 1 ? '' : 's'} open: ${signOff.openCommentsReason}`
    : '';
  // Revisions frozen before checking existed were issued by whoever froze them.
  const opening = signOff
    ? `Revision ${s.code} of "${s.building.name}" (${stacks}) is issued ${issue}. ${signOffWords(signOff)}`
    : `${s.frozenBy.name} has frozen revision ${s.code} of "${s.building.name}" (${stacks}) ${issue}.`;
  const text =
    `${opening}\n` +
    (reason ? `\n${reason}\n` : '') +
    note +
    ack +
    `\nThe calculation package is attached. Revisions of the building: ${link}\n` +
    `Snapshot SHA-256: ${hash}\n`;
  const html =
    `<p>${escapeHtml(opening)}</p>` +
    (reason ? `<p><b>${escapeHtml(reason)}</b></p>` : '') +
    (s.note ? `<p>Note: ${escapeHtml(s.note)}</p>` : '') +
    (s.acknowledgement ? `<p><b>${escapeHtml(s.acknowledgement)}</b></p>` : '') +
    `<p>The calculation package is attached. <a href="${escapeHtml(link)}">Open the revisions of the building</a>.</p>`;
  return { to, subject, text, html };
}

/**
 * Sends again to every recipient not yet reached: failed sends go back in the queue, and recipients
 * with no send queued (revisions frozen before the outbox existed) get one. Returns how many.
 */
export async function resendRevisionMail(
  ctx: ServerContext,
  revisionId: number,
  head: IssueHead,
  hash: string,
  link: string,
): Promise<number> {
  const signOff = await loadSignOff(ctx.db, revisionId);
  const n = await ctx.db.transaction(async (trx: Knex) => {
    let queued = await requeueFailed(trx, revisionId);
    const open = await trx('mail_queue')
      .where({ attach_revision_id: revisionId })
      .whereIn('status', ['pending', 'sending'])
      .pluck<number[]>('recipient_id');
    const waiting = new Set(open);
    for (const row of await recipientRows(trx, revisionId)) {
      if (row.status === 'sent') continue;
      await trx('revision_recipients').where({ id: row.id }).update({ status: 'pending', updated_at: now() });
      if (waiting.has(row.id)) continue;
      await enqueueMail(trx, [
        {
          kind: 'revision',
          message: revisionMessage(head, hash, row.email, link, signOff),
          attachRevisionId: revisionId,
          recipientId: row.id,
          buildingId: head.building.id,
        },
      ]);
      queued += 1;
    }
    return queued;
  });
  ctx.outbox.kick();
  return n;
}
