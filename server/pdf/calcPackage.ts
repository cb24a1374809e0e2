// The calculation package of a revision, drawn from its snapshot alone: the same snapshot always
// gives the same pages (and, with the dates fixed from the freeze, the same bytes).
import type { SignOff } from '../../shared/schema/reviews.ts';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { drawCover, momentsOn } from './cover.ts';
import { drawPageFurniture, trackSections } from './pageFurniture.ts';
import { createPdf, toBuffer } from './pdf.ts';
import { drawScheduleSection } from './scheduleSection.ts';
import { drawStackSection } from './stackSection.ts';
import { drawSummary } from './summary.ts';

export interface PackageExtras {
  /** Printed at the top of every page: a re-drawn copy or a check copy says so. */
  mark?: string;
  /** The review's sign-offs for the cover; null or absent for a revision frozen before checking existed. */
  signOff?: SignOff | null;
}

export async function renderCalcPackage(
  snapshot: RevisionSnapshot,
  hash: string,
  { mark, signOff = null }: PackageExtras = {},
): Promise<Buffer> {
  const doc = createPdf(snapshot);
  const sections = trackSections(doc);
  sections.set('Cover');
  drawCover(doc, snapshot, hash, signOff);
  sections.set('Summary');
  drawSummary(doc, snapshot);
  snapshot.stacks.forEach((stack, i) => {
    sections.set(`Stack ${stack.name}`);
    drawStackSection(doc, stack, snapshot.levels, i, momentsOn(snapshot));
  });
  sections.set('Column schedule');
  drawScheduleSection(doc, snapshot);
  drawPageFurniture(doc, snapshot, hash, sections.titles, mark);
  return toBuffer(doc);
}
