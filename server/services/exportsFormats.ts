// Tables out as CSV (csv-stringify) and XLSX (exceljs), with the units in the column headers.
import ExcelJS from 'exceljs';
import { stringify } from 'csv-stringify/sync';

export type Cell = string | number | undefined;

/**
 * Text that a spreadsheet would run as a formula (= + - @ first) gets a leading apostrophe, which
 * spreadsheets show as text; readCsv takes it off again, so names still round-trip.
 */
export const spreadsheetSafe = (cell: Cell): Cell =>
  typeof cell === 'string' && /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell;

export function toCsv(columns: readonly string[], rows: readonly Partial<Record<string, Cell>>[]): string {
  return stringify(
    rows.map((r) => columns.map((c) => spreadsheetSafe(r[c]) ?? '')),
    { header: true, columns: [...columns], record_delimiter: 'windows' },
  );
}

export async function toXlsx(
  sheet: string,
  columns: readonly string[],
  rows: readonly Partial<Record<string, Cell>>[],
  note: string,
): Promise<Buffer> {
  const book = new ExcelJS.Workbook();
  book.creator = 'Stanchion';
  const ws = book.addWorksheet(sheet.replace(/[\\/?*[\]:]/g, '-').slice(0, 31) || 'Results');
  ws.columns = columns.map((c) => ({ header: c, key: c, width: Math.max(10, c.length + 2) }));
  ws.getRow(1).font = { bold: true };
  ws.views = [{ state: 'frozen', ySplit: 1 }];
  for (const r of rows) ws.addRow(Object.fromEntries(columns.map((c) => [c, r[c] ?? null])));
  const notes = book.addWorksheet('Notes');
  notes.getColumn(1).width = 120;
  notes.addRow([note]);
  notes.addRow([`Exported ${new Date().toISOString()}`]);
  return Buffer.from(await book.xlsx.writeBuffer());
}

/** A file name safe in a Content-Disposition header. */
export const safeFileName = (name: string): string =>
  name.replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^_+|_+$/g, '') || 'export';
