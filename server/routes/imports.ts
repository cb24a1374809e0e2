// Uploads of level loads and company sections (docs/contracts.md §Imports): engineers preview and apply; members read
// the building's own sections. Files arrive as multipart field "file", at most MAX_IMPORT_BYTES.
import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import { applyFieldsSchema, MAX_IMPORT_BYTES, type ImportProblem } from '../../shared/schema/imports.ts';
import type { ServerContext } from '../context.ts';
import { badRequest, HttpError, unprocessable } from '../errors.ts';
import { currentAccess, currentUser, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { parseBody, parseQuery } from '../middleware/validate.ts';
import { listCompanySections } from '../services/companySections.ts';
import { problemCount } from '../services/importsCsv.ts';
import { applyLoads, previewLoads, type ApplyFields } from '../services/importsLoads.ts';
import { problemsMessage } from '../services/importsApply.ts';
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

  /** Each kind: POST …/imports/<kind> previews a file (422 with the preview when it has problems), POST
   *  …/imports/<kind>/apply applies the same file. */
  function importRoutes<P extends { problems: ImportProblem[]; problemsOmitted?: number }>(
    kind: string,
    preview: (db: Knex, buildingId: number, file: Buffer) => Promise<P>,
    apply: (buildingId: number, file: Buffer, fields: ApplyFields, user: User) => Promise<unknown>,
  ): void {
    router.post(`/buildings/:id/imports/${kind}`, auth, engineer, receiveFile, async (req, res) => {
      const checked = await preview(ctx.db, currentAccess(req).buildingId, uploadedFile(req));
      if (checked.problems.length > 0) throw unprocessable(problemsMessage(problemCount(checked)), checked);
      res.json(checked);
    });
    router.post(`/buildings/:id/imports/${kind}/apply`, auth, engineer, receiveFile, async (req, res) => {
      const file = uploadedFile(req);
      const fields = parseBody(applyFieldsSchema, req);
      res.json(await apply(currentAccess(req).buildingId, file, fields, currentUser(req)));
    });
  }

  importRoutes('loads', previewLoads, (id, file, fields, user) => applyLoads(ctx, id, file, fields, user));
  importRoutes('sections', previewSections, (id, file, { fileHash }, user) =>
    applySections(ctx, id, file, { fileHash }, user),
  );
  // The grid and the levels' floor loads (docs/building-model.md)
  importRoutes('grid', previewGrid, (id, file, { fileHash }, user) => applyGrid(ctx, id, file, fileHash, user));
  importRoutes('floor-loads', previewFloorLoads, (id, file, { fileHash }, user) =>
    applyFloorLoads(ctx, id, file, fileHash, user),
  );

  router.get('/buildings/:id/sections', auth, viewer, async (req, res) => {
    const { q } = parseQuery(sectionsQuerySchema, req);
    res.json(await listCompanySections(ctx.db, currentAccess(req).buildingId, q));
  });
}
