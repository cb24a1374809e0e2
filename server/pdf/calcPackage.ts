// The calculation package of a revision, drawn from its snapshot alone: the same snapshot always
// gives the same pages (and, with the dates fixed from the freeze, the same bytes).
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { drawCover, momentsOn } from './cover.ts';
import { drawPageFurniture, trackSections } from './pageFurniture.ts';
import { createPdf, toBuffer } from './pdf.ts';
import { drawStackSection } from './stackSection.ts';
import { drawSummary } from './summary.ts';

/** `mark` (a re-drawn copy) is printed at the top of every page. */
export async function renderCalcPackage(snapshot: RevisionSnapshot, hash: string, mark?: string): Promise<Buffer> {
  const doc = createPdf(snapshot);
  const sections = trackSections(doc);
  sections.set('Cover');
  drawCover(doc, snapshot, hash);
  sections.set('Summary');
  drawSummary(doc, snapshot);
  snapshot.stacks.forEach((stack, i) => {
    sections.set(`Stack ${stack.name}`);
    drawStackSection(doc, stack, snapshot.levels, i, momentsOn(snapshot));
  });
  drawPageFurniture(doc, snapshot, hash, sections.titles, mark);
  return toBuffer(doc);
}
