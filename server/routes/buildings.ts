// Buildings and their members. Parse, call a service, respond.
import type { Router } from 'express';
import { z } from 'zod';
import {
  addMemberBodySchema,
  createBuildingBodySchema,
  emailSchema,
  idParamSchema,
  updateBuildingBodySchema,
  updateMemberBodySchema,
} from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { byBodyEmail, byBuilding, byUser, limiter } from '../middleware/rateLimits.ts';
import { parseBody, parsePatch } from '../middleware/validate.ts';
import { canRead } from '../services/accessPolicy.ts';
import { findUserById } from '../services/users.ts';
import { createBuilding, getBuilding, listBuildings } from '../services/buildings.ts';
import { updateBuilding } from '../services/buildingUpdate.ts';
import {
  addMember,
  cancelInvitation,
  listMembers,
  removeMember,
  updateInvitationRole,
  updateMemberRole,
} from '../services/members.ts';

export function registerBuildingRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const viewer = requireRole(ctx, 'viewer');
  const lead = requireRole(ctx, 'lead');

  router.get('/buildings', auth, async (req, res) => {
    res.json(await listBuildings(ctx.db, currentUser(req)));
  });
  router.post('/buildings', auth, async (req, res) => {
    const body = parseBody(createBuildingBodySchema, req);
    res.status(201).json(await createBuilding(ctx.db, currentUser(req), body));
  });
  router.get('/buildings/:id', auth, viewer, async (req, res) => {
    const { buildingId, role } = currentAccess(req);
    res.json(await getBuilding(ctx.db, buildingId, role));
  });
  router.patch('/buildings/:id', auth, lead, async (req, res) => {
    const body = parsePatch(updateBuildingBodySchema, req);
    res.json(await updateBuilding(ctx, currentAccess(req).buildingId, body, currentUser(req)));
  });

  router.get('/buildings/:id/members', auth, viewer, async (req, res) => {
    res.json(await listMembers(ctx.db, currentAccess(req).buildingId));
  });
  // Adding a member may send an invitation e-mail: limited per lead, per building and per recipient.
  const { limits } = ctx.config;
  const inviteLimits = [
    limiter(ctx, 'mail-user', limits.mailPerUser, byUser, 'Too many e-mails sent from this account'),
    limiter(ctx, 'invite-building', limits.invitesPerBuilding, byBuilding, 'Too many invitations from this building'),
    limiter(ctx, 'invite-recipient', limits.mailPerRecipient, byBodyEmail, 'Too many e-mails to this address'),
  ];
  router.post('/buildings/:id/members', auth, lead, ...inviteLimits, async (req, res) => {
    const { email, role } = parseBody(addMemberBodySchema, req);
    const settings = { link: `${ctx.config.publicUrl}/sign-in`, days: ctx.config.invitationDays };
    res
      .status(201)
      .json(
        await addMember(ctx.db, ctx.outbox, currentAccess(req).buildingId, email, role, currentUser(req), settings),
      );
  });
  // :memberId is the user id of a member, or the e-mail address of a pending invitation.
  router.patch('/buildings/:id/members/:memberId', auth, lead, async (req, res) => {
    const { role } = parseBody(updateMemberBodySchema, req);
    const member = memberKey(req.params.memberId);
    const { buildingId } = currentAccess(req);
    res.json(
      'userId' in member
        ? await updateMemberRole(ctx.db, buildingId, member.userId, role, currentUser(req))
        : await updateInvitationRole(ctx.db, buildingId, member.email, role, currentUser(req)),
    );
  });
  router.delete('/buildings/:id/members/:memberId', auth, lead, async (req, res) => {
    const member = memberKey(req.params.memberId);
    const { buildingId } = currentAccess(req);
    if ('userId' in member) {
      await removeMember(ctx.db, buildingId, member.userId, currentUser(req));
      await revokeLiveAccess(ctx, buildingId, member.userId);
    } else await cancelInvitation(ctx.db, buildingId, member.email, currentUser(req));
    res.status(204).end();
  });
}

/** A removed member's open sockets leave the building's rooms at once, unless a site admin may still read. */
async function revokeLiveAccess(ctx: ServerContext, buildingId: number, userId: number): Promise<void> {
  const user = await findUserById(ctx.db, userId);
  if (!user || (await canRead(ctx.db, user, buildingId))) return;
  const stacks = await ctx.db('stacks').where({ building_id: buildingId }).pluck<number[]>('id');
  await ctx.broadcaster.accessRevoked({ userId, buildingId, stackIds: stacks });
}

const memberKeySchema = z.union([
  z
    .string()
    .regex(/^\d+$/)
    .transform((s) => ({ userId: idParamSchema.parse(s) })),
  emailSchema.transform((email) => ({ email })),
]);
function memberKey(value: unknown): { userId: number } | { email: string } {
  return z.object({ memberId: memberKeySchema }).parse({ memberId: value }).memberId;
}
