// Every API route on one router mounted at /api, so the role-matrix test can list them all.
import { Router } from 'express';
import type { ServerContext } from '../context.ts';
import { registerAdminRoutes } from './admin.ts';
import { registerAuthRoutes } from './auth.ts';
import { registerBuildingModelRoutes } from './buildingModel.ts';
import { registerBuildingRoutes } from './buildings.ts';
import { registerDevRoutes } from './dev.ts';
import { registerExportRoutes } from './exports.ts';
import { registerHealthRoutes } from './health.ts';
import { registerImportRoutes } from './imports.ts';
import { registerLevelRoutes } from './levels.ts';
import { registerRevisionRoutes } from './revisions.ts';
import { registerReviewRoutes } from './reviews.ts';
import { registerRobustnessRoutes } from './robustness.ts';
import { registerScheduleRoutes } from './schedule.ts';
import { registerStackHistoryRoutes } from './stackHistory.ts';
import { registerStackPositionRoutes } from './stackPositions.ts';
import { registerSectionRoutes } from './sections.ts';
import { registerSizingRoutes } from './sizing.ts';
import { registerStackRoutes } from './stacks.ts';

export function createApiRouter(ctx: ServerContext): Router {
  const router = Router();
  registerHealthRoutes(router, ctx);
  registerAuthRoutes(router, ctx);
  registerBuildingRoutes(router, ctx);
  registerLevelRoutes(router, ctx);
  registerBuildingModelRoutes(router, ctx);
  registerStackRoutes(router, ctx);
  registerRevisionRoutes(router, ctx);
  registerReviewRoutes(router, ctx);
  registerSectionRoutes(router, ctx);
  registerSizingRoutes(router, ctx);
  registerImportRoutes(router, ctx);
  registerExportRoutes(router, ctx);
  registerRobustnessRoutes(router, ctx);
  registerScheduleRoutes(router, ctx);
  registerStackHistoryRoutes(router, ctx);
  registerStackPositionRoutes(router, ctx);
  registerDevRoutes(router, ctx);
  registerAdminRoutes(router, ctx);
  return router;
}
