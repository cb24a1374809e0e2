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
  const abs = Math.abs(v);
  if (abs >= 1e6) return scientific(v);
  if (Number.isInteger(v)) return String(v);
  const places = abs >= 1000 ? 0 : abs >= 100 ? 1 : abs >= 10 ? 2 : 3;
  return v.toFixed(places);
}

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶', 7: '⁷', 8: '⁸', 9: '⁹' };

/** "2.767×10⁸": second moments of area and critical forces read better this way. */
function scientific(v: number): string {
  const [mantissa, exponent] = v.toExponential(3).split('e');
  const power = String(Number(exponent)).split('').map((c) => SUPERSCRIPT[c] ?? c).join('');
  return `${mantissa}×10${power}`;
}
