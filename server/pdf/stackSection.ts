// One stack of the package: its elevation beside a table of its lifts, the load take-down, then the
// member check of every lift.
import type { Level } from '../../shared/schema/api.ts';
import { NO_FACE_REACTIONS_NOTE } from '../../shared/engine/simple/applyNominalMoments.ts';
import type { SnapshotStack } from '../../shared/schema/revisions.ts';
import { summariseResult } from '../services/analysis.ts';
import { drawConnectionChecks } from './connectionWorking.ts';
import { drawBucklingShapes, SHAPE_MIN_HEIGHT } from './bucklingShape.ts';
import { drawElevation } from './elevation.ts';
import { governingShort, metres, ratio, liftName } from './format.ts';
import { COLOUR, CONTENT_BOTTOM, FONT, FULL_WIDTH, MARGIN, SIZE, utilisationColour } from './layout.ts';
import { drawMemberChecks } from './memberWorking.ts';
import type { Pdf } from './pdf.ts';
import { heading, note } from './summary.ts';
import { drawTable, type Column } from './table.ts';
import { drawTakeDown } from './takeDownTable.ts';
import { hasCombined } from './utilisations.ts';

const ELEVATION_WIDTH = 222;
const LIFT_COLUMNS: Column[] = [
  { header: 'Lift', width: 30 },
  { header: 'From', unit: 'm', width: 34, align: 'right' },
  { header: 'To', unit: 'm', width: 34, align: 'right' },
  { header: 'Section', width: 88 },
  { header: 'Grade', width: 32 },
  { header: 'Util.', width: 30, align: 'right' },
  { header: 'Mode', width: 30 },
];

function momentsLine(stack: SnapshotStack, included: boolean): string {
  if (!included) return 'Nominal moments: not included in this revision (axial checks only).';
  if (!hasCombined(stack.results))
    return 'Nominal moments: included, but no beam reactions are given on the column faces of this stack (axial checks only).';
  return 'Nominal moments: included, from the beam reactions on the column faces; the combined check (N+M) is printed beside the axial check.';
}

/** A typical column (docs/typical-columns.md): every position's utilisation, and whose working follows. */
function typicalLine(stack: SnapshotStack): string | null {
  const positions = stack.results.positions;
  if (!positions?.length) return null;
  const own = positions.find((p) => p.positionId === null);
  const each = positions
    .map((p) => `${p.name} ${ratio(p.utilisation)}${p.name === stack.results.governingPosition ? ' (governs)' : ''}`)
    .join(' · ');
  const ownName = own?.name ?? 'its own place';
  const then = stack.governingWorking
    ? `; the take-down and working at ${stack.governingWorking.position}, which governs, follow them`
    : '';
  return `Typical column at ${positions.length} positions, each checked with its own floor loads: ${each}. The summary above is that of the governing position; the lifts, take-down and working below are those of ${ownName}${then}.`;
}

export function drawStackSection(
  doc: Pdf,
  stack: SnapshotStack,
  levels: Level[],
  index: number,
  momentsIncluded: boolean,
): void {
  doc.addPage();
  doc.y = MARGIN.top;
  heading(doc, `2.${index + 1}  Stack ${stack.name}`);
  const sum = summariseResult(stack.doc, stack.results);
  const line = `${stack.results.lifts.length} lifts · governing lift ${sum.governingLiftLabel ?? '–'} (${sum.governingSection ?? '–'}) · utilisation ${ratio(sum.utilisation)} · document version ${stack.version}`;
  doc
    .font(FONT.regular)
    .fontSize(SIZE.body)
    .fillColor(COLOUR.muted)
    .text(line, MARGIN.left, doc.y, { width: FULL_WIDTH });
  doc.text(momentsLine(stack, momentsIncluded), MARGIN.left, doc.y + 2, { width: FULL_WIDTH });
  const typical = typicalLine(stack);
  if (typical) doc.fillColor(COLOUR.ink).text(typical, MARGIN.left, doc.y + 2, { width: FULL_WIDTH });
  // The line above already says when no face reactions give a moment
  for (const w of stack.results.warnings.filter((x) => x.message !== NO_FACE_REACTIONS_NOTE.message))
    doc.fillColor(COLOUR.near).text(`Note: ${w.message}`, MARGIN.left, doc.y + 2, { width: FULL_WIDTH });
  const top = doc.y + 16;

  const height = Math.min(CONTENT_BOTTOM - top - 40, 560);
  drawElevation(doc, stack, levels, { x: MARGIN.left, y: top + 10, width: ELEVATION_WIDTH, height });

  doc.y = top;
  const rows = [...stack.results.lifts]
    .reverse()
    .map((l) => [
      { text: liftName(l), bold: l.liftId === stack.results.governingLiftId },
      metres(l.bottom),
      metres(l.top),
      l.section,
      l.grade,
      { text: ratio(l.utilisation), colour: utilisationColour(l.utilisation), bold: true },
      governingShort[l.governing],
    ]);
  drawTable(doc, MARGIN.left + ELEVATION_WIDTH + 10, LIFT_COLUMNS, rows);
  const critical = stack.results.criticalBuckling;
  const room = top + 10 + height - (doc.y + 16);
  if (critical && room >= SHAPE_MIN_HEIGHT) {
    drawBucklingShapes(doc, critical, {
      x: MARGIN.left + ELEVATION_WIDTH + 10,
      y: doc.y + 16,
      width: FULL_WIDTH - ELEVATION_WIDTH - 10,
      height: Math.min(room, 320),
    });
  }

  doc.addPage();
  doc.y = MARGIN.top;
  drawTakeDown(doc, stack, levels);
  doc.y += 10;
  heading(doc, 'Member checks', 11);
  drawMemberChecks(doc, stack);
  drawConnectionChecks(doc, stack);
  if (stack.governingWorking) drawGoverningPosition(doc, stack, stack.governingWorking, levels);
}

/** A typical column governed by a further position: that position's take-down and working (docs/typical-columns.md). */
function drawGoverningPosition(
  doc: Pdf,
  stack: SnapshotStack,
  governing: NonNullable<SnapshotStack['governingWorking']>,
  levels: Level[],
): void {
  const there: SnapshotStack = { ...stack, results: governing.results };
  doc.addPage();
  doc.y = MARGIN.top;
  heading(doc, `Stack ${stack.name} at ${governing.position}, the position that governs the type`, 11);
  note(
    doc,
    `The same lifts, splices, sections and fixities, checked with the floor loads of the tributary area at ${governing.position}.`,
  );
  doc.y += 8;
  drawTakeDown(doc, there, levels);
  doc.y += 10;
  heading(doc, `Member checks at ${governing.position}`, 11);
  drawMemberChecks(doc, there);
  drawConnectionChecks(doc, there);
}
