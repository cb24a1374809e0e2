// The sync protocol of one open stack (docs/live-protocol.md): the server's document, version and results, and
// the edits still on their way. Edits are applied at once (optimistically), sent one at a time, each on the
// version it was made against and under its own id, and rolled back when the server refuses them. A change
// whose id is the head edit's is that edit coming back; any other is a colleague's.
import { computed, ref, shallowRef } from 'vue';
import type { Level } from '@shared/schema/api.ts';
import type { Op } from '@shared/schema/ops.ts';
import type { StackResult } from '@shared/schema/results.ts';
import type { StackChanged, StackJoinAck } from '@shared/schema/socket.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import { applyOps as applyOpsToDoc } from '@shared/ops/applyOps.ts';
import { joinStack, LiveError, newEditId, onStackChanged, sendEdit, type LiveSocket } from '@/api/live.ts';
import { describeError } from '@/stores/notify.ts';

export interface PendingEdit<Tag = unknown> {
  /** Echoed by the server in the ack and the broadcast of this edit. */
  id: string;
  ops: Op[];
  label: string;
  /** What the caller wants back when the edit is refused (the store: its undo entry). */
  tag: Tag;
  state: 'queued' | 'sent' | 'acked';
  /** Version the server gave it, once acknowledged. */
  version?: number;
}

export type LinkState = 'connecting' | 'live' | 'offline';

export interface SyncHooks<Tag> {
  /** Every successful join (the first and each re-join), with the server's answer. */
  joined: (ack: StackJoinAck, first: boolean) => void;
  joinFailed: (e: unknown, first: boolean) => void;
  /** An edit the server will not take: the reason is in words. */
  refused: (edit: PendingEdit<Tag>, reason: string) => void;
  /** A change that moved a level, with the building's levels after it (docs/live-protocol.md). */
  levelsMoved: (levels: Level[]) => void;
  /** Places what the user sees (the store: tied nodes at their levels' elevations, docs/stack-editing.md). */
  place: (doc: StackDocument) => StackDocument;
}

function tryApply(d: StackDocument, ops: Op[]): StackDocument | null {
  try {
    return applyOpsToDoc(d, ops);
  } catch {
    // An edit that no longer applies is reported when the server answers for it.
    return null;
  }
}

/** The nodes a change names (updated or removed), for a form to say who replaced what its user was typing. */
const touchedNodes = (ops: Op[]): Set<string> =>
  new Set(ops.flatMap((op) => (op.op === 'updateNode' || op.op === 'removeNode' ? [op.id] : [])));

export function useStackSync<Tag>(hooks: SyncHooks<Tag>) {
  const link = ref<LinkState>('connecting');
  const confirmed = shallowRef<StackDocument | null>(null);
  const version = ref(0);
  const results = shallowRef<StackResult | null>(null);
  const pending = shallowRef<PendingEdit<Tag>[]>([]);
  /** The nodes the latest change touched and the colleague who made it (null for one's own). */
  const lastChange = shallowRef<{ nodeIds: ReadonlySet<string>; by: string | null }>({ nodeIds: new Set(), by: null });

  let socket: LiveSocket | null = null;
  let stackId: number | null = null;
  let joined = false;
  /** Bumped on every (re-)join so that answers to edits sent before it are ignored. */
  let generation = 0;

  /** What the user sees: the server's document with every edit still on its way applied on top. */
  const doc = computed<StackDocument | null>(() => {
    if (!confirmed.value) return null;
    let d = confirmed.value;
    for (const p of pending.value) d = tryApply(d, p.ops) ?? d;
    return hooks.place(d);
  });
  const saving = computed(() => pending.value.length > 0);

  function attach(s: LiveSocket, id: number): void {
    socket = s;
    stackId = id;
    link.value = 'connecting';
    s.on('connect', () => void join());
    s.on('disconnect', () => (link.value = 'offline'));
    s.on('connect_error', () => (link.value = 'offline'));
    onStackChanged(s, onChanged, () => void join());
  }

  /** Joins (or re-joins after a conflict or a reconnect) and takes the server's document. */
  async function join(): Promise<void> {
    if (!socket || stackId === null) return;
    generation++;
    const first = !joined;
    try {
      const ack = await joinStack(socket, stackId);
      confirmed.value = ack.doc;
      version.value = ack.version;
      results.value = ack.results;
      link.value = 'live';
      if (joined) reapplyPending();
      joined = true;
      hooks.joined(ack, first);
      pump();
    } catch (e) {
      link.value = 'offline';
      hooks.joinFailed(e, first);
    }
  }

  /** After a re-join: keep the waiting edits that still apply to the server's document; report the rest. */
  function reapplyPending(): void {
    let d = confirmed.value as StackDocument;
    const kept: PendingEdit<Tag>[] = [];
    for (const p of pending.value) {
      const next = tryApply(d, p.ops);
      if (next) {
        d = next;
        kept.push({ ...p, state: 'queued', version: undefined });
      } else hooks.refused(p, 'it no longer fits the latest version of the stack');
    }
    pending.value = kept;
  }

  /** Sends the next queued edit when none is in flight. */
  function pump(): void {
    const next = pending.value.find((p) => p.state !== 'acked');
    if (!socket || !next || next.state === 'sent' || link.value !== 'live' || stackId === null) return;
    const base = Math.max(version.value, ...pending.value.map((p) => p.version ?? 0));
    next.state = 'sent';
    const gen = generation;
    sendEdit(socket, stackId, base, next.ops, next.id).then(
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
        hooks.refused(next, describeError(e));
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
    if (c.stackId !== stackId || !confirmed.value) return;
    if (c.version <= version.value) {
      if (c.version !== version.value) return;
      if (c.levels) hooks.levelsMoved(c.levels);
      results.value = c.results;
      return;
    }
    if (c.version > version.value + 1) return void join();
    const head = pending.value[0];
    const mine = head && (head.version === c.version || (c.editId !== undefined && c.editId === head.id));
    if (mine) {
      commitHead(c.version);
    } else {
      const next = tryApply(confirmed.value, c.ops);
      if (!next) return void join();
      lastChange.value = { nodeIds: touchedNodes(c.ops), by: c.by.name };
      confirmed.value = next;
      version.value = c.version;
    }
    if (c.levels) hooks.levelsMoved(c.levels);
    results.value = c.results;
    pump();
  }

  /** Queues ops already checked to apply on `doc`, and sends them when the link allows. */
  function enqueue(ops: Op[], label: string, tag: Tag): void {
    lastChange.value = { nodeIds: new Set(), by: null };
    pending.value = [...pending.value, { id: newEditId(), ops, label, tag, state: 'queued' }];
    pump();
  }

  /** Forgets the stack (closing it); the socket is the caller's to close. */
  function reset(): void {
    socket = null;
    stackId = null;
    joined = false;
    generation++;
    confirmed.value = null;
    results.value = null;
    pending.value = [];
    link.value = 'connecting';
  }

  return { link, doc, version, results, saving, lastChange, attach, enqueue, reset };
}
