// Member checks of one stack: for each lift, the pieces it is cut into with their forces and buckling
// lengths, then every step of the governing piece's check with its clause in the margin column; where that
// piece carries nominal moments, the steps of its combined check follow in the same layout.
import type { CalcStep, LiftResult, PieceCheck } from '../../shared/schema/results.ts';
import type { SnapshotStack } from '../../shared/schema/revisions.ts';
import { governingWords, kN, metres, ratio, stepValue, liftName } from './format.ts';
import { BODY, COLOUR, FONT, MARGIN, SIZE, utilisationColour } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { COMBINED_LEGEND, drawPieceTable } from './pieceTable.ts';
import { noteHere, reference } from './summary.ts';
import { drawTable, ensureSpace, textIn, wrapLines, type Column } from './table.ts';
import { hasCombined, liftUtilisations } from './utilisations.ts';

const STEP_COLUMNS: Column[] = [
  { header: 'Quantity', width: 92, wrap: true },
  { header: 'Meaning', width: 168, wrap: true },
  { header: 'Value', width: 86, align: 'right' },
  { header: 'Unit', width: 42 },
];

/** The other check beside the one that governs, e.g. "axial alone 0.842" when N+M governs. */
function otherCheck(lift: LiftResult): string {
  const { axial, combined } = liftUtilisations(lift);
  if (combined === null) return '';
  return lift.governing === 'combined'
    ? ` · axial check alone ${ratio(axial)}`
    : ` · combined check ${ratio(combined)}`;
}

function liftHeading(doc: Pdf, lift: LiftResult, governing: boolean): void {
  ensureSpace(doc, 120);
  const y = doc.y;
  doc
    .font(FONT.bold)
    .fontSize(SIZE.h2)
    .fillColor(COLOUR.ink)
    .text(`Lift ${liftName(lift)}   ${lift.section} ${lift.grade}`, MARGIN.left + 9, y, {
      width: BODY.width - 9,
      lineBreak: false,
    });
  const words = `${metres(lift.bottom)} to ${metres(lift.top)} m · utilisation ${ratio(lift.utilisation)}, ${governingWords[lift.governing]}${otherCheck(lift)}${governing ? ' · governing lift of the stack' : ''}${lift.utilisation > 1 ? ' · FAILS' : ''}`;
  doc
    .font(FONT.regular)
    .fontSize(SIZE.body)
    .fillColor(lift.utilisation > 1 ? COLOUR.fail : COLOUR.muted);
  // Wrapped by hand: pdfkit's line wrapper on every lift is a large share of a big package's time.
  const lines = wrapLines(doc, words, BODY.width - 9);
  lines.forEach((line, k) =>
    textIn(doc, line.text, MARGIN.left + 9, y + 14 + k * 10, BODY.width - 9, 'left', line.width),
  );
  const bottom = y + 14 + lines.length * 10;
  doc.rect(MARGIN.left, y, 3, bottom - y).fill(utilisationColour(lift.utilisation));
  doc.y = bottom + 6;
}

function governingPieceIndex(lift: LiftResult): number {
  let best = 0;
  lift.pieces.forEach((p, i) => {
    if (p.utilisation > lift.pieces[best].utilisation) best = i;
  });
  return best;
}

/** A bold title, a muted line under it with its reference in the margin, then the steps with theirs. */
export function drawWorking(doc: Pdf, title: string, basis: string, basisRef: string, steps: CalcStep[]): void {
  ensureSpace(doc, 60);
  doc
    .font(FONT.bold)
    .fontSize(SIZE.body)
    .fillColor(COLOUR.ink)
    .text(title, MARGIN.left, doc.y, { width: BODY.width, lineBreak: false });
  doc
    .font(FONT.regular)
    .fontSize(SIZE.small)
    .fillColor(COLOUR.muted)
    .text(basis, MARGIN.left, doc.y + 1, { width: BODY.width, lineBreak: false });
  reference(doc, basisRef, doc.y - 9);
  doc.y += 6;
  const rows = steps.map((step) => {
    const { value, unit } = stepValue(step);
    return [{ text: step.symbol, bold: true }, step.description ?? '', value, unit];
  });
  drawTable(doc, MARGIN.left, STEP_COLUMNS, rows, { refs: steps.map((s) => s.clause) });
  doc.y += 8;
}

function drawCombinedWorking(doc: Pdf, piece: PieceCheck): void {
  const combined = piece.combined;
  if (!combined || combined.steps.length === 0) return;
  drawWorking(
    doc,
    `Combined check with nominal moments${combined.combination ? `, eq. ${combined.combination}` : ''}, utilisation ${ratio(combined.utilisation)}`,
    `same piece; simple construction: beam reactions on the faces; NEd and reactions of one combination (EN 1990 6.4.3.2)`,
    'EN 1993-1-1 6.3.1, 6.3.2',
    combined.steps,
  );
}

export function drawLiftCheck(doc: Pdf, lift: LiftResult, governing: boolean, withCombined: boolean): void {
  liftHeading(doc, lift, governing);
  const gi = governingPieceIndex(lift);
  drawPieceTable(doc, lift, gi, withCombined);

  const piece = lift.pieces[gi];
  if (!piece) return;
  const title = piece.combined
    ? `Axial working for the governing piece, ${metres(piece.from)} to ${metres(piece.to)} m`
    : `Working for the governing piece, ${metres(piece.from)} to ${metres(piece.to)} m`;
  drawWorking(
    doc,
    title,
    `checked with NEd = ${kN(Math.max(piece.NEdY, piece.NEdZ))} kN, E = 210 000 N/mm²`,
    'EN 1993-1-1 3.2.6 (E)',
    piece.check.steps,
  );
  drawCombinedWorking(doc, piece);
}

export function drawMemberChecks(doc: Pdf, stack: SnapshotStack): void {
  const withCombined = hasCombined(stack.results);
  if (withCombined) noteHere(doc, COMBINED_LEGEND);
  for (const lift of stack.results.lifts)
    drawLiftCheck(doc, lift, lift.liftId === stack.results.governingLiftId, withCombined);
}
