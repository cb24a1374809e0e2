// The robustness summary of a building: which splices meet the tying requirement of its consequence class.
// Every member of the building may read it.
import type { Router } from 'express';
import type { ServerContext } from '../context.ts';
import { currentAccess, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { buildingRobustness } from '../services/robustness.ts';

export function registerRobustnessRoutes(router: Router, ctx: ServerContext): void {
  router.get('/buildings/:id/robustness', requireAuth(ctx), requireRole(ctx, 'viewer'), async (req, res) => {
    res.json(await buildingRobustness(ctx.db, currentAccess(req).buildingId));
  });
}
