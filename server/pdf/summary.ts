// Summary: every stack with its governing lift and utilisation, then the levels of the building.
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { summariseResult } from '../services/analysis.ts';
import { governingShort, kN, metres, ratio, liftName } from './format.ts';
import { BODY, COLOUR, FONT, MARGIN, REF_COLUMN, SIZE, utilisationColour } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { drawTable, type Column } from './table.ts';
import { liftUtilisations } from './utilisations.ts';

export function heading(doc: Pdf, text: string, size: number = SIZE.h1): void {
  doc.font(FONT.bold).fontSize(size).fillColor(COLOUR.ink).text(text, MARGIN.left, doc.y, { width: BODY.width });
  doc.y += 4;
}

/** A note in the small muted type: what a table or drawing shows and by which clauses. */
export function note(
  doc: Pdf,
  text: string,
  x: number = MARGIN.left,
  y: number = doc.y,
  width: number = BODY.width,
): void {
  doc.font(FONT.regular).fontSize(SIZE.small).fillColor(COLOUR.muted);
  doc.text(text, x, y, { width });
}

/** A note where the page has reached, full body width, with a gap below it. */
export function noteHere(doc: Pdf, text: string): void {
  note(doc, text);
  doc.y += 8;
}

export function reference(doc: Pdf, text: string, y: number): void {
  doc
    .font(FONT.regular)
    .fontSize(SIZE.small)
    .fillColor(COLOUR.accent)
    .text(text, REF_COLUMN.x, y + 1, { width: REF_COLUMN.width, lineBreak: false });
}

const STATUS_WORDS = { passes: 'passes', fails: 'FAILS', errors: 'errors' } as const;

export function drawSummary(doc: Pdf, s: RevisionSnapshot): void {
  doc.addPage();
  doc.y = MARGIN.top;
  heading(doc, '1  Summary of stacks');
  const columns: Column[] = [
    { header: 'Stack', width: 38 },
    { header: 'Lifts', width: 26, align: 'right' },
    { header: 'NEd at base', unit: 'kN', width: 58, align: 'right' },
    { header: 'Governing lift', width: 66 },
    { header: 'Section', width: 94 },
    { header: 'Grade', width: 32 },
    { header: 'Governs', width: 42 },
    { header: 'Axial', unit: 'util.', width: 34, align: 'right' },
    { header: 'N+M', unit: 'util.', width: 34, align: 'right' },
    { header: 'Utilisation', width: 50, align: 'right' },
    { header: 'Status', width: 36 },
  ];
  const rows = s.stacks.map((st) => {
    const sum = summariseResult(st.doc, st.results);
    // A typical column governed away from its own place (docs/typical-columns.md): that position's figures; the
    // split into axial and N+M and the base force are printed for the own place only, on the stack's pages.
    const elsewhere = st.results.positions?.find(
      (p) => p.name === st.results.governingPosition && p.positionId !== null,
    );
    const gov = st.results.lifts.find((l) => l.liftId === sum.governingLiftId);
    const both = gov && !elsewhere ? liftUtilisations(gov) : null;
    const base = elsewhere ? undefined : st.results.lifts[0]?.pieces[0]?.NEd;
    const mode = elsewhere?.lifts.find((l) => l.liftId === sum.governingLiftId)?.governing ?? gov?.governing;
    return [
      { text: st.name, bold: true },
      String(st.results.lifts.length),
      base === undefined ? '–' : kN(base),
      gov ? `${liftName(gov)}${elsewhere ? ` at ${elsewhere.name}` : ''}` : '–',
      gov?.section ?? '–',
      gov?.grade ?? '–',
      mode ? governingShort[mode as keyof typeof governingShort] : '–',
      ratio(both?.axial ?? null),
      ratio(both?.combined ?? null),
      { text: ratio(sum.utilisation), colour: utilisationColour(sum.utilisation), bold: true },
      { text: STATUS_WORDS[sum.status], colour: sum.status === 'passes' ? COLOUR.ink : COLOUR.fail },
    ];
  });
  drawTable(doc, MARGIN.left, columns, rows);
  const noteY = doc.y;
  doc
    .font(FONT.regular)
    .fontSize(SIZE.small)
    .fillColor(COLOUR.muted)
    .text(
      'Axial: the largest of NEd/Nc,Rd, NEd,y/Nb,y,Rd and NEd,z/Nb,z,Rd. N+M: the combined check of a column in simple construction, NEd/Nb,min,Rd + My,Ed/Mb,Rd + 1.5·Mz,Ed/Mz,Rd, where beam reactions on the column faces give nominal moments (– where none act). Utilisation: the larger of the two, over the pieces of the governing lift; Governs names the check (section, y-y or z-z buckling, N+M). A lift passes when it does not exceed 1.0.',
      MARGIN.left,
      noteY,
      { width: BODY.width },
    );
  reference(doc, 'EN 1993-1-1 6.2.4, 6.3.1.1', noteY);
  reference(doc, 'EN 1993-1-1 6.3.2 (Mb,Rd), 6.2.5', noteY + 8);
  doc.y += 16;

  heading(doc, 'Levels', SIZE.h2);
  drawTable(
    doc,
    MARGIN.left,
    [
      { header: 'Level', width: 140 },
      { header: 'Elevation', unit: 'm', width: 70, align: 'right' },
    ],
    [...s.levels].sort((a, b) => b.elevation - a.elevation).map((l) => [l.name, metres(l.elevation)]),
  );
}
