// Outgoing e-mail over SMTP (nodemailer) with bounded connection, greeting and socket times, so a
// mail server that accepts and never answers costs at most MAIL_TIMEOUT_MS per attempt. Requests do
// not send: they queue (mailQueue.ts) and the background sender (mailSender.ts) calls trySend.
// sendMail (retrying in place) remains for tools and tests that want a message out at once.
import type { Knex } from 'knex';
import nodemailer from 'nodemailer';
import type { Logger } from 'pino';
import type { Config } from '../config.ts';
import { now } from '../db.ts';
import { startSmtpFake, type SmtpFake } from './smtpFake.ts';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer; contentType?: string }[];
}

export interface Mailer {
  /** true when the message was accepted by the SMTP server. */
  sendMail(message: MailMessage): Promise<boolean>;
  /** One attempt: null when the SMTP server accepted the message, else why not (logged in mail_log). */
  trySend(message: MailMessage, attempt: number): Promise<string | null>;
  /** Port of the local fake, null when a real SMTP_URL is used. */
  fakePort: number | null;
  close(): Promise<void>;
}

export const MAIL_ATTEMPTS = 3;

export async function createMailer(
  config: Pick<Config, 'smtpUrl' | 'mailFrom'> & Partial<Pick<Config, 'mail'>>,
  db: Knex,
  log: Logger,
  retryDelayMs = 200,
): Promise<Mailer> {
  let fake: SmtpFake | null = null;
  if (!config.smtpUrl) fake = await startSmtpFake(db);
  const t = config.mail?.timeoutMs ?? 15_000;
  const bounds = { connectionTimeout: t, greetingTimeout: t, socketTimeout: t, dnsTimeout: t };
  const transport = config.smtpUrl
    ? nodemailer.createTransport({ url: config.smtpUrl, ...bounds })
    : nodemailer.createTransport({ host: '127.0.0.1', port: fake?.port, secure: false, ignoreTLS: true, ...bounds });

  async function trySend(message: MailMessage, attempt: number): Promise<string | null> {
    try {
      await transport.sendMail({ from: config.mailFrom, ...message });
      await logMail(db, log, message, 'sent', attempt, null);
      return null;
    } catch (e) {
      const error = e instanceof Error ? e.message : String(e);
      await logMail(db, log, message, 'failed', attempt, error);
      return error;
    }
  }

  async function sendMail(message: MailMessage): Promise<boolean> {
    let lastError = '';
    for (let attempt = 1; attempt <= MAIL_ATTEMPTS; attempt++) {
      try {
        await transport.sendMail({ from: config.mailFrom, ...message });
        await logMail(db, log, message, 'sent', attempt, null);
        return true;
      } catch (e) {
        lastError = e instanceof Error ? e.message : String(e);
        if (attempt < MAIL_ATTEMPTS) await sleep(retryDelayMs * 2 ** (attempt - 1));
      }
    }
    await logMail(db, log, message, 'failed', MAIL_ATTEMPTS, lastError);
    return false;
  }

  return {
    sendMail,
    trySend,
    fakePort: fake?.port ?? null,
    async close() {
      transport.close();
      await fake?.close();
    },
  };
}

async function logMail(
  db: Knex,
  log: Logger,
  m: MailMessage,
  status: 'sent' | 'failed',
  attempts: number,
  error: string | null,
): Promise<void> {
  try {
    await db('mail_log').insert({ to: m.to, subject: m.subject, status, attempts, error, created_at: now() });
  } catch (e) {
    // The database may be closing during shutdown; the mail outcome is still reported in the log.
    log.error({ err: e, to: m.to, status }, 'mail_log insert failed');
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
