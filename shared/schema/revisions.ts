// Frozen revisions (docs/contracts.md §Revisions): the freeze body, the immutable snapshot, the API replies and the
// comparison of two states of a building. Both ends use these; nothing is redeclared.
import { z } from 'zod';
import type { BuildingModel, StackPlacement } from './building.ts';
import type { Level } from './api.ts';
import type { AnalysisOptions, StackResult, StackStatus } from './results.ts';
import type { NodeKind, SectionDims, StackDocument } from './stack.ts';
import type { ReviewSummary } from './reviews.ts';

export const revisionPurposeSchema = z.enum(['preliminary', 'construction']);
export type RevisionPurpose = z.infer<typeof revisionPurposeSchema>;

/** Code prefix per purpose: P01, P02… for preliminary issues, C01, C02… for construction. */
export const REVISION_PREFIX: Record<RevisionPurpose, string> = { preliminary: 'P', construction: 'C' };

export const freezeBodySchema = z
  .object({
    note: z.string().trim().max(2000).default(''),
    purpose: revisionPurposeSchema,
    /** Required (true) when any lift has a utilisation above 1.0; the note must then say why. */
    acknowledgeFailingLifts: z.boolean().default(false),
    /**
     * The newest revision of the building its sender has seen (null: none). When given, a freeze is
     * refused (409) if a newer one exists, so a retried or doubled request makes one revision.
     */
    afterRevisionId: z.number().int().positive().max(Number.MAX_SAFE_INTEGER).nullable().optional(),
  })
  .strict();
export type FreezeBody = z.input<typeof freezeBodySchema>;

export const compareQuerySchema = z
  .object({
    from: z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER),
    to: z
      .union([z.literal('current'), z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER)])
      .default('current'),
  })
  .strict();
export type CompareQuery = z.infer<typeof compareQuerySchema>;

/** One stack as frozen: its document and the results of that version. */
export interface SnapshotStack {
  id: number;
  name: string;
  version: number;
  doc: StackDocument;
  results: StackResult;
  /** Where the stack stood on the grid, for a stack whose loads came from the floors (docs/building-model.md). */
  placement?: StackPlacement;
  /**
   * A typical column whose check a further position governs: the full results at that position (its take-down
   * and the working of every lift), which the package prints after the own place's (docs/typical-columns.md).
   */
  governingWorking?: { position: string; results: StackResult };
}

/** Everything a revision freezes. Its canonical JSON (sorted keys) is what the hash covers. */
export interface RevisionSnapshot {
  format: 1;
  building: { id: number; name: string; reference: string };
  code: string;
  purpose: RevisionPurpose;
  note: string;
  /** Set when lifts failed at freeze: who accepted that and which lifts. */
  acknowledgement: string | null;
  frozenAt: string;
  frozenBy: { id: number; name: string; email: string };
  engineVersion: string;
  options: AnalysisOptions;
  levels: Level[];
  stacks: SnapshotStack[];
  /** The grid, build-ups, floor loads and areas set by hand the derived loads came from; absent when the building has none. */
  buildingModel?: BuildingModel;
  /** The building's own sections the lifts use (by name), for the column schedule; absent when none. */
  sections?: Record<string, SectionDims>;
}

export type MailStatus = 'pending' | 'sent' | 'failed';

export interface RevisionRecipient {
  email: string;
  name: string;
  status: MailStatus;
  attempts: number;
  error: string | null;
  updatedAt: string;
}

export interface RevisionSummary {
  id: number;
  buildingId: number;
  code: string;
  purpose: RevisionPurpose;
  note: string;
  frozenAt: string;
  frozenBy: { id: number; name: string };
  /** SHA-256 (hex) of the canonical snapshot. */
  hash: string;
  stackCount: number;
  worstUtilisation: number | null;
  failingLifts: number;
  mail: Record<MailStatus, number>;
  /** Prepared, checked, approved (docs/issue-workflow.md). */
  review: ReviewSummary;
}

export interface RevisionStackSummary {
  id: number;
  name: string;
  version: number;
  governingLiftId: string | null;
  governingLiftLabel: string | null;
  governingSection: string | null;
  utilisation: number | null;
  status: StackStatus;
  /** Every lift as frozen (its node id for linking, its label L1, L2, … for people): what a check comment names. */
  lifts: { liftId: string; label: string }[];
}

export interface RevisionDetail extends RevisionSummary {
  engineVersion: string;
  acknowledgement: string | null;
  options: AnalysisOptions;
  levels: Level[];
  stacks: RevisionStackSummary[];
  recipients: RevisionRecipient[];
}

/** A refused freeze (422) lists what stops it in `details.reasons`. */
export interface FreezeRefusal {
  reasons: { stackId: number; stack: string; nodeId?: string; message: string }[];
}

export type Change = 'added' | 'removed' | 'changed';
export type FieldValue = string | number | null;

export interface FieldChange {
  field: string;
  from: FieldValue;
  to: FieldValue;
}

export interface NodeChange {
  nodeId: string;
  kind: NodeKind;
  /** Plain words for the node, e.g. "Restraint at +7.600" or "Lift lift-2". */
  label: string;
  change: Change;
  fields: FieldChange[];
}

export interface LiftUtilisationChange {
  liftId: string;
  /** L1, L2, … as the results name the lift (its node id for results stored before lifts had labels). */
  label: string;
  section: { from: string | null; to: string | null };
  from: number | null;
  to: number | null;
}

export interface StackComparison {
  stackId: number;
  name: string;
  change: Change;
  nodes: NodeChange[];
  lifts: LiftUtilisationChange[];
}

export interface RevisionComparison {
  from: { id: number; code: string };
  to: { id: number | null; code: string };
  stacks: StackComparison[];
  unchangedStacks: number;
  levels: FieldChange[];
  options: FieldChange[];
}
