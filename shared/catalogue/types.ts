import type { SectionDims } from '../schema/stack.ts';

export const SERIES = ['UKC', 'UKB', 'HE A', 'HE B', 'HE M', 'IPE', 'SHS', 'RHS', 'CHS'] as const;
export type Series = (typeof SERIES)[number];

export interface CatalogueEntry {
  designation: string;
  series: Series;
  dims: SectionDims;
  /** Nominal mass, kg/m, where the designation or the product table states one. */
  massPerMetre?: number;
}
