// A stack's history (docs/stack-history.md): its versions in words and the stack as it was at one of them, read only.
// Every member of the building may read them.
import type { Router } from 'express';
import { z } from 'zod';
import type { ServerContext } from '../context.ts';
import { requireAuth } from '../middleware/auth.ts';
import { buildingOfStack, requireRole } from '../middleware/access.ts';
import { idParam } from '../middleware/validate.ts';
import { stackAsOf, stackHistory } from '../services/stackHistory.ts';

const versionParamSchema = z.object({ version: z.coerce.number().int().min(0).max(Number.MAX_SAFE_INTEGER) });

export function registerStackHistoryRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const stackViewer = requireRole(ctx, 'viewer', buildingOfStack);

  router.get('/stacks/:id/history', auth, stackViewer, async (req, res) => {
    res.json(await stackHistory(ctx.db, idParam(req)));
  });
  router.get('/stacks/:id/versions/:version', auth, stackViewer, async (req, res) => {
    const { version } = versionParamSchema.parse({ version: req.params.version });
    res.json(await stackAsOf(ctx.db, idParam(req), version));
  });
}
