// Load take-down of one stack, top to bottom: the loads entering at each level, the running totals and
// the design axial force with the EN 1990 expression that governs, referenced in the margin.
import type { Level } from '../../shared/schema/api.ts';
import type { SnapshotStack } from '../../shared/schema/revisions.ts';
import { kN, metres } from './format.ts';
import { MARGIN } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { heading } from './summary.ts';
import { drawTable, type Column } from './table.ts';

const COLUMNS: Column[] = [
  { header: 'Where', width: 70 },
  { header: 'Elevation', unit: 'm', width: 46, align: 'right' },
  { header: 'Gk', unit: 'kN', width: 40, align: 'right' },
  { header: 'Qk', unit: 'kN', width: 40, align: 'right' },
  { header: 'Cat.', width: 26, align: 'center' },
  { header: 'ΣGk below', unit: 'kN', width: 50, align: 'right' },
  { header: 'ΣQk below', unit: 'kN, by cat.', width: 64 },
  { header: 'NEd below', unit: 'kN', width: 52, align: 'right' },
];

function placeNames(stack: SnapshotStack, levels: Level[]): Map<string, string> {
  const levelName = new Map(levels.map((l) => [l.id, l.name]));
  const names = new Map<string, string>();
  for (const n of stack.doc.nodes) {
    if (n.kind === 'cap') names.set(n.id, 'Cap');
    if (n.kind === 'restraint') names.set(n.id, (n.data.levelId && levelName.get(n.data.levelId)) || n.id);
  }
  return names;
}

export function drawTakeDown(doc: Pdf, stack: SnapshotStack, levels: Level[]): void {
  heading(doc, 'Load take-down', 11);
  const names = placeNames(stack, levels);
  const rows = stack.results.takeDown.map((r) => [
    names.get(r.nodeId) ?? r.nodeId,
    metres(r.elevation),
    kN(r.Gk),
    kN(r.Qk),
    r.category,
    kN(r.sumGk),
    Object.entries(r.sumQkByCategory)
      .map(([cat, q]) => `${cat} ${q.toFixed(0)}`)
      .join(' · '),
    { text: kN(r.NEd), bold: true },
  ]);
  const refs = stack.results.takeDown.map((r) => `EN 1990 eq. ${r.combination}`);
  drawTable(doc, MARGIN.left, COLUMNS, rows, { refs });
}
