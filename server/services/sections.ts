// Catalogue search for the section pickers (GET /api/sections).
import { CATALOGUE, searchSections, type Series } from '../../shared/catalogue/index.ts';
import { sectionProperties } from '../../shared/engine/sectionProperties.ts';

export interface SectionHit {
  designation: string;
  series: Series;
  /** kg/m: the nominal mass where the product table gives one, otherwise computed from the dimensions. */
  massPerMetre: number;
}

export function findSections(q: string, series: Series | undefined, limit: number): SectionHit[] {
  const pool = q ? searchSections(q, CATALOGUE.length) : CATALOGUE;
  return pool
    .filter((e) => !series || e.series === series)
    .slice(0, limit)
    .map((e) => ({
      designation: e.designation,
      series: e.series,
      massPerMetre: e.massPerMetre ?? sectionProperties(e.dims).massPerMetre,
    }));
}
