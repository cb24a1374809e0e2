// The development mail catcher: GET /api/dev/outbox (admin only, absent in production) and the
// attachments of one captured message. Replies are checked against the shared zod schema.
import { z } from 'zod';
import { outboxMessageSchema, type OutboxMessage } from '@shared/schema/outbox.ts';
import { fetchFile } from './download.ts';
import { apiFetch } from './http.ts';

export async function listOutbox(): Promise<OutboxMessage[]> {
  return z.array(outboxMessageSchema).parse(await apiFetch<unknown>('GET', '/dev/outbox'));
}

/** An attachment needs the bearer token, so it is fetched as a blob rather than linked. */
export async function fetchOutboxAttachment(messageId: number, index: number): Promise<Blob> {
  return (await fetchFile(`/dev/outbox/${messageId}/attachments/${index}`)).blob;
}
