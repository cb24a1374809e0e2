// The development mail catcher: one message captured by the local SMTP fake, as
// GET /api/dev/outbox returns it. Attachments are listed by name and size; their content is fetched
// one at a time from /api/dev/outbox/:id/attachments/:n.
import { z } from 'zod';

export const outboxAttachmentSchema = z.object({
  filename: z.string(),
  contentType: z.string(),
  /** bytes */
  size: z.number().int().nonnegative(),
});
export type OutboxAttachment = z.infer<typeof outboxAttachmentSchema>;

export const outboxMessageSchema = z.object({
  id: z.number().int().positive(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  attachments: z.array(outboxAttachmentSchema),
  /** ISO 8601, UTC */
  createdAt: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
