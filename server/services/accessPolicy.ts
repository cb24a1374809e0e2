// The one access policy (SPEC §8, docs/access.md), applied by the REST middleware and by every event of
// the live channel alike:
// - a non-member gets 404 for the building and everything in it, so existence does not leak;
// - a site admin who is not a member may read (as if a viewer) but may not write: 403;
// - a member with too low a role gets 403.
import type { Knex } from 'knex';
import { ROLE_RANK, type Role, type User } from '../../shared/schema/api.ts';
import type { ReviewActions, ReviewState } from '../../shared/schema/reviews.ts';
import type { RevisionPurpose } from '../../shared/schema/revisions.ts';
import { conflict, forbidden, notFound, type HttpError } from '../errors.ts';

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

/** What a review step needs to know of the revision (docs/issue-workflow.md). */
export interface ReviewFacts {
  state: ReviewState;
  purpose: RevisionPurpose;
  code: string;
  preparedBy: number;
}

export type ReviewAction = keyof ReviewActions;

/**
 * Why the caller may not take a step of a revision's review, or null when they may. The role is the
 * caller's on the building (null: a site admin reading, who signs nothing). Rules: engineers and leads
 * comment and resolve while the revision is open; a member who did not prepare it checks it; a lead
 * approves and issues a checked revision, or a preliminary one without a check.
 */
export function reviewRefusal(
  action: ReviewAction,
  role: Role | null,
  userId: number,
  r: ReviewFacts,
): HttpError | null {
  const need: Role = action === 'approve' ? 'lead' : 'engineer';
  if (role === null || ROLE_RANK[role] < ROLE_RANK[need])
    return forbidden(`This needs the ${need} role on this building`);
  if (r.state === 'issued') return conflict(`Revision ${r.code} is issued: its review is closed`);
  if (r.state === 'superseded') return conflict(`Revision ${r.code} was superseded by a newer revision`);
  if (action === 'check') {
    if (r.preparedBy === userId) return forbidden(`You prepared revision ${r.code}: another member must check it`);
    if (r.state !== 'prepared') return conflict(`Revision ${r.code} is checked already`);
  }
  if (action === 'approve' && r.state === 'prepared' && r.purpose !== 'preliminary')
    return conflict(`Revision ${r.code} is for construction: it must be checked before it is approved`);
  return null;
}

export function reviewActions(role: Role | null, userId: number, r: ReviewFacts): ReviewActions {
  const may = (a: ReviewAction) => reviewRefusal(a, role, userId, r) === null;
  return { check: may('check'), approve: may('approve'), comment: may('comment'), resolve: may('resolve') };
}
