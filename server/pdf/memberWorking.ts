// Member checks of one stack: for each lift, the pieces it is cut into with their forces and buckling
// lengths, then every step of the governing piece's check with its clause in the margin column.
import type { LiftResult } from '../../shared/schema/results.ts';
import type { SnapshotStack } from '../../shared/schema/revisions.ts';
import { governingWords, kN, metres, ratio, stepValue } from './format.ts';
import { BODY, COLOUR, FONT, MARGIN, SIZE, utilisationColour } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { reference } from './summary.ts';
import { drawTable, ensureSpace, type Column } from './table.ts';

const PIECE_COLUMNS: Column[] = [
  { header: 'From', unit: 'm', width: 34, align: 'right' },
  { header: 'To', unit: 'm', width: 34, align: 'right' },
  { header: 'NEd', unit: 'kN', width: 40, align: 'right' },
  { header: 'NEd,y', unit: 'kN', width: 38, align: 'right' },
  { header: 'NEd,z', unit: 'kN', width: 38, align: 'right' },
  { header: 'ky', width: 26, align: 'right' },
  { header: 'Lcr,y', unit: 'm', width: 34, align: 'right' },
  { header: 'kz', width: 26, align: 'right' },
  { header: 'Lcr,z', unit: 'm', width: 34, align: 'right' },
  { header: 'Util.', width: 30, align: 'right' },
  { header: 'Check', width: 54 },
];

const STEP_COLUMNS: Column[] = [
  { header: 'Quantity', width: 92 },
  { header: 'Meaning', width: 168 },
  { header: 'Value', width: 86, align: 'right' },
  { header: 'Unit', width: 42 },
];

function liftHeading(doc: Pdf, lift: LiftResult, governing: boolean): void {
  ensureSpace(doc, 120);
  const y = doc.y;
  doc.rect(MARGIN.left, y, 3, 24).fill(utilisationColour(lift.utilisation));
  doc.font(FONT.bold).fontSize(SIZE.h2).fillColor(COLOUR.ink).text(`Lift ${lift.liftId}   ${lift.section} ${lift.grade}`, MARGIN.left + 9, y, { width: BODY.width - 9, lineBreak: false });
  const words = `${metres(lift.bottom)} to ${metres(lift.top)} m · utilisation ${ratio(lift.utilisation)}, ${governingWords[lift.governing]}${governing ? ' · governing lift of the stack' : ''}${lift.utilisation > 1 ? ' · FAILS' : ''}`;
  doc.font(FONT.regular).fontSize(SIZE.body).fillColor(lift.utilisation > 1 ? COLOUR.fail : COLOUR.muted).text(words, MARGIN.left + 9, y + 14, { width: BODY.width - 9, lineBreak: false });
  doc.y = y + 30;
}

function governingPieceIndex(lift: LiftResult): number {
  let best = 0;
  lift.pieces.forEach((p, i) => {
    if (p.utilisation > lift.pieces[best].utilisation) best = i;
  });
  return best;
}

export function drawLiftCheck(doc: Pdf, lift: LiftResult, governing: boolean): void {
  liftHeading(doc, lift, governing);
  const gi = governingPieceIndex(lift);
  const rows = lift.pieces.map((p) => [
    metres(p.from),
    metres(p.to),
    kN(p.NEd),
    kN(p.NEdY),
    kN(p.NEdZ),
    p.kY.toFixed(2),
    metres(p.LcrY),
    p.kZ.toFixed(2),
    metres(p.LcrZ),
    { text: ratio(p.utilisation), colour: utilisationColour(p.utilisation), bold: true },
    governingWords[p.governing],
  ]);
  const refs = lift.pieces.map((_p, i) => (i === 0 ? 'Lcr = k·L, EN 1993-1-1 6.3.1.3' : null));
  drawTable(doc, MARGIN.left, PIECE_COLUMNS, rows, { refs, shade: (i) => (i === gi ? COLOUR.band : null) });

  const piece = lift.pieces[gi];
  if (!piece) return;
  ensureSpace(doc, 60);
  doc.font(FONT.bold).fontSize(SIZE.body).fillColor(COLOUR.ink).text(`Working for the governing piece, ${metres(piece.from)} to ${metres(piece.to)} m`, MARGIN.left, doc.y, { width: BODY.width, lineBreak: false });
  doc.font(FONT.regular).fontSize(SIZE.small).fillColor(COLOUR.muted).text(`checked with NEd = ${kN(Math.max(piece.NEdY, piece.NEdZ))} kN, E = 210 000 N/mm²`, MARGIN.left, doc.y + 1, { width: BODY.width, lineBreak: false });
  reference(doc, 'EN 1993-1-1 3.2.6 (E)', doc.y - 9);
  doc.y += 6;
  const steps = piece.check.steps;
  const stepRows = steps.map((step) => {
    const { value, unit } = stepValue(step);
    return [{ text: step.symbol, bold: true }, step.description ?? '', value, unit];
  });
  drawTable(doc, MARGIN.left, STEP_COLUMNS, stepRows, { refs: steps.map((s) => s.clause) });
  doc.y += 8;
}

export function drawMemberChecks(doc: Pdf, stack: SnapshotStack): void {
  for (const lift of stack.results.lifts) drawLiftCheck(doc, lift, lift.liftId === stack.results.governingLiftId);
}
