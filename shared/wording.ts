// How the product words what engineers read, in one place for the screen, the calculation package and
// the e-mail: elevations, lift labels, level names, check names. No internal node id is ever printed;
// see docs/stack-editing.md.
import type { GoverningMode } from './schema/results.ts';

/** The minus sign (U+2212), not the hyphen: elevations below datum print as "−1.500" everywhere. */
const MINUS = '\u2212';

/** Elevation as engineers print it on sections: signed, to the millimetre ("+8.000", "−1.500"). */
export function formatElevation(metres: number): string {
  const text = Math.abs(metres).toFixed(3);
  return metres < 0 && text !== '0.000' ? `${MINUS}${text}` : `+${text}`;
}

/** "L3": lifts are counted from the bottom of the stack. */
export const liftLabel = (indexFromBottom: number): string => `L${indexFromBottom + 1}`;

/** A lift as a person reads it: its label, or a plain word when it has none yet (never its node id). */
export const liftWord = (lift: { label?: string }): string => (lift.label ? `Lift ${lift.label}` : 'A lift');

/** "Level 3" for a level named "3" or "Level 3" alike, never "Level Level 3". */
export function levelWord(name: string): string {
  return /^level\b/i.test(name.trim()) ? name.trim() : `Level ${name.trim()}`;
}

/** What each term of the axial and combined checks is called on screen and in the package. */
export const CHECK_NAMES: Record<GoverningMode, string> = {
  'cross-section': 'Cross-section resistance',
  'flexural-y': 'Flexural buckling about y-y',
  'flexural-z': 'Flexural buckling about z-z',
  combined: 'Axial force with nominal moments (simple construction)',
};

/** Node ids as the editor makes them ("lift-jsvj7d", "restraint-3", "edge-k2"): never for a person's eyes. */
export const INTERNAL_ID_PATTERN = /\b(?:support|lift|splice|restraint|cap|load|edge)-[a-z0-9]{1,8}\b/;
