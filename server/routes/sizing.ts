// Sizing previews (docs/analysis-rules.md §Sizing): engineers and leads ask for the lightest passing sections of a
// stack or of a whole building. Nothing is stored.
import type { Router } from 'express';
import { sizingRequestSchema } from '../../shared/schema/sizing.ts';
import type { ServerContext } from '../context.ts';
import { buildingOfStack, requireRole } from '../middleware/access.ts';
import { currentAccess, requireAuth } from '../middleware/auth.ts';
import { idParam, parseBody } from '../middleware/validate.ts';
import { buildingSizingPreview, stackSizingPreview } from '../services/sizing.ts';

export function registerSizingRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  router.post('/stacks/:id/sizing', auth, requireRole(ctx, 'engineer', buildingOfStack), async (req, res) => {
    const request = parseBody(sizingRequestSchema, req);
    res.json(await stackSizingPreview(ctx.db, idParam(req), request));
  });
  router.post('/buildings/:id/sizing', auth, requireRole(ctx, 'engineer'), async (req, res) => {
    const request = parseBody(sizingRequestSchema, req);
    res.json(await buildingSizingPreview(ctx, currentAccess(req).buildingId, request));
  });
}
