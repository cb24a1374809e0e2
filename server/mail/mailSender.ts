// The background sender of the durable outbox (mailQueue.ts), one per server process. It looks for due
// rows every MAIL_POLL_MS (and at once when a request queues mail), sends each with the mailer's
// bounded timeouts, and retries a failure after MAIL_RETRY_BASE_MS × 2^(attempt − 1), capped at an
// hour, until MAIL_MAX_ATTEMPTS; then the row is failed and a lead may send again. A revision's mail
// carries its stored package (revisionPackages.ts), drawn here if it is not drawn yet. What happens
// to each send is copied to the revision's recipient row, which the revision page shows.
import { randomBytes } from 'node:crypto';
import type { Logger } from 'pino';
import type { ServerContext } from '../context.ts';
import { now } from '../db.ts';
import { packageFilename } from '../services/revisionsMail.ts';
import { issuedPackage } from '../services/revisionPackages.ts';
import { loadSnapshotHead } from '../services/revisions.ts';
import { claimDue, dueAttachments, recordAttempt, renewClaim, type QueuedMail, type QueueStatus } from './mailQueue.ts';
import type { MailMessage } from './mailer.ts';

const MAX_RETRY_DELAY_MS = 60 * 60_000;
const BATCH = 10;

export interface MailSender {
  /** Look for due mail now (after a request queued some). */
  kick(): void;
  stop(): Promise<void>;
}

export function retryDelay(retryBaseMs: number, attempts: number): number {
  // Exponential back-off (common practice, no source).
  return Math.min(retryBaseMs * 2 ** Math.max(0, attempts - 1), MAX_RETRY_DELAY_MS);
}

async function messageOf(ctx: ServerContext, mail: QueuedMail): Promise<MailMessage> {
  const message: MailMessage = {
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    ...(mail.html ? { html: mail.html } : {}),
  };
  if (mail.attach_revision_id === null) return message;
  const pkg = await issuedPackage(ctx, mail.attach_revision_id);
  const head = await loadSnapshotHead(ctx.db, mail.attach_revision_id);
  return {
    ...message,
    attachments: [{ filename: packageFilename(head), content: pkg.bytes, contentType: 'application/pdf' }],
  };
}

async function reportToRecipient(
  ctx: ServerContext,
  mail: QueuedMail,
  status: QueueStatus,
  error: string | null,
): Promise<void> {
  if (mail.recipient_id === null) return;
  await ctx
    .db('revision_recipients')
    .where({ id: mail.recipient_id })
    .update({
      status: status === 'sending' ? 'pending' : status,
      attempts: ctx.db.raw('attempts + 1'),
      error: status === 'sent' ? null : error,
      updated_at: now(),
    });
}

export function startMailSender(ctx: ServerContext, log: Logger): MailSender {
  const owner = `${process.pid}-${randomBytes(4).toString('hex')}`;
  // The lease must outlast one send (connection, greeting and data each bounded by the timeout) and
  // the package drawing: a send outliving it would let another process claim the row again.
  const { retryBaseMs, maxAttempts, pollMs, leaseMs } = ctx.config.mail;
  let stopped = false;
  let running: Promise<void> | null = null;
  let again = false;

  async function sendOne(mail: QueuedMail): Promise<void> {
    let error: string | null;
    try {
      const message = await messageOf(ctx, mail);
      if (!(await renewClaim(ctx.db, mail, owner, leaseMs))) {
        log.warn({ id: mail.id }, 'mail claim lost before sending; another process has it');
        return;
      }
      error = await ctx.mailer.trySend(message, mail.attempts + 1);
    } catch (e) {
      error = e instanceof Error ? e.message : String(e);
    }
    const attempts = mail.attempts + 1;
    const retryIn = error === null || attempts >= maxAttempts ? null : retryDelay(retryBaseMs, attempts);
    const status = await recordAttempt(ctx.db, mail, owner, error, retryIn);
    await reportToRecipient(ctx, mail, status, error);
    if (error !== null) log.warn({ to: mail.to, subject: mail.subject, attempts, status, error }, 'mail not sent');
  }

  async function tick(): Promise<void> {
    do {
      again = false;
      // Account mail first: someone is waiting at the screen for the verification link, and it must not
      // queue behind the drawing of a revision's package.
      for (const mail of await claimDue(ctx.db, owner, leaseMs, BATCH, 'account')) {
        if (stopped) return;
        await sendOne(mail);
      }
      // Packages are drawn before any row is claimed, so a claim's lease covers only the SMTP exchange.
      for (const revisionId of await dueAttachments(ctx.db, BATCH)) {
        await issuedPackage(ctx, revisionId).catch((err: unknown) =>
          log.warn({ err, revisionId }, 'package for mail not drawn; the send will report it'),
        );
      }
      const batch = await claimDue(ctx.db, owner, leaseMs, BATCH);
      for (const mail of batch) {
        if (stopped) return;
        await sendOne(mail);
      }
      if (batch.length === BATCH) again = true;
    } while (again && !stopped);
  }

  function kick(): void {
    if (stopped) return;
    if (running) {
      again = true;
      return;
    }
    running = tick()
      .catch((err: unknown) => log.error({ err }, 'mail sender pass failed; it runs again at the next poll'))
      .finally(() => {
        running = null;
      });
  }

  const timer = setInterval(kick, pollMs);
  timer.unref();
  kick();
  return {
    kick,
    async stop() {
      stopped = true;
      clearInterval(timer);
      await running;
    },
  };
}
