// The section catalogue search behind the section pickers: GET /api/sections?q=&series=.
// The reply is checked with zod because no shared type describes it yet.
import { z } from 'zod';
import { apiFetch } from './http.ts';

export const sectionHitSchema = z.object({
  designation: z.string(),
  series: z.string(),
  /** kg/m */
  massPerMetre: z.number(),
});
export type SectionHit = z.infer<typeof sectionHitSchema>;

export async function searchSections(q: string, series?: string): Promise<SectionHit[]> {
  const params = new URLSearchParams({ q });
  if (series) params.set('series', series);
  const reply = await apiFetch<unknown>('GET', `/sections?${params.toString()}`);
  return z.array(sectionHitSchema).parse(reply);
}
