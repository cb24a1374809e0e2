// Vertical tie force of a column (EN 1991-1-7 A.6) and the consequence classes that ask for it (Annex A).
import type { ConsequenceClass } from '../../schema/results.ts';
import type { Category } from '../../schema/stack.ts';
import { CATEGORIES } from '../stack/combinationFactors.ts';
import type { CategoryValues } from '../stack/combination.ts';

/** EN 1991-1-7 A.5 (class 2a) asks for horizontal ties only; A.6 asks for vertical ties from class 2b (A.4(1)). */
export function needsVerticalTies(consequenceClass: ConsequenceClass): boolean {
  return consequenceClass === '2b' || consequenceClass === '3';
}

/** ψ1: EN 1990 Table A1.1 (A, B 0.5; C, D 0.7; E 0.9; roofs H 0), the UK National Annex the same (from memory). */
export function psi1(category: Category): number {
  return { A: 0.5, B: 0.5, C: 0.7, D: 0.7, E: 0.9, H: 0 }[category];
}

export interface StoreyReaction {
  nodeId: string;
  elevation: number;
  Gk: number;
  Qk: CategoryValues;
}

export interface TieForce {
  /** N */
  T: number;
  nodeId: string | null;
  elevation: number | null;
}

/**
 * The reaction of one storey in the accidental design situation, EN 1990 eq. 6.11b: Gk + ψ1·Qk. Every category
 * at the storey takes ψ1 (not ψ2 for the accompanying ones), which is on the safe side (common practice, no source).
 */
export function accidentalReaction(Gk: number, Qk: CategoryValues): number {
  let value = Gk;
  for (const c of CATEGORIES) value += psi1(c) * (Qk[c] ?? 0);
  return value;
}

/**
 * EN 1991-1-7 A.6(2): a column's vertical tie force is the largest design vertical permanent and variable load
 * reaction applied to it from any one storey; taken here in the accidental combination (EN 1990 6.4.3.3).
 * Reactions in kN, the force returned in N.
 */
export function verticalTieForce(storeys: readonly StoreyReaction[]): TieForce {
  let best: TieForce = { T: 0, nodeId: null, elevation: null };
  for (const s of storeys) {
    const T = accidentalReaction(s.Gk, s.Qk) * 1e3;
    if (T > best.T) best = { T, nodeId: s.nodeId, elevation: s.elevation };
  }
  return best;
}
