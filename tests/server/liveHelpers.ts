// Real socket.io-client connections to a test server, with promise-returning emits.
import { io, type Socket } from 'socket.io-client';
import type {
  BuildingStackChanged,
  BuildingStacksChanged,
  ClientToServerEvents,
  ServerToClientEvents,
  StackChanged,
  StackJoinAck,
} from '../../shared/schema/socket.ts';
import type { ApiErrorBody } from '../../shared/schema/errors.ts';
import type { Op } from '../../shared/schema/ops.ts';
import type { StackDocument } from '../../shared/schema/stack.ts';
import { applyOps } from '../../shared/ops/applyOps.ts';

export type LiveClient = Socket<ServerToClientEvents, ClientToServerEvents>;
export type AckReply<T> = { ok: true; data: T } | ({ ok: false } & ApiErrorBody);

export function connect(url: string, token: string | null): Promise<LiveClient> {
  const socket: LiveClient = io(url, {
    auth: token ? { token } : {},
    transports: ['websocket'],
    reconnection: false,
    forceNew: true,
  });
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket));
    socket.once('connect_error', (err) => {
      socket.close();
      reject(err);
    });
  });
}

/** Emits an event and resolves with its acknowledgement (any payload, valid or not). */
export function request<T>(
  socket: LiveClient,
  event: string,
  payload: unknown,
  timeoutMs = 10_000,
): Promise<AckReply<T>> {
  return new Promise((resolve, reject) => {
    const emit = socket.timeout(timeoutMs).emit as unknown as (
      e: string,
      p: unknown,
      cb: (err: Error | null, res: AckReply<T>) => void,
    ) => void;
    emit.call(socket.timeout(timeoutMs), event, payload, (err, res) => (err ? reject(err) : resolve(res)));
  });
}

/** Resolves with the next `event` that satisfies `match`, or rejects after timeoutMs. */
export function next<E extends keyof ServerToClientEvents>(
  socket: LiveClient,
  event: E,
  match: (p: Parameters<ServerToClientEvents[E]>[0]) => boolean = () => true,
  timeoutMs = 5000,
): Promise<Parameters<ServerToClientEvents[E]>[0]> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      socket.off(event, listener as never);
      reject(new Error(`no ${String(event)} within ${timeoutMs} ms`));
    }, timeoutMs);
    const listener = (p: Parameters<ServerToClientEvents[E]>[0]) => {
      if (!match(p)) return;
      clearTimeout(timer);
      socket.off(event, listener as never);
      resolve(p);
    };
    socket.on(event, listener as never);
  });
}

/**
 * The building room's summary of one stack: from `building:stack-changed`, or from `building:stacks-changed`
 * when the write changed several stacks of the building (docs/live-protocol.md).
 */
export function nextStackSummary(
  socket: LiveClient,
  match: (p: BuildingStackChanged) => boolean,
  timeoutMs = 5000,
): Promise<BuildingStackChanged> {
  return new Promise((resolve, reject) => {
    const stop = () => {
      clearTimeout(timer);
      socket.off('building:stack-changed', one);
      socket.off('building:stacks-changed', many);
    };
    const timer = setTimeout(() => {
      stop();
      reject(new Error(`no building summary of the stack within ${timeoutMs} ms`));
    }, timeoutMs);
    const one = (p: BuildingStackChanged) => {
      if (!match(p)) return;
      stop();
      resolve(p);
    };
    const many = (p: BuildingStacksChanged) => {
      const found = p.stacks.find(match);
      if (found) one(found);
    };
    socket.on('building:stack-changed', one);
    socket.on('building:stacks-changed', many);
  });
}

/** A small deterministic PRNG (mulberry32) so a failing run can be repeated. */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A simulated editor: keeps its own copy of the document from join + stack:changed, like the client does. */
export class Editor {
  doc!: StackDocument;
  version = 0;
  acked: { version: number; ops: Op[] }[] = [];
  conflicts = 0;
  private added = 0;
  private readonly early = new Map<number, Op[]>();
  constructor(
    readonly name: string,
    readonly socket: LiveClient,
    readonly stackId: number,
    readonly rand: () => number,
  ) {
    // Changes committed on different server processes can arrive out of order through the Redis
    // adapter (a process emits its own commit at once, another's a moment later): hold each one until
    // every version before it has been applied. The tests then check that every version did arrive.
    socket.on('stack:changed', (p: StackChanged) => {
      if (p.stackId !== stackId || p.version <= this.version) return;
      this.early.set(p.version, p.ops);
      this.applyInOrder();
    });
  }
  async join(): Promise<void> {
    const r = await request<StackJoinAck>(this.socket, 'stack:join', { stackId: this.stackId });
    if (!r.ok) throw new Error(r.error.message);
    if (r.data.version >= this.version) {
      this.doc = r.data.doc;
      this.version = r.data.version;
      this.applyInOrder();
    }
  }
  private applyInOrder(): void {
    for (const v of this.early.keys()) if (v <= this.version) this.early.delete(v);
    for (let ops = this.early.get(this.version + 1); ops; ops = this.early.get(this.version + 1)) {
      this.early.delete(this.version + 1);
      this.doc = applyOps(this.doc, ops);
      this.version += 1;
    }
  }
  private pick<T>(xs: T[]): T {
    return xs[Math.floor(this.rand() * xs.length)];
  }
  private randomOps(): Op[] {
    const restraints = this.doc.nodes.filter((n) => n.kind === 'restraint');
    const loads = this.doc.nodes.filter((n) => n.kind === 'load' && n.id.startsWith('ld-'));
    const roll = this.rand();
    if (roll < 0.35)
      return [{ op: 'updateNode', id: this.pick(restraints).id, data: { Gk: Math.round(50 + this.rand() * 200) } }];
    if (roll < 0.6) {
      const n = this.pick(this.doc.nodes);
      return [
        { op: 'moveNode', id: n.id, position: { x: Math.round(this.rand() * 400), y: Math.round(this.rand() * 400) } },
      ];
    }
    if (roll < 0.85 || loads.length === 0) {
      this.added += 1;
      const id = `ld-${this.name}-${this.added}`;
      const target = this.pick(restraints).id;
      return [
        { op: 'addNode', node: { id, kind: 'load', data: { label: `extra ${id}`, Gk: 10, Qk: 5, category: 'B' } } },
        { op: 'addEdge', edge: { id: `e-${id}`, source: id, target } },
      ];
    }
    return [{ op: 'removeNode', id: this.pick(loads).id }];
  }
  async edit(): Promise<void> {
    const ops = this.randomOps();
    const r = await request<{ version: number }>(this.socket, 'stack:edit', {
      stackId: this.stackId,
      baseVersion: this.version,
      ops,
    });
    if (r.ok) this.acked.push({ version: r.data.version, ops });
    else if (r.error.code === 'conflict' || r.error.code === 'unprocessable') {
      // As the client does: re-join to take the server's document, then carry on.
      this.conflicts += 1;
      await this.join();
    } else throw new Error(`${this.name}: ${r.error.code} ${r.error.message}`);
  }
}
