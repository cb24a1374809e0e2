// Development tools: the captured outbox of the local SMTP fake (admin only; absent in production).
import type { RequestHandler, Router } from 'express';
import type { ServerContext } from '../context.ts';
import { notFound } from '../errors.ts';
import { requireAdmin, requireAuth } from '../middleware/auth.ts';
import { idParam } from '../middleware/validate.ts';
import { getOutboxAttachment, listOutbox } from '../mail/outbox.ts';

export function registerDevRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const devOnly: RequestHandler = (req, _res, next) => {
    if (ctx.config.production) throw notFound(`Route ${req.method} /api${req.path}`);
    next();
  };
  router.get('/dev/outbox', devOnly, auth, requireAdmin, async (_req, res) => {
    res.json(await listOutbox(ctx.db));
  });
  router.get('/dev/outbox/:id/attachments/:n', devOnly, auth, requireAdmin, async (req, res) => {
    const a = await getOutboxAttachment(ctx.db, idParam(req), Number(req.params.n));
    res.attachment(a.filename).type(a.contentType).send(a.content);
  });
}
