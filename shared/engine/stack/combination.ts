// Design axial force from characteristic loads (EN 1990 6.4.3.2, Table A1.2(B); docs/analysis-rules.md §Combinations,
// §Reduction for storeys).
import type { AnalysisOptions } from '../../schema/results.ts';
import type { Category } from '../../schema/stack.ts';
import { CATEGORIES, GAMMA_G, GAMMA_Q, isReducibleCategory, psi0, xi } from './combinationFactors.ts';
import { alphaA } from '../building/alphaA.ts';
import { alphaN } from './imposedReduction.ts';

export type CategoryValues = Partial<Record<Category, number>>;

/** Characteristic loads carried by the column at one section (kN) and the storeys loaded above it. */
export interface AxialState {
  sumGk: number;
  sumQk: CategoryValues;
  /** Per category: the number of levels above the section that carry imposed load of it. */
  loadedLevels: CategoryValues;
  /** Per category: the floor area (m²) above the section under that imposed load, where the floors give it. */
  loadedArea?: CategoryValues;
}

export interface DesignForce {
  NEd: number;
  /** The expression that governs, e.g. "6.10b, leading A". */
  combination: string;
  leading: Category | null;
  /** Storeys above the section carrying imposed load of the leading category (of any category when none leads). */
  n: number;
  /** αn applied to the leading action (EN 1991-1-1 6.3.1.2(11)): 1 when its category is not reduced,
   *  null when no variable action leads (eq. 6.10a, or permanent load only), so none is reduced. */
  alphaN: number | null;
}

/** One expression of EN 1990 6.4.3.2: eq. 6.10, or eq. 6.10a or 6.10b taken alone. */
export type Expression = '6.10' | '6.10a' | '6.10b';

/** `expression`: only that expression of '6.10ab' (for checks that must use one combination throughout). */
type Options = Pick<AnalysisOptions, 'combination' | 'annex' | 'imposedReduction'> & { expression?: Expression };

/** The reduction of the leading action: αn, or under the UK annex αA where it is smaller. */
function leadingReduction(
  state: AxialState,
  category: Category,
  options: Options,
): { factor: number; byArea: boolean } {
  const byStoreys = alphaN(state.loadedLevels[category] ?? 0, options.annex, category);
  const area = state.loadedArea?.[category] ?? 0;
  // UK National Annex to EN 1991-1-1 NA.2.5–NA.2.6 (from memory): a column may take αA for the area it supports
  // or αn for the storeys, not both. EN 1991-1-1 6.2.2(2) gives columns αn alone, so 'EN' keeps αn.
  if (options.annex !== 'UK' || area <= 0) return { factor: byStoreys, byArea: false };
  const byArea = alphaA(area, 'UK', category);
  return byArea < byStoreys ? { factor: byArea, byArea: true } : { factor: byStoreys, byArea: false };
}

/** Q_L*: the leading action, reduced only for categories A–D (EN 1991-1-1 6.3.1.2(10)–(11), 6.2.2(2)). */
function leadingValue(state: AxialState, category: Category, options: Options): number {
  const Q = state.sumQk[category] ?? 0;
  if (!options.imposedReduction || !isReducibleCategory(category)) return Q;
  return leadingReduction(state, category, options).factor * Q;
}

function leadingLabel(state: AxialState, category: Category, options: Options): string {
  const reduced =
    options.imposedReduction && isReducibleCategory(category) && leadingReduction(state, category, options).byArea;
  return reduced ? `leading ${category} (αA)` : `leading ${category}`;
}

/** γQ·ψ0,i·Q_i for each category, in CATEGORIES order: the accompanying values. */
function accompanyingValues(state: AxialState, options: Options): number[] {
  return CATEGORIES.map((c) => GAMMA_Q * psi0(c, options.annex) * (state.sumQk[c] ?? 0));
}

/** max over the leading action L of permanent + γQ·Q_L* + Σ(i≠L) γQ·ψ0,i·Q_i. */
function withLeading(
  permanent: number,
  state: AxialState,
  accompanying: readonly number[],
  options: Options,
): { value: number; leading: Category | null } {
  let value = permanent;
  let leading: Category | null = null;
  CATEGORIES.forEach((L, l) => {
    if (!((state.sumQk[L] ?? 0) > 0)) return;
    let candidate = permanent + GAMMA_Q * leadingValue(state, L, options);
    for (let i = 0; i < accompanying.length; i++) if (i !== l) candidate += accompanying[i];
    if (leading === null || candidate > value) {
      value = candidate;
      leading = L;
    }
  });
  return { value, leading };
}

/** The reduction the leading action received, for the take-down's working: n and αn (EN 1991-1-1 6.3.1.2(11)). */
function reductionOf(
  state: AxialState,
  leading: Category | null,
  options: Options,
): { n: number; alphaN: number | null } {
  if (leading === null) return { n: Math.max(0, ...CATEGORIES.map((c) => state.loadedLevels[c] ?? 0)), alphaN: null };
  const n = state.loadedLevels[leading] ?? 0;
  const Q = state.sumQk[leading] ?? 0;
  return { n, alphaN: Q > 0 ? leadingValue(state, leading, options) / Q : 1 };
}

export function designAxialForce(state: AxialState, options: Options): DesignForce {
  const permanent = GAMMA_G * state.sumGk;
  const accompanying = accompanyingValues(state, options);
  if (options.combination === '6.10') {
    // EN 1990 eq. 6.10
    const { value, leading } = withLeading(permanent, state, accompanying, options);
    return {
      NEd: value,
      leading,
      combination: leading ? `6.10, ${leadingLabel(state, leading, options)}` : '6.10, permanent only',
      ...reductionOf(state, leading, options),
    };
  }
  // EN 1990 eq. 6.10a: every variable action at its combination value ψ0·Qk
  let a = permanent;
  for (const value of accompanying) a += value;
  // EN 1990 eq. 6.10b: ξ·γG·Gk with a leading variable action
  const b = withLeading(xi(options.annex) * permanent, state, accompanying, options);
  if (options.expression === '6.10a')
    return { NEd: a, leading: null, combination: '6.10a', ...reductionOf(state, null, options) };
  if (options.expression === '6.10b') {
    return {
      NEd: b.value,
      leading: b.leading,
      combination: b.leading ? `6.10b, ${leadingLabel(state, b.leading, options)}` : '6.10b',
      ...reductionOf(state, b.leading, options),
    };
  }
  if (a >= b.value) return { NEd: a, leading: null, combination: '6.10a', ...reductionOf(state, null, options) };
  return {
    NEd: b.value,
    leading: b.leading,
    combination: b.leading ? `6.10b, ${leadingLabel(state, b.leading, options)}` : '6.10b',
    ...reductionOf(state, b.leading, options),
  };
}
