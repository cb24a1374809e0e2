// The development mail catcher for site admins: the captured messages, newest first, the one open
// in the detail pane, and attachment downloads.
import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import type { OutboxMessage } from '@shared/schema/outbox.ts';
import { fetchOutboxAttachment, listOutbox } from '@/api/outbox.ts';
import { saveBlob } from '@/api/download.ts';
import { useLoad } from '@/composables/useLoad.ts';
import { useNotifyStore } from './notify.ts';

/** Newest first by capture time; the id breaks ties between messages of the same instant. */
export function newestFirst(messages: OutboxMessage[]): OutboxMessage[] {
  return [...messages].sort((a, b) => b.createdAt.localeCompare(a.createdAt) || b.id - a.id);
}

export const useOutboxStore = defineStore('outbox', () => {
  const notify = useNotifyStore();
  const messages = ref<OutboxMessage[]>([]);
  const loading = useLoad();
  const selectedId = ref<number | null>(null);
  const selected = computed(() => messages.value.find((m) => m.id === selectedId.value) ?? null);

  async function load(): Promise<void> {
    await loading.run(async () => {
      messages.value = newestFirst(await listOutbox());
    });
  }

  function select(id: number | null): void {
    selectedId.value = id;
  }

  async function downloadAttachment(message: OutboxMessage, index: number): Promise<void> {
    const attachment = message.attachments[index];
    if (!attachment) return;
    try {
      saveBlob(await fetchOutboxAttachment(message.id, index), attachment.filename);
    } catch (e) {
      notify.error(e, `Could not download ${attachment.filename}`);
    }
  }

  return { messages, loaded: loading.outcome, selectedId, selected, load, select, downloadAttachment };
});
