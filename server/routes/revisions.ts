// Revisions (issue 8): leads freeze; every member reads, downloads the package and compares.
import type { Request, RequestHandler, Router } from 'express';
import { compareQuerySchema, freezeBodySchema } from '../../shared/schema/revisions.ts';
import type { ServerContext } from '../context.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { idParam, parseBody, parseQuery } from '../middleware/validate.ts';
import { buildingOfRevisionId, freezeRevision, getRevision, listRevisions, loadSnapshot } from '../services/revisions.ts';
import { compareRevisions } from '../services/revisionsCompare.ts';
import { packageFilename, sendRevisionMail } from '../services/revisionsMail.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import { now } from '../db.ts';

/** Where the e-mail's link points: the page the lead froze from (Origin), else this server. */
function revisionsLink(req: Request, buildingId: number): string {
  const origin = req.get('origin') ?? `${req.protocol}://${req.get('host') ?? 'localhost'}`;
  return `${origin}/buildings/${buildingId}/revisions`;
}

/** When each freeze request reached this process, before it waited for the database (see freezeRevision). */
const arrivals = new WeakMap<Request, string>();
const stampArrival: RequestHandler = (req, _res, next) => {
  arrivals.set(req, now());
  next();
};

export function registerRevisionRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const ofRevision = (db: ServerContext['db'], req: Request) => buildingOfRevisionId(db, idParam(req));
  const revisionViewer = requireRole(ctx, 'viewer', ofRevision);
  const revisionLead = requireRole(ctx, 'lead', ofRevision);

  router.post('/buildings/:id/revisions', stampArrival, auth, requireRole(ctx, 'lead'), async (req, res) => {
    const body = parseBody(freezeBodySchema, req);
    const { buildingId } = currentAccess(req);
    const { id, snapshot, hash } = await freezeRevision(ctx.db, buildingId, { ...body, engineVersion: ENGINE_VERSION }, currentUser(req), arrivals.get(req) ?? now());
    // Committed: from here on a failure to send is recorded per recipient and never undoes the freeze.
    const pdf = await ctx.offThread.renderPackage(snapshot, hash);
    await sendRevisionMail(ctx, id, snapshot, hash, revisionsLink(req, buildingId), pdf);
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
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${packageFilename(snapshot)}"`);
    res.send(pdf);
  });
  router.post('/revisions/:id/resend', auth, revisionLead, async (req, res) => {
    const id = idParam(req);
    const { snapshot, hash } = await loadSnapshot(ctx.db, id);
    const pdf = await ctx.offThread.renderPackage(snapshot, hash);
    await sendRevisionMail(ctx, id, snapshot, hash, revisionsLink(req, snapshot.building.id), pdf);
    res.json(await getRevision(ctx.db, id));
  });
}
