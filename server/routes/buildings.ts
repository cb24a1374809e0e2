// Buildings and their members (issue 5). Parse, call a service, respond.
import type { Router } from 'express';
import { z } from 'zod';
import { addMemberBodySchema, createBuildingBodySchema, emailSchema, idParamSchema, updateBuildingBodySchema, updateMemberBodySchema } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { parseBody, parsePatch } from '../middleware/validate.ts';
import { createBuilding, getBuilding, listBuildings } from '../services/buildings.ts';
import { updateBuilding } from '../services/buildingUpdate.ts';
import { addMember, cancelInvitation, listMembers, removeMember, updateInvitationRole, updateMemberRole } from '../services/members.ts';

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
  router.post('/buildings/:id/members', auth, lead, async (req, res) => {
    const { email, role } = parseBody(addMemberBodySchema, req);
    res.status(201).json(await addMember(ctx.db, ctx.outbox, currentAccess(req).buildingId, email, role, currentUser(req)));
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
    if ('userId' in member) await removeMember(ctx.db, buildingId, member.userId, currentUser(req));
    else await cancelInvitation(ctx.db, buildingId, member.email, currentUser(req));
    res.status(204).end();
  });
}

const memberKeySchema = z.union([
  z.string().regex(/^\d+$/).transform((s) => ({ userId: idParamSchema.parse(s) })),
  emailSchema.transform((email) => ({ email })),
]);
function memberKey(value: unknown): { userId: number } | { email: string } {
  return z.object({ memberId: memberKeySchema }).parse({ memberId: value }).memberId;
}
