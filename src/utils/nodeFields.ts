// The fields of each node kind's properties form, with the unit in every label (docs/contracts.md §Stack document: m,
// kN). Lifts have their own form (section picker, buckling-length overrides).
import type { NodeKind } from '@shared/schema/stack.ts';
import type { FieldInfo } from '@/utils/formErrors.ts';
import { AXES_WORD, CATEGORY_WORD, FIXITY_WORD } from '@/utils/nodeWords.ts';

export interface FieldOption {
  label: string;
  value: string;
}

export interface FieldSpec extends FieldInfo {
  key: string;
  type: 'number' | 'text' | 'select';
  options?: FieldOption[];
  hint?: string;
  /** Decimal places a stored number is shown with. */
  places?: number;
}

const words = (record: Record<string, string>, keys: readonly string[]): FieldOption[] =>
  keys.map((value) => ({ value, label: record[value] }));

const fixity = (withFree: boolean): FieldSpec => ({
  key: 'fixity',
  label: 'Rotational fixity',
  type: 'select',
  options: words(FIXITY_WORD, withFree ? ['pinned', 'partial', 'fixed', 'free'] : ['pinned', 'partial', 'fixed']),
  hint: withFree ? 'Free: the top is a cantilever, which needs a fixed base segment' : undefined,
});
// To the millimetre, as the node titles and the levels show elevations.
const elevation: FieldSpec = { key: 'elevation', label: 'Elevation', unit: 'm', type: 'number', places: 3 };
const loads: FieldSpec[] = [
  {
    key: 'Gk',
    label: 'Permanent load Gk',
    unit: 'kN',
    type: 'number',
    hint: 'Characteristic, entering the column here',
  },
  { key: 'Qk', label: 'Imposed load Qk', unit: 'kN', type: 'number', hint: 'Characteristic, entering the column here' },
  {
    key: 'category',
    label: 'Imposed load category (EN 1991-1-1)',
    type: 'select',
    options: words(CATEGORY_WORD, ['A', 'B', 'C', 'D', 'E', 'H']),
  },
];

export const NODE_FIELDS: Record<Exclude<NodeKind, 'lift'>, FieldSpec[]> = {
  support: [elevation, fixity(false)],
  splice: [elevation],
  restraint: [
    elevation,
    { key: 'axes', label: 'Restrains buckling about', type: 'select', options: words(AXES_WORD, ['both', 'y', 'z']) },
    fixity(false),
    ...loads,
  ],
  cap: [elevation, fixity(true), ...loads],
  load: [{ key: 'label', label: 'Description', type: 'text' }, ...loads],
};

/** "Elevation (m)": the label a field shows. */
export function fieldLabel(f: FieldInfo): string {
  return f.unit ? `${f.label} (${f.unit})` : f.label;
}
