// CSV imports into a building's stacks (docs/contracts.md §Imports): check a file (preview with problems by
// row), apply the checked file, and the building's own sections for the pickers.
import { z } from 'zod';
import {
  applyResultSchema,
  companySectionHitSchema,
  loadsPreviewSchema,
  sectionsPreviewSchema,
  type ApplyResult,
  type CompanySectionHit,
  type LoadsPreview,
  type SectionsPreview,
} from '@shared/schema/imports.ts';
import { http } from './http.ts';

export type ImportKind = 'loads' | 'sections';
export type ImportPreview = LoadsPreview | SectionsPreview;

/** A preview of either kind; a 422 carries one in its details (with problems). */
export const importPreviewSchema = z.discriminatedUnion('kind', [loadsPreviewSchema, sectionsPreviewSchema]);

const imports = (buildingId: number, kind: ImportKind) => `/buildings/${buildingId}/imports/${kind}`;

export async function checkImport(buildingId: number, kind: ImportKind, body: FormData): Promise<ImportPreview> {
  return importPreviewSchema.parse(await http.post(imports(buildingId, kind), body));
}

/** The server refuses (409) when a stack moved on since the check. */
export async function applyImport(buildingId: number, kind: ImportKind, body: FormData): Promise<ApplyResult> {
  return applyResultSchema.parse(await http.post(`${imports(buildingId, kind)}/apply`, body));
}

export async function searchCompanySections(buildingId: number, q: string): Promise<CompanySectionHit[]> {
  const query = new URLSearchParams({ q });
  return z.array(companySectionHitSchema).parse(await http.get(`/buildings/${buildingId}/sections?${query}`));
}
