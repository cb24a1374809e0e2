// Sizing (docs/analysis-rules.md §Sizing): the request for a proposal of the lightest passing sections, and the
// preview the engine returns. Nothing here is stored; accepting a proposal sends ordinary updateNode ops.
import { z } from 'zod';
import { SERIES } from '../catalogue/types.ts';
import type { Issue } from './results.ts';
import { gradeSchema, type Grade } from './stack.ts';

/** A catalogue series, or 'HE' for HE A, HE B and HE M together (one nominal size spans all three). */
export const SIZING_SERIES = [...SERIES, 'HE'] as const;
export const sizingSeriesSchema = z.enum(SIZING_SERIES);
export type SizingSeries = z.infer<typeof sizingSeriesSchema>;

export const sizingRequestSchema = z
  .object({
    series: sizingSeriesSchema,
    grade: gradeSchema,
    /** Largest utilisation accepted, e.g. 0.9 to leave a margin. */
    target: z.number().finite().gt(0).max(1).default(1),
    /** A lift is never heavier (kg/m) than the lift below it. */
    noUpwardIncrease: z.boolean().default(true),
    /** Every lift of a stack keeps one serial size (nominal depth × width), so splices stay simple. */
    sameSerialSize: z.boolean().default(false),
    /** Only these sections of the series may be proposed. */
    allowed: z.array(z.string().trim().min(1).max(80)).min(1).max(500).optional(),
  })
  .strict();
export type SizingRequest = z.output<typeof sizingRequestSchema>;
export type SizingRequestInput = z.input<typeof sizingRequestSchema>;

/**
 * proposed: a lighter or heavier section than now; unchanged: the current section and grade are the
 * answer; none: no section of the series passes; blocked: not sized because a lift above has none.
 */
export type LiftSizingStatus = 'proposed' | 'unchanged' | 'none' | 'blocked';

export interface SectionChoice {
  section: string;
  grade: Grade;
  /** kg/m, from the section's dimensions (the value the self-weight uses). */
  massPerMetre: number;
  /**
   * With every lift as in this column of the preview (before: as now; after: the whole proposal);
   * null when the member check cannot take the current section (the message says why).
   */
  utilisation: number | null;
}

export interface LiftSizing {
  liftId: string;
  /** L1, L2, … from the bottom. */
  name: string;
  bottom: number;
  top: number;
  before: SectionChoice;
  after: SectionChoice | null;
  status: LiftSizingStatus;
  message?: string;
}

export interface StackSizing {
  /** Problems that stop the stack being analysed, so it is not sized. */
  errors: Issue[];
  /** Top lift first is how they were sized; listed here from the bottom like the results table. */
  lifts: LiftSizing[];
  /** The serial size every lift keeps when sameSerialSize is on. */
  serialSize: string | null;
  /** Every lift has a section at or below the target. */
  complete: boolean;
  /** Column mass, kg: as now, and with every proposed section (lifts without one keep theirs); null with errors. */
  massBefore: number | null;
  massAfter: number | null;
  /** Detailed splices that fail, or need a division plate, with the proposed sections (flagged, not hidden). */
  spliceFlags?: Issue[];
}

export interface StackSizingPreview extends StackSizing {
  stackId: number;
  name: string;
  /** The version the proposal was made on: the base version for accepting it. */
  version: number;
}

export interface BuildingSizingPreview {
  buildingId: number;
  stacks: StackSizingPreview[];
  /** Totals over the stacks without errors, kg. */
  massBefore: number;
  massAfter: number;
}
