// Load take-down (docs/analysis-rules.md §Take-down): load entering at a restraint or the cap acts on all of the
// column below it; self-weight is permanent load on the column below each point.
import type { AnalysisOptions, TakeDownRow } from '../../schema/results.ts';
import { CATEGORIES } from './combinationFactors.ts';
import {
  designAxialForce,
  type AxialState,
  type CategoryValues,
  type DesignForce,
  type Expression,
} from './combination.ts';
import { SAME_ELEVATION_M } from './context.ts';

/** A point where load enters the column: a restraint or the cap, with the load nodes attached to it (kN). */
export interface LoadEntry {
  nodeId: string;
  elevation: number;
  Gk: number;
  Qk: CategoryValues;
  /** Floor area (m²) under the imposed load entering here, by category: for αA (docs/building-model.md). */
  area?: CategoryValues;
}

/** Self-weight of one length of column (kN/m). */
export interface ColumnWeight {
  bottom: number;
  top: number;
  perMetre: number;
}

/** Self-weight from mass per metre: kN/m = kg/m × 9.81 N/kg / 1000 (docs/analysis-rules.md §Take-down). */
export function selfWeightPerMetre(massPerMetre: number): number {
  return (massPerMetre * 9.81) / 1000;
}

export interface AxialQuery {
  elevation: number;
  /** Include the entries at this elevation: the column just below a load point. */
  includeEntriesAt: boolean;
}

function selfWeightAbove(weights: readonly ColumnWeight[], elevation: number): number {
  let sum = 0;
  for (const w of weights) if (w.top > elevation) sum += w.perMetre * (w.top - Math.max(elevation, w.bottom));
  return sum;
}

/** Queries from the top of the stack down: just above an elevation comes before just below it. */
function sweepOrder(queries: readonly AxialQuery[]): number[] {
  const level = queries.map((q) =>
    q.includeEntriesAt ? q.elevation - SAME_ELEVATION_M : q.elevation + SAME_ELEVATION_M,
  );
  return queries.map((_, i) => i).sort((a, b) => level[b] - level[a]);
}

/**
 * Loads in the column at each queried section: every entry above it (and at it, when asked), plus the
 * self-weight above it. One sweep down the stack, so a whole stack costs O(entries + queries).
 */
export function axialStates(
  entries: readonly LoadEntry[],
  weights: readonly ColumnWeight[],
  queries: readonly AxialQuery[],
  order: readonly number[] = sweepOrder(queries),
): AxialState[] {
  const down = [...entries].sort((a, b) => b.elevation - a.elevation);
  const states: AxialState[] = new Array(queries.length);
  let sumGk = 0;
  const sumQk: CategoryValues = {};
  const loadedLevels: CategoryValues = {};
  let loadedArea: CategoryValues | undefined;
  let next = 0;
  for (const qi of order) {
    const { elevation, includeEntriesAt } = queries[qi];
    const limit = includeEntriesAt ? elevation - SAME_ELEVATION_M : elevation + SAME_ELEVATION_M;
    for (; next < down.length && down[next].elevation >= limit; next++) {
      const entry = down[next];
      sumGk += entry.Gk;
      for (const c of CATEGORIES) {
        const Q = entry.Qk[c] ?? 0;
        if (Q <= 0) continue;
        sumQk[c] = (sumQk[c] ?? 0) + Q;
        loadedLevels[c] = (loadedLevels[c] ?? 0) + 1;
        const area = entry.area?.[c];
        if (area !== undefined) {
          loadedArea ??= {};
          loadedArea[c] = (loadedArea[c] ?? 0) + area;
        }
      }
    }
    const state: AxialState = {
      sumGk: sumGk + selfWeightAbove(weights, elevation),
      sumQk: { ...sumQk },
      loadedLevels: { ...loadedLevels },
    };
    if (loadedArea) state.loadedArea = { ...loadedArea };
    states[qi] = state;
  }
  return states;
}

/** Loads in the column at one elevation (see axialStates). */
export function axialStateAt(
  entries: readonly LoadEntry[],
  weights: readonly ColumnWeight[],
  elevation: number,
  includeEntriesAt: boolean,
): AxialState {
  return axialStates(entries, weights, [{ elevation, includeEntriesAt }])[0];
}

function categoriesOf(Qk: CategoryValues): string {
  let names = '';
  for (const c of CATEGORIES) if ((Qk[c] ?? 0) > 0) names += names ? `+${c}` : c;
  return names || '-';
}

type CombinationOptions = Pick<AnalysisOptions, 'combination' | 'annex' | 'imposedReduction'> & {
  expression?: Expression;
};

/**
 * Design forces at the queried sections (`order`: top down), never less than at any section above. The force in a column
 * below a floor is the force above plus what the floor adds, so where αn (EN 1991-1-1 6.3.1.2(11))
 * would give less, because one more loaded storey lowers αn on the whole leading load, the force
 * from above is kept (common practice, no source: the UK steps do this between 10 and 11 storeys).
 */
function designForces(
  states: readonly AxialState[],
  order: readonly number[],
  options: CombinationOptions,
): DesignForce[] {
  const forces = states.map((state) => designAxialForce(state, options));
  let above: DesignForce | null = null;
  for (const i of order) {
    if (above && forces[i].NEd < above.NEd)
      forces[i] = { ...above, combination: `${above.combination}, held at the force above` };
    above = forces[i];
  }
  return forces;
}

function takeDownRow(entry: LoadEntry, state: AxialState, force: DesignForce): TakeDownRow {
  let Qk = 0;
  const sumQkByCategory: Record<string, number> = {};
  for (const c of CATEGORIES) {
    Qk += entry.Qk[c] ?? 0;
    if (state.sumQk[c] !== undefined) sumQkByCategory[c] = state.sumQk[c];
  }
  return {
    nodeId: entry.nodeId,
    elevation: entry.elevation,
    Gk: entry.Gk,
    Qk,
    category: categoriesOf(entry.Qk),
    sumGk: state.sumGk,
    sumQkByCategory,
    NEd: force.NEd,
    combination: force.combination,
    n: force.n,
    alphaN: force.alphaN,
  };
}

export interface TakeDown {
  /** One row per load entry, top to bottom: loads entering, totals and NEd just below the point. */
  rows: TakeDownRow[];
  /** NEd just above each of `sections` (the bottoms of pieces), kN. */
  sectionNEd: number[];
}

/** The take-down of a stack, and the design force at further sections, all from one sweep. */
export function takeDown(
  entries: readonly LoadEntry[],
  weights: readonly ColumnWeight[],
  options: CombinationOptions,
  sections: readonly number[] = [],
): TakeDown {
  const ordered = [...entries].sort((p, q) => q.elevation - p.elevation || (p.nodeId < q.nodeId ? -1 : 1));
  const queries: AxialQuery[] = ordered.map((e) => ({ elevation: e.elevation, includeEntriesAt: true }));
  for (const elevation of sections) queries.push({ elevation, includeEntriesAt: false });
  const order = sweepOrder(queries);
  const states = axialStates(entries, weights, queries, order);
  const forces = designForces(states, order, options);
  return {
    rows: ordered.map((entry, i) => takeDownRow(entry, states[i], forces[i])),
    sectionNEd: forces.slice(ordered.length).map((f) => f.NEd),
  };
}

export function takeDownRows(
  entries: readonly LoadEntry[],
  weights: readonly ColumnWeight[],
  options: CombinationOptions,
): TakeDownRow[] {
  return takeDown(entries, weights, options).rows;
}
