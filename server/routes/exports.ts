// Downloads (docs/contracts.md §Imports): results per stack and per building as CSV or XLSX, and the level-loads
// template. Every member of the building may download.
import type { Response, Router } from 'express';
import type { ServerContext } from '../context.ts';
import { currentAccess, requireAuth } from '../middleware/auth.ts';
import { buildingOfStack, requireRole } from '../middleware/access.ts';
import { idParam } from '../middleware/validate.ts';
import { safeFileName, toCsv, toXlsx } from '../services/exportsFormats.ts';
import { buildingResults, columnsOf, RESULTS_NOTE, stackResults, type ResultRow } from '../services/exportsResults.ts';
import { loadsTemplateCsv } from '../services/exportsTemplate.ts';
import { floorLoadsCsv, gridCsv } from '../services/importsModel.ts';

const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

function sendCsv(res: Response, fileName: string, text: string): void {
  res.attachment(fileName).type('text/csv; charset=utf-8').send(text);
}

async function sendResults(
  res: Response,
  format: 'csv' | 'xlsx',
  table: { name: string; rows: ResultRow[] },
): Promise<void> {
  const fileName = `${safeFileName(table.name)}-results.${format}`;
  const columns = columnsOf(table.rows);
  if (format === 'csv') return sendCsv(res, fileName, toCsv(columns, table.rows));
  res
    .attachment(fileName)
    .type(XLSX_TYPE)
    .send(await toXlsx(table.name, columns, table.rows, RESULTS_NOTE));
}

export function registerExportRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const viewer = requireRole(ctx, 'viewer');
  const stackViewer = requireRole(ctx, 'viewer', buildingOfStack);

  router.get('/stacks/:id/results.csv', auth, stackViewer, async (req, res) => {
    await sendResults(res, 'csv', await stackResults(ctx.db, idParam(req)));
  });
  router.get('/stacks/:id/results.xlsx', auth, stackViewer, async (req, res) => {
    await sendResults(res, 'xlsx', await stackResults(ctx.db, idParam(req)));
  });
  router.get('/buildings/:id/results.csv', auth, viewer, async (req, res) => {
    await sendResults(res, 'csv', await buildingResults(ctx.db, currentAccess(req).buildingId));
  });
  router.get('/buildings/:id/results.xlsx', auth, viewer, async (req, res) => {
    await sendResults(res, 'xlsx', await buildingResults(ctx.db, currentAccess(req).buildingId));
  });
  router.get('/buildings/:id/imports/loads/template.csv', auth, viewer, async (req, res) => {
    sendCsv(res, 'level-loads.csv', await loadsTemplateCsv(ctx.db, currentAccess(req).buildingId));
  });
  router.get('/buildings/:id/grid.csv', auth, viewer, async (req, res) => {
    sendCsv(res, 'grid.csv', await gridCsv(ctx.db, currentAccess(req).buildingId));
  });
  router.get('/buildings/:id/floor-loads.csv', auth, viewer, async (req, res) => {
    sendCsv(res, 'floor-loads.csv', await floorLoadsCsv(ctx.db, currentAccess(req).buildingId));
  });
}
