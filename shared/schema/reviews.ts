// Checking and approving a revision (docs/issue-workflow.md): the bodies of the steps and comments, and the
// review record the server sends back. Both ends use these; the client validates every reply with them.
import { z } from 'zod';

const id = z.number().int().positive().max(Number.MAX_SAFE_INTEGER);

/** Where a revision stands. 'issued' covers revisions frozen before checking existed. */
export const reviewStateSchema = z.enum(['prepared', 'checked', 'issued', 'superseded']);
export type ReviewState = z.infer<typeof reviewStateSchema>;

export const signatureSchema = z.object({ name: z.string(), at: z.string() });
export type Signature = z.infer<typeof signatureSchema>;

export const reviewCommentSchema = z.object({
  id,
  stackId: id,
  stack: z.string(),
  /** A lift of that stack (its node id and its label, L1, L2, …); null: the comment is on the whole stack. */
  liftId: z.string().nullable(),
  lift: z.string().nullable(),
  text: z.string(),
  by: signatureSchema,
  resolved: z.object({ name: z.string(), at: z.string(), note: z.string() }).nullable(),
});
export type ReviewComment = z.infer<typeof reviewCommentSchema>;

/** What the caller may do next on this revision; the server decides, the client only shows or hides. */
export const reviewActionsSchema = z.object({
  check: z.boolean(),
  approve: z.boolean(),
  comment: z.boolean(),
  resolve: z.boolean(),
});
export type ReviewActions = z.infer<typeof reviewActionsSchema>;

export const reviewSchema = z.object({
  revisionId: id,
  code: z.string(),
  state: reviewStateSchema,
  prepared: signatureSchema,
  checked: signatureSchema.nullable(),
  approved: signatureSchema.nullable(),
  /** Issued as a preliminary issue without a check: the cover says so. */
  unchecked: z.boolean(),
  /** Why the lead approved with comments still open (printed on the cover); null when none were open. */
  openCommentsReason: z.string().nullable(),
  comments: z.array(reviewCommentSchema),
  actions: reviewActionsSchema,
});
export type RevisionReview = z.infer<typeof reviewSchema>;

/** The sign-offs as the revisions list shows them. */
export const reviewSummarySchema = z.object({
  state: reviewStateSchema,
  prepared: signatureSchema,
  checked: signatureSchema.nullable(),
  approved: signatureSchema.nullable(),
  unchecked: z.boolean(),
  openComments: z.number().int().nonnegative(),
});
export type ReviewSummary = z.infer<typeof reviewSummarySchema>;

/** The parts of a prepared revision's reply the client relies on (the rest is the RevisionDetail of revisions.ts). */
export const preparedRevisionSchema = z.looseObject({ id, code: z.string(), review: reviewSummarySchema });

const text = (max: number) => z.string().trim().max(max);

export const checkBodySchema = z.object({ note: text(2000).default('') }).strict();
export type CheckBody = z.input<typeof checkBodySchema>;

export const approveBodySchema = z
  .object({
    /** Required (non-empty) to approve while comments are open: it is stored and printed on the cover. */
    openCommentsReason: text(2000).default(''),
  })
  .strict();
export type ApproveBody = z.input<typeof approveBodySchema>;

export const commentBodySchema = z
  .object({
    stackId: id,
    liftId: z.string().min(1).max(100).nullable().default(null),
    text: text(2000).min(1, 'Write the comment'),
  })
  .strict();
export type CommentBody = z.input<typeof commentBodySchema>;

/** Resolving a comment, or reopening a resolved one: the note shown with the resolution, or why it is reopened
 *  (kept in the audit log with the resolution it undoes). */
export const resolveBodySchema = z.object({ note: text(2000).default('') }).strict();
export type ResolveBody = z.input<typeof resolveBodySchema>;

/** What the package prints of the review: the sign-offs and, when approved with comments open, why and which. */
export interface SignOff {
  prepared: Signature;
  checked: Signature | null;
  approved: Signature | null;
  unchecked: boolean;
  openCommentsReason: string | null;
  openComments: { stack: string; lift: string | null; text: string; by: string }[];
}
