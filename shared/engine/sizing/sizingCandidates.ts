// The sections a proposal may choose from: one series (or HE A/B/M together), lightest first,
// optionally limited to a list the engineer gives.
import { designationKey, sectionsInSeries, type Series } from '../../catalogue/index.ts';
import type { SizingSeries } from '../../schema/sizing.ts';
import type { Annex, SectionClass } from '../../schema/results.ts';
import type { Grade } from '../../schema/stack.ts';
import { EngineError, isEngineError } from '../errors.ts';
import { gradeData, sectionData } from '../sectionData.ts';
import { serialSize } from './serialSize.ts';

export interface Candidate {
  designation: string;
  serial: string;
  /** kg/m from the dimensions: the value the analysis takes for self-weight (docs/analysis-rules.md §Take-down). */
  massPerMetre: number;
}

/** A candidate in one grade: Aeff·fy (N), the cross-section resistance with γM0 = 1.0 (EN 1993-1-1 eq. 6.10/6.11). */
export interface GradedCandidate extends Candidate {
  squash: number;
  /** In pure compression (EN 1993-1-1 Table 5.2): class 4 is never proposed where nominal moments act. */
  sectionClass: SectionClass;
}

const HE_SERIES: readonly Series[] = ['HE A', 'HE B', 'HE M'];
const BY_SERIES = new Map<SizingSeries, readonly Candidate[]>();

function seriesCandidates(series: SizingSeries): readonly Candidate[] {
  const cached = BY_SERIES.get(series);
  if (cached) return cached;
  const entries = series === 'HE' ? HE_SERIES.flatMap((s) => sectionsInSeries(s)) : sectionsInSeries(series);
  // Array.prototype.sort is stable: equal masses keep the order of the product tables.
  const list = entries
    .map((e) => ({
      designation: e.designation,
      serial: serialSize(e.designation),
      massPerMetre: sectionData(e.designation).props.massPerMetre,
    }))
    .sort((a, b) => a.massPerMetre - b.massPerMetre);
  BY_SERIES.set(series, list);
  return list;
}

/** Lightest first. Throws EngineError 'invalid_input' when an allowed name is not in the series. */
export function sizingCandidates(series: SizingSeries, allowed?: readonly string[]): readonly Candidate[] {
  const all = seriesCandidates(series);
  if (!allowed) return all;
  const keys = new Set(all.map((c) => designationKey(c.designation)));
  const unknown = allowed.filter((name) => !keys.has(designationKey(name)));
  if (unknown.length > 0) throw new EngineError('invalid_input', `Not in the ${series} series: ${unknown.join(', ')}`);
  const wanted = new Set(allowed.map(designationKey));
  return all.filter((c) => wanted.has(designationKey(c.designation)));
}

/**
 * The candidates the member check can take in this grade. A section the rules do not cover (no yield
 * strength in the product standard at its thickness, no Table 6.2 row) cannot be shown to pass, so
 * it is never proposed.
 */
export function checkableCandidates(candidates: readonly Candidate[], grade: Grade, annex: Annex): GradedCandidate[] {
  const graded: GradedCandidate[] = [];
  for (const c of candidates) {
    try {
      const g = gradeData(sectionData(c.designation), grade, annex);
      graded.push({ ...c, squash: g.squash, sectionClass: g.sectionClass });
    } catch (error) {
      if (!isEngineError(error) || error.code !== 'unsupported') throw error;
    }
  }
  return graded;
}
