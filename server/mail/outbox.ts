// Reading the messages captured by the local SMTP fake.
import type { Knex } from 'knex';
import { z } from 'zod';
import type { OutboxMessage } from '../../shared/schema/outbox.ts';
import { isoTime } from '../db.ts';
import { notFound } from '../errors.ts';

const storedAttachments = z.array(
  z.object({ filename: z.string(), contentType: z.string(), size: z.number(), content: z.string() }),
);

interface OutboxRow {
  id: number;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  attachments: string;
  created_at: unknown;
}

export async function listOutbox(db: Knex): Promise<OutboxMessage[]> {
  const rows = await db<OutboxRow>('outbox').orderBy('id', 'desc').limit(200);
  return rows.map((r) => ({
    id: r.id,
    to: r.to,
    subject: r.subject,
    text: r.text,
    html: r.html,
    attachments: storedAttachments
      .parse(JSON.parse(r.attachments))
      .map(({ filename, contentType, size }) => ({ filename, contentType, size })),
    createdAt: isoTime(r.created_at),
  }));
}

export async function getOutboxAttachment(
  db: Knex,
  id: number,
  index: number,
): Promise<{ filename: string; contentType: string; content: Buffer }> {
  const row = await db<OutboxRow>('outbox').where({ id }).first();
  const a = row && Number.isInteger(index) ? storedAttachments.parse(JSON.parse(row.attachments))[index] : undefined;
  if (!a) throw notFound('Attachment');
  return { filename: a.filename, contentType: a.contentType, content: Buffer.from(a.content, 'base64') };
}
