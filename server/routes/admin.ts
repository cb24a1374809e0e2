// Site-admin repairs. A building whose last lead is gone cannot be managed by any member, so a site
// admin may give it a lead again (only while it has none).
import type { Router } from 'express';
import { restoreLeadBodySchema } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { currentUser, requireAdmin, requireAuth } from '../middleware/auth.ts';
import { idParam, parseBody } from '../middleware/validate.ts';
import { restoreLead } from '../services/members.ts';

export function registerAdminRoutes(router: Router, ctx: ServerContext): void {
  router.post('/admin/buildings/:id/lead', requireAuth(ctx), requireAdmin, async (req, res) => {
    const { email } = parseBody(restoreLeadBodySchema, req);
    res.json(await restoreLead(ctx.db, idParam(req), email, currentUser(req)));
  });
}
