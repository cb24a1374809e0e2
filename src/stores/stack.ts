// The open stack: what the stack page shows and the edits it makes. Opening is one join on the live channel,
// whose answer carries the document, results, building, role and levels (docs/live-protocol.md). The sync
// protocol (useStackSync), the undo history (useUndoHistory) and presence (useStackPresence) each live in
// their own composable; this store opens and closes them together and turns edits into undoable steps.
import { computed, ref, shallowRef } from 'vue';
import { defineStore } from 'pinia';
import { ROLE_RANK, type Level, type Role } from '@shared/schema/api.ts';
import type { Op } from '@shared/schema/ops.ts';
import { applyOps as applyOpsToDoc } from '@shared/ops/applyOps.ts';
import { placeOnLevels } from '@shared/engine/stack/placeOnLevels.ts';
import { notifyUnauthorised } from '@/api/http.ts';
import { connectLive, isSessionRefusal, LiveError, leaveStack, type LiveSocket } from '@/api/live.ts';
import { drawnWhereLaidOut, inverseOps } from '@/utils/inverseOps.ts';
import { useStackPresence } from '@/composables/useStackPresence.ts';
import { useStackSync } from '@/composables/useStackSync.ts';
import { useUndoHistory, type HistoryEntry } from '@/composables/useUndoHistory.ts';
import { useLoad } from '@/composables/useLoad.ts';
import { isNotFound, useNotifyStore } from './notify.ts';

export type { LinkState } from '@/composables/useStackSync.ts';

export interface OpenOptions {
  token: string;
  userId: number;
  /** Socket.IO server URL; same origin when absent. */
  url?: string;
}

export const useStackStore = defineStore('stack', () => {
  const notify = useNotifyStore();
  const history = useUndoHistory();
  const presence = useStackPresence();
  const sync = useStackSync<HistoryEntry | null>({
    joined(ack, first) {
      name.value = ack.name;
      buildingId.value = ack.buildingId;
      buildingName.value = ack.buildingName;
      role.value = ack.role;
      gridX.value = ack.gridX ?? null;
      takeLevels(ack.levels);
      if (first) opening.outcome.state = 'ready';
      presence.joinedStack();
      settleOpening();
    },
    joinFailed(e, first) {
      if (first && opening.outcome.state !== 'ready') return failOpening(e);
      notify.error(e, 'Could not open the live connection');
    },
    refused(edit, reason) {
      if (edit.tag) history.forget(edit.tag);
      notify.error(new Error(`${edit.label} was not applied: ${reason}`));
    },
    levelsMoved: (list) => takeLevels(list),
    // A copy of a level's elevation in the document is never trusted (docs/stack-editing.md).
    place: (d) => placeOnLevels(d, levels.value),
  });

  const stackId = ref<number | null>(null);
  const name = ref('');
  const buildingId = ref<number | null>(null);
  const role = ref<Role>('viewer');
  /** How opening the stack went; `missing`: it does not exist or is not shared with this person. */
  const opening = useLoad();
  const buildingName = ref('');
  /** The building's levels: they place the tied nodes and name take-down rows (from every join, and with a
   *  change that moved a level). */
  const levels = shallowRef<Level[]>([]);
  /** The x line of the stack's place on the grid; null off the grid (docs/building-model.md). */
  const gridX = ref<string | null>(null);

  function takeLevels(list: readonly Level[]): void {
    levels.value = [...list].sort((a, b) => a.elevation - b.elevation);
  }

  let socket: LiveSocket | null = null;
  /** Resolves the promise `open` returned, once the stack is open or could not be. */
  let settleOpening: () => void = () => undefined;

  /** Edits made while the link is down wait in the queue and are sent after the re-join. */
  const canEdit = computed(() => ROLE_RANK[role.value] >= ROLE_RANK.engineer && sync.doc.value !== null);
  const isViewer = computed(() => ROLE_RANK[role.value] < ROLE_RANK.engineer);

  /** A stack that cannot be opened: gone, not shared, or the server out of reach (the page offers a retry). */
  function failOpening(e: unknown): void {
    const missing = isNotFound(e) || (e instanceof LiveError && e.code === 'not_found');
    opening.failed(e, missing);
    settleOpening();
    // Refused for good: stop trying. Out of reach: Socket.IO keeps trying and a later join opens the page.
    if (missing || (e instanceof LiveError && e.code === 'forbidden')) disconnect();
  }

  /** Opens the stack; resolves once it is open or could not be (`opened` says which). */
  function open(id: number, opts: OpenOptions): Promise<void> {
    close();
    const opened = new Promise<void>((resolve) => (settleOpening = resolve));
    stackId.value = id;
    opening.outcome.state = 'loading';
    const s = connectLive(opts.token, opts.url);
    socket = s;
    sync.attach(s, id);
    presence.attach(s, id, opts.userId);
    s.on('connect_error', (e) => {
      if (isSessionRefusal(e)) return notifyUnauthorised();
      if (opening.outcome.state === 'loading') failOpening(new Error(`Cannot reach the server (${e.message})`));
    });
    return opened;
  }

  /** Applies `ops` at once and queues them for the server; false (with a message) when they do not apply. */
  function edit(ops: Op[], label: string, record: 'new' | 'undo' | 'redo' = 'new'): boolean {
    const before = sync.doc.value;
    if (!before || !canEdit.value || ops.length === 0) return false;
    try {
      applyOpsToDoc(before, ops);
    } catch (e) {
      notify.error(e, `${label} is not possible`);
      return false;
    }
    // A node drawn where the layout puts it has no stored position: undoing a move puts it back there.
    const entry: HistoryEntry = { label, ops: inverseOps(before, ops, applyOpsToDoc, drawnWhereLaidOut(before)) };
    if (record === 'new') history.record(entry);
    else if (record === 'undo') history.pushRedo(entry);
    else history.pushUndo(entry);
    sync.enqueue(ops, label, entry);
    return true;
  }

  function undo(): void {
    const entry = history.popUndo();
    if (entry && !edit(entry.ops, `Undo ${entry.label.toLowerCase()}`, 'undo')) history.pushUndo(entry);
  }
  function redo(): void {
    const entry = history.popRedo();
    if (entry && !edit(entry.ops, `Redo ${entry.label.toLowerCase()}`, 'redo')) history.pushRedo(entry);
  }

  function disconnect(): void {
    if (socket) {
      if (stackId.value !== null && socket.connected) leaveStack(socket, stackId.value);
      socket.removeAllListeners();
      socket.disconnect();
    }
    socket = null;
  }

  function close(): void {
    disconnect();
    sync.reset();
    presence.reset();
    history.clear();
    stackId.value = null;
    opening.reset();
    buildingName.value = '';
    levels.value = [];
    gridX.value = null;
  }

  return {
    stackId,
    name,
    buildingId,
    buildingName,
    gridX,
    levels,
    lastChange: sync.lastChange,
    role,
    opened: opening.outcome,
    link: sync.link,
    doc: sync.doc,
    version: sync.version,
    results: sync.results,
    selection: presence.selection,
    presence: presence.presence,
    others: presence.others,
    canEdit,
    isViewer,
    saving: sync.saving,
    canUndo: history.canUndo,
    canRedo: history.canRedo,
    undoLabel: history.undoLabel,
    redoLabel: history.redoLabel,
    open,
    close,
    edit,
    undo,
    redo,
    select: presence.select,
  };
});
