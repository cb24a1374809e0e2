// The local SMTP fake used when SMTP_URL is unset (development and tests): it accepts every message on
// 127.0.0.1 and stores it, parsed, in the outbox table.
import type { AddressInfo } from 'node:net';
import type { Knex } from 'knex';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { now } from '../db.ts';

export interface StoredAttachment {
  filename: string;
  contentType: string;
  size: number;
  /** base64 */
  content: string;
}

export interface SmtpFake {
  port: number;
  close(): Promise<void>;
}

export async function startSmtpFake(db: Knex): Promise<SmtpFake> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      const to = session.envelope.rcptTo.map((r) => r.address).join(', ');
      simpleParser(stream)
        .then(async (mail) => {
          const attachments: StoredAttachment[] = mail.attachments.map((a, i) => ({
            filename: a.filename ?? `attachment-${i + 1}`,
            contentType: a.contentType,
            size: a.size,
            content: a.content.toString('base64'),
          }));
          await db('outbox').insert({
            to,
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            attachments: JSON.stringify(attachments),
            created_at: now(),
          });
        })
        .then(
          () => callback(),
          (err: Error) => callback(err),
        );
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const { port } = server.server.address() as AddressInfo;
  return {
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
