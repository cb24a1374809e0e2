// The review of the open revision (docs/issue-workflow.md): its sign-offs and comments, and the steps the server
// lets this member take. After a step the revisions list is read again, so its sign-off column stays true.
import { ref } from 'vue';
import { defineStore } from 'pinia';
import type { ApproveBody, CommentBody, RevisionReview } from '@shared/schema/reviews.ts';
import type { FreezeBody, RevisionDetail } from '@shared/schema/revisions.ts';
import { reviewsApi } from '@/api/reviews.ts';
import { useNotifyStore } from './notify.ts';
import { useRevisionsStore } from './revisions.ts';

export const useReviewsStore = defineStore('reviews', () => {
  const notify = useNotifyStore();
  const revisions = useRevisionsStore();
  const review = ref<RevisionReview | null>(null);
  const busy = ref(false);

  async function load(revisionId: number): Promise<void> {
    try {
      review.value = await reviewsApi.get(revisionId);
    } catch (e) {
      notify.error(e, 'Could not read the review');
    }
  }

  /** Prepares a revision for checking; a refusal is thrown back so the dialog can list its reasons. */
  async function prepare(body: FreezeBody): Promise<RevisionDetail> {
    const buildingId = revisions.buildingId;
    if (buildingId === null) throw new Error('No building is open');
    const afterRevisionId = revisions.list.reduce<number | null>((m, r) => (m === null || r.id > m ? r.id : m), null);
    const created = await reviewsApi.prepare(buildingId, { afterRevisionId, ...body });
    await revisions.load(buildingId);
    await revisions.open(created.id);
    notify.success(`Revision ${created.code} prepared: it waits for its check`);
    return created;
  }

  /**
   * One step. Busy only while the server answers: the revisions list and the open revision are read again after
   * (their own errors are reported by their store), so the next step's button never waits on that refresh.
   */
  async function step(what: string, work: () => Promise<RevisionReview>): Promise<boolean> {
    busy.value = true;
    try {
      review.value = await work();
    } catch (e) {
      notify.error(e, `Could not ${what}`);
      return false;
    } finally {
      busy.value = false;
    }
    const refreshed = review.value.revisionId;
    if (revisions.buildingId !== null) void revisions.load(revisions.buildingId);
    void revisions.open(refreshed);
    return true;
  }

  const check = (id: number) => step('record the check', () => reviewsApi.check(id));
  const comment = (id: number, body: CommentBody) => step('add the comment', () => reviewsApi.comment(id, body));
  const resolve = (id: number, commentId: number) =>
    step('resolve the comment', () => reviewsApi.resolve(id, commentId));
  const reopen = (id: number, commentId: number) => step('reopen the comment', () => reviewsApi.reopen(id, commentId));
  async function approve(id: number, body: ApproveBody): Promise<boolean> {
    const ok = await step('approve the revision', () => reviewsApi.approve(id, body));
    if (ok && review.value) notify.success(`Revision ${review.value.code} approved and issued; the team is e-mailed`);
    return ok;
  }

  return { review, busy, load, prepare, check, comment, resolve, reopen, approve };
});
