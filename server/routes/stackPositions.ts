// Typical columns (docs/typical-columns.md): every member reads where a stack also stands; engineers and leads
// add and remove its further positions and set their areas by hand.
import type { Router } from 'express';
import { putAreaOverridesBodySchema } from '../../shared/schema/building.ts';
import { addStackPositionBodySchema } from '../../shared/schema/stackPositions.ts';
import type { ServerContext } from '../context.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { buildingOfStack, requireRole } from '../middleware/access.ts';
import { idParam, parseBody } from '../middleware/validate.ts';
import {
  addStackPosition,
  buildingPositions,
  listStackPositions,
  putPositionAreaOverrides,
  removeStackPosition,
} from '../services/stackPositions.ts';

export function registerStackPositionRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const viewer = requireRole(ctx, 'viewer');
  const stackViewer = requireRole(ctx, 'viewer', buildingOfStack);
  const stackEngineer = requireRole(ctx, 'engineer', buildingOfStack);

  router.get('/buildings/:id/stack-positions', auth, viewer, async (req, res) => {
    res.json(await buildingPositions(ctx.db, currentAccess(req).buildingId));
  });
  router.get('/stacks/:id/positions', auth, stackViewer, async (req, res) => {
    res.json(await listStackPositions(ctx.db, idParam(req)));
  });
  router.post('/stacks/:id/positions', auth, stackEngineer, async (req, res) => {
    const body = parseBody(addStackPositionBodySchema, req);
    res.status(201).json(await addStackPosition(ctx, idParam(req), body, currentUser(req)));
  });
  router.delete('/stacks/:id/positions/:positionId', auth, stackEngineer, async (req, res) => {
    res.json(await removeStackPosition(ctx, idParam(req), idParam(req, 'positionId'), currentUser(req)));
  });
  router.put('/stacks/:id/positions/:positionId/area-overrides', auth, stackEngineer, async (req, res) => {
    const { overrides } = parseBody(putAreaOverridesBodySchema, req);
    const positionId = idParam(req, 'positionId');
    res.json(await putPositionAreaOverrides(ctx, idParam(req), positionId, overrides, currentUser(req)));
  });
}
