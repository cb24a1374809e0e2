// The buckled shapes of a stack from its critical buckling analysis, one small plot per axis: the column
// drawn straight, the mode beside it (largest displacement a fixed width), restraints as ticks, and αcr.
import type { CriticalAxis, StackResult } from '../../shared/schema/results.ts';
import type { Box } from './elevation.ts';
import { COLOUR, FONT, SIZE } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { note } from './summary.ts';

/** Total height of the two plots with their captions (pt). */
export const SHAPE_MIN_HEIGHT = 140;

function drawAxis(doc: Pdf, axis: CriticalAxis, title: string, box: Box): void {
  doc
    .font(FONT.bold)
    .fontSize(SIZE.table)
    .fillColor(COLOUR.ink)
    .text(title, box.x, box.y, { width: box.width, lineBreak: false });
  doc
    .font(FONT.regular)
    .fontSize(SIZE.small)
    .fillColor(COLOUR.muted)
    .text(`αcr = ${axis.alphaCr.toFixed(2)}`, box.x, box.y + 10, { width: box.width, lineBreak: false });
  const shape = axis.shape;
  if (!shape || shape.elevations.length < 2) return;
  const top = box.y + 24;
  const height = box.height - 24;
  const z0 = shape.elevations[0];
  const span = Math.max(shape.elevations[shape.elevations.length - 1] - z0, 1e-3);
  const yOf = (z: number) => top + height - ((z - z0) / span) * height;
  const mid = box.x + box.width / 2;
  const amplitude = box.width / 2 - 6;
  doc.lineWidth(0.5).strokeColor(COLOUR.rule).moveTo(mid, yOf(z0)).lineTo(mid, top).stroke();
  // Held points: no lateral displacement there, drawn as short ticks.
  shape.elevations.forEach((z, i) => {
    if (shape.displacements[i] === 0)
      doc
        .moveTo(mid - 4, yOf(z))
        .lineTo(mid + 4, yOf(z))
        .stroke();
  });
  doc
    .lineWidth(1)
    .strokeColor(COLOUR.accent)
    .moveTo(mid + shape.displacements[0] * amplitude, yOf(z0));
  shape.elevations.forEach((z, i) => doc.lineTo(mid + shape.displacements[i] * amplitude, yOf(z)));
  doc.stroke();
}

/** Both axes side by side in `box`. */
export function drawBucklingShapes(doc: Pdf, critical: NonNullable<StackResult['criticalBuckling']>, box: Box): void {
  note(
    doc,
    'Buckled shapes from the critical buckling analysis of the stack (EN 1993-1-1 5.2.1(3)); αcr on the design forces.',
    box.x,
    box.y,
    box.width,
  );
  const y = doc.y + 4;
  const half = (box.width - 10) / 2;
  const height = box.y + box.height - y;
  drawAxis(doc, critical.y, 'About y-y', { x: box.x, y, width: half, height });
  drawAxis(doc, critical.z, 'About z-z', { x: box.x + half + 10, y, width: half, height });
}
