// Turns a zod error from a shared schema into one plain sentence per form field.
import type { z } from 'zod';

export interface FieldInfo {
  label: string;
  unit?: string;
}

function describe(issue: z.core.$ZodIssue, unit: string): string {
  const suffix = unit ? ` ${unit}` : '';
  switch (issue.code) {
    case 'too_small':
      if (issue.origin === 'string')
        return Number(issue.minimum) <= 1 ? 'is required' : `must be at least ${issue.minimum} characters`;
      if (issue.origin === 'array') return `needs at least ${issue.minimum}`;
      return `must be at least ${issue.minimum}${suffix}`;
    case 'too_big':
      if (issue.origin === 'string') return `must be at most ${issue.maximum} characters`;
      if (issue.origin === 'array') return `may have at most ${issue.maximum}`;
      return `must be at most ${issue.maximum}${suffix}`;
    case 'invalid_type':
      return issue.expected === 'number' || issue.expected === 'int' ? 'must be a number' : 'is required';
    default:
      return issue.message;
  }
}

/** First message per top-level field, e.g. { elevation: "Elevation must be at most 1000 m" }. Given the
 *  typed values, a field left empty reads "is required" whatever rule refused it (an empty e-mail
 *  address is not "not an e-mail address" to the person typing). */
export function fieldErrors(
  error: z.ZodError,
  fields: Record<string, FieldInfo>,
  typed?: Record<string, unknown>,
): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = String(issue.path[0] ?? '');
    if (key in out) continue;
    const info = fields[key];
    const empty = typeof typed?.[key] === 'string' && (typed[key] as string).trim() === '';
    out[key] = info ? `${info.label} ${empty ? 'is required' : describe(issue, info.unit ?? '')}` : issue.message;
  }
  return out;
}

/** Reads a number typed into a text field; empty or unreadable text gives NaN so the schema refuses it. */
export function readNumber(text: string | number | null | undefined): number {
  if (typeof text === 'number') return text;
  const trimmed = (text ?? '').trim().replace(',', '.').replace('−', '-');
  return trimmed === '' ? Number.NaN : Number(trimmed);
}
