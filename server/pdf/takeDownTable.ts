// Load take-down of one stack, top to bottom: the loads entering at each level, the running totals and
// the design axial force with the EN 1990 expression that governs, referenced in the margin.
import type { Level } from '../../shared/schema/api.ts';
import type { SnapshotStack } from '../../shared/schema/revisions.ts';
import { kN, metres } from './format.ts';
import { MARGIN } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { heading, note } from './summary.ts';
import { drawTable, type Column } from './table.ts';

// Widths add up to the body width (388 pt) and suit the widest figures at the table size; the two
// columns whose text can be long wrap instead of being cut.
const COLUMNS: Column[] = [
  { header: 'Where', width: 56, wrap: true },
  { header: 'Elev.', unit: 'm', width: 44, align: 'right' },
  { header: 'Gk', unit: 'kN', width: 36, align: 'right' },
  { header: 'Qk', unit: 'kN', width: 36, align: 'right' },
  { header: 'Cat.', width: 24, align: 'center' },
  { header: 'n', width: 18, align: 'right' },
  { header: 'αn', width: 30, align: 'right' },
  { header: 'ΣGk', unit: 'kN', width: 46, align: 'right' },
  { header: 'ΣQk', unit: 'kN', width: 52, wrap: true },
  { header: 'NEd', unit: 'kN', width: 46, align: 'right' },
];

/** What a person calls each load point: the cap, the level a floor sits on, or "Floor" (never a node id). */
function placeNames(stack: SnapshotStack, levels: Level[]): Map<string, string> {
  const levelName = new Map(levels.map((l) => [l.id, l.name]));
  const names = new Map<string, string>();
  for (const n of stack.doc.nodes) {
    if (n.kind === 'cap') names.set(n.id, 'Cap');
    if (n.kind === 'restraint') names.set(n.id, (n.data.levelId && levelName.get(n.data.levelId)) || 'Floor');
  }
  return names;
}

export function drawTakeDown(doc: Pdf, stack: SnapshotStack, levels: Level[]): void {
  heading(doc, 'Load take-down', 11);
  note(
    doc,
    'Loads entering at each point; totals (ΣQk by category) and NEd just below it. n: storeys above carrying imposed load of the leading category; αn: the reduction applied to it (EN 1991-1-1 6.3.1.2(11)), – where no imposed load leads (eq. 6.10a).',
  );
  doc.moveDown(0.3);
  const names = placeNames(stack, levels);
  const rows = stack.results.takeDown.map((r) => [
    names.get(r.nodeId) ?? 'Floor',
    metres(r.elevation),
    kN(r.Gk),
    kN(r.Qk),
    r.category,
    r.n === undefined ? '–' : String(r.n),
    r.alphaN === undefined || r.alphaN === null ? '–' : r.alphaN.toFixed(2),
    kN(r.sumGk),
    Object.entries(r.sumQkByCategory)
      .map(([cat, q]) => `${cat} ${q.toFixed(0)}`)
      .join(' · '),
    { text: kN(r.NEd), bold: true },
  ]);
  const refs = stack.results.takeDown.map((r) => `EN 1990 eq. ${r.combination}`);
  drawTable(doc, MARGIN.left, COLUMNS, rows, { refs });
}
