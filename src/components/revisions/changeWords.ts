// How a comparison reads on screen.
import type { Change, FieldChange, LiftUtilisationChange } from '@shared/schema/revisions.ts';

export const CHANGE_COLOUR: Record<Change, string> = { added: 'positive', removed: 'negative', changed: 'warning' };

const value = (v: FieldChange['from']) => (v === null ? '—' : typeof v === 'number' ? String(Math.round(v * 1000) / 1000) : v);

/** "section: UKC 254x254x73 → UKC 305x305x97". */
export const fieldWords = (f: FieldChange) => `${f.field}: ${value(f.from)} → ${value(f.to)}`;

/** Signed change of utilisation to two places, or the word for a lift that came or went. */
export function utilisationDelta(l: LiftUtilisationChange): string {
  if (l.from === null) return 'new lift';
  if (l.to === null) return 'lift removed';
  const d = l.to - l.from;
  return `${d >= 0 ? '+' : '−'}${Math.abs(d).toFixed(2)}`;
}
