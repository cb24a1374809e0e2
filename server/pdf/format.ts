// Numbers and words as they are printed on the calculation sheets.
import type { GoverningMode } from '../../shared/schema/results.ts';

/** Figures as the working prints them (shared with the screens). */
export { figures as num, formatStep as stepValue } from '../../shared/stepFormat.ts';

export const kN = (v: number) => v.toFixed(1);
export const metres = (v: number) => v.toFixed(3);
export const ratio = (v: number | null) => (v === null ? '–' : v.toFixed(3));

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/** "1 Dec 2025, 10:32 UTC": fixed wording, independent of the server's locale and time zone. */
export function frozenDate(iso: string): string {
  const d = new Date(iso);
  const hh = String(d.getUTCHours()).padStart(2, '0');
  const mm = String(d.getUTCMinutes()).padStart(2, '0');
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}, ${hh}:${mm} UTC`;
}

/** Keyed by every mode, so a new one cannot print as "undefined". */
export const governingWords: Record<GoverningMode, string> = {
  'cross-section': 'cross-section',
  'flexural-y': 'buckling y-y',
  'flexural-z': 'buckling z-z',
  combined: 'combined axial and nominal moments (simple construction)',
};

/** For narrow columns headed "Mode"; N+M is the combined check, explained beside each such table. */
export const governingShort: Record<GoverningMode, string> = {
  'cross-section': 'section',
  'flexural-y': 'y-y',
  'flexural-z': 'z-z',
  combined: 'N+M',
};

/** How the package names a lift: its label (L1, L2, … from the bottom), never its internal node id. */
export const liftName = (lift: { liftId: string; label?: string }): string => lift.label ?? 'lift';
