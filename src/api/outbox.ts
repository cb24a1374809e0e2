// The development mail catcher: GET /api/dev/outbox (admin only, absent in production) and the
// attachments of one captured message. Replies are checked against the shared zod schema.
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schema/errors.ts';
import { outboxMessageSchema, type OutboxMessage } from '@shared/schema/outbox.ts';
import { ApiError, apiFetch, getToken } from './http.ts';

export async function listOutbox(): Promise<OutboxMessage[]> {
  return z.array(outboxMessageSchema).parse(await apiFetch<unknown>('GET', '/dev/outbox'));
}

/** An attachment needs the bearer token, so it is fetched as a blob rather than linked. */
export async function fetchOutboxAttachment(messageId: number, index: number): Promise<Blob> {
  const token = getToken();
  let res: Response;
  try {
    res = await fetch(`/api/dev/outbox/${messageId}/attachments/${index}`, { headers: token ? { Authorization: `Bearer ${token}` } : {} });
  } catch (e) {
    throw new ApiError(0, 'network', `Cannot reach the server (${(e as Error).message})`);
  }
  if (!res.ok) {
    // The API's error shape when it sent one; otherwise the status says enough.
    const body = apiErrorSchema.safeParse(await res.json().catch(() => undefined));
    if (body.success) throw new ApiError(res.status, body.data.error.code, body.data.error.message);
    throw new ApiError(res.status, 'internal', `Download failed (${res.status})`);
  }
  return res.blob();
}
