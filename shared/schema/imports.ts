// Imports and exports (docs/contracts.md §Imports): CSV columns, previews, problems and apply bodies. Both ends use
// these.
import { z } from 'zod';
import type { FloorSpan, Grid } from './building.ts';
import { categorySchema, sectionDimsSchema } from './stack.ts';

/** Columns of the level-loads file, in the order the template writes them (kN per level). */
export const LOAD_COLUMNS = ['stack', 'level', 'Gk_kN', 'Qk_kN', 'category'] as const;
/** Columns of the company-sections file; dimensions in mm, unused ones left empty. */
export const SECTION_COLUMNS = [
  'designation',
  'shape',
  'make',
  'h_mm',
  'b_mm',
  'tw_mm',
  'tf_mm',
  'r_mm',
  'd_mm',
  't_mm',
] as const;

/** Largest upload accepted, bytes. */
export const MAX_IMPORT_BYTES = 2 * 1024 * 1024;
/** Most data rows in one file: a guard, far above the stacks × levels of a real building. */
export const MAX_IMPORT_ROWS = 20_000;
/** Longest line read (characters): a real row is a few dozen; a line of a million commas is refused at once. */
export const MAX_IMPORT_LINE_CHARS = 4096;
/** Most problems listed in one reply; the rest are counted (problemsOmitted) and named in the last entry. */
export const MAX_LISTED_PROBLEMS = 100;

/** One thing wrong with an uploaded file. row is the file's line number (the header is row 1). */
export const importProblemSchema = z.object({
  row: z.number().int().min(0),
  column: z.string().nullable(),
  message: z.string(),
});
export type ImportProblem = z.infer<typeof importProblemSchema>;

export const floorLoadSchema = z.object({ Gk: z.number(), Qk: z.number(), category: categorySchema });
export type FloorLoad = z.infer<typeof floorLoadSchema>;

export const loadChangeSchema = z.object({
  row: z.number().int(),
  stack: z.string(),
  stackId: z.number().int(),
  level: z.string(),
  /** The restraint (or cap) at that level that receives the loads. */
  restraintId: z.string(),
  before: floorLoadSchema,
  after: floorLoadSchema,
});
export type LoadChange = z.infer<typeof loadChangeSchema>;

/** The version of each stack a preview was computed against; apply refuses (409) when one has moved. */
export const previewBasisSchema = z
  .array(z.object({ stackId: z.number().int().positive(), version: z.number().int().min(0) }))
  .max(10_000);
export type PreviewBasis = z.infer<typeof previewBasisSchema>;

export const loadsPreviewSchema = z.object({
  kind: z.literal('loads'),
  /** sha256 of the file: apply must send the same bytes. */
  fileHash: z.string(),
  rows: z.number().int(),
  unchanged: z.number().int(),
  changes: z.array(loadChangeSchema),
  problems: z.array(importProblemSchema),
  /** Problems found beyond the MAX_LISTED_PROBLEMS listed. */
  problemsOmitted: z.number().int().min(0).optional(),
  basis: previewBasisSchema,
});
export type LoadsPreview = z.infer<typeof loadsPreviewSchema>;

export const sectionChangeSchema = z.object({
  row: z.number().int(),
  designation: z.string(),
  before: sectionDimsSchema.nullable(),
  after: sectionDimsSchema,
});
export type SectionChange = z.infer<typeof sectionChangeSchema>;

export const sectionsPreviewSchema = z.object({
  kind: z.literal('sections'),
  fileHash: z.string(),
  rows: z.number().int(),
  unchanged: z.number().int(),
  changes: z.array(sectionChangeSchema),
  problems: z.array(importProblemSchema),
  /** Problems found beyond the MAX_LISTED_PROBLEMS listed. */
  problemsOmitted: z.number().int().min(0).optional(),
});
export type SectionsPreview = z.infer<typeof sectionsPreviewSchema>;

/** Text fields sent beside the file when applying: the preview's hash and basis, as JSON text. */
export const applyFieldsSchema = z
  .object({
    fileHash: z
      .string()
      .regex(/^[0-9a-f]{64}$/)
      .optional(),
    basis: z
      .string()
      .max(500_000)
      .transform((text, ctx) => {
        try {
          return JSON.parse(text) as unknown;
        } catch {
          ctx.addIssue({ code: 'custom', message: 'must be JSON' });
          return z.NEVER;
        }
      })
      .pipe(previewBasisSchema)
      .optional(),
  })
  .strict();

export const applyResultSchema = z.object({
  applied: z.number().int(),
  stacks: z.array(z.object({ stackId: z.number().int(), version: z.number().int() })),
});
export type ApplyResult = z.infer<typeof applyResultSchema>;

/** A building's own section as listed beside the catalogue (GET /api/buildings/:id/sections). */
export const companySectionHitSchema = z.object({
  designation: z.string(),
  series: z.literal('Company'),
  dims: sectionDimsSchema,
  /** kg/m, computed from the dimensions. */
  massPerMetre: z.number(),
});
export type CompanySectionHit = z.infer<typeof companySectionHitSchema>;

/** The grid as CSV (docs/building-model.md): one line per row, x or y, its name and position. */
export const GRID_COLUMNS = ['direction', 'name', 'position_m'] as const;
/** Floor loads as CSV: a level by name, a build-up by name (empty: none) and how the floor spans. */
export const FLOOR_LOAD_COLUMNS = ['level', 'buildup', 'span'] as const;

export interface GridPreview {
  fileHash: string;
  /** The grid the file gives (edges kept), or null while the file has problems. */
  grid: Grid | null;
  rows: { row: number; direction: 'x' | 'y'; name: string; position: number; change: 'new' | 'moved' | 'same' }[];
  problems: ImportProblem[];
}

export interface FloorLoadsPreview {
  fileHash: string;
  rows: {
    row: number;
    levelId: string;
    level: string;
    buildupId: string | null;
    buildup: string | null;
    span: FloorSpan;
    change: 'changed' | 'same';
  }[];
  problems: ImportProblem[];
}
