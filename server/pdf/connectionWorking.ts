// Splices and base of one stack: a table of the checks, then each check's notes and working with its clauses.
import { connectionRows } from '../../shared/connectionRows.ts';
import type { SnapshotStack } from '../../shared/schema/revisions.ts';
import { COLOUR, MARGIN } from './layout.ts';
import { drawWorking } from './memberWorking.ts';
import type { Pdf } from './pdf.ts';
import { heading, note } from './summary.ts';
import { drawTable, ensureSpace, type Column } from './table.ts';

const COLUMNS: Column[] = [
  { header: 'Where', width: 80 },
  { header: 'Sections and fit', width: 150, wrap: true },
  { header: 'NEd', unit: 'kN', width: 40, align: 'right' },
  { header: 'Tension', unit: 'kN', width: 42, align: 'right' },
  { header: 'Resist.', unit: 'kN', width: 42, align: 'right' },
  { header: 'Util.', width: 32, align: 'right' },
  { header: 'Check', width: 80, wrap: true },
];

export function drawConnectionChecks(doc: Pdf, stack: SnapshotStack): void {
  const rows = connectionRows(stack.results);
  if (rows.length === 0) return;
  ensureSpace(doc, 120);
  heading(doc, 'Splices and base', 11);
  note(
    doc,
    'Tension per splice: the vertical tie force of EN 1991-1-7 A.6 (consequence class 2b and 3) or net tension under permanent load alone. Base plate by the effective-area method of EN 1993-1-8 6.2.5. "not given": no detail (or building class) given yet.',
  );
  doc.y += 6;
  drawTable(
    doc,
    MARGIN.left,
    COLUMNS,
    rows.map((r) => [
      r.where,
      r.fit,
      r.NEd,
      r.tension,
      r.resistance,
      r.utilisation,
      { text: r.statusText, bold: r.status === 'fails', colour: r.status === 'fails' ? COLOUR.fail : undefined },
    ]),
  );
  doc.y += 8;
  for (const r of rows) {
    if (r.steps.length === 0 && r.notes.length === 0) continue;
    drawWorking(
      doc,
      `${r.where}: ${r.statusText}`,
      r.notes.join(' · '),
      r.id === stack.results.base?.nodeId ? 'EN 1993-1-8 6.2.5' : 'EN 1991-1-7 A.6, EN 1993-1-8 3.6',
      r.steps,
    );
  }
}
