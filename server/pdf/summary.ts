// Summary: every stack with its governing lift and utilisation, then the levels of the building.
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { summariseResult } from '../services/analysis.ts';
import { governingWords, kN, metres, ratio } from './format.ts';
import { BODY, COLOUR, FONT, MARGIN, REF_COLUMN, SIZE, utilisationColour } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { drawTable, type Column } from './table.ts';

export function heading(doc: Pdf, text: string, size: number = SIZE.h1): void {
  doc.font(FONT.bold).fontSize(size).fillColor(COLOUR.ink).text(text, MARGIN.left, doc.y, { width: BODY.width });
  doc.y += 4;
}

export function reference(doc: Pdf, text: string, y: number): void {
  doc.font(FONT.regular).fontSize(SIZE.small).fillColor(COLOUR.accent).text(text, REF_COLUMN.x, y + 1, { width: REF_COLUMN.width, lineBreak: false });
}

const STATUS_WORDS = { passes: 'passes', fails: 'FAILS', errors: 'errors' } as const;

export function drawSummary(doc: Pdf, s: RevisionSnapshot): void {
  doc.addPage();
  doc.y = MARGIN.top;
  heading(doc, '1  Summary of stacks');
  const columns: Column[] = [
    { header: 'Stack', width: 46 },
    { header: 'Lifts', width: 30, align: 'right' },
    { header: 'NEd at base', unit: 'kN', width: 58, align: 'right' },
    { header: 'Governing lift', width: 62 },
    { header: 'Section', width: 104 },
    { header: 'Grade', width: 34 },
    { header: 'Check', width: 62 },
    { header: 'Utilisation', width: 50, align: 'right' },
    { header: 'Status', width: 58 },
  ];
  const rows = s.stacks.map((st) => {
    const sum = summariseResult(st.doc, st.results);
    const gov = st.results.lifts.find((l) => l.liftId === sum.governingLiftId);
    const base = st.results.lifts[0]?.pieces[0]?.NEd;
    return [
      { text: st.name, bold: true },
      String(st.results.lifts.length),
      base === undefined ? '–' : kN(base),
      sum.governingLiftId ?? '–',
      gov?.section ?? '–',
      gov?.grade ?? '–',
      gov ? governingWords[gov.governing] : '–',
      { text: ratio(sum.utilisation), colour: utilisationColour(sum.utilisation), bold: true },
      { text: STATUS_WORDS[sum.status], colour: sum.status === 'passes' ? COLOUR.ink : COLOUR.fail },
    ];
  });
  drawTable(doc, MARGIN.left, columns, rows);
  doc.font(FONT.regular).fontSize(SIZE.small).fillColor(COLOUR.muted).text(
    'Utilisation is the largest of NEd/Nc,Rd, NEd,y/Nb,y,Rd and NEd,z/Nb,z,Rd over the pieces of the governing lift. A lift passes when it does not exceed 1.0.',
    MARGIN.left, doc.y, { width: BODY.width },
  );
  reference(doc, 'EN 1993-1-1 6.2.4, 6.3.1.1', doc.y - 16);
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
