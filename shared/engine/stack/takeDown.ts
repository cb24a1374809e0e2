// Load take-down (SPEC §5.1): load entering at a restraint or the cap acts on all of the column below it;
// self-weight is permanent load on the column below each point.
import type { AnalysisOptions, TakeDownRow } from '../../schema/results.ts';
import type { Category } from '../../schema/stack.ts';
import { CATEGORIES } from './combinationFactors.ts';
import { designAxialForce, type AxialState, type CategoryValues } from './combination.ts';
import { SAME_ELEVATION_M } from './context.ts';

/** A point where load enters the column: a restraint or the cap, with the load nodes attached to it (kN). */
export interface LoadEntry {
  nodeId: string;
  elevation: number;
  Gk: number;
  Qk: CategoryValues;
}

/** Self-weight of one length of column (kN/m). */
export interface ColumnWeight {
  bottom: number;
  top: number;
  perMetre: number;
}

/** Self-weight from mass per metre: kN/m = kg/m × 9.81 N/kg / 1000 (SPEC §5.1, g = 9.81 m/s²). */
export function selfWeightPerMetre(massPerMetre: number): number {
  return (massPerMetre * 9.81) / 1000;
}

/**
 * Loads in the column at an elevation: from every entry above it, and from the entries at it when
 * `includeEntriesAt` (the column just below a load point), plus the self-weight above the elevation.
 */
export function axialStateAt(
  entries: readonly LoadEntry[],
  weights: readonly ColumnWeight[],
  elevation: number,
  includeEntriesAt: boolean,
): AxialState {
  const threshold = includeEntriesAt ? elevation - SAME_ELEVATION_M : elevation + SAME_ELEVATION_M;
  let sumGk = 0;
  const sumQk: CategoryValues = {};
  const loadedLevels: CategoryValues = {};
  for (const entry of entries) {
    if (entry.elevation < threshold) continue;
    sumGk += entry.Gk;
    for (const c of CATEGORIES) {
      const Q = entry.Qk[c] ?? 0;
      if (Q <= 0) continue;
      sumQk[c] = (sumQk[c] ?? 0) + Q;
      loadedLevels[c] = (loadedLevels[c] ?? 0) + 1;
    }
  }
  for (const w of weights) sumGk += w.perMetre * Math.max(0, w.top - Math.max(elevation, w.bottom));
  return { sumGk, sumQk, loadedLevels };
}

function categoriesOf(Qk: CategoryValues): string {
  const present = CATEGORIES.filter((c: Category) => (Qk[c] ?? 0) > 0);
  return present.length ? present.join('+') : '-';
}

/** One row per load entry, top to bottom: loads entering, totals and NEd just below the point. */
export function takeDownRows(
  entries: readonly LoadEntry[],
  weights: readonly ColumnWeight[],
  options: Pick<AnalysisOptions, 'combination' | 'annex' | 'imposedReduction'>,
): TakeDownRow[] {
  const ordered = [...entries].sort((p, q) => q.elevation - p.elevation || (p.nodeId < q.nodeId ? -1 : 1));
  return ordered.map((entry) => {
    const state = axialStateAt(entries, weights, entry.elevation, true);
    const force = designAxialForce(state, options);
    const Qk = CATEGORIES.reduce((sum, c) => sum + (entry.Qk[c] ?? 0), 0);
    return {
      nodeId: entry.nodeId,
      elevation: entry.elevation,
      Gk: entry.Gk,
      Qk,
      category: categoriesOf(entry.Qk),
      sumGk: state.sumGk,
      sumQkByCategory: { ...state.sumQk } as Record<string, number>,
      NEd: force.NEd,
      combination: force.combination,
    };
  });
}
