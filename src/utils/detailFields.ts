// The fields of a splice detail and a base plate as the properties forms show them.
import { boltClassSchema, boltDiameterSchema, concreteClassSchema, gradeSchema } from '@shared/schema/stack.ts';
import type { FieldOption } from '@/utils/nodeFields.ts';

export interface DetailField {
  path: readonly string[];
  label: string;
  unit?: string;
  /** A select's options, their values as typed: a numeric field stores its choice as a number. */
  options?: FieldOption[];
  numeric: boolean;
}

const grades = gradeSchema.options.map((g) => ({ label: g, value: g }));
export const CONCRETE_CLASSES = concreteClassSchema.options;

export const SPLICE_FIELDS: readonly DetailField[] = [
  { path: ['plate', 'width'], label: 'Cover plate width', unit: 'mm', numeric: true },
  { path: ['plate', 'thickness'], label: 'Cover plate thickness', unit: 'mm', numeric: true },
  { path: ['plate', 'grade'], label: 'Plate grade', options: grades, numeric: false },
  { path: ['bolts', 'number'], label: 'Bolts a flange, each side', numeric: true },
  {
    path: ['bolts', 'diameter'],
    label: 'Bolt size',
    options: boltDiameterSchema.options.map((d) => ({ label: `M${d.value}`, value: String(d.value) })),
    numeric: true,
  },
  {
    path: ['bolts', 'class'],
    label: 'Bolt class',
    options: boltClassSchema.options.map((c) => ({ label: c, value: c })),
    numeric: false,
  },
];

export const BASE_PLATE_FIELDS: readonly DetailField[] = [
  { path: ['b'], label: 'Width b (across the flanges)', unit: 'mm', numeric: true },
  { path: ['l'], label: 'Length l (along the depth)', unit: 'mm', numeric: true },
  { path: ['t'], label: 'Thickness t', unit: 'mm', numeric: true },
  { path: ['grade'], label: 'Plate grade', options: grades, numeric: false },
  { path: ['grout'], label: 'Grout joint', unit: 'mm', numeric: true },
];
