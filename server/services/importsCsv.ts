// Reads an uploaded CSV file into rows keyed by column, or says by line what is wrong with it.
// Everything a user can get wrong becomes a problem with a row number; nothing here throws for bad input.
import { createHash } from 'node:crypto';
import { CsvError, parse, type Options } from 'csv-parse';
import { parse as parseSync } from 'csv-parse/sync';
import {
  MAX_IMPORT_LINE_CHARS,
  MAX_IMPORT_ROWS,
  MAX_LISTED_PROBLEMS,
  type ImportProblem,
} from '../../shared/schema/imports.ts';

export interface CsvRow {
  /** Line of the file the row ends on (the header is line 1). */
  line: number;
  cells: Record<string, string>;
}

/** When some rows are the wrong width, `rows` still holds the others, so their problems are reported in the
 *  same answer; a file that cannot be read at all has none. */
export type CsvRead = { ok: true; rows: CsvRow[] } | { ok: false; problems: ImportProblem[]; rows: CsvRow[] };

export const fileHash = (buf: Buffer): string => createHash('sha256').update(buf).digest('hex');

const lineOfOffset = (buf: Buffer, offset: number): number => {
  let line = 1;
  for (let i = 0; i < offset; i += 1) if (buf[i] === 0x0a) line += 1;
  return line;
};

/** The text of the file, or the line where it stops being UTF-8 text. */
function decodeText(buf: Buffer): { text: string } | { problem: ImportProblem } {
  const nul = buf.indexOf(0);
  if (nul >= 0) {
    return {
      problem: {
        row: lineOfOffset(buf, nul),
        column: null,
        message: 'The file holds binary data, not text; save it as CSV (comma-separated values) and try again',
      },
    };
  }
  const decoder = new TextDecoder('utf-8', { fatal: true });
  try {
    return { text: decoder.decode(buf) };
  } catch {
    // Find the first line that is not UTF-8, so the message can point at it.
    let start = 0;
    let line = 1;
    while (start < buf.length) {
      const end = buf.indexOf(0x0a, start);
      const stop = end < 0 ? buf.length : end;
      try {
        decoder.decode(buf.subarray(start, stop));
      } catch {
        return {
          problem: {
            row: line,
            column: null,
            message: 'This line is not UTF-8 text; save the file as CSV UTF-8 and try again',
          },
        };
      }
      start = stop + 1;
      line += 1;
    }
    return { problem: { row: 1, column: null, message: 'The file is not UTF-8 text' } };
  }
}

const OTHER_SEPARATORS: ReadonlyArray<readonly [string, string]> = [
  [';', 'semicolons'],
  ['\t', 'tabs'],
  ['|', 'vertical bars'],
];

function headerProblems(header: string[], columns: readonly string[], required: readonly string[]): ImportProblem[] {
  const expected = columns.join(',');
  if (header.length === 1) {
    for (const [sep, name] of OTHER_SEPARATORS) {
      if (header[0]!.includes(sep))
        return [
          {
            row: 1,
            column: null,
            message: `The columns are separated by ${name}; separate them by commas: ${expected}`,
          },
        ];
    }
  }
  const problems: ImportProblem[] = [];
  const seen = new Set<string>();
  for (const name of header) {
    const known = columns.find((c) => c.toLowerCase() === name.toLowerCase());
    if (!known)
      problems.push({ row: 1, column: name, message: `Unknown column "${name}"; the columns are ${expected}` });
    else if (seen.has(known)) problems.push({ row: 1, column: known, message: `Column ${known} appears twice` });
    else seen.add(known);
  }
  for (const name of required)
    if (!seen.has(name))
      problems.push({ row: 1, column: name, message: `Column ${name} is missing; the columns are ${expected}` });
  return problems;
}

const csvErrorLine = (e: CsvError): number => {
  const lines = (e as CsvError & { lines?: unknown }).lines;
  return typeof lines === 'number' ? lines : 1;
};
const csvProblem = (e: CsvError, row: number): ImportProblem => ({
  row,
  column: null,
  message: `The file cannot be read as CSV here: ${e.message.replace(/^Invalid [^:]*: /, '').replace(/ at line \d+/, '')}`,
});

/**
 * Each line of the file that cannot be read as a CSV row by itself. The file's shape is already bounded
 * (shapeProblem), and the event loop is served between batches of lines.
 */
async function lineByLineProblems(text: string): Promise<ImportProblem[]> {
  const problems: ImportProblem[] = [];
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  for (let i = 0; i < lines.length; i += 1) {
    if (i % 500 === 499) await new Promise((r) => setImmediate(r));
    const line = lines[i]!;
    if (line.trim() === '') continue;
    try {
      parseSync(line, { trim: true, relax_column_count: true });
    } catch (e) {
      if (!(e instanceof CsvError)) throw e;
      problems.push(csvProblem(e, i + 1));
    }
  }
  return problems;
}

/** Text fed to the parser at a time; the event loop serves others between slices (docs/access.md). */
const SLICE_CHARS = 32 * 1024;

/** csv-parse's streaming parser fed in slices with a turn of the event loop between them. */
async function parseInSlices(text: string, options: Options): Promise<unknown[]> {
  const parser = parse(options);
  const records: unknown[] = [];
  let failure: unknown = null;
  parser.on('readable', () => {
    for (let r: unknown = parser.read(); r !== null; r = parser.read()) records.push(r);
  });
  parser.on('error', (e) => (failure ??= e));
  const ended = new Promise<void>((resolve) => {
    parser.on('end', resolve);
    parser.on('close', resolve);
    parser.on('error', () => resolve());
  });
  for (let i = 0; i < text.length && failure === null && !parser.destroyed; i += SLICE_CHARS) {
    parser.write(text.slice(i, i + SLICE_CHARS));
    await new Promise((r) => setImmediate(r));
  }
  if (failure === null && !parser.destroyed) parser.end();
  await ended;
  if (failure !== null) throw failure;
  return records;
}

/**
 * Refuses, before any parsing, a file whose lines are too long or too many to be a real import: the cost
 * of reading a file then stays bounded by its size, whatever it holds (a million commas, a million lines).
 */
function shapeProblem(text: string, width: number, expected: string): ImportProblem | null {
  let lines = 0;
  let line = 0;
  for (let start = 0; start < text.length;) {
    const end = text.indexOf('\n', start);
    const stop = end < 0 ? text.length : end;
    line += 1;
    if (stop - start > MAX_IMPORT_LINE_CHARS) {
      return {
        row: line,
        column: null,
        message: `This line is longer than ${MAX_IMPORT_LINE_CHARS} characters; a row holds ${width} short values: ${expected}`,
      };
    }
    if (stop - start > 1 || (stop > start && text[start] !== '\r')) lines += 1;
    if (lines > MAX_IMPORT_ROWS + 1) {
      return {
        row: line,
        column: null,
        message: `The file has more than ${MAX_IMPORT_ROWS} rows; at most ${MAX_IMPORT_ROWS} can be imported at once`,
      };
    }
    start = stop + 1;
  }
  return null;
}

/**
 * Parses the file: UTF-8 text, comma-separated, a header row naming `columns` (any order, any case),
 * at least the `required` ones, then at most MAX_IMPORT_ROWS data rows of the header's width.
 */
export async function readCsv(
  buf: Buffer,
  columns: readonly string[],
  required: readonly string[] = columns,
): Promise<CsvRead> {
  const expected = columns.join(',');
  const decoded = decodeText(buf);
  if ('problem' in decoded) return { ok: false, problems: [decoded.problem], rows: [] };
  if (decoded.text.replace(/^\uFEFF/, '').trim() === '') {
    return {
      ok: false,
      problems: [
        {
          row: 1,
          column: null,
          message: `The file is empty; it needs a header row (${expected}) and one row per entry`,
        },
      ],
      rows: [],
    };
  }

  const shape = shapeProblem(decoded.text, columns.length, expected);
  if (shape) return { ok: false, problems: [shape], rows: [] };

  let records: { info: { lines: number }; record: string[] }[];
  try {
    // With info: true each record comes as { info, record }; the typings only know plain rows.
    // Bounded work whatever the file: parsing stops one record past the row limit, and a line longer
    // than any real row (a million commas) stops it at once.
    records = (await parseInSlices(decoded.text, {
      bom: true,
      info: true,
      trim: true,
      skip_empty_lines: true,
      relax_column_count: true,
      to: MAX_IMPORT_ROWS + 2,
      max_record_size: MAX_IMPORT_LINE_CHARS,
    })) as typeof records;
  } catch (e) {
    if (e instanceof CsvError && e.code === 'CSV_MAX_RECORD_SIZE') {
      const line =
        typeof (e as CsvError & { lines?: unknown }).lines === 'number' ? (e as CsvError & { lines: number }).lines : 1;
      return {
        ok: false,
        problems: [
          {
            row: line,
            column: null,
            message: `This line is longer than ${MAX_IMPORT_LINE_CHARS} characters; a row holds ${columns.length} short values: ${expected}`,
          },
        ],
        rows: [],
      };
    }
    if (e instanceof CsvError) {
      // The parser stops at the first bad row; reading the lines one by one finds every other one too, so
      // the person fixes the file once. A quoted value running over lines cannot be read so; then the
      // parser's one problem is all there is to report.
      const each = await lineByLineProblems(decoded.text);
      return { ok: false, problems: each.length ? each : [csvProblem(e, csvErrorLine(e))], rows: [] };
    }
    throw e;
  }

  const [head, ...data] = records;
  const header = head!.record;
  if (header.length > columns.length * 2) {
    return {
      ok: false,
      problems: [
        { row: 1, column: null, message: `The header has ${header.length} columns; the columns are ${expected}` },
      ],
      rows: [],
    };
  }
  const problems = headerProblems(header, columns, required);
  if (problems.length > 0) return { ok: false, problems, rows: [] };
  if (data.length === 0)
    return { ok: false, problems: [{ row: 2, column: null, message: 'The file has a header but no rows' }], rows: [] };
  if (data.length > MAX_IMPORT_ROWS) {
    return {
      ok: false,
      problems: [
        {
          row: MAX_IMPORT_ROWS + 2,
          column: null,
          message: `The file has more than ${MAX_IMPORT_ROWS} rows; at most ${MAX_IMPORT_ROWS} can be imported at once`,
        },
      ],
      rows: [],
    };
  }

  const names = header.map((h) => columns.find((c) => c.toLowerCase() === h.toLowerCase())!);
  const rows: CsvRow[] = [];
  for (const { info, record } of data) {
    if (record.length !== names.length) {
      problems.push({
        row: info.lines,
        column: null,
        message: `This row has ${record.length} values; the header has ${names.length}`,
      });
      continue;
    }
    const cells: Record<string, string> = {};
    // An apostrophe before = + - @ is how our downloads keep text from running as a formula.
    names.forEach((name, i) => (cells[name] = record[i]!.replace(/^'(?=[=+\-@])/, '')));
    rows.push({ line: info.lines, cells });
  }
  return problems.length > 0 ? { ok: false, problems, rows } : { ok: true, rows };
}

/**
 * The first MAX_LISTED_PROBLEMS problems, and a last entry saying how many more were left out, so a file
 * with a problem on every line answers with a short list rather than megabytes of it.
 */
export function listProblems<T extends { problems: ImportProblem[] }>(preview: T): T & { problemsOmitted?: number } {
  const omitted = preview.problems.length - MAX_LISTED_PROBLEMS;
  if (omitted <= 0) return preview;
  const more = {
    row: 0,
    column: null,
    message: `… and ${omitted} more problem${omitted === 1 ? '' : 's'} not listed; fix these and upload the file again`,
  };
  return { ...preview, problems: [...preview.problems.slice(0, MAX_LISTED_PROBLEMS), more], problemsOmitted: omitted };
}

/** Every problem found, listed or not. */
export const problemCount = (preview: { problems: ImportProblem[]; problemsOmitted?: number }): number =>
  preview.problemsOmitted ? MAX_LISTED_PROBLEMS + preview.problemsOmitted : preview.problems.length;

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** A number cell in [min, max], or the problem with it. */
export function numberCell(
  row: CsvRow,
  column: string,
  unit: string,
  min: number,
  max: number,
  problems: ImportProblem[],
): number | null {
  const text = row.cells[column] ?? '';
  const fail = (message: string) => {
    problems.push({ row: row.line, column, message });
    return null;
  };
  if (text === '') return fail(`${column} is empty`);
  if (!NUMBER.test(text)) return fail(`"${text}" is not a number (use a point for decimals, e.g. 12.5)`);
  const value = Number(text);
  if (!Number.isFinite(value)) return fail(`"${text}" is not a finite number`);
  if (value < min)
    return fail(min === 0 ? `${column} must not be negative` : `${column} must be at least ${min} ${unit}`);
  if (value > max) return fail(`${column} must be at most ${max} ${unit}`);
  return value;
}

/** The file's own problems and those found in its readable rows, in the order of the file. */
export const byRow = (problems: ImportProblem[]): ImportProblem[] =>
  problems
    .map((p, i) => [p, i] as const)
    .sort(([a, i], [b, j]) => a.row - b.row || i - j)
    .map(([p]) => p);
