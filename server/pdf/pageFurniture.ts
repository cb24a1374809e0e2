// What every page carries: a running header (building, revision, section) and a footer with the
// safety note of README §Safety and "page n of N". Drawn after the content, over the buffered pages.
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { SAFETY_NOTE } from '../../shared/safety.ts';
import { COLOUR, FONT, MARGIN, PAGE, SIZE } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { textIn, wrapLines } from './table.ts';

/** Remembers which part of the package each page belongs to, for the running header. */
export function trackSections(doc: Pdf): { set(title: string): void; titles: string[] } {
  let current = '';
  const titles: string[] = [];
  doc.on('pageAdded', () => titles.push(current));
  return {
    titles,
    set(title: string) {
      current = title;
    },
  };
}

export function drawPageFurniture(
  doc: Pdf,
  s: RevisionSnapshot,
  hash: string,
  sectionTitles: string[],
  mark?: string,
): void {
  const { start, count } = doc.bufferedPageRange();
  const width = PAGE.width - MARGIN.left - MARGIN.right;
  const left = `${s.building.name}${s.building.reference ? ` (${s.building.reference})` : ''}`;
  doc.font(FONT.regular).fontSize(SIZE.small);
  const noteLines = wrapLines(doc, SAFETY_NOTE, width - 90);
  const right = `Revision ${s.code} · ${s.purpose === 'construction' ? 'for construction' : 'preliminary'}`;
  for (let i = start; i < start + count; i++) {
    doc.switchToPage(i);
    // Text below the bottom margin would otherwise start a new page.
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;

    const headerY = 30;
    doc
      .font(FONT.bold)
      .fontSize(SIZE.small + 0.5)
      .fillColor(COLOUR.accent);
    textIn(doc, left, MARGIN.left, headerY, width * 0.6);
    doc.font(FONT.regular).fillColor(COLOUR.muted);
    textIn(doc, right, MARGIN.left, headerY, width, 'right');
    const section = sectionTitles[i - start];
    if (section) {
      doc.font(FONT.bold).fillColor(COLOUR.ink);
      textIn(doc, section, MARGIN.left, headerY + 10, width, 'right');
    }
    doc
      .moveTo(MARGIN.left, headerY + 22)
      .lineTo(PAGE.width - MARGIN.right, headerY + 22)
      .lineWidth(0.5)
      .stroke(COLOUR.rule);
    if (mark) {
      doc
        .font(FONT.bold)
        .fontSize(SIZE.small + 0.5)
        .fillColor(COLOUR.fail);
      textIn(doc, mark, MARGIN.left, headerY - 14, width);
    }

    const footerY = PAGE.height - MARGIN.bottom + 16;
    doc
      .moveTo(MARGIN.left, footerY - 6)
      .lineTo(PAGE.width - MARGIN.right, footerY - 6)
      .lineWidth(0.5)
      .stroke(COLOUR.rule);
    doc.font(FONT.regular).fontSize(SIZE.small).fillColor(COLOUR.muted);
    noteLines.forEach((line, k) =>
      textIn(doc, line.text, MARGIN.left, footerY + k * 8.5, width - 90, 'left', line.width),
    );
    doc
      .font(FONT.bold)
      .fontSize(SIZE.small + 0.5)
      .fillColor(COLOUR.ink);
    textIn(doc, `Page ${i - start + 1} of ${count}`, PAGE.width - MARGIN.right - 80, footerY, 80, 'right');
    doc.font(FONT.regular).fontSize(SIZE.small).fillColor(COLOUR.muted);
    textIn(doc, `snapshot ${hash.slice(0, 12)}`, PAGE.width - MARGIN.right - 80, footerY + 10, 80, 'right');

    doc.page.margins.bottom = bottom;
  }
}
