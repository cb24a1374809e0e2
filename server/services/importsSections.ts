// Company sections from a CSV file (docs/contracts.md §Imports): checked like the level loads, previewed, then
// written in one transaction; stacks whose lifts use a changed section are re-analysed in the same transaction.
import type { Knex } from 'knex';
import { designationKey, findSection } from '../../shared/catalogue/index.ts';
import { isEngineError } from '../../shared/engine/errors.ts';
import { validateDims } from '../../shared/engine/validateDims.ts';
import type { User } from '../../shared/schema/api.ts';
import {
  SECTION_COLUMNS,
  type ApplyResult,
  type ImportProblem,
  type SectionChange,
  type SectionsPreview,
} from '../../shared/schema/imports.ts';
import type { Op } from '../../shared/schema/ops.ts';
import { MAX_DIMENSION_MM, sectionDimsSchema, type SectionDims } from '../../shared/schema/stack.ts';
import type { ServerContext } from '../context.ts';
import { companySectionMap, upsertCompanySections } from './companySections.ts';
import { byRow, listProblems, numberCell, readCsv, type CsvRow } from './importsCsv.ts';
import { announceApplied, assertPreviewed, commitEachStack, nothingRead } from './importsApply.ts';

const DIMS_BY_SHAPE = { I: ['h', 'b', 'tw', 'tf', 'r'], RHS: ['h', 'b', 't'], CHS: ['d', 't'] } as const;
const MAKES = {
  I: ['rolled', 'welded'],
  RHS: ['hot-finished', 'cold-formed'],
  CHS: ['hot-finished', 'cold-formed'],
} as const;
const ALL_DIMS = ['h', 'b', 'tw', 'tf', 'r', 'd', 't'] as const;
type Shape = keyof typeof DIMS_BY_SHAPE;

function shapeCell(row: CsvRow, problems: ImportProblem[]): { shape: Shape; square: boolean } | null {
  const text = (row.cells.shape ?? '').toUpperCase();
  if (text === 'I' || text === 'RHS' || text === 'CHS') return { shape: text, square: false };
  if (text === 'SHS') return { shape: 'RHS', square: true };
  problems.push({
    row: row.line,
    column: 'shape',
    message: `"${row.cells.shape ?? ''}" is not a shape; use I, SHS, RHS or CHS`,
  });
  return null;
}

/** The dimensions of one row, checked by the document schema and by the engine's geometry rules. */
function dimsOf(row: CsvRow, problems: ImportProblem[]): SectionDims | null {
  const before = problems.length;
  const kind = shapeCell(row, problems);
  if (!kind) return null;
  const make = (row.cells.make ?? '').toLowerCase();
  const makes: readonly string[] = MAKES[kind.shape];
  if (!makes.includes(make))
    problems.push({
      row: row.line,
      column: 'make',
      message: `"${row.cells.make ?? ''}" is not a make of ${kind.shape} sections; use ${makes.join(' or ')}`,
    });

  const used: readonly string[] = DIMS_BY_SHAPE[kind.shape];
  const dims: Record<string, number> = {};
  for (const d of ALL_DIMS) {
    const column = `${d}_mm`;
    const text = row.cells[column] ?? '';
    if (!used.includes(d)) {
      if (text !== '')
        problems.push({
          row: row.line,
          column,
          message: `${column} is not a dimension of ${kind.shape} sections; leave it empty`,
        });
      continue;
    }
    // A square hollow section may give its side once; a welded I section may have no root radius.
    if (text === '' && d === 'b' && kind.square && dims.h !== undefined) dims.b = dims.h;
    else if (text === '' && d === 'r' && make === 'welded') dims.r = 0;
    else {
      const value = numberCell(row, column, 'mm', 0, MAX_DIMENSION_MM, problems);
      if (value !== null) dims[d] = value;
    }
  }
  if (kind.square && dims.h !== undefined && dims.b !== undefined && dims.h !== dims.b) {
    problems.push({
      row: row.line,
      column: 'b_mm',
      message: 'An SHS has equal sides; use RHS for a rectangular section',
    });
  }
  if (problems.length > before) return null;

  const parsed = sectionDimsSchema.safeParse({ shape: kind.shape, make, ...dims });
  if (!parsed.success) {
    for (const issue of parsed.error.issues)
      problems.push({
        row: row.line,
        column: issue.path.length ? `${String(issue.path[0])}_mm` : null,
        message: issue.message,
      });
    return null;
  }
  try {
    return validateDims(parsed.data);
  } catch (e) {
    if (!isEngineError(e)) throw e;
    problems.push({ row: row.line, column: null, message: e.message });
    return null;
  }
}

export async function previewSections(db: Knex, buildingId: number, file: Buffer): Promise<SectionsPreview> {
  const empty: SectionsPreview = { kind: 'sections', ...nothingRead(file) };
  const read = await readCsv(file, SECTION_COLUMNS, ['designation', 'shape', 'make']);
  if (!read.ok && read.rows.length === 0) return listProblems({ ...empty, problems: read.problems });

  const existing = new Map(
    [...(await companySectionMap(db, buildingId))].map(([designation, dims]) => [
      designationKey(designation),
      { designation, dims },
    ]),
  );
  // Rows of the wrong width are reported together with the problems of every other row.
  const problems: ImportProblem[] = read.ok ? [] : [...read.problems];
  const changes: SectionChange[] = [];
  const firstRowOf = new Map<string, number>();
  let unchanged = 0;
  for (const row of read.rows) {
    const before = problems.length;
    const name = row.cells.designation ?? '';
    const key = designationKey(name);
    if (name === '') problems.push({ row: row.line, column: 'designation', message: 'designation is empty' });
    else if (name.length > 80)
      problems.push({ row: row.line, column: 'designation', message: 'designation is longer than 80 characters' });
    else if (findSection(name))
      problems.push({
        row: row.line,
        column: 'designation',
        message: `"${name}" is a standard section in the catalogue; give your own section another name`,
      });
    else if (firstRowOf.has(key))
      problems.push({
        row: row.line,
        column: 'designation',
        message: `Row ${firstRowOf.get(key)} already defines "${name}"`,
      });
    firstRowOf.set(key, firstRowOf.get(key) ?? row.line);
    const dims = dimsOf(row, problems);
    if (!dims || problems.length > before) continue;
    const current = existing.get(key);
    if (current && JSON.stringify(current.dims) === JSON.stringify(dims)) unchanged += 1;
    else
      changes.push({
        row: row.line,
        designation: current?.designation ?? name,
        before: current?.dims ?? null,
        after: dims,
      });
  }
  return listProblems({ ...empty, rows: read.rows.length, unchanged, changes, problems: byRow(problems) });
}

/** Writes the sections, then re-analyses (as an edit of their lifts) the stacks that use a changed one. */
export async function applySections(
  ctx: ServerContext,
  buildingId: number,
  file: Buffer,
  fields: { fileHash?: string },
  user: User,
): Promise<ApplyResult> {
  const committed = await ctx.db.transaction(async (trx) => {
    const preview = await previewSections(trx, buildingId, file);
    assertPreviewed(preview, fields.fileHash);
    await upsertCompanySections(
      trx,
      buildingId,
      preview.changes.map((c) => ({ designation: c.designation, dims: c.after })),
    );

    const changedKeys = new Set(preview.changes.map((c) => designationKey(c.designation)));
    const done = await commitEachStack(trx, buildingId, user, 'import.sections', (stack) =>
      stack.doc.nodes.flatMap((n): Op[] =>
        n.kind === 'lift' && typeof n.data.section === 'string' && changedKeys.has(designationKey(n.data.section))
          ? [{ op: 'updateNode', id: n.id, data: { section: n.data.section } }]
          : [],
      ),
    );
    return { done, applied: preview.changes.length };
  });
  return announceApplied(ctx, user, committed.done, committed.applied);
}
