// Numbers and words as they are printed on the calculation sheets.
import type { CalcStep, GoverningMode } from '../../shared/schema/results.ts';

/** Fixed decimals that keep about four significant figures. */
export function num(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  const a = Math.abs(v);
  if (Number.isInteger(v) && a < 1e6) return String(v);
  const dp = a >= 1000 ? 0 : a >= 100 ? 1 : a >= 10 ? 2 : 3;
  return v.toFixed(dp);
}

export const kN = (v: number) => v.toFixed(1);
export const metres = (v: number) => v.toFixed(3);
export const ratio = (v: number | null) => (v === null ? '–' : v.toFixed(3));

/**
 * Steps come in N and mm (SPEC §6); forces print in kN, moments in kN·m, section moduli in cm³ and second
 * moments in cm⁴, as handbooks give them.
 */
export function stepValue(step: CalcStep): { value: string; unit: string } {
  if (typeof step.value === 'string') return { value: step.value, unit: step.unit };
  if (step.unit === 'N') return { value: num(step.value / 1e3), unit: 'kN' };
  if (step.unit === 'N·mm') return { value: num(step.value / 1e6), unit: 'kN·m' };
  if (step.unit === 'mm³') return { value: num(step.value / 1e3), unit: 'cm³' };
  if (step.unit === 'mm⁴') return { value: num(step.value / 1e4), unit: 'cm⁴' };
  return { value: num(step.value), unit: step.unit };
}

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
export const governingShort: Record<GoverningMode, string> = { 'cross-section': 'section', 'flexural-y': 'y-y', 'flexural-z': 'z-z', combined: 'N+M' };

/** How the package names a lift: its label (L1, L2, … from the bottom) and node id. */
export const liftName = (lift: { liftId: string; label?: string }): string => (lift.label ? `${lift.label} (${lift.liftId})` : lift.liftId);
