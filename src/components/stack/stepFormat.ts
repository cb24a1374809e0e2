// How a line of the engine's working reads on screen: forces in kN rather than N, figures to four
// significant digits, text values as they are.
import type { CalcStep } from '@shared/schema/results.ts';

export function formatStepValue(step: CalcStep): { value: string; unit: string } {
  if (typeof step.value === 'string') return { value: step.value, unit: step.unit };
  if (step.unit === 'N') return { value: significant(step.value / 1000), unit: 'kN' };
  return { value: significant(step.value), unit: step.unit };
}

function significant(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  if (Number.isInteger(v) && Math.abs(v) < 1e6) return String(v);
  const abs = Math.abs(v);
  const places = abs >= 1000 ? 0 : abs >= 100 ? 1 : abs >= 10 ? 2 : 3;
  return v.toFixed(places);
}
