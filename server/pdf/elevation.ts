// The drawn elevation of one stack: lifts coloured by utilisation, splices, floor restraints with their
// level names, the support and the cap, to a true vertical scale.
import { placeOnLevels } from '../../shared/engine/stack/placeOnLevels.ts';
import type { Level } from '../../shared/schema/api.ts';
import type { SnapshotStack } from '../../shared/schema/revisions.ts';
import type { StackNode } from '../../shared/schema/stack.ts';
import { metres, ratio, liftName } from './format.ts';
import { COLOUR, FONT, SIZE, utilisationColour } from './layout.ts';
import type { Pdf } from './pdf.ts';

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

type Of<K extends StackNode['kind']> = Extract<StackNode, { kind: K }>;
const ofKind = <K extends StackNode['kind']>(nodes: StackNode[], kind: K) =>
  nodes.filter((n): n is Of<K> => n.kind === kind);

/** Labels closer than this (pt) to the one above are left out so the drawing stays legible. */
const LABEL_GAP = 8;

function drawSupport(doc: Pdf, x: number, y: number, fixity: string): void {
  doc.lineWidth(0.8).strokeColor(COLOUR.ink);
  if (fixity === 'fixed') {
    doc
      .moveTo(x - 12, y)
      .lineTo(x + 12, y)
      .stroke();
    for (let i = -12; i < 12; i += 4)
      doc
        .moveTo(x + i, y)
        .lineTo(x + i - 4, y + 5)
        .stroke();
  } else {
    doc.polygon([x, y], [x - 7, y + 9], [x + 7, y + 9]).stroke();
    doc
      .moveTo(x - 10, y + 9)
      .lineTo(x + 10, y + 9)
      .stroke();
  }
}

export function drawElevation(doc: Pdf, stack: SnapshotStack, levels: Level[], box: Box): void {
  // Tied nodes at the frozen levels, also for a revision frozen before documents were placed on freezing
  const { nodes } = placeOnLevels(stack.doc, levels);
  const support = ofKind(nodes, 'support')[0];
  const cap = ofKind(nodes, 'cap')[0];
  const lifts = stack.results.lifts;
  const bottom = support?.data.elevation ?? lifts[0]?.bottom ?? 0;
  const top = cap?.data.elevation ?? lifts[lifts.length - 1]?.top ?? bottom + 1;
  const span = Math.max(top - bottom, 1e-3);
  const yOf = (z: number) => box.y + box.height - ((z - bottom) / span) * box.height;
  const colX = box.x + 96;
  const levelName = new Map(levels.map((l) => [l.id, l.name]));

  // Lifts, with the section and utilisation beside each.
  for (const lift of lifts) {
    const y1 = yOf(lift.top);
    const y0 = yOf(lift.bottom);
    const governing = lift.liftId === stack.results.governingLiftId;
    const half = governing ? 6 : 4;
    doc.rect(colX - half, y1 + 0.6, half * 2, y0 - y1 - 1.2).fill(utilisationColour(lift.utilisation));
    if (y0 - y1 >= 16) {
      const mid = (y0 + y1) / 2;
      doc
        .font(governing ? FONT.bold : FONT.regular)
        .fontSize(SIZE.small)
        .fillColor(COLOUR.ink)
        .text(`${lift.section} ${lift.grade}`, colX + 14, mid - 8, { width: box.width - 110, lineBreak: false });
      doc
        .fillColor(utilisationColour(lift.utilisation))
        .text(`${liftName(lift)} · ${ratio(lift.utilisation)}${governing ? ' governs' : ''}`, colX + 14, mid, {
          width: box.width - 110,
          lineBreak: false,
        });
    }
  }

  for (const splice of ofKind(nodes, 'splice')) {
    const y = yOf(splice.data.elevation);
    crossLine(doc, colX, y, 1.2);
    // The splice's tension check beside it (docs/splices-and-bases.md): a failing splice is printed in the failing colour
    const check = stack.results.splices?.find((c) => c.nodeId === splice.id);
    const words = !check
      ? ''
      : check.status === 'fails'
        ? ' · FAILS'
        : check.status === 'passes'
          ? ` · ${ratio(check.utilisation ?? 0)}`
          : ' · detail not given';
    const colour = check?.status === 'fails' ? COLOUR.fail : COLOUR.muted;
    doc
      .font(FONT.regular)
      .fontSize(SIZE.small - 0.5)
      .fillColor(colour)
      .text(`splice ${metres(splice.data.elevation)}${words}`, colX + 14, y - 3, { lineBreak: false });
  }

  // Restraints from the top down, labelled on the left unless they crowd the one above.
  let lastLabel = -Infinity;
  const restraints = ofKind(nodes, 'restraint').sort((a, b) => b.data.elevation - a.data.elevation);
  for (const r of restraints) {
    const y = yOf(r.data.elevation);
    doc
      .moveTo(colX - 22, y)
      .lineTo(colX - 5, y)
      .lineWidth(0.8)
      .stroke(COLOUR.accent);
    doc
      .moveTo(colX - 22, y - 3)
      .lineTo(colX - 22, y + 3)
      .stroke(COLOUR.accent);
    if (y - lastLabel >= LABEL_GAP) {
      const axes = r.data.axes === 'both' ? '' : ` (${r.data.axes}-${r.data.axes} only)`;
      const name = r.data.levelId ? levelName.get(r.data.levelId) : undefined;
      doc
        .font(FONT.regular)
        .fontSize(SIZE.small)
        .fillColor(COLOUR.ink)
        .text(`${metres(r.data.elevation)}${axes}`, box.x, y - 7, { width: 70, align: 'right', lineBreak: false });
      if (name) doc.fillColor(COLOUR.muted).text(name, box.x, y, { width: 70, align: 'right', lineBreak: false });
      lastLabel = y;
    }
  }

  if (support) {
    const y = yOf(support.data.elevation);
    drawSupport(doc, colX, y, support.data.fixity);
    doc
      .font(FONT.regular)
      .fontSize(SIZE.small)
      .fillColor(COLOUR.ink)
      .text(`${metres(support.data.elevation)} base, ${support.data.fixity}`, box.x, y + 12, {
        width: 150,
        lineBreak: false,
      });
  }
  if (cap) {
    const y = yOf(cap.data.elevation);
    crossLine(doc, colX, y, 2);
    doc
      .font(FONT.regular)
      .fontSize(SIZE.small)
      .fillColor(COLOUR.ink)
      .text(`${metres(cap.data.elevation)} cap, ${cap.data.fixity}`, box.x, y - 16, { width: 150, lineBreak: false });
  }
}

/** A short line across the column at y: a splice (thin) or the cap (thick). */
function crossLine(doc: Pdf, colX: number, y: number, width: number): void {
  doc
    .moveTo(colX - 9, y)
    .lineTo(colX + 9, y)
    .lineWidth(width)
    .stroke(COLOUR.ink);
}
