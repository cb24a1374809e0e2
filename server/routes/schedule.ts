// The column schedule (docs/column-schedule.md): as JSON for the screen and as CSV, XLSX and DXF downloads. Every
// member of the building may read it.
import type { Router } from 'express';
import type { ServerContext } from '../context.ts';
import { currentAccess, requireAuth } from '../middleware/auth.ts';
import { requireRole } from '../middleware/access.ts';
import { safeFileName } from '../services/exportsFormats.ts';
import { buildingSchedule, scheduleCsv, scheduleDxf, scheduleXlsx } from '../services/columnSchedule.ts';

const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';
const fileName = (name: string, ext: string) => `${safeFileName(name)}-column-schedule.${ext}`;

export function registerScheduleRoutes(router: Router, ctx: ServerContext): void {
  const auth = requireAuth(ctx);
  const viewer = requireRole(ctx, 'viewer');

  router.get('/buildings/:id/schedule', auth, viewer, async (req, res) => {
    res.json((await buildingSchedule(ctx.db, currentAccess(req).buildingId)).schedule);
  });
  router.get('/buildings/:id/schedule.csv', auth, viewer, async (req, res) => {
    const { name, schedule } = await buildingSchedule(ctx.db, currentAccess(req).buildingId);
    res.attachment(fileName(name, 'csv')).type('text/csv; charset=utf-8').send(scheduleCsv(schedule));
  });
  router.get('/buildings/:id/schedule.xlsx', auth, viewer, async (req, res) => {
    const { name, schedule } = await buildingSchedule(ctx.db, currentAccess(req).buildingId);
    res
      .attachment(fileName(name, 'xlsx'))
      .type(XLSX_TYPE)
      .send(await scheduleXlsx(name, schedule));
  });
  router.get('/buildings/:id/schedule.dxf', auth, viewer, async (req, res) => {
    const { name, schedule } = await buildingSchedule(ctx.db, currentAccess(req).buildingId);
    res.attachment(fileName(name, 'dxf')).type('application/dxf').send(scheduleDxf(name, schedule));
  });
}
