// Checking and approving revisions (docs/issue-workflow.md): preparing one, its review record, the check,
// comments, their resolution and reopening, and the approval that issues it. Replies are checked against the shared schemas.
import {
  preparedRevisionSchema,
  reviewSchema,
  type ApproveBody,
  type CheckBody,
  type CommentBody,
  type ResolveBody,
  type RevisionReview,
} from '@shared/schema/reviews.ts';
import type { FreezeBody, RevisionDetail } from '@shared/schema/revisions.ts';
import { apiFetch } from './http.ts';

const review = async (reply: Promise<unknown>): Promise<RevisionReview> => reviewSchema.parse(await reply);

export const reviewsApi = {
  /** Frozen for checking: not issued or mailed until a lead approves it. */
  async prepare(buildingId: number, body: FreezeBody & { afterRevisionId?: number | null }): Promise<RevisionDetail> {
    const reply = await apiFetch<unknown>('POST', `/buildings/${buildingId}/revisions/prepare`, body);
    preparedRevisionSchema.parse(reply);
    // The id, code and sign-offs are checked above; the rest is the revision detail every revision reply carries.
    return reply as RevisionDetail;
  },
  get: (revisionId: number) => review(apiFetch<unknown>('GET', `/revisions/${revisionId}/review`)),
  check: (revisionId: number, body: CheckBody = {}) =>
    review(apiFetch<unknown>('POST', `/revisions/${revisionId}/check`, body)),
  comment: (revisionId: number, body: CommentBody) =>
    review(apiFetch<unknown>('POST', `/revisions/${revisionId}/comments`, body)),
  resolve: (revisionId: number, commentId: number, body: ResolveBody = {}) =>
    review(apiFetch<unknown>('POST', `/revisions/${revisionId}/comments/${commentId}/resolve`, body)),
  reopen: (revisionId: number, commentId: number, body: ResolveBody = {}) =>
    review(apiFetch<unknown>('POST', `/revisions/${revisionId}/comments/${commentId}/reopen`, body)),
  approve: (revisionId: number, body: ApproveBody = {}) =>
    review(apiFetch<unknown>('POST', `/revisions/${revisionId}/approve`, body)),
};
