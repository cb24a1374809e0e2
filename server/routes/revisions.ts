// Revisions (docs/contracts.md §Revisions): leads freeze; every member reads, downloads the package and compares.
import type { Request, RequestHandler, Router } from 'express';
import { z } from 'zod';
import { compareQuerySchema, freezeBodySchema } from '../../shared/schema/revisions.ts';
import type { ServerContext } from '../context.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { byUser, limiter } from '../middleware/rateLimits.ts';
import { idParam, parseBody, parseQuery } from '../middleware/validate.ts';
import {
  buildingOfRevisionId,
  freezeRevision,
  getRevision,
  listRevisions,
  loadIssueHead,
  loadSnapshotHead,
} from '../services/revisions.ts';
import { compareRevisions } from '../services/revisionsCompare.ts';
import { packageFilename, resendRevisionMail } from '../services/revisionsMail.ts';
import {
  CHECK_COPY_REASON,
  issuedPackage,
  packageCopy,
  redrawCopy,
  type StoredPackage,
} from '../services/revisionPackages.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import { reanalyseOutdated } from '../services/outdatedResults.ts';
import { now } from '../db.ts';

/** Where the e-mail's link points: the configured public URL, never a request header (docs/access.md). */
export function revisionsLink(ctx: ServerContext, buildingId: number): string {
  return `${ctx.config.publicUrl}/buildings/${buildingId}/revisions`;
}

/** When each freeze request reached this process, before it waited for the database (see freezeRevision). */
const arrivals = new WeakMap<Request, string>();
export const arrivalOf = (req: Request): string => arrivals.get(req) ?? now();
export const stampArrival: RequestHandler = (req, _res, next) => {
  arrivals.set(req, now());
  next();
};

/**
 * Committed, with the package due and the e-mails queued: the route has answered. The package is drawn once
 * in the background (or by the mail sender, or the first download, whichever comes first).
 */
export function drawAfterIssue(ctx: ServerContext, req: Request, revisionId: number): void {
  void issuedPackage(ctx, revisionId)
    .catch((err: unknown) =>
      req.log.warn({ err, revisionId }, 'package not drawn yet; the mail sender or the first download draws it'),
    )
    .finally(() => ctx.outbox.kick());
}

/** The per-account limit on routes that send e-mail (a freeze or an approval mails every member). */
/**
 * After a revision's state or comments changed (committed): the building's room hears it, so members with the
 * revisions open refresh them (docs/issue-workflow.md). A failed notification is logged, never an error reply.
 */
export function tellRevisionChanged(ctx: ServerContext, req: Request, revisionId: number): void {
  const user = currentUser(req);
  try {
    ctx.broadcaster.revisionChanged({
      buildingId: currentAccess(req).buildingId,
      revisionId,
      by: { userId: user.id, name: user.name },
    });
  } catch (err) {
    ctx.log.error({ err, revisionId }, 'revision broadcast failed');
  }
}

export function mailPerUserLimit(ctx: ServerContext) {
  return limiter(ctx, 'mail-user', ctx.config.limits.mailPerUser, byUser, 'Too many e-mails sent from this account');
}

export function registerRevisionRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const ofRevision = (db: ServerContext['db'], req: Request) => buildingOfRevisionId(db, idParam(req));
  const revisionViewer = requireRole(ctx, 'viewer', ofRevision);
  const revisionLead = requireRole(ctx, 'lead', ofRevision);
  // Both send an e-mail to every member.
  const mailLimit = mailPerUserLimit(ctx);

  router.post('/buildings/:id/revisions', stampArrival, auth, requireRole(ctx, 'lead'), mailLimit, async (req, res) => {
    const body = parseBody(freezeBodySchema, req);
    const { buildingId } = currentAccess(req);
    // Results of older rules are brought up to date first: the revision names the current engine version.
    await reanalyseOutdated(ctx, buildingId, currentUser(req));
    // A lead's freeze: a preliminary revision is prepared and issued at once without a check (the cover says
    // so); a construction revision is prepared and waits for its check and approval (docs/issue-workflow.md).
    const { id, issued, outline } = await freezeRevision(
      ctx.db,
      buildingId,
      {
        ...body,
        link: revisionsLink(ctx, buildingId),
        engineVersion: ENGINE_VERSION,
        issueUnchecked: body.purpose === 'preliminary',
      },
      currentUser(req),
      arrivalOf(req),
    );
    res.status(201).json(await getRevision(ctx.db, id, outline));
    tellRevisionChanged(ctx, req, id);
    if (issued) drawAfterIssue(ctx, req, id);
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
  // ?copy=n serves a re-drawn copy; without it, the issued package as stored (verified on read).
  router.get('/revisions/:id/calc.pdf', auth, revisionViewer, async (req, res) => {
    const { copy } = parseQuery(copyQuerySchema, req);
    const id = idParam(req);
    const pkg = await packageCopy(ctx, id, copy);
    const head = await loadSnapshotHead(ctx.db, id);
    res.setHeader('X-Package-SHA256', pkg.sha256);
    res
      .attachment(packageFilename(head).replace(/\.pdf$/, `${copySuffix(pkg)}.pdf`))
      .type('application/pdf')
      .send(pkg.bytes);
  });
  router.post('/revisions/:id/resend', auth, revisionLead, mailLimit, async (req, res) => {
    const id = idParam(req);
    const { head, hash } = await loadIssueHead(ctx.db, id);
    await resendRevisionMail(ctx, id, head, hash, revisionsLink(ctx, head.building.id));
    res.json(await getRevision(ctx.db, id));
  });
  // Only when the issued package is tampered or lost: a new copy, marked as re-drawn on every page.
  router.post('/revisions/:id/package/redraw', auth, revisionLead, async (req, res) => {
    const pkg = await redrawCopy(ctx, idParam(req), currentUser(req));
    res.status(201).json({ copy: pkg.copy, sha256: pkg.sha256, size: pkg.bytes.length, reason: pkg.reason });
  });
}

const copySuffix = (pkg: StoredPackage) =>
  pkg.copy > 0 ? `-redrawn-copy-${pkg.copy}` : pkg.reason === CHECK_COPY_REASON ? '-check-copy' : '';

const copyQuerySchema = z.object({ copy: z.coerce.number().int().min(0).max(10_000).default(0) });
