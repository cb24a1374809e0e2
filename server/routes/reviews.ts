// Checking and approving revisions (docs/issue-workflow.md): engineers and leads prepare; a member who did not
// prepare a revision checks it and comments on its stacks and lifts; a lead approves, which issues it.
import type { Request, Router } from 'express';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import {
  approveBodySchema,
  checkBodySchema,
  commentBodySchema,
  resolveBodySchema,
} from '../../shared/schema/reviews.ts';
import { freezeBodySchema } from '../../shared/schema/revisions.ts';
import type { ServerContext } from '../context.ts';
import { requireRole } from '../middleware/access.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { idParam, parseBody } from '../middleware/validate.ts';
import { reanalyseOutdated } from '../services/outdatedResults.ts';
import { approveRevision } from '../services/revisionIssue.ts';
import { buildingOfRevisionId, freezeRevision, getRevision } from '../services/revisions.ts';
import { addComment, markComment } from '../services/reviewComments.ts';
import { checkRevision, getReview } from '../services/reviews.ts';
import {
  arrivalOf,
  drawAfterIssue,
  mailPerUserLimit,
  revisionsLink,
  stampArrival,
  tellRevisionChanged,
} from './revisions.ts';

export function registerReviewRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const ofRevision = (db: ServerContext['db'], req: Request) => buildingOfRevisionId(db, idParam(req));
  const viewer = requireRole(ctx, 'viewer', ofRevision);
  const engineer = requireRole(ctx, 'engineer', ofRevision);
  const lead = requireRole(ctx, 'lead', ofRevision);
  // Approving issues the revision: an e-mail to every member, counted with the freeze's.
  const mailLimit = mailPerUserLimit(ctx);
  const review = (req: Request) => getReview(ctx.db, idParam(req), currentUser(req), currentAccess(req).role);

  // Prepared for checking: the snapshot is frozen as the lead's freeze does, but nothing is issued or mailed.
  router.post(
    '/buildings/:id/revisions/prepare',
    stampArrival,
    auth,
    requireRole(ctx, 'engineer'),
    async (req, res) => {
      const body = parseBody(freezeBodySchema, req);
      const { buildingId } = currentAccess(req);
      await reanalyseOutdated(ctx, buildingId, currentUser(req));
      const { id, outline } = await freezeRevision(
        ctx.db,
        buildingId,
        { ...body, link: revisionsLink(ctx, buildingId), engineVersion: ENGINE_VERSION, issueUnchecked: false },
        currentUser(req),
        arrivalOf(req),
      );
      res.status(201).json(await getRevision(ctx.db, id, outline));
      tellRevisionChanged(ctx, req, id);
    },
  );
  router.get('/revisions/:id/review', auth, viewer, async (req, res) => {
    res.json(await review(req));
  });
  router.post('/revisions/:id/check', auth, engineer, async (req, res) => {
    const body = parseBody(checkBodySchema, req);
    await checkRevision(ctx.db, idParam(req), body, currentUser(req), currentAccess(req).role);
    res.json(await review(req));
    tellRevisionChanged(ctx, req, idParam(req));
  });
  router.post('/revisions/:id/comments', auth, engineer, async (req, res) => {
    const body = parseBody(commentBodySchema, req);
    await addComment(ctx.db, idParam(req), body, currentUser(req), currentAccess(req).role);
    res.status(201).json(await review(req));
    tellRevisionChanged(ctx, req, idParam(req));
  });
  // Resolving a comment and reopening it: one rule, one body (docs/issue-workflow.md §Open comments).
  for (const [step, to] of [
    ['resolve', 'resolved'],
    ['reopen', 'open'],
  ] as const)
    router.post(`/revisions/:id/comments/:commentId/${step}`, auth, engineer, async (req, res) => {
      const body = parseBody(resolveBodySchema, req);
      const commentId = idParam(req, 'commentId');
      await markComment(ctx.db, idParam(req), commentId, to, body, currentUser(req), currentAccess(req).role);
      res.json(await review(req));
      tellRevisionChanged(ctx, req, idParam(req));
    });
  router.post('/revisions/:id/approve', auth, lead, mailLimit, async (req, res) => {
    const body = parseBody(approveBodySchema, req);
    const id = idParam(req);
    const { buildingId, role } = currentAccess(req);
    await approveRevision(ctx.db, id, body, currentUser(req), role, revisionsLink(ctx, buildingId));
    res.json(await review(req));
    tellRevisionChanged(ctx, req, id);
    drawAfterIssue(ctx, req, id);
  });
}
