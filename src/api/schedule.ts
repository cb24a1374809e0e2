// A building's column schedule and tonnage (docs/column-schedule.md), on screen and as files.
import type { ColumnSchedule } from '@shared/schedule/columnSchedule.ts';
import { columnScheduleSchema } from '@shared/schema/replies.ts';
import { downloadFile } from './download.ts';
import { http } from './http.ts';

export type ScheduleFormat = 'csv' | 'xlsx' | 'dxf';

export async function getSchedule(buildingId: number): Promise<ColumnSchedule> {
  return columnScheduleSchema.parse(await http.get(`/buildings/${buildingId}/schedule`));
}

export function downloadSchedule(buildingId: number, format: ScheduleFormat): Promise<void> {
  return downloadFile(`/buildings/${buildingId}/schedule.${format}`, `column-schedule.${format}`);
}
