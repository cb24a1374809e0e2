// Level loads from a CSV file (docs/contracts.md §Imports): every row checked against the building, a preview of what
// would change, and an apply that writes every stack in one transaction or nothing.
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import {
  LOAD_COLUMNS,
  type ApplyResult,
  type ImportProblem,
  type LoadChange,
  type LoadsPreview,
  type PreviewBasis,
} from '../../shared/schema/imports.ts';
import type { Op } from '../../shared/schema/ops.ts';
import { categorySchema, MAX_LOAD_KN, type Category } from '../../shared/schema/stack.ts';
import type { ServerContext } from '../context.ts';
import { conflict } from '../errors.ts';
import { announceApplied, assertPreviewed, commitEachStack, nothingRead } from './importsApply.ts';
import { byRow, listProblems, numberCell, readCsv, type CsvRow } from './importsCsv.ts';
import {
  buildingLevels,
  buildingStacks,
  floorLoadOf,
  nodesAtLevel,
  sameLoad,
  type LevelRef,
  type StackRef,
} from './importsLoadTargets.ts';

const CATEGORIES = categorySchema.options.join(', ');

/** The one item of `items` named `name` (exactly, else ignoring case), or the problem with it. */
function byName<T>(
  items: readonly T[],
  nameOf: (t: T) => string,
  name: string,
  what: string,
  row: CsvRow,
  column: string,
  problems: ImportProblem[],
): T | null {
  const fail = (message: string) => {
    problems.push({ row: row.line, column, message });
    return null;
  };
  if (name === '') return fail(`${column} is empty`);
  let found = items.filter((t) => nameOf(t) === name);
  if (found.length === 0) found = items.filter((t) => nameOf(t).toLowerCase() === name.toLowerCase());
  if (found.length === 0) return fail(`No ${what} "${name}" in this building`);
  if (found.length > 1) return fail(`${found.length} ${what}s are called "${name}"; rename one of them first`);
  return found[0]!;
}

function categoryCell(row: CsvRow, problems: ImportProblem[]): Category | null {
  const text = row.cells.category ?? '';
  const parsed = categorySchema.safeParse(text.toUpperCase());
  if (parsed.success) return parsed.data;
  problems.push({
    row: row.line,
    column: 'category',
    message:
      text === ''
        ? `category is empty; use one of ${CATEGORIES}`
        : `"${text}" is not an imposed-load category; use one of ${CATEGORIES} (EN 1991-1-1 Table 6.1; H = roofs)`,
  });
  return null;
}

/** Checks every row of the file against the building as it is in `db` now. */
export async function previewLoads(db: Knex, buildingId: number, file: Buffer): Promise<LoadsPreview> {
  const empty: LoadsPreview = { kind: 'loads', ...nothingRead(file), basis: [] };
  const read = await readCsv(file, LOAD_COLUMNS);
  if (!read.ok && read.rows.length === 0) return listProblems({ ...empty, problems: read.problems });

  const [stacks, levels] = await Promise.all([buildingStacks(db, buildingId), buildingLevels(db, buildingId)]);
  // Rows of the wrong width are reported together with the problems of every other row.
  const problems: ImportProblem[] = read.ok ? [] : [...read.problems];
  const changes: LoadChange[] = [];
  const firstRowOf = new Map<string, number>();
  let unchanged = 0;
  for (const row of read.rows) {
    const before = problems.length;
    const stack = byName<StackRef>(stacks, (s) => s.row.name, row.cells.stack ?? '', 'stack', row, 'stack', problems);
    const level = byName<LevelRef>(levels, (l) => l.name, row.cells.level ?? '', 'level', row, 'level', problems);
    const Gk = numberCell(row, 'Gk_kN', 'kN', 0, MAX_LOAD_KN, problems);
    const Qk = numberCell(row, 'Qk_kN', 'kN', 0, MAX_LOAD_KN, problems);
    const category = categoryCell(row, problems);
    if (!stack || !level) continue;

    const nodes = nodesAtLevel(stack.doc, level, levels);
    if (nodes.length !== 1) {
      const message =
        nodes.length === 0
          ? `Stack ${stack.row.name} has no restraint at level ${level.name}`
          : `Stack ${stack.row.name} has ${nodes.length} restraints at level ${level.name}; set their loads in the stack editor`;
      problems.push({ row: row.line, column: 'level', message });
      continue;
    }
    const node = nodes[0]!;
    const key = `${stack.row.id}/${node.id}`;
    const first = firstRowOf.get(key);
    if (first !== undefined) {
      problems.push({
        row: row.line,
        column: 'level',
        message: `Row ${first} already gives the loads of stack ${stack.row.name} at level ${level.name}`,
      });
      continue;
    }
    firstRowOf.set(key, row.line);
    if (problems.length > before || Gk === null || Qk === null || category === null) continue;

    const after = { Gk, Qk, category };
    const current = floorLoadOf(node);
    if (sameLoad(current, after)) unchanged += 1;
    else
      changes.push({
        row: row.line,
        stack: stack.row.name,
        stackId: stack.row.id,
        level: level.name,
        restraintId: node.id,
        before: current,
        after,
      });
  }
  const changed = new Set(changes.map((c) => c.stackId));
  const basis = stacks.filter((s) => changed.has(s.row.id)).map((s) => ({ stackId: s.row.id, version: s.row.version }));
  return listProblems({ ...empty, rows: read.rows.length, unchanged, changes, problems: byRow(problems), basis });
}

export { problemsMessage } from './importsApply.ts';

/** 409 when a stack of the preview has moved on since, or the preview did not cover it. */
function assertBasis(basis: PreviewBasis, current: PreviewBasis): void {
  const previewed = new Map(basis.map((b) => [b.stackId, b.version]));
  const moved = current.filter((c) => previewed.get(c.stackId) !== c.version);
  if (moved.length > 0) {
    throw conflict('Some stacks have changed since the preview; preview the file again', { stacks: moved });
  }
}

export interface ApplyFields {
  fileHash?: string;
  basis?: PreviewBasis;
}

/** Writes every change of the file in one transaction, then tells the live rooms. */
export async function applyLoads(
  ctx: ServerContext,
  buildingId: number,
  file: Buffer,
  fields: ApplyFields,
  user: User,
): Promise<ApplyResult> {
  const committed = await ctx.db.transaction(async (trx) => {
    const preview = await previewLoads(trx, buildingId, file);
    assertPreviewed(preview, fields.fileHash);
    if (fields.basis) assertBasis(fields.basis, preview.basis);

    const opsByStack = new Map<number, Op[]>();
    for (const c of preview.changes) {
      const ops = opsByStack.get(c.stackId) ?? [];
      ops.push({ op: 'updateNode', id: c.restraintId, data: { ...c.after } });
      opsByStack.set(c.stackId, ops);
    }
    const done = await commitEachStack(trx, buildingId, user, 'import.loads', (stack) => opsByStack.get(stack.row.id));
    return { done, applied: preview.changes.length };
  });
  return announceApplied(ctx, user, committed.done, committed.applied);
}
