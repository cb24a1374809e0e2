// Building-scoped rights on REST routes: finds the building a route is about and applies the one access
// policy (services/accessPolicy.ts), which the live channel applies too.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Knex } from 'knex';
import type { Role } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { notFound } from '../errors.ts';
import { checkAccess, roleIn } from '../services/accessPolicy.ts';
import { currentUser } from './auth.ts';
import { idParam } from './validate.ts';

type BuildingOf = (db: Knex, req: Request) => Promise<number | null>;

/** The building named by :id on /api/buildings/:id/... routes. */
export const buildingFromParam: BuildingOf = async (db, req) => {
  const id = idParam(req);
  const row = await db('buildings').where({ id }).first('id');
  return row ? id : null;
};

/** The building of the stack named by :id on /api/stacks/:id/... routes. */
export const buildingOfStack: BuildingOf = async (db, req) => {
  const row = await db('stacks')
    .where({ id: idParam(req) })
    .first<{ building_id: number } | undefined>('building_id');
  return row ? row.building_id : null;
};

export { roleIn };

export function requireRole(
  ctx: ServerContext,
  minRole: Role,
  buildingOf: BuildingOf = buildingFromParam,
): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const user = currentUser(req);
    const buildingId = await buildingOf(ctx.db, req);
    const what = buildingOf === buildingOfStack ? 'Stack' : 'Building';
    if (buildingId === null) throw notFound(what);
    const role = await checkAccess(ctx.db, user, buildingId, what, minRole);
    req.access = { buildingId, role };
    next();
  };
}
