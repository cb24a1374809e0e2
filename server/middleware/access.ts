// Building-scoped rights (docs/rights.md). Policy, applied on every route:
// - a non-member gets 404 for the building and everything in it, so existence does not leak;
// - a site admin who is not a member may read (as if a viewer) but may not write: 403;
// - a member with too low a role gets 403.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Knex } from 'knex';
import { ROLE_RANK, type Role } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { forbidden, notFound } from '../errors.ts';
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
  const row = await db('stacks').where({ id: idParam(req) }).first<{ building_id: number } | undefined>('building_id');
  return row ? row.building_id : null;
};

export async function roleIn(db: Knex, buildingId: number, userId: number): Promise<Role | null> {
  const row = await db('memberships').where({ building_id: buildingId, user_id: userId }).first<{ role: Role } | undefined>('role');
  return row ? row.role : null;
}

export function requireRole(ctx: ServerContext, minRole: Role, buildingOf: BuildingOf = buildingFromParam): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const user = currentUser(req);
    const buildingId = await buildingOf(ctx.db, req);
    if (buildingId === null) throw notFound(buildingOf === buildingOfStack ? 'Stack' : 'Building');
    const role = await roleIn(ctx.db, buildingId, user.id);
    if (role === null) {
      if (!user.isAdmin) throw notFound(buildingOf === buildingOfStack ? 'Stack' : 'Building');
      if (minRole !== 'viewer') throw forbidden('Site admins edit a building only as members of it');
    } else if (ROLE_RANK[role] < ROLE_RANK[minRole]) {
      throw forbidden(`This needs the ${minRole} role on this building`);
    }
    req.access = { buildingId, role };
    next();
  };
}
