// A plain ruled table: a header with units on a second line, rows that carry on to the next page with
// the header repeated. Cells are drawn without wrapping, so column widths must suit the content.
import { COLOUR, CONTENT_BOTTOM, FONT, MARGIN, REF_COLUMN, ROW_HEIGHT, SIZE } from './layout.ts';
import type { Pdf } from './pdf.ts';

export interface Column {
  header: string;
  unit?: string;
  width: number;
  align?: 'left' | 'right' | 'center';
  /** Wrap long text onto more lines (the row grows) instead of cutting it with an ellipsis. */
  wrap?: boolean;
}

export type Cell = string | { text: string; colour?: string; bold?: boolean };

/**
 * One line of text inside [x, x + width], aligned by hand and cut with an ellipsis when too long.
 * Without a width pdfkit skips its line wrapper, which is most of the cost of a large package.
 */
export function textIn(
  doc: Pdf,
  text: string,
  x: number,
  y: number,
  width: number,
  align: Column['align'] = 'left',
  measured?: number,
): void {
  let t = text;
  let w = measured ?? doc.widthOfString(t);
  if (w > width) {
    while (t.length > 1 && doc.widthOfString(`${t}…`) > width) t = t.slice(0, -1);
    t = `${t}…`;
    w = doc.widthOfString(t);
  }
  const dx = align === 'right' ? width - w : align === 'center' ? (width - w) / 2 : 0;
  // textWidth (a pdfkit option its types omit) spares a second measurement of the same string.
  doc.text(t, x + dx, y, { lineBreak: false, textWidth: w } as PDFKit.Mixins.TextOptions);
}

/** Moves to a new page when fewer than `height` points remain on this one. */
export function ensureSpace(doc: Pdf, height: number): void {
  if (doc.y + height > CONTENT_BOTTOM) {
    doc.addPage();
    doc.y = MARGIN.top;
  }
}

function drawHeader(doc: Pdf, x: number, columns: Column[]): void {
  const y = doc.y;
  const width = columns.reduce((s, c) => s + c.width, 0);
  doc.rect(x, y, width, ROW_HEIGHT * 2 + 2).fill(COLOUR.band);
  doc.font(FONT.bold).fontSize(SIZE.table).fillColor(COLOUR.ink);
  let cx = x;
  for (const c of columns) {
    textIn(doc, c.header, cx + 3, y + 2, c.width - 6, c.align);
    if (c.unit) {
      doc.font(FONT.regular).fillColor(COLOUR.muted);
      textIn(doc, `[${c.unit}]`, cx + 3, y + 2 + ROW_HEIGHT, c.width - 6, c.align);
      doc.font(FONT.bold).fillColor(COLOUR.ink);
    }
    cx += c.width;
  }
  doc
    .moveTo(x, y + ROW_HEIGHT * 2 + 2)
    .lineTo(x + width, y + ROW_HEIGHT * 2 + 2)
    .lineWidth(0.6)
    .stroke(COLOUR.ink);
  doc.y = y + ROW_HEIGHT * 2 + 4;
}

export interface TableOptions {
  /** Clause or equation per row, printed in the right-hand margin column (wrapped when it is long). */
  refs?: (string | null)[];
  shade?: (rowIndex: number) => string | null;
}

/** Line pitch of wrapped table text and of wrapped references (pt). */
const LINE = { cell: 8.5, ref: 7.5 } as const;

export interface Line {
  text: string;
  width: number;
}

/** Greedy word wrap at the current font, each line with its measured width; text that fits is measured once. */
export function wrapLines(doc: Pdf, text: string, width: number): Line[] {
  const whole = doc.widthOfString(text);
  if (whole <= width) return [{ text, width: whole }];
  const lines: Line[] = [];
  let line: Line = { text: '', width: 0 };
  for (const word of text.split(' ')) {
    const next = line.text ? `${line.text} ${word}` : word;
    const w = doc.widthOfString(next);
    if (line.text && w > width) {
      lines.push(line);
      line = { text: word, width: doc.widthOfString(word) };
    } else line = { text: next, width: w };
  }
  if (line.text) lines.push(line);
  return lines;
}

const cellParts = (cell: Cell) => (typeof cell === 'string' ? { text: cell, colour: undefined, bold: false } : cell);

function setRefStyle(doc: Pdf): void {
  doc.font(FONT.regular).fontSize(SIZE.small).fillColor(COLOUR.accent);
}

/** Lines of each wrapping cell and of the reference; null for cells drawn on one line. */
function measureRow(
  doc: Pdf,
  columns: Column[],
  row: Cell[],
  ref: string | null | undefined,
): { cells: (Line[] | null)[]; ref: Line[]; height: number } {
  let extra = 0;
  const cells = row.map((cell, j) => {
    const c = columns[j];
    if (!c.wrap) return null;
    const { text, bold } = cellParts(cell);
    doc.font(bold ? FONT.bold : FONT.regular).fontSize(SIZE.table);
    const lines = wrapLines(doc, text, c.width - 6);
    extra = Math.max(extra, (lines.length - 1) * LINE.cell);
    return lines;
  });
  let refLines: Line[] = [];
  if (ref) {
    setRefStyle(doc);
    refLines = wrapLines(doc, ref, REF_COLUMN.width);
    extra = Math.max(extra, (refLines.length - 1) * LINE.ref);
  }
  return { cells, ref: refLines, height: ROW_HEIGHT + extra };
}

export function drawTable(doc: Pdf, x: number, columns: Column[], rows: Cell[][], opts: TableOptions = {}): void {
  ensureSpace(doc, ROW_HEIGHT * 4);
  drawHeader(doc, x, columns);
  const width = columns.reduce((s, c) => s + c.width, 0);
  rows.forEach((row, i) => {
    const measured = measureRow(doc, columns, row, opts.refs?.[i]);
    if (doc.y + measured.height > CONTENT_BOTTOM) {
      doc.addPage();
      doc.y = MARGIN.top;
      drawHeader(doc, x, columns);
    }
    const y = doc.y;
    const fill = opts.shade?.(i);
    if (fill) doc.rect(x, y - 1, width, measured.height).fill(fill);
    let cx = x;
    // Setting a colour parses it every time; a large package sets far fewer when only changes are sent.
    let style = '';
    doc.fontSize(SIZE.table);
    row.forEach((cell, j) => {
      const c = columns[j];
      const { text, colour, bold } = cellParts(cell);
      const next = `${bold ? 'b' : 'r'}${colour ?? COLOUR.ink}`;
      if (text && next !== style) {
        doc.font(bold ? FONT.bold : FONT.regular).fillColor(colour ?? COLOUR.ink);
        style = next;
      }
      const lines = measured.cells[j];
      if (lines)
        lines.forEach((line, k) =>
          textIn(doc, line.text, cx + 3, y + 1 + k * LINE.cell, c.width - 6, c.align, line.width),
        );
      else if (text) textIn(doc, text, cx + 3, y + 1, c.width - 6, c.align);
      cx += c.width;
    });
    if (measured.ref.length > 0) {
      setRefStyle(doc);
      measured.ref.forEach((line, k) =>
        textIn(doc, line.text, REF_COLUMN.x, y + 1.5 + k * LINE.ref, REF_COLUMN.width, 'left', line.width),
      );
    }
    doc
      .moveTo(x, y + measured.height - 1)
      .lineTo(x + width, y + measured.height - 1)
      .lineWidth(0.25)
      .stroke(COLOUR.rule);
    doc.y = y + measured.height;
  });
  doc.y += 6;
}
