// A stack's history (docs/stack-history.md): its versions in words and the stack as it was at one of them, read only.
// Every member of the building may read them; engineers and leads may restore a version (a new version, broadcast).
import type { Router } from 'express';
import { z } from 'zod';
import type { ServerContext } from '../context.ts';
import { currentUser, requireAuth } from '../middleware/auth.ts';
import { buildingOfStack, requireRole } from '../middleware/access.ts';
import { idParam, parseBody } from '../middleware/validate.ts';
import { broadcastChange } from '../services/stackOps.ts';
import { getStack } from '../services/stacks.ts';
import { restoreVersion, stackAsOf, stackHistory } from '../services/stackHistory.ts';

const restoreBodySchema = z.object({ baseVersion: z.number().int().min(0).max(Number.MAX_SAFE_INTEGER) }).strict();
const versionParamSchema = z.object({ version: z.coerce.number().int().min(0).max(Number.MAX_SAFE_INTEGER) });

export function registerStackHistoryRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const stackViewer = requireRole(ctx, 'viewer', buildingOfStack);
  const stackEngineer = requireRole(ctx, 'engineer', buildingOfStack);

  router.get('/stacks/:id/history', auth, stackViewer, async (req, res) => {
    res.json(await stackHistory(ctx.db, idParam(req)));
  });
  router.get('/stacks/:id/versions/:version', auth, stackViewer, async (req, res) => {
    const { version } = versionParamSchema.parse({ version: req.params.version });
    res.json(await stackAsOf(ctx.db, idParam(req), version));
  });
  router.post('/stacks/:id/versions/:version/restore', auth, stackEngineer, async (req, res) => {
    const stackId = idParam(req);
    const { version } = versionParamSchema.parse({ version: req.params.version });
    const { baseVersion } = parseBody(restoreBodySchema, req);
    const user = currentUser(req);
    const change = await restoreVersion(ctx.db, { stackId, version, baseVersion, userId: user.id });
    if (change) broadcastChange(ctx, change, { userId: user.id, name: user.name });
    res.json(await getStack(ctx.db, stackId));
  });
}
