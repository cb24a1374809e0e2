// Outgoing e-mail over SMTP (nodemailer). Sending never throws into a request that has already
// committed: it retries, then records the failure in mail_log.
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
  /** Port of the local fake, null when a real SMTP_URL is used. */
  fakePort: number | null;
  close(): Promise<void>;
}

export const MAIL_ATTEMPTS = 3;

export async function createMailer(config: Pick<Config, 'smtpUrl' | 'mailFrom'>, db: Knex, log: Logger, retryDelayMs = 200): Promise<Mailer> {
  let fake: SmtpFake | null = null;
  if (!config.smtpUrl) fake = await startSmtpFake(db);
  const transport = config.smtpUrl
    ? nodemailer.createTransport(config.smtpUrl)
    : nodemailer.createTransport({ host: '127.0.0.1', port: fake?.port, secure: false, ignoreTLS: true });

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
    fakePort: fake?.port ?? null,
    async close() {
      transport.close();
      await fake?.close();
    },
  };
}

async function logMail(db: Knex, log: Logger, m: MailMessage, status: 'sent' | 'failed', attempts: number, error: string | null): Promise<void> {
  try {
    await db('mail_log').insert({ to: m.to, subject: m.subject, status, attempts, error, created_at: now() });
  } catch (e) {
    // The database may be closing during shutdown; the mail outcome is still reported in the log.
    log.error({ err: e, to: m.to, status }, 'mail_log insert failed');
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
