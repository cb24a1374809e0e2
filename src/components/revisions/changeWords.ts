// How a comparison reads on screen: quantities with their units, elevations to the millimetre, and the
// analysis options in the words of the options dialog rather than their stored keys.
import type { Change, FieldChange, LiftUtilisationChange } from '@shared/schema/revisions.ts';
import { levelWord } from '@shared/wording.ts';
import { formatElevation } from '@/utils/format.ts';

export const CHANGE_COLOUR: Record<Change, string> = { added: 'positive', removed: 'negative', changed: 'warning' };

type Value = FieldChange['from'];

interface FieldWord {
  name: string;
  /** Printed once, after the new value: "Gk: 240 → 400 kN". */
  unit?: string;
  show?: (v: Value) => string;
}

const plain = (v: Value) => (v === null ? '—' : typeof v === 'number' ? String(Math.round(v * 1000) / 1000) : v);
const elevation = (v: Value) => (typeof v === 'number' ? formatElevation(v) : plain(v));
/** Stored booleans reach the comparison as the text "true" / "false". */
const onOff = (v: Value) => (v === 'true' ? 'on' : v === 'false' ? 'off' : plain(v));
const among = (words: Record<string, string>) => (v: Value) => (typeof v === 'string' && words[v]) || plain(v);

const NODE_FIELD: Record<string, FieldWord> = {
  elevation: { name: 'elevation', unit: 'm', show: elevation },
  Gk: { name: 'Gk', unit: 'kN' },
  Qk: { name: 'Qk', unit: 'kN' },
  kY: { name: 'ky' },
  kZ: { name: 'kz' },
  levelId: { name: 'level' },
  faces: { name: 'beam reactions on the faces' },
};

const OPTION_FIELD: Record<string, FieldWord> = {
  combination: { name: 'load combination', show: among({ '6.10': 'eq. 6.10', '6.10ab': 'eqs. 6.10a and 6.10b' }) },
  annex: { name: 'factors', show: among({ UK: 'UK National Annex', EN: 'recommended values of the EN' }) },
  imposedReduction: { name: 'imposed-load reduction for storeys', show: onOff },
  selfWeight: { name: 'self-weight', show: onOff },
  nominalMoments: { name: 'nominal moments of simple construction', show: onOff },
  bucklingLengths: {
    name: 'buckling lengths from',
    show: among({ factors: 'tabulated factors', critical: 'critical buckling analysis' }),
  },
};

function words(f: FieldChange, word: FieldWord = { name: f.field }): string {
  const show = word.show ?? plain;
  // The unit follows the last figure: "— → +5.000 m" for a level added, "+5.000 m → —" for one removed.
  const unit = word.unit ? ` ${word.unit}` : '';
  const from = f.to === null && f.from !== null ? `${show(f.from)}${unit}` : show(f.from);
  const to = f.to !== null ? `${show(f.to)}${unit}` : show(f.to);
  return `${word.name}: ${from} → ${to}`;
}

/** "section: UKC 254x254x73 → UKC 305x305x97", "Gk: 240 → 400 kN". */
export const fieldWords = (f: FieldChange) => words(f, NODE_FIELD[f.field]);

/** "self-weight: on → off". */
export const optionWords = (f: FieldChange) => words(f, OPTION_FIELD[f.field]);

/** A level's elevation, keyed by its name ("Level Roof", and "Level 3" for a level named "Level 3", never
 *  "Level Level 3"); comparisons stored before names were unique may still carry an id, left out when not needed. */
export function levelWords(f: FieldChange, all: FieldChange[]): string {
  const name = f.field.replace(/ \(id [^)]*\)$/, '');
  const shared = all.filter((o) => o.field.replace(/ \(id [^)]*\)$/, '') === name).length > 1;
  return words(f, { name: levelWord(shared ? f.field : name), unit: 'm', show: elevation });
}

/** Signed change of utilisation to two places, or the word for a lift that came or went. */
export function utilisationDelta(l: LiftUtilisationChange): string {
  if (l.from === null) return 'new lift';
  if (l.to === null) return 'lift removed';
  const d = l.to - l.from;
  return `${d >= 0 ? '+' : '−'}${Math.abs(d).toFixed(2)}`;
}
