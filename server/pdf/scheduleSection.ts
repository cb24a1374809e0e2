// The column schedule and tonnage as their own section of the package (docs/column-schedule.md): built from the
// frozen stacks by the same shared module the screen and the downloads use, so every figure agrees with them.
import { buildColumnSchedule, type ColumnSchedule } from '../../shared/schedule/columnSchedule.ts';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { metres, ratio } from './format.ts';
import { BODY, MARGIN, SIZE, utilisationColour } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { heading, noteHere, reference } from './summary.ts';
import { drawTable, ensureSpace, type Column } from './table.ts';

export function scheduleOf(s: RevisionSnapshot): ColumnSchedule {
  return buildColumnSchedule(s.stacks, s.levels, new Map(Object.entries(s.sections ?? {})));
}

const tonnes = (kg: number) => (kg / 1000).toFixed(2);

const TYPE_COLUMNS: Column[] = [
  { header: 'Type', width: 40 },
  { header: 'Stacks', width: BODY.width - 40, wrap: true },
];
const LEVEL_TONNAGE_COLUMNS: Column[] = [
  { header: 'Level', width: 160 },
  { header: 'Column steel', unit: 't', width: 70, align: 'right' },
];
const SERIES_TONNAGE_COLUMNS: Column[] = [
  { header: 'Series', width: 100 },
  { header: 'Grade', width: 60 },
  { header: 'Column steel', unit: 't', width: 70, align: 'right' },
];

export function drawScheduleSection(doc: Pdf, s: RevisionSnapshot): void {
  const schedule = scheduleOf(s);
  doc.addPage();
  doc.y = MARGIN.top;
  heading(doc, '3  Column schedule');
  const columns: Column[] = [
    { header: 'Stack', width: 30, wrap: true },
    { header: 'Type', width: 28 },
    { header: 'Lift', width: 24 },
    { header: 'From', width: 82, wrap: true },
    { header: 'To', width: 82, wrap: true },
    { header: 'Length', unit: 'm', width: 36, align: 'right' },
    { header: 'Section', width: 78, wrap: true },
    { header: 'Grade', width: 32 },
    { header: 'Bottom', width: 48, wrap: true },
    { header: 'Util.', width: 30, align: 'right' },
    { header: 'Mass', unit: 'kg', width: 36, align: 'right' },
  ];
  const rows = schedule.rows.map((r) => [
    { text: r.stack, bold: true },
    r.type,
    r.lift,
    r.fromLevel,
    r.toLevel,
    metres(r.length),
    r.section,
    r.grade,
    r.bottomJoint === 'base' ? `base, ${r.baseFixity}` : 'splice',
    { text: ratio(r.utilisation), colour: utilisationColour(r.utilisation), bold: true },
    r.mass.toFixed(0),
  ]);
  drawTable(doc, MARGIN.left, columns, rows);
  const noteY = doc.y;
  noteHere(
    doc,
    'One row per lift of every stack, named by the levels; Util.: the governing utilisation of the lift (section 2). Mass = mass per metre (A × 7850 kg/m³) × length. Stacks with the same lifts (ends, sections, grades) and base share a type, drawn and fabricated once.',
  );
  reference(doc, 'EN 1991-1-1 Table A.4', noteY);

  if (schedule.types.some((t) => t.stacks.length > 1)) {
    ensureSpace(doc, 60);
    heading(doc, 'Column types', SIZE.h2);
    const types = schedule.types.map((t) => [t.type, t.stacks.join(', ')]);
    drawTable(doc, MARGIN.left, TYPE_COLUMNS, types);
    doc.y += 6;
  }

  ensureSpace(doc, 80);
  heading(doc, 'Tonnage', SIZE.h2);
  const byLevel = [...schedule.tonnage.byLevel].reverse().map((l) => [l.level, tonnes(l.mass)]);
  drawTable(doc, MARGIN.left, LEVEL_TONNAGE_COLUMNS, byLevel);
  noteHere(doc, 'By level: the column steel between a level and the next one up.');
  ensureSpace(doc, 60);
  drawTable(doc, MARGIN.left, SERIES_TONNAGE_COLUMNS, [
    ...schedule.tonnage.bySeriesGrade.map((g) => [g.series, g.grade, tonnes(g.mass)]),
    [{ text: 'Total', bold: true }, '', { text: tonnes(schedule.tonnage.total), bold: true }],
  ]);
  doc.y += 6;
  for (const gap of schedule.gaps) noteHere(doc, `Not scheduled: ${gap.stack}: ${gap.reason}`);
}
