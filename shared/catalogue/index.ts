// The section catalogue: standard rolled and hollow sections by designation (docs/analysis-rules.md §Member check).
import { EngineError } from '../engine/errors.ts';
import { validateDims } from '../engine/validateDims.ts';
import type { SectionDims } from '../schema/stack.ts';
import { designationKey, dimsDesignation } from './designation.ts';
import { CHS, RHS, SHS } from './hollow.ts';
import { HE_A, HE_B, HE_M, IPE, UKB, UKC } from './rolled.ts';
import { SERIES, type CatalogueEntry, type Series } from './types.ts';

export { SERIES, type CatalogueEntry, type Series };
export { designationKey, dimsDesignation, formatMm } from './designation.ts';

const BY_SERIES: Readonly<Record<Series, readonly CatalogueEntry[]>> = {
  UKC,
  UKB,
  'HE A': HE_A,
  'HE B': HE_B,
  'HE M': HE_M,
  IPE,
  SHS,
  RHS,
  CHS,
};

/** Every catalogue entry, series by series in picker order. */
export const CATALOGUE: readonly CatalogueEntry[] = SERIES.flatMap((s) => BY_SERIES[s]);

const KEYS: ReadonlyArray<readonly [full: string, size: string, entry: CatalogueEntry]> = CATALOGUE.map((e) => {
  const full = designationKey(e.designation);
  return [full, full.replace(/^[A-Z ]*?(?=\d)/, ''), e] as const;
});
const BY_KEY: ReadonlyMap<string, CatalogueEntry> = new Map(KEYS.map(([full, , e]) => [full, e]));

/** The catalogue entry with this designation (any case, spacing, "x" or "×"), or undefined. */
export function findSection(designation: string): CatalogueEntry | undefined {
  return BY_KEY.get(designationKey(designation));
}

/**
 * A catalogue designation, a company section from `extra`, or dimensions, as a designation and
 * its dimensions. Throws EngineError 'unknown_section' or 'invalid_input'.
 */
export function resolveSection(
  section: string | SectionDims,
  extra?: ReadonlyMap<string, SectionDims>,
): { designation: string; dims: SectionDims } {
  if (typeof section !== 'string') {
    const dims = validateDims(section);
    return { designation: dimsDesignation(dims), dims };
  }
  const own = extra?.get(section) ?? (extra ? findExtra(extra, section) : undefined);
  if (own) return { designation: section.trim(), dims: validateDims(own) };
  const entry = findSection(section);
  if (entry) return { designation: entry.designation, dims: entry.dims };
  const hints = searchSections(section.replace(/x?[\d.]*$/i, ''), 3).map((e) => e.designation);
  const hint = hints.length > 0 ? ` Similar: ${hints.join(', ')}.` : '';
  throw new EngineError(
    'unknown_section',
    `"${section}" is not a section in the catalogue or in this building's own sections.${hint}`,
  );
}

function findExtra(extra: ReadonlyMap<string, SectionDims>, designation: string): SectionDims | undefined {
  const key = designationKey(designation);
  for (const [name, dims] of extra) if (designationKey(name) === key) return dims;
  return undefined;
}

/** Entries whose designation starts with the text, or whose size does ("203x2" finds UKC 203x203…). */
export function searchSections(prefix: string, limit = 20): CatalogueEntry[] {
  const key = designationKey(prefix);
  const hits: CatalogueEntry[] = [];
  if (limit <= 0) return hits;
  // "HEB 3" is the start of "HE 3xx B", which no plain prefix test can see
  const euro = /^HE ?([ABM]) ?(\d*)$/.exec(key.replace(/^HE (\d*) ?([ABM])$/, 'HE $2 $1'));
  for (const [full, size, entry] of KEYS) {
    const match = euro
      ? entry.series === `HE ${euro[1]}` && size.startsWith(euro[2]!)
      : full.startsWith(key) || size.startsWith(key);
    if (match) {
      hits.push(entry);
      if (hits.length >= limit) break;
    }
  }
  return hits;
}

/** Series names in picker order. */
export function listSeries(): readonly Series[] {
  return SERIES;
}

/** The entries of one series, in the order of the product tables. */
export function sectionsInSeries(series: Series | string): readonly CatalogueEntry[] {
  return (BY_SERIES as Readonly<Record<string, readonly CatalogueEntry[]>>)[series] ?? [];
}
