// Live-channel latency (docs/live-protocol.md): edit → stack:changed at every other client in the room, p50/p95 with
// 20 and 100 clients, and sustained edits per second. The server runs in its own process so client
// work does not distort it; the baseline is a bare Socket.IO acknowledgement round trip in the same run.
import { spawn } from 'node:child_process';
import { createInterface } from 'node:readline';
import { io, type Socket } from 'socket.io-client';
import { DEMO_BUILDING } from '../seeds/demo.ts';
import type { AuthResponse, BuildingSummary, StackSummary } from '../shared/schema/api.ts';
import type { ClientToServerEvents, ServerToClientEvents, StackJoinAck } from '../shared/schema/socket.ts';

type Client = Socket<ServerToClientEvents, ClientToServerEvents>;
type Reply<T> = { ok: true; data: T } | { ok: false; error: { code: string; message: string } };

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!;
}

async function startBenchServer(): Promise<{ url: string; stop(): void }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'bench/serve.ts'], { stdio: ['pipe', 'pipe', 'inherit'] });
  const line = await new Promise<string>((resolve, reject) => {
    createInterface({ input: child.stdout }).once('line', resolve);
    child.once('exit', (code) => reject(new Error(`bench server exited with ${code}`)));
  });
  return { url: (JSON.parse(line) as { url: string }).url, stop: () => child.stdin.end() };
}

async function api<T>(url: string, method: string, path: string, token: string | null, body?: unknown): Promise<T> {
  const res = await fetch(`${url}/api${path}`, {
    method,
    headers: { 'Content-Type': 'application/json', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

function connect(url: string, token: string): Promise<Client> {
  const s: Client = io(url, { auth: { token }, transports: ['websocket'], forceNew: true, reconnection: false });
  return new Promise((resolve, reject) => {
    s.once('connect', () => resolve(s));
    s.once('connect_error', reject);
  });
}

function ack<T>(s: Client, event: 'stack:join' | 'stack:edit', payload: unknown): Promise<Reply<T>> {
  return new Promise((resolve) =>
    (s.emit as unknown as (e: string, p: unknown, cb: (r: Reply<T>) => void) => void)(event, payload, resolve),
  );
}

async function roomLatency(
  url: string,
  token: string,
  stackId: number,
  clients: number,
  edits: number,
): Promise<{ p50: number; p95: number; baselineP50: number }> {
  const sockets = await Promise.all(Array.from({ length: clients }, () => connect(url, token)));
  const joins = await Promise.all(sockets.map((s) => ack<StackJoinAck>(s, 'stack:join', { stackId })));
  const first = joins[0]!;
  if (!first.ok) throw new Error(first.error.message);
  let version = first.data.version;
  const nodeId = first.data.doc.nodes[0]!.id;
  const [editor, ...watchers] = sockets as [Client, ...Client[]];
  const samples: number[] = [];
  const baseline: number[] = [];
  for (let i = 0; i < edits; i += 1) {
    const t0 = performance.now();
    const arrivals = watchers.map(
      (w) =>
        new Promise<void>((resolve) =>
          w.once('stack:changed', () => (samples.push(performance.now() - t0), resolve())),
        ),
    );
    const r = await ack<{ version: number }>(editor, 'stack:edit', {
      stackId,
      baseVersion: version,
      ops: [{ op: 'moveNode', id: nodeId, position: { x: i, y: i } }],
    });
    if (!r.ok) throw new Error(r.error.message);
    version = r.data.version;
    await Promise.all(arrivals);
    // Baseline: the cheapest acknowledged round trip the channel can make (a refused, malformed edit).
    const b0 = performance.now();
    await ack(editor, 'stack:edit', { stackId: -1 });
    baseline.push(performance.now() - b0);
  }
  sockets.forEach((s) => s.close());
  samples.sort((a, b) => a - b);
  baseline.sort((a, b) => a - b);
  return { p50: percentile(samples, 50), p95: percentile(samples, 95), baselineP50: percentile(baseline, 50) };
}

async function sustainedEdits(url: string, token: string, stackId: number, seconds: number): Promise<number> {
  const s = await connect(url, token);
  const j = await ack<StackJoinAck>(s, 'stack:join', { stackId });
  if (!j.ok) throw new Error(j.error.message);
  let version = j.data.version;
  const nodeId = j.data.doc.nodes[0]!.id;
  let done = 0;
  const end = performance.now() + seconds * 1000;
  while (performance.now() < end) {
    const r = await ack<{ version: number }>(s, 'stack:edit', {
      stackId,
      baseVersion: version,
      ops: [{ op: 'moveNode', id: nodeId, position: { x: done, y: 0 } }],
    });
    if (!r.ok) throw new Error(r.error.message);
    version = r.data.version;
    done += 1;
  }
  s.close();
  return done / seconds;
}

export async function benchRealtime(): Promise<void> {
  const server = await startBenchServer();
  try {
    const { token } = await api<AuthResponse>(server.url, 'POST', '/auth/login', null, {
      email: 'engineer@stanchion.test',
      password: 'stanchion-demo',
    });
    // The office block's first stack, the one every earlier run measured, so the figures stay comparable.
    const buildings = await api<BuildingSummary[]>(server.url, 'GET', '/buildings', token);
    const building = buildings.find((b) => b.name === DEMO_BUILDING.name)!;
    const stacks = await api<StackSummary[]>(server.url, 'GET', `/buildings/${building.id}/stacks`, token);
    const stackId = stacks[0]!.id;
    for (const clients of [20, 100]) {
      const r = await roomLatency(server.url, token, stackId, clients, clients === 20 ? 100 : 40);
      console.log(
        `live edit → stack:changed, ${clients} clients: p50 ${r.p50.toFixed(2)} ms, p95 ${r.p95.toFixed(2)} ms ` +
          `(bare ack round trip p50 ${r.baselineP50.toFixed(2)} ms; p50 ratio ×${(r.p50 / r.baselineP50).toFixed(1)})  target p95 < 25 ms at 20`,
      );
    }
    console.log(
      `live edits sustained (one editor, ack before next): ${(await sustainedEdits(server.url, token, stackId, 3)).toFixed(0)} edits/s`,
    );
  } finally {
    server.stop();
  }
}
