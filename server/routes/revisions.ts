// Revisions (docs/contracts.md §Revisions): leads freeze; every member reads, downloads the package and compares.
import type { Request, Router } from 'express';
import { compareQuerySchema, freezeBodySchema } from '../../shared/schema/revisions.ts';
import type { ServerContext } from '../context.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { byUser, limiter } from '../middleware/rateLimits.ts';
import { idParam, parseBody, parseQuery } from '../middleware/validate.ts';
import { buildingOfRevisionId, freezeRevision, getRevision, listRevisions, loadSnapshot } from '../services/revisions.ts';
import { compareRevisions } from '../services/revisionsCompare.ts';
import { packageFilename, sendRevisionMail } from '../services/revisionsMail.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import { reanalyseOutdated } from '../services/outdatedResults.ts';

/** Where the e-mail's link points: the configured public URL, never a request header (docs/access.md). */
function revisionsLink(ctx: ServerContext, buildingId: number): string {
  return `${ctx.config.publicUrl}/buildings/${buildingId}/revisions`;
}

export function registerRevisionRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const ofRevision = (db: ServerContext['db'], req: Request) => buildingOfRevisionId(db, idParam(req));
  const revisionViewer = requireRole(ctx, 'viewer', ofRevision);
  const revisionLead = requireRole(ctx, 'lead', ofRevision);
  // Both send an e-mail to every member.
  const mailLimit = limiter(ctx, 'mail-user', ctx.config.limits.mailPerUser, byUser, 'Too many e-mails sent from this account');

  router.post('/buildings/:id/revisions', auth, requireRole(ctx, 'lead'), mailLimit, async (req, res) => {
    const body = parseBody(freezeBodySchema, req);
    const { buildingId } = currentAccess(req);
    // Results of older rules are brought up to date first: the revision names the current engine version.
    await reanalyseOutdated(ctx, buildingId, currentUser(req));
    const { id, snapshot, hash } = await freezeRevision(ctx.db, buildingId, { ...body, engineVersion: ENGINE_VERSION }, currentUser(req));
    // Committed: from here on a failure to send is recorded per recipient and never undoes the freeze.
    const pdf = await ctx.offThread.renderPackage(snapshot, hash);
    await sendRevisionMail(ctx, id, snapshot, hash, revisionsLink(ctx, buildingId), pdf);
    res.status(201).json(await getRevision(ctx.db, id));
  });
  router.get('/buildings/:id/revisions', auth, requireRole(ctx, 'viewer'), async (req, res) => {
    res.json(await listRevisions(ctx.db, currentAccess(req).buildingId));
  });
  router.get('/buildings/:id/revisions/compare', auth, requireRole(ctx, 'viewer'), async (req, res) => {
    const query = parseQuery(compareQuerySchema, req);
    res.json(await compareRevisions(ctx.db, currentAccess(req).buildingId, query));
  });
  router.get('/revisions/:id', auth, revisionViewer, async (req, res) => {
    res.json(await getRevision(ctx.db, idParam(req)));
  });
  router.get('/revisions/:id/calc.pdf', auth, revisionViewer, async (req, res) => {
    const { snapshot, hash } = await loadSnapshot(ctx.db, idParam(req));
    const pdf = await ctx.offThread.renderPackage(snapshot, hash);
    res.attachment(packageFilename(snapshot)).type('application/pdf').send(pdf);
  });
  router.post('/revisions/:id/resend', auth, revisionLead, mailLimit, async (req, res) => {
    const id = idParam(req);
    const { snapshot, hash } = await loadSnapshot(ctx.db, id);
    const pdf = await ctx.offThread.renderPackage(snapshot, hash);
    await sendRevisionMail(ctx, id, snapshot, hash, revisionsLink(ctx, snapshot.building.id), pdf);
    res.json(await getRevision(ctx.db, id));
  });
}
