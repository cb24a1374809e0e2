// How a line of the engine's working reads, on screen and on the calculation sheets alike. Steps come
// in N and mm (docs/analysis-rules.md §Member check); they read as handbooks and design offices write them: forces in
// kN, moments in kN·m, areas in cm², section moduli in cm³, second moments in cm⁴, buckling lengths in m, partial
// factors to two places, other figures to about four significant figures.
import type { CalcStep } from './schema/results.ts';

/** Fixed decimals that keep about four significant figures; whole numbers as they are. */
export function figures(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  const a = Math.abs(v);
  if (Number.isInteger(v) && a < 1e6) return String(v);
  const dp = a >= 1000 ? 0 : a >= 100 ? 1 : a >= 10 ? 2 : 3;
  return v.toFixed(dp);
}

/** Divisor and printed unit for each unit the engine uses. */
const PRINTED: Readonly<Record<string, readonly [number, string]>> = {
  N: [1e3, 'kN'],
  'N·mm': [1e6, 'kN·m'],
  'mm²': [1e2, 'cm²'],
  'mm³': [1e3, 'cm³'],
  'mm⁴': [1e4, 'cm⁴'],
};

export function formatStep(step: CalcStep): { value: string; unit: string } {
  if (typeof step.value === 'string') return { value: step.value, unit: step.unit };
  if (step.symbol.startsWith('γ')) return { value: step.value.toFixed(2), unit: step.unit };
  if (step.unit === 'mm' && step.symbol.startsWith('Lcr')) return { value: (step.value / 1e3).toFixed(3), unit: 'm' };
  const printed = PRINTED[step.unit];
  return printed
    ? { value: figures(step.value / printed[0]), unit: printed[1] }
    : { value: figures(step.value), unit: step.unit };
}
