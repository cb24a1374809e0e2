// The open stack: its document, version and results, kept in step with the server over the live channel.
// Edits are applied here at once (optimistically), sent one at a time, each on the version it was made
// against, and rolled back when the server refuses them. Undo and redo are new edits built locally.
import { computed, ref, shallowRef, watch } from 'vue';
import { defineStore } from 'pinia';
import { ROLE_RANK, type Building, type Level, type Role, type StackDetail } from '@shared/schema/api.ts';
import type { Op } from '@shared/schema/ops.ts';
import type { StackResult } from '@shared/schema/results.ts';
import type { PresenceUser, StackChanged, StackJoinAck } from '@shared/schema/socket.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import { applyOps as applyOpsToDoc } from '@shared/ops/applyOps.ts';
import { placeOnLevels } from '@shared/engine/stack/placeOnLevels.ts';
import { levelsApi } from '@/api/buildings.ts';
import { apiFetch } from '@/api/http.ts';
import { connectLive, joinStack, leaveStack, LiveError, selectNodes, sendEdit, type LiveSocket } from '@/api/live.ts';
import { drawnWhereLaidOut, inverseOps } from '@/composables/inverseOps.ts';
import { useUndoHistory, type HistoryEntry } from '@/composables/useUndoHistory.ts';
import { describeError, isNotFound, useNotifyStore } from './notify.ts';
import type { LoadState } from './buildings.ts';

interface PendingEdit {
  ops: Op[];
  label: string;
  /** The undo entry this edit created, dropped if the edit is refused. */
  history: HistoryEntry | null;
  state: 'queued' | 'sent' | 'acked';
  /** Version the server gave it, once acknowledged. */
  version?: number;
}

export type LinkState = 'connecting' | 'live' | 'offline';

export interface OpenOptions {
  token: string;
  userId: number;
  /** Socket.IO server URL; same origin when absent. */
  url?: string;
}

export const useStackStore = defineStore('stack', () => {
  const notify = useNotifyStore();
  const history = useUndoHistory();

  const stackId = ref<number | null>(null);
  const name = ref('');
  const buildingId = ref<number | null>(null);
  const role = ref<Role>('viewer');
  const state = ref<LoadState>('idle');
  const loadError = ref('');
  /** The stack does not exist or is not shared with this person. */
  const loadMissing = ref(false);
  const buildingName = ref('');
  /** The building's levels: they place the tied nodes and name take-down rows (read on opening, on every join
   *  and with a change that moved a level). */
  const levels = shallowRef<Level[]>([]);
  const link = ref<LinkState>('connecting');
  const confirmed = shallowRef<StackDocument | null>(null);
  const version = ref(0);
  const results = shallowRef<StackResult | null>(null);
  /** The x line of the stack's place on the grid when it was opened; null off the grid (docs/building-model.md). */
  const gridX = ref<string | null>(null);
  const pending = shallowRef<PendingEdit[]>([]);
  const selection = ref<string[]>([]);
  const presence = shallowRef<PresenceUser[]>([]);
  /** The nodes the latest change touched and the colleague who made it (null for one's own), so a form can
   *  say who replaced what its user was typing. */
  const lastChange = shallowRef<{ nodeIds: ReadonlySet<string>; by: string | null }>({ nodeIds: new Set(), by: null });

  let socket: LiveSocket | null = null;
  let me = 0;
  let joined = false;
  /** Bumped on every (re-)join so that answers to edits sent before it are ignored. */
  let generation = 0;

  /** Edits made while the link is down wait in the queue and are sent after the re-join. */
  const canEdit = computed(() => ROLE_RANK[role.value] >= ROLE_RANK.engineer && confirmed.value !== null);
  const isViewer = computed(() => ROLE_RANK[role.value] < ROLE_RANK.engineer);
  const saving = computed(() => pending.value.length > 0);
  const others = computed(() => presence.value.filter((u) => u.userId !== me));

  /** What the user sees: the server's document with every edit still on its way applied on top, its tied
   *  nodes at their levels' elevations (a copy in the document is never trusted: docs/stack-editing.md). */
  const doc = computed<StackDocument | null>(() => {
    if (!confirmed.value) return null;
    let d = confirmed.value;
    for (const p of pending.value) d = tryApply(d, p.ops) ?? d;
    return placeOnLevels(d, levels.value);
  });

  function tryApply(d: StackDocument, ops: Op[]): StackDocument | null {
    try {
      return applyOpsToDoc(d, ops);
    } catch {
      // An edit that no longer applies is reported when the server answers for it.
      return null;
    }
  }

  async function open(id: number, opts: OpenOptions): Promise<void> {
    close();
    stackId.value = id;
    me = opts.userId;
    state.value = 'loading';
    try {
      const detail = await apiFetch<StackDetail>('GET', `/stacks/${id}`);
      const [building, buildingLevels] = await Promise.all([
        apiFetch<Building>('GET', `/buildings/${detail.buildingId}`),
        levelsApi.list(detail.buildingId),
      ]);
      if (stackId.value !== id) return;
      takeLevels(buildingLevels);
      name.value = detail.name;
      buildingId.value = detail.buildingId;
      gridX.value = detail.gridX ?? null;
      buildingName.value = building.name;
      role.value = building.role;
      takeServerState(detail);
      state.value = 'ready';
    } catch (e) {
      loadError.value = describeError(e);
      loadMissing.value = isNotFound(e);
      state.value = 'error';
      return;
    }
    connect(opts);
  }

  function connect(opts: OpenOptions): void {
    const s = connectLive(opts.token, opts.url);
    socket = s;
    link.value = 'connecting';
    s.on('connect', () => void join());
    s.on('disconnect', () => (link.value = 'offline'));
    s.on('connect_error', () => (link.value = 'offline'));
    s.on('stack:changed', onChanged);
    s.on('presence', (p) => {
      if (p.stackId === stackId.value) presence.value = p.users;
    });
  }

  function takeServerState(s: StackJoinAck | StackDetail): void {
    if ('levels' in s && s.levels) takeLevels(s.levels);
    confirmed.value = s.doc;
    version.value = s.version;
    results.value = s.results;
  }

  /** Joins (or re-joins after a conflict or a reconnect) and takes the server's document. */
  async function join(): Promise<void> {
    if (!socket || stackId.value === null) return;
    generation++;
    try {
      const ack = await joinStack(socket, stackId.value);
      takeServerState(ack);
      link.value = 'live';
      if (joined) reapplyPending();
      joined = true;
      if (selection.value.length) selectNodes(socket, stackId.value, selection.value);
      pump();
    } catch (e) {
      link.value = 'offline';
      notify.error(e, 'Could not open the live connection');
    }
  }

  /** After a re-join: keep the waiting edits that still apply to the server's document; report the rest. */
  function reapplyPending(): void {
    let d = confirmed.value as StackDocument;
    const kept: PendingEdit[] = [];
    for (const p of pending.value) {
      const next = tryApply(d, p.ops);
      if (next) {
        d = next;
        kept.push({ ...p, state: 'queued', version: undefined });
      } else refuse(p, 'it no longer fits the latest version of the stack');
    }
    pending.value = kept;
  }

  function refuse(p: PendingEdit, reason: string): void {
    if (p.history) history.forget(p.history);
    notify.error(new Error(`${p.label} was not applied: ${reason}`));
  }

  /** Sends the next queued edit when none is in flight. */
  function pump(): void {
    const next = pending.value.find((p) => p.state !== 'acked');
    if (!socket || !next || next.state === 'sent' || link.value !== 'live' || stackId.value === null) return;
    const base = Math.max(version.value, ...pending.value.map((p) => p.version ?? 0));
    next.state = 'sent';
    const gen = generation;
    sendEdit(socket, stackId.value, base, next.ops).then(
      (ack) => {
        if (gen !== generation || !pending.value.includes(next)) return pump();
        next.state = 'acked';
        next.version = ack.version;
        if (ack.version === version.value + 1 && pending.value[0] === next) commitHead(ack.version);
        pump();
      },
      (e: unknown) => {
        if (gen !== generation) return;
        const code = e instanceof LiveError ? e.code : 'internal';
        if (code === 'conflict' || code === 'timeout') return void join();
        pending.value = pending.value.filter((p) => p !== next);
        refuse(next, describeError(e));
        reapplyPending();
        pump();
      },
    );
  }

  function commitHead(v: number): void {
    const [head, ...rest] = pending.value;
    confirmed.value = applyOpsToDoc(confirmed.value as StackDocument, head.ops);
    version.value = v;
    pending.value = rest;
  }

  function onChanged(c: StackChanged): void {
    if (c.stackId !== stackId.value || !confirmed.value) return;
    if (c.version <= version.value) {
      if (c.version !== version.value) return;
      if (c.levels) takeLevels(c.levels);
      results.value = c.results;
      return;
    }
    if (c.version > version.value + 1) return void join();
    const head = pending.value[0];
    const mine =
      head &&
      (head.version === c.version ||
        (head.state === 'sent' && c.by.userId === me && JSON.stringify(head.ops) === JSON.stringify(c.ops)));
    if (mine) {
      commitHead(c.version);
    } else {
      const next = tryApply(confirmed.value, c.ops);
      if (!next) return void join();
      lastChange.value = {
        nodeIds: new Set(c.ops.flatMap((op) => (op.op === 'updateNode' || op.op === 'removeNode' ? [op.id] : []))),
        by: c.by.name,
      };
      confirmed.value = next;
      version.value = c.version;
    }
    if (c.levels) takeLevels(c.levels);
    results.value = c.results;
    pump();
  }

  function takeLevels(list: readonly Level[]): void {
    levels.value = [...list].sort((a, b) => a.elevation - b.elevation);
  }

  /** Applies `ops` at once and queues them for the server; false (with a message) when they do not apply. */
  function edit(ops: Op[], label: string, record: 'new' | 'undo' | 'redo' = 'new'): boolean {
    const before = doc.value;
    if (!before || !canEdit.value || ops.length === 0) return false;
    try {
      applyOpsToDoc(before, ops);
    } catch (e) {
      notify.error(e, `${label} is not possible`);
      return false;
    }
    // A node drawn where the layout puts it has no stored position: undoing a move puts it back there.
    lastChange.value = { nodeIds: new Set(), by: null };
    const entry: HistoryEntry = { label, ops: inverseOps(before, ops, applyOpsToDoc, drawnWhereLaidOut(before)) };
    if (record === 'new') history.record(entry);
    else if (record === 'undo') history.pushRedo(entry);
    else history.pushUndo(entry);
    pending.value = [...pending.value, { ops, label, history: entry, state: 'queued' }];
    pump();
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

  function select(ids: string[]): void {
    const same = ids.length === selection.value.length && ids.every((id) => selection.value.includes(id));
    if (!same) selection.value = [...ids];
  }
  watch(selection, (ids) => {
    if (socket?.connected && stackId.value !== null && joined) selectNodes(socket, stackId.value, ids);
  });

  function close(): void {
    if (socket) {
      if (stackId.value !== null && socket.connected) leaveStack(socket, stackId.value);
      socket.removeAllListeners();
      socket.disconnect();
    }
    socket = null;
    joined = false;
    generation++;
    stackId.value = null;
    confirmed.value = null;
    results.value = null;
    pending.value = [];
    selection.value = [];
    presence.value = [];
    history.clear();
    state.value = 'idle';
    loadError.value = '';
    loadMissing.value = false;
    buildingName.value = '';
    levels.value = [];
    link.value = 'connecting';
  }

  return {
    stackId,
    name,
    buildingId,
    gridX,
    buildingName,
    levels,
    lastChange,
    role,
    state,
    loadError,
    loadMissing,
    link,
    doc,
    version,
    results,
    selection,
    presence,
    others,
    canEdit,
    isViewer,
    saving,
    canUndo: history.canUndo,
    canRedo: history.canRedo,
    undoLabel: history.undoLabel,
    redoLabel: history.redoLabel,
    open,
    close,
    edit,
    undo,
    redo,
    select,
  };
});
