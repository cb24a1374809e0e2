// A building's revisions (docs/contracts.md §REST routes): list, freeze, one revision with its mail,
// resend, the package and the comparison of two states.
import { z } from 'zod';
import type { FreezeBody, RevisionComparison, RevisionDetail, RevisionSummary } from '@shared/schema/revisions.ts';
import { revisionComparisonSchema, revisionDetailSchema, revisionSummarySchema } from '@shared/schema/replies.ts';
import { downloadFile } from './download.ts';
import { http } from './http.ts';

export async function listRevisions(buildingId: number): Promise<RevisionSummary[]> {
  return z.array(revisionSummarySchema).parse(await http.get(`/buildings/${buildingId}/revisions`));
}

/** afterRevisionId: the newest revision the caller has seen, so a retried request cannot freeze twice. */
export async function freezeRevision(
  buildingId: number,
  body: FreezeBody & { afterRevisionId: number | null },
): Promise<RevisionDetail> {
  return revisionDetailSchema.parse(await http.post(`/buildings/${buildingId}/revisions`, body));
}

export async function getRevision(id: number): Promise<RevisionDetail> {
  return revisionDetailSchema.parse(await http.get(`/revisions/${id}`));
}

export async function resendRevision(id: number): Promise<RevisionDetail> {
  return revisionDetailSchema.parse(await http.post(`/revisions/${id}/resend`));
}

/** The package is drawn again for each download and needs the bearer token: fetched as a blob and saved. */
export function downloadPackage(rev: Pick<RevisionSummary, 'id' | 'code'>): Promise<void> {
  return downloadFile(`/revisions/${rev.id}/calc.pdf`, `revision-${rev.code}.pdf`);
}

export async function compareRevisions(
  buildingId: number,
  from: number,
  to: number | 'current',
): Promise<RevisionComparison> {
  const query = new URLSearchParams({ from: String(from), to: String(to) });
  return revisionComparisonSchema.parse(await http.get(`/buildings/${buildingId}/revisions/compare?${query}`));
}
