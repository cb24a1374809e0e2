// Uploads of level loads and company sections (docs/contracts.md §Imports): engineers preview and apply; members read
// the building's own sections. Files arrive as multipart field "file", at most MAX_IMPORT_BYTES.
import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { applyFieldsSchema, MAX_IMPORT_BYTES } from '../../shared/schema/imports.ts';
import type { ServerContext } from '../context.ts';
import { badRequest, HttpError, unprocessable } from '../errors.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { parseBody, parseQuery } from '../middleware/validate.ts';
import { listCompanySections } from '../services/companySections.ts';
import { problemCount } from '../services/importsCsv.ts';
import { applyLoads, previewLoads, problemsMessage } from '../services/importsLoads.ts';
import { applySections, previewSections } from '../services/importsSections.ts';
import { applyFloorLoads, applyGrid, previewFloorLoads, previewGrid } from '../services/importsModel.ts';

const receive = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_IMPORT_BYTES, files: 1, fields: 4, parts: 6, fieldSize: 600_000 },
}).single('file');

const megabytes = MAX_IMPORT_BYTES / (1024 * 1024);

/** multer, with its failures turned into the API's error shape (413 for a file over the limit). */
const receiveFile: RequestHandler = (req: Request, res: Response, next: NextFunction) => {
  receive(req, res, (err: unknown) => {
    if (err === undefined || err === null) return next();
    if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
      return next(
        new HttpError(
          413,
          'payload_too_large',
          `The file is larger than ${megabytes} MB; split it and import the parts one by one`,
          {
            problems: [{ row: 0, column: null, message: `The file is larger than ${megabytes} MB` }],
          },
        ),
      );
    }
    if (err instanceof multer.MulterError)
      return next(
        badRequest(
          `The upload was refused: ${err.message}${err.field ? ` (${err.field})` : ''}; send one CSV file in the form field "file"`,
        ),
      );
    // busboy's own errors are malformed multipart bodies: the client's fault, never a 500.
    return next(badRequest(`The upload could not be read: ${err instanceof Error ? err.message : String(err)}`));
  });
};

function uploadedFile(req: Request): Buffer {
  if (!req.file) throw badRequest('Attach the CSV file as the multipart form field "file"');
  return req.file.buffer;
}

const sectionsQuerySchema = z.object({ q: z.string().trim().max(80).default('') });

export function registerImportRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const viewer = requireRole(ctx, 'viewer');
  const engineer = requireRole(ctx, 'engineer');

  router.post('/buildings/:id/imports/loads', auth, engineer, receiveFile, async (req, res) => {
    const preview = await previewLoads(ctx.db, currentAccess(req).buildingId, uploadedFile(req));
    if (preview.problems.length > 0) throw unprocessable(problemsMessage(problemCount(preview)), preview);
    res.json(preview);
  });
  router.post('/buildings/:id/imports/loads/apply', auth, engineer, receiveFile, async (req, res) => {
    const file = uploadedFile(req);
    const fields = parseBody(applyFieldsSchema, req);
    res.json(await applyLoads(ctx, currentAccess(req).buildingId, file, fields, currentUser(req)));
  });

  router.post('/buildings/:id/imports/sections', auth, engineer, receiveFile, async (req, res) => {
    const preview = await previewSections(ctx.db, currentAccess(req).buildingId, uploadedFile(req));
    if (preview.problems.length > 0) throw unprocessable(problemsMessage(problemCount(preview)), preview);
    res.json(preview);
  });
  router.post('/buildings/:id/imports/sections/apply', auth, engineer, receiveFile, async (req, res) => {
    const file = uploadedFile(req);
    const { fileHash } = parseBody(applyFieldsSchema, req);
    res.json(await applySections(ctx, currentAccess(req).buildingId, file, { fileHash }, currentUser(req)));
  });

  // The grid and the levels' floor loads (docs/building-model.md)
  router.post('/buildings/:id/imports/grid', auth, engineer, receiveFile, async (req, res) => {
    const preview = await previewGrid(ctx.db, currentAccess(req).buildingId, uploadedFile(req));
    if (preview.problems.length > 0) throw unprocessable(problemsMessage(preview.problems.length), preview);
    res.json(preview);
  });
  router.post('/buildings/:id/imports/grid/apply', auth, engineer, receiveFile, async (req, res) => {
    const file = uploadedFile(req);
    const { fileHash } = parseBody(applyFieldsSchema, req);
    res.json(await applyGrid(ctx, currentAccess(req).buildingId, file, fileHash, currentUser(req)));
  });
  router.post('/buildings/:id/imports/floor-loads', auth, engineer, receiveFile, async (req, res) => {
    const preview = await previewFloorLoads(ctx.db, currentAccess(req).buildingId, uploadedFile(req));
    if (preview.problems.length > 0) throw unprocessable(problemsMessage(preview.problems.length), preview);
    res.json(preview);
  });
  router.post('/buildings/:id/imports/floor-loads/apply', auth, engineer, receiveFile, async (req, res) => {
    const file = uploadedFile(req);
    const { fileHash } = parseBody(applyFieldsSchema, req);
    res.json(await applyFloorLoads(ctx, currentAccess(req).buildingId, file, fileHash, currentUser(req)));
  });

  router.get('/buildings/:id/sections', auth, viewer, async (req, res) => {
    const { q } = parseQuery(sectionsQuerySchema, req);
    res.json(await listCompanySections(ctx.db, currentAccess(req).buildingId, q));
  });
}
