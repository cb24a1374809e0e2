// The building's column schedule (docs/column-schedule.md) from the stored documents and results of each stack's
// current version, and its downloads: CSV, XLSX and a drawing-ready DXF table.
import type { Knex } from 'knex';
import ExcelJS from 'exceljs';
import { DxfWriter, point3d } from '@tarikjabiri/dxf';
import { buildColumnSchedule, type ColumnSchedule, type ScheduleRow } from '../../shared/schedule/columnSchedule.ts';
import { companySectionMap } from './companySections.ts';
import { listLevels } from './levels.ts';
import { parseDoc, parseResults, stackRowsWithResults } from './stackRows.ts';
import { spreadsheetSafe, toCsv, type Cell } from './exportsFormats.ts';

export async function buildingSchedule(
  db: Knex,
  buildingId: number,
): Promise<{ name: string; schedule: ColumnSchedule }> {
  const building = await db('buildings').where({ id: buildingId }).first<{ name: string }>('name');
  const rows = await stackRowsWithResults(db).where({ building_id: buildingId });
  const stacks = rows.map((r) => ({
    id: r.id,
    name: r.name,
    version: r.version,
    doc: parseDoc(r.doc),
    results: parseResults(r),
  }));
  const levels = await listLevels(db, buildingId);
  return {
    name: building.name,
    schedule: buildColumnSchedule(stacks, levels, await companySectionMap(db, buildingId)),
  };
}

/** Columns of the downloads, with their units. */
export const SCHEDULE_COLUMNS = [
  'stack',
  'type',
  'lift',
  'from_level',
  'to_level',
  'bottom_m',
  'top_m',
  'length_m',
  'section',
  'series',
  'grade',
  'bottom_joint',
  'base_fixity',
  'splice_levels',
  'utilisation',
  'governing_check',
  'status',
  'mass_kg_per_m',
  'mass_kg',
] as const;
type ScheduleColumn = (typeof SCHEDULE_COLUMNS)[number];

const round = (n: number, places: number): number => Number(n.toFixed(places));

export function scheduleCells(r: ScheduleRow): Record<ScheduleColumn, Cell> {
  return {
    stack: r.stack,
    type: r.type,
    lift: r.lift,
    from_level: r.fromLevel,
    to_level: r.toLevel,
    bottom_m: round(r.bottom, 3),
    top_m: round(r.top, 3),
    length_m: round(r.length, 3),
    section: r.section,
    series: r.series,
    grade: r.grade,
    bottom_joint: r.bottomJoint,
    base_fixity: r.baseFixity,
    splice_levels: r.splices,
    utilisation: round(r.utilisation, 3),
    governing_check: r.governing,
    status: r.status,
    mass_kg_per_m: round(r.massPerMetre, 1),
    mass_kg: round(r.mass, 1),
  };
}

const tonnes = (kg: number): number => round(kg / 1000, 3);

/** The tonnage as (what, tonnes) lines, shared by the CSV, the XLSX and the DXF. */
export function tonnageLines(s: ColumnSchedule): [string, number][] {
  return [
    ['Total', tonnes(s.tonnage.total)],
    ...s.tonnage.byLevel.map((l): [string, number] => [`Level band from ${l.level}`, tonnes(l.mass)]),
    ...s.tonnage.bySeriesGrade.map((g): [string, number] => [`${g.series} ${g.grade}`, tonnes(g.mass)]),
  ];
}

/** Stacks left out, in words; empty when every stack is listed. */
const gapLines = (s: ColumnSchedule): string[] => s.gaps.map((g) => `Not scheduled: ${g.stack}: ${g.reason}`);

export function scheduleCsv(s: ColumnSchedule): string {
  const table = toCsv(SCHEDULE_COLUMNS, s.rows.map(scheduleCells));
  const tonnage = toCsv(
    ['tonnage', 'tonnes'],
    tonnageLines(s).map(([what, t]) => ({ tonnage: what, tonnes: t })),
  );
  const notes = toCsv(
    ['note'],
    [s.note, ...gapLines(s)].map((note) => ({ note })),
  );
  return `${table}\r\n${tonnage}\r\n${notes}`;
}

export async function scheduleXlsx(name: string, s: ColumnSchedule): Promise<Buffer> {
  const book = new ExcelJS.Workbook();
  book.creator = 'Stanchion';
  const sheet = book.addWorksheet('Column schedule');
  sheet.columns = SCHEDULE_COLUMNS.map((c) => ({ header: c, key: c, width: Math.max(10, c.length + 2) }));
  sheet.getRow(1).font = { bold: true };
  sheet.views = [{ state: 'frozen', ySplit: 1 }];
  for (const r of s.rows) {
    const cells = scheduleCells(r);
    sheet.addRow(Object.fromEntries(SCHEDULE_COLUMNS.map((c) => [c, spreadsheetSafe(cells[c]) ?? null])));
  }
  const tonnage = book.addWorksheet('Tonnage');
  tonnage.columns = [
    { header: 'tonnage', key: 'what', width: 40 },
    { header: 'tonnes', key: 't', width: 12 },
  ];
  tonnage.getRow(1).font = { bold: true };
  for (const [what, t] of tonnageLines(s)) tonnage.addRow({ what: spreadsheetSafe(what), t });
  const notes = book.addWorksheet('Notes');
  notes.getColumn(1).width = 120;
  for (const line of [`${name}: column schedule`, s.note, ...gapLines(s), `Exported ${new Date().toISOString()}`])
    notes.addRow([spreadsheetSafe(line)]);
  return Buffer.from(await book.xlsx.writeBuffer());
}

/** Columns of the drawn table: header, width (drawing units, mm at 1:1) and the cell text. */
const DXF_COLUMNS: readonly { head: string; width: number; text: (r: ScheduleRow) => string }[] = [
  { head: 'Stack', width: 25, text: (r) => r.stack },
  { head: 'Type', width: 12, text: (r) => r.type },
  { head: 'Lift', width: 12, text: (r) => r.lift },
  { head: 'From', width: 40, text: (r) => r.fromLevel },
  { head: 'To', width: 40, text: (r) => r.toLevel },
  { head: 'Section', width: 45, text: (r) => r.section },
  { head: 'Grade', width: 15, text: (r) => r.grade },
  { head: 'Base', width: 18, text: (r) => r.baseFixity },
  { head: 'Splices', width: 60, text: (r) => r.splices },
  { head: 'Util.', width: 14, text: (r) => r.utilisation.toFixed(2) },
  { head: 'Mass kg', width: 18, text: (r) => r.mass.toFixed(0) },
];
const ROW_H = 8;
const TEXT_H = 3.5;

/** The schedule as a table of lines and single-line texts (DXF R12-style entities every CAD reader takes). */
export function scheduleDxf(name: string, s: ColumnSchedule): string {
  const dxf = new DxfWriter();
  const width = DXF_COLUMNS.reduce((sum, c) => sum + c.width, 0);
  const lines: string[][] = [DXF_COLUMNS.map((c) => c.head), ...s.rows.map((r) => DXF_COLUMNS.map((c) => c.text(r)))];
  dxf.addText(point3d(0, ROW_H * 1.5), 5, `${name}: column schedule`);
  lines.forEach((cells, i) => {
    const top = -i * ROW_H;
    dxf.addLine(point3d(0, top), point3d(width, top));
    let x = 0;
    cells.forEach((cell, j) => {
      if (cell) dxf.addText(point3d(x + 1.5, top - ROW_H + 2.25), TEXT_H, cell);
      x += DXF_COLUMNS[j]!.width;
    });
  });
  const bottom = -lines.length * ROW_H;
  dxf.addLine(point3d(0, bottom), point3d(width, bottom));
  let x = 0;
  for (const c of [...DXF_COLUMNS, undefined]) {
    dxf.addLine(point3d(x, 0), point3d(x, bottom));
    x += c?.width ?? 0;
  }
  const footer = [...tonnageLines(s).map(([what, t]) => `${what}: ${t.toFixed(3)} t`), ...gapLines(s), s.note];
  footer.forEach((line, i) => dxf.addText(point3d(0, bottom - (i + 1.5) * ROW_H), TEXT_H, line));
  return dxf.stringify();
}
