// Who else has the open stack and what they have selected (docs/live-protocol.md §Presence), and this
// person's own selection, which colleagues see.
import { computed, ref, shallowRef, watch } from 'vue';
import type { PresenceUser } from '@shared/schema/socket.ts';
import { selectNodes, type LiveSocket } from '@/api/live.ts';

export function useStackPresence() {
  const selection = ref<string[]>([]);
  const presence = shallowRef<PresenceUser[]>([]);
  const me = ref(0);

  let socket: LiveSocket | null = null;
  let stackId: number | null = null;
  /** Selections are sent only once the stack is joined (the server refuses them before). */
  let joined = false;

  const others = computed(() => presence.value.filter((u) => u.userId !== me.value));

  function attach(s: LiveSocket, id: number, userId: number): void {
    socket = s;
    stackId = id;
    me.value = userId;
    s.on('presence', (p) => {
      if (p.stackId === stackId) presence.value = p.users;
    });
  }

  /** After each (re-)join: colleagues see this person's selection again. */
  function joinedStack(): void {
    joined = true;
    if (socket && stackId !== null && selection.value.length) selectNodes(socket, stackId, selection.value);
  }

  function select(ids: string[]): void {
    const same = ids.length === selection.value.length && ids.every((id) => selection.value.includes(id));
    if (!same) selection.value = [...ids];
  }
  watch(selection, (ids) => {
    if (socket?.connected && stackId !== null && joined) selectNodes(socket, stackId, ids);
  });

  function reset(): void {
    socket = null;
    stackId = null;
    joined = false;
    selection.value = [];
    presence.value = [];
  }

  return { selection, presence, others, attach, joinedStack, select, reset };
}
