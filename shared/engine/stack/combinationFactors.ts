// Partial and combination factors for the ULS of a column in a building (EN 1990 Annex A1).
import type { Annex } from '../../schema/results.ts';
import type { Category } from '../../schema/stack.ts';

/** EN 1990 Table A1.2(B): γG,sup and γQ (recommended values, kept by the UK National Annex). */
export const GAMMA_G = 1.35;
export const GAMMA_Q = 1.5;

/** Categories in the order used for ties and printing; A–D are the ones EN 1991-1-1 6.3.1.2(11) reduces. */
export const CATEGORIES: readonly Category[] = ['A', 'B', 'C', 'D', 'E', 'H'];

export function isReducibleCategory(category: Category): boolean {
  return category === 'A' || category === 'B' || category === 'C' || category === 'D';
}

/** ψ0: EN 1990 Table A1.1 (A–D 0.7, E 1.0, H 0); UK National Annex Table NA.A1.1 gives roofs 0.7. */
export function psi0(category: Category, annex: Annex): number {
  if (category === 'E') return 1.0;
  if (category === 'H') return annex === 'UK' ? 0.7 : 0.0;
  return 0.7;
}

/** ξ, reduction of unfavourable permanent actions in eq. 6.10b: EN 1990 Table A1.2(B) note 0.85; UK NA 0.925. */
export function xi(annex: Annex): number {
  return annex === 'UK' ? 0.925 : 0.85;
}
