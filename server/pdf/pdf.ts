// The pdfkit document type used by every part of the package, and its creation with our fonts.
import PDFDocument from 'pdfkit';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { bundledFonts } from './fonts.ts';
import { FONT, MARGIN } from './layout.ts';

export type Pdf = PDFKit.PDFDocument;

/** Dates and the file ID come from the freeze time, so the same snapshot gives the same bytes. */
export function createPdf(s: RevisionSnapshot): Pdf {
  const frozen = new Date(s.frozenAt);
  const doc = new PDFDocument({
    size: 'A4',
    margins: MARGIN,
    bufferPages: true,
    autoFirstPage: false,
    info: {
      Title: `${s.building.name}: calculation package, revision ${s.code}`,
      Author: s.frozenBy.name,
      Subject: `Steel column design, revision ${s.code} (${s.purpose})`,
      Creator: 'Stanchion',
      Producer: 'Stanchion',
      CreationDate: frozen,
      ModDate: frozen,
    },
  });
  // pdfkit takes a fontkit font object as a font source (PDFFontFactory.open); its types list files only.
  for (const [name, font] of Object.entries(bundledFonts())) doc.registerFont(name, font as unknown as Buffer);
  doc.font(FONT.regular);
  return doc;
}

export function toBuffer(doc: Pdf): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}
