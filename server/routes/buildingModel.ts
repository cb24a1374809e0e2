// The building model (docs/building-model.md): every member reads it; engineers and leads edit the grid,
// build-ups, floor loads, a stack's place on the grid and its areas set by hand.
import type { Router } from 'express';
import {
  putAreaOverridesBodySchema,
  putBuildupsBodySchema,
  putFloorLoadBodySchema,
  putGridBodySchema,
  stackPlacementSchema,
} from '../../shared/schema/building.ts';
import type { ServerContext } from '../context.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { buildingOfStack, requireRole } from '../middleware/access.ts';
import { idParam, parseBody } from '../middleware/validate.ts';
import {
  getModel,
  placeStack,
  putAreaOverrides,
  putBuildups,
  putFloorLoad,
  putGrid,
} from '../services/buildingModel.ts';

export function registerBuildingModelRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const viewer = requireRole(ctx, 'viewer');
  const engineer = requireRole(ctx, 'engineer');
  const stackEngineer = requireRole(ctx, 'engineer', buildingOfStack);

  router.get('/buildings/:id/model', auth, viewer, async (req, res) => {
    res.json(await getModel(ctx.db, currentAccess(req).buildingId));
  });
  router.put('/buildings/:id/grid', auth, engineer, async (req, res) => {
    const { grid } = parseBody(putGridBodySchema, req);
    res.json(await putGrid(ctx, currentAccess(req).buildingId, grid, currentUser(req)));
  });
  router.put('/buildings/:id/buildups', auth, engineer, async (req, res) => {
    const { buildups } = parseBody(putBuildupsBodySchema, req);
    res.json(await putBuildups(ctx, currentAccess(req).buildingId, buildups, currentUser(req)));
  });
  router.put('/buildings/:id/levels/:levelId/floor-load', auth, engineer, async (req, res) => {
    const body = parseBody(putFloorLoadBodySchema, req);
    res.json(await putFloorLoad(ctx, currentAccess(req).buildingId, idParam(req, 'levelId'), body, currentUser(req)));
  });
  router.put('/stacks/:id/placement', auth, stackEngineer, async (req, res) => {
    const placement = parseBody(stackPlacementSchema, req);
    res.json(await placeStack(ctx, idParam(req), placement, currentUser(req)));
  });
  router.put('/stacks/:id/area-overrides', auth, stackEngineer, async (req, res) => {
    const { overrides } = parseBody(putAreaOverridesBodySchema, req);
    res.json(await putAreaOverrides(ctx, idParam(req), overrides, currentUser(req)));
  });
}
