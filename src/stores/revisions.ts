// Revisions of the open building: the list, one revision's detail with its mail status, freezing,
// resending, the package download and the comparison of two states.
import { ref } from 'vue';
import { defineStore } from 'pinia';
import type {
  FreezeBody,
  FreezeRefusal,
  RevisionComparison,
  RevisionDetail,
  RevisionSummary,
} from '@shared/schema/revisions.ts';
import { ApiError } from '@/api/http.ts';
import * as revisionsApi from '@/api/revisions.ts';
import { useLoad } from '@/composables/useLoad.ts';
import { useNotifyStore } from './notify.ts';

/** The 422 of a refused freeze carries its reasons; anything else has none. */
export function refusalReasons(e: unknown): FreezeRefusal['reasons'] {
  if (!(e instanceof ApiError) || e.status !== 422) return [];
  const details = e.details as Partial<FreezeRefusal> | undefined;
  return Array.isArray(details?.reasons) ? details.reasons : [];
}

export const useRevisionsStore = defineStore('revisions', () => {
  const notify = useNotifyStore();
  const buildingId = ref<number | null>(null);
  const list = ref<RevisionSummary[]>([]);
  const loading = useLoad();
  const detail = ref<RevisionDetail | null>(null);
  const comparison = ref<RevisionComparison | null>(null);
  const comparing = ref(false);

  async function load(id: number): Promise<void> {
    if (buildingId.value !== id) {
      list.value = [];
      detail.value = null;
      comparison.value = null;
    }
    buildingId.value = id;
    await loading.run(async () => {
      list.value = await revisionsApi.listRevisions(id);
    });
  }

  /** Freezes; a refusal is thrown back so the dialog can list its reasons. */
  async function freeze(body: FreezeBody): Promise<RevisionDetail> {
    if (buildingId.value === null) throw new Error('No building is open');
    // The newest revision this page shows: a doubled or retried request then cannot freeze twice.
    const afterRevisionId = list.value.reduce<number | null>((m, r) => (m === null || r.id > m ? r.id : m), null);
    const created = await revisionsApi.freezeRevision(buildingId.value, { afterRevisionId, ...body });
    detail.value = created;
    list.value = [created, ...list.value.filter((r) => r.id !== created.id)];
    // A lead's freeze of a construction revision waits for its check and approval (docs/issue-workflow.md).
    notify.success(
      created.review.state === 'issued'
        ? `Revision ${created.code} frozen; e-mail to ${created.recipients.length} member${created.recipients.length === 1 ? '' : 's'} is on its way`
        : `Revision ${created.code} frozen: it is issued once it is checked and approved`,
    );
    return created;
  }

  async function open(id: number): Promise<void> {
    try {
      detail.value = await revisionsApi.getRevision(id);
    } catch (e) {
      notify.error(e, 'Could not open the revision');
    }
  }

  /**
   * A colleague froze, checked, commented on or approved a revision (heard on the building's channel): the list
   * and, when it is the one open, the revision are read again, without the page going back to loading.
   */
  async function refresh(revisionId: number): Promise<void> {
    if (buildingId.value === null) return;
    try {
      list.value = await revisionsApi.listRevisions(buildingId.value);
      if (detail.value?.id === revisionId) detail.value = await revisionsApi.getRevision(revisionId);
    } catch (e) {
      notify.error(e, 'Could not bring the revisions up to date');
    }
  }

  async function resend(id: number): Promise<void> {
    try {
      const updated = await revisionsApi.resendRevision(id);
      detail.value = updated;
      list.value = list.value.map((r) => (r.id === id ? updated : r));
      if (updated.mail.failed > 0)
        notify.error(new Error(`${updated.mail.failed} e-mails still failed`), `Revision ${updated.code}`);
      else notify.success(`Revision ${updated.code}: every member has the e-mail`);
    } catch (e) {
      notify.error(e, 'Could not send the e-mails again');
    }
  }

  /** The package needs the bearer token, so it is fetched as a blob and saved, not linked. */
  /** The package is drawn again for each download, which takes seconds on a large building. */
  const downloading = ref<number | null>(null);

  async function download(rev: Pick<RevisionSummary, 'id' | 'code'>): Promise<void> {
    downloading.value = rev.id;
    try {
      await revisionsApi.downloadPackage(rev);
    } catch (e) {
      notify.error(e, `Could not download revision ${rev.code}`);
    } finally {
      downloading.value = null;
    }
  }

  async function compare(from: number, to: number | 'current'): Promise<void> {
    if (buildingId.value === null) return;
    comparing.value = true;
    try {
      comparison.value = await revisionsApi.compareRevisions(buildingId.value, from, to);
    } catch (e) {
      notify.error(e, 'Could not compare');
    } finally {
      comparing.value = false;
    }
  }

  return {
    buildingId,
    list,
    loaded: loading.outcome,
    detail,
    comparison,
    comparing,
    downloading,
    load,
    freeze,
    open,
    refresh,
    resend,
    download,
    compare,
  };
});
