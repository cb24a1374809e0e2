// Levels of a building: engineers and leads edit, every member reads.
import type { Router } from 'express';
import { createLevelBodySchema, levelMovePreviewBodySchema, updateLevelBodySchema } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { idParam, parseBody, parsePatch } from '../middleware/validate.ts';
import { createLevel, deleteLevel, listLevels, previewLevelMove, updateLevel } from '../services/levels.ts';

export function registerLevelRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const viewer = requireRole(ctx, 'viewer');
  const engineer = requireRole(ctx, 'engineer');

  router.get('/buildings/:id/levels', auth, viewer, async (req, res) => {
    res.json(await listLevels(ctx.db, currentAccess(req).buildingId));
  });
  router.post('/buildings/:id/levels', auth, engineer, async (req, res) => {
    const body = parseBody(createLevelBodySchema, req);
    res.status(201).json(await createLevel(ctx.db, currentAccess(req).buildingId, body, currentUser(req)));
  });
  router.patch('/buildings/:id/levels/:levelId', auth, engineer, async (req, res) => {
    const body = parsePatch(updateLevelBodySchema, req);
    res.json(await updateLevel(ctx, currentAccess(req).buildingId, idParam(req, 'levelId'), body, currentUser(req)));
  });
  // Stores nothing: what moving the level would do to the stacks, shown before the engineer saves.
  router.post('/buildings/:id/levels/:levelId/preview', auth, engineer, async (req, res) => {
    const body = parseBody(levelMovePreviewBodySchema, req);
    res.json(await previewLevelMove(ctx.db, currentAccess(req).buildingId, idParam(req, 'levelId'), body.elevation));
  });
  router.delete('/buildings/:id/levels/:levelId', auth, engineer, async (req, res) => {
    await deleteLevel(ctx.db, currentAccess(req).buildingId, idParam(req, 'levelId'), currentUser(req));
    res.status(204).end();
  });
}
