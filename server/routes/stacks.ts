// Stacks: members read; engineers create and edit; leads delete.
import type { Router } from 'express';
import { z } from 'zod';
import {
  applyOpsBodySchema,
  createStackBodySchema,
  patchStackBodySchema,
  putStackBodySchema,
} from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { buildingOfStack, requireRole } from '../middleware/access.ts';
import { idParam, parseBody, parseQuery } from '../middleware/validate.ts';
import { opsSince } from '../services/stackHistory.ts';
import { broadcastChange, editStack, replaceDoc } from '../services/stackOps.ts';
import { createStack, deleteStack, getStack, listStacks, renameStack } from '../services/stacks.ts';

const sinceQuerySchema = z.object({ since: z.coerce.number().int().min(0).max(Number.MAX_SAFE_INTEGER).default(0) });

export function registerStackRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const stackViewer = requireRole(ctx, 'viewer', buildingOfStack);
  const stackEngineer = requireRole(ctx, 'engineer', buildingOfStack);
  const stackLead = requireRole(ctx, 'lead', buildingOfStack);

  router.get('/buildings/:id/stacks', auth, requireRole(ctx, 'viewer'), async (req, res) => {
    res.json(await listStacks(ctx.db, currentAccess(req).buildingId));
  });
  router.post('/buildings/:id/stacks', auth, requireRole(ctx, 'engineer'), async (req, res) => {
    const body = parseBody(createStackBodySchema, req);
    res.status(201).json(await createStack(ctx.db, currentAccess(req).buildingId, body, currentUser(req)));
  });

  router.get('/stacks/:id', auth, stackViewer, async (req, res) => {
    res.json(await getStack(ctx.db, idParam(req)));
  });
  router.get('/stacks/:id/ops', auth, stackViewer, async (req, res) => {
    const { since } = parseQuery(sinceQuerySchema, req);
    res.json(await opsSince(ctx.db, idParam(req), since));
  });
  router.put('/stacks/:id', auth, stackEngineer, async (req, res) => {
    const { doc, baseVersion } = parseBody(putStackBodySchema, req);
    const user = currentUser(req);
    const stackId = idParam(req);
    const change = await replaceDoc(ctx.db, { stackId, baseVersion, doc, userId: user.id });
    if (change) broadcastChange(ctx, change, { userId: user.id, name: user.name });
    res.json(await getStack(ctx.db, stackId));
  });
  router.post('/stacks/:id/ops', auth, stackEngineer, async (req, res) => {
    const { ops, baseVersion } = parseBody(applyOpsBodySchema, req);
    const change = await editStack(ctx, { stackId: idParam(req), baseVersion, ops }, currentUser(req));
    res.json({ version: change.version, doc: change.doc, results: change.results });
  });
  router.patch('/stacks/:id', auth, stackEngineer, async (req, res) => {
    const { name } = parseBody(patchStackBodySchema, req);
    res.json(await renameStack(ctx.db, idParam(req), name, currentUser(req)));
  });
  router.delete('/stacks/:id', auth, stackLead, async (req, res) => {
    await deleteStack(ctx, idParam(req), currentUser(req));
    res.status(204).end();
  });
}
