// The pieces a lift is cut into, with their forces, buckling lengths and utilisation. When the stack carries
// nominal moments the table gives the axial and the combined (N+M) utilisation side by side, the one that
// governs in bold and coloured.
import type { LiftResult, PieceCheck } from '../../shared/schema/results.ts';
import { governingShort, governingWords, kN, metres, ratio } from './format.ts';
import { COLOUR, MARGIN, utilisationColour } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { drawTable, type Cell, type Column } from './table.ts';
import { axialOf, combinedOf } from './utilisations.ts';
import { BUCKLING_LENGTH_RULE } from '../../shared/engine/stack/bucklingLengthFactor.ts';

/** From, To, the forces and the buckling lengths: the columns both layouts start with. */
const forceColumns = (kWidth: number): Column[] => [
  { header: 'From', unit: 'm', width: 34, align: 'right' },
  { header: 'To', unit: 'm', width: 34, align: 'right' },
  { header: 'NEd', unit: 'kN', width: 38, align: 'right' },
  { header: 'NEd,y', unit: 'kN', width: 38, align: 'right' },
  { header: 'NEd,z', unit: 'kN', width: 38, align: 'right' },
  { header: 'ky', width: kWidth, align: 'right' },
  { header: 'Lcr,y', unit: 'm', width: 34, align: 'right' },
  { header: 'kz', width: kWidth, align: 'right' },
  { header: 'Lcr,z', unit: 'm', width: 34, align: 'right' },
];

const AXIAL_COLUMNS: Column[] = [
  ...forceColumns(26),
  { header: 'Util.', width: 30, align: 'right' },
  { header: 'Check', width: 56 },
];

/** Same width as the axial layout (the body width), so both sit clear of the reference column. */
const COMBINED_COLUMNS: Column[] = [
  ...forceColumns(24),
  { header: 'Axial', unit: 'util.', width: 30, align: 'right' },
  { header: 'N+M', unit: 'util.', width: 30, align: 'right' },
  { header: 'Mode', width: 30 },
];

/** Printed once above the member checks of a stack that carries nominal moments. */
export const COMBINED_LEGEND =
  'Axial: the largest of NEd/Nc,Rd, NEd,y/Nb,y,Rd and NEd,z/Nb,z,Rd. N+M: the combined check of a column in simple construction with its nominal moments (– where no moment acts on the piece). Mode: the check that governs (section, y-y or z-z buckling, or N+M).';

const LCR_REF = BUCKLING_LENGTH_RULE;
/** Lengths from the critical buckling analysis: the equivalent length and, beside it, the tabulated factor. */
const CRITICAL_REF = 'Lcr = π√(EI/Ncr), Ncr = αcr·NEd, EN 1993-1-1 6.3.1.2(1)';
const tabulated = (p: PieceCheck): string | null =>
  p.tableKY === undefined && p.tableKZ === undefined
    ? null
    : `tabulated ky ${p.tableKY?.toFixed(2) ?? '–'}, kz ${p.tableKZ?.toFixed(2) ?? '–'}`;

function utilisationCell(u: number | null, governs: boolean): Cell {
  if (u === null) return { text: '–', colour: COLOUR.muted };
  return governs ? { text: ratio(u), colour: utilisationColour(u), bold: true } : ratio(u);
}

export function drawPieceTable(doc: Pdf, lift: LiftResult, governingPiece: number, withCombined: boolean): void {
  const rows = lift.pieces.map((p) => {
    const common: Cell[] = [
      metres(p.from),
      metres(p.to),
      kN(p.NEd),
      kN(p.NEdY),
      kN(p.NEdZ),
      p.kY.toFixed(2),
      metres(p.LcrY),
      p.kZ.toFixed(2),
      metres(p.LcrZ),
    ];
    if (!withCombined) return [...common, utilisationCell(p.utilisation, true), governingWords[p.governing]];
    const combinedGoverns = p.governing === 'combined';
    return [
      ...common,
      utilisationCell(axialOf(p), !combinedGoverns),
      utilisationCell(combinedOf(p), combinedGoverns),
      governingShort[p.governing],
    ];
  });
  const critical = lift.pieces.some((p) => tabulated(p) !== null);
  const refs = lift.pieces.map((p, i) => {
    if (!critical) return i === 0 ? LCR_REF : null;
    return [i === 0 ? CRITICAL_REF : null, tabulated(p)].filter(Boolean).join('; ') || null;
  });
  drawTable(doc, MARGIN.left, withCombined ? COMBINED_COLUMNS : AXIAL_COLUMNS, rows, {
    refs,
    shade: (i) => (i === governingPiece ? COLOUR.band : null),
  });
}
