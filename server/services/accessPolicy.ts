// The one access policy (SPEC §8, docs/access.md), applied by the REST middleware and by every event of
// the live channel alike:
// - a non-member gets 404 for the building and everything in it, so existence does not leak;
// - a site admin who is not a member may read (as if a viewer) but may not write: 403;
// - a member with too low a role gets 403.
import type { Knex } from 'knex';
import { ROLE_RANK, type Role, type User } from '../../shared/schema/api.ts';
import { forbidden, notFound } from '../errors.ts';

export async function roleIn(db: Knex, buildingId: number, userId: number): Promise<Role | null> {
  const row = await db('memberships')
    .where({ building_id: buildingId, user_id: userId })
    .first<{ role: Role } | undefined>('role');
  return row ? row.role : null;
}

/**
 * The caller's role on the building (null for a site admin reading as a viewer), or the refusal the policy
 * gives. `what` names the thing asked for in the 404 ("Building", "Stack", …); buildingId null means it
 * does not exist.
 */
export async function checkAccess(
  db: Knex,
  user: Pick<User, 'id' | 'isAdmin'>,
  buildingId: number | null,
  what: string,
  minRole: Role,
): Promise<Role | null> {
  if (buildingId === null) throw notFound(what);
  const role = await roleIn(db, buildingId, user.id);
  if (role === null) {
    if (!user.isAdmin) throw notFound(what);
    if (minRole !== 'viewer') throw forbidden('Site admins edit a building only as members of it');
    return null;
  }
  if (ROLE_RANK[role] < ROLE_RANK[minRole]) throw forbidden(`This needs the ${minRole} role on this building`);
  return role;
}

/** Whether the user may still read the building at all (a member, or a site admin). */
export async function canRead(db: Knex, user: Pick<User, 'id' | 'isAdmin'>, buildingId: number): Promise<boolean> {
  return user.isAdmin || (await roleIn(db, buildingId, user.id)) !== null;
}
