// Preview changes and problems as table rows for the import dialog. Pure, so it is tested on its own.
import type { FloorLoad, ImportProblem, LoadChange, SectionChange } from '@shared/schema/imports.ts';
import type { SectionDims } from '@shared/schema/stack.ts';

export interface LoadChangeRow {
  key: string;
  row: number;
  stack: string;
  level: string;
  Gk: string;
  Qk: string;
  category: string;
}

export interface SectionChangeRow {
  key: string;
  row: number;
  designation: string;
  status: 'new' | 'changed';
  shape: string;
  dims: string;
}

export interface RowProblems {
  row: number;
  items: { column: string | null; message: string }[];
}

/** "100 → 150", or just "100" when the value stays. */
function beforeAfter<K extends keyof FloorLoad>(c: LoadChange, k: K): string {
  return c.before[k] === c.after[k] ? String(c.after[k]) : `${c.before[k]} → ${c.after[k]}`;
}

export function loadChangeRows(changes: readonly LoadChange[]): LoadChangeRow[] {
  return changes.map((c) => ({
    key: `${c.stackId}/${c.restraintId}`,
    row: c.row,
    stack: c.stack,
    level: c.level,
    Gk: beforeAfter(c, 'Gk'),
    Qk: beforeAfter(c, 'Qk'),
    category: beforeAfter(c, 'category'),
  }));
}

/** Dimensions as "h 203.2 · b 203.6 · …" in mm, in the order of the CSV columns. */
export function dimsText(d: SectionDims): string {
  const parts: [string, number][] =
    d.shape === 'I'
      ? [
          ['h', d.h],
          ['b', d.b],
          ['tw', d.tw],
          ['tf', d.tf],
          ['r', d.r],
        ]
      : d.shape === 'RHS'
        ? [
            ['h', d.h],
            ['b', d.b],
            ['t', d.t],
          ]
        : [
            ['d', d.d],
            ['t', d.t],
          ];
  return parts.map(([k, v]) => `${k} ${v}`).join(' · ');
}

export function sectionChangeRows(changes: readonly SectionChange[]): SectionChangeRow[] {
  return changes.map((c) => ({
    key: c.designation,
    row: c.row,
    designation: c.designation,
    status: c.before ? 'changed' : 'new',
    shape: `${c.after.shape === 'RHS' && c.after.h === c.after.b ? 'SHS' : c.after.shape}, ${c.after.make}`,
    dims:
      c.before && dimsText(c.before) !== dimsText(c.after)
        ? `${dimsText(c.before)} → ${dimsText(c.after)}`
        : dimsText(c.after),
  }));
}

/** Problems grouped by the row of the file they are on, in file order (row 0: the file as a whole). */
export function problemsByRow(problems: readonly ImportProblem[]): RowProblems[] {
  const rows = new Map<number, RowProblems>();
  for (const p of problems) {
    const entry = rows.get(p.row) ?? { row: p.row, items: [] };
    entry.items.push({ column: p.column, message: p.message });
    rows.set(p.row, entry);
  }
  return [...rows.values()].sort((a, b) => a.row - b.row);
}
