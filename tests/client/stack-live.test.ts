// The stack store against the real server: REST for the detail, Socket.IO for joining and editing.
// Real SQLite in a temp dir, real HTTP server on an ephemeral port, real socket.io-client.
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { createApp } from 'vue';
import { Notify, Quasar } from 'quasar';
import { createPinia, setActivePinia } from 'pinia';
import type { AuthResponse, Building, Level } from '@shared/schema/api.ts';
import { setToken } from '@/api/http.ts';
import { connectLive, joinStack, sendEdit } from '@/api/live.ts';
import { useStackStore } from '@/stores/stack.ts';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';

// The server runs in its own Node.js process: this test file runs in a browser-like environment.
const SERVER_SCRIPT = `
  import { startServer } from './server/server.ts';
  const s = await startServer({ port: 0, dataDir: process.env.DATA_DIR, logLevel: 'silent', config: { bcryptRounds: 4 } });
  console.log('LISTENING ' + s.url);
`;

let child: ChildProcess;
let dataDir: string;
let baseUrl: string;
let engineer: AuthResponse;
let colleague: AuthResponse;
let viewer: AuthResponse;
let building: Building;
let stackId: number;

/** Polls until `check` holds: the store hears the server asynchronously. */
async function until(check: () => boolean, ms = 5000): Promise<void> {
  const end = Date.now() + ms;
  while (!check()) {
    if (Date.now() > end) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 20));
  }
}

async function api<T>(method: string, path: string, token: string | null, body?: unknown): Promise<T> {
  const res = await fetch(`${baseUrl}/api${path}`, {
    method,
    headers: { 'Content-Type': 'application/json', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

/** Registers, follows the verification link the server's SMTP fake captured, and signs in. */
async function register(label: string): Promise<AuthResponse> {
  const email = `${label}-${Date.now()}@example.test`;
  const password = 'correct horse battery';
  await api('POST', '/auth/register', null, { email, password, name: `${label} person` });
  // The link arrives through the background mail sender, a moment after the request.
  const db = new Database(join(dataDir, 'stanchion.sqlite'), { readonly: true });
  try {
    let token: string | undefined;
    for (const deadline = Date.now() + 15_000; !token && Date.now() < deadline;) {
      const mail = db.prepare('SELECT text FROM outbox WHERE "to" = ? ORDER BY id DESC').get(email) as
        { text: string } | undefined;
      token = /verify-email\?token=(\S+)/.exec(mail?.text ?? '')?.[1];
      if (!token) await new Promise((r) => setTimeout(r, 20));
    }
    if (!token) throw new Error(`no verification link for ${email}`);
    await api('POST', '/auth/verify', null, { token: decodeURIComponent(token) });
  } finally {
    db.close();
  }
  return api<AuthResponse>('POST', '/auth/login', null, { email, password });
}

beforeAll(async () => {
  dataDir = mkdtempSync(join(tmpdir(), 'stanchion-client-'));
  child = spawn(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', SERVER_SCRIPT], {
    cwd: process.cwd(),
    env: { ...process.env, DATA_DIR: dataDir, NODE_ENV: 'test' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  baseUrl = await new Promise<string>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`server exited with ${code}`)));
    child.stdout?.on('data', (chunk: Buffer) => {
      const m = /LISTENING (\S+)/.exec(chunk.toString());
      if (m) resolve(m[1]);
    });
  });
  // Same origin as the app in production: the store's relative /api requests reach the test server.
  (window as unknown as { happyDOM: { setURL: (u: string) => void } }).happyDOM.setURL(baseUrl);
  // happy-dom keeps GET responses in its own cache (ignoring who asked); a browser revalidates them.
  const domFetch = window.fetch.bind(window);
  vi.stubGlobal('fetch', (input: RequestInfo | URL, init: RequestInit = {}) =>
    domFetch(input, { ...init, headers: { ...(init.headers as Record<string, string>), 'Cache-Control': 'no-cache' } }),
  );
  // The store reports refusals through Quasar's Notify, which needs the plugin installed once.
  createApp({}).use(Quasar, { plugins: { Notify } });
  engineer = await register('engineer');
  colleague = await register('colleague');
  viewer = await register('viewer');
  building = await api<Building>('POST', '/buildings', engineer.token, { name: 'Invented office block' });
  await api('POST', `/buildings/${building.id}/members`, engineer.token, {
    email: colleague.user.email,
    role: 'engineer',
  });
  await api('POST', `/buildings/${building.id}/members`, engineer.token, { email: viewer.user.email, role: 'viewer' });
  const created = await api<{ id: number }>('POST', `/buildings/${building.id}/stacks`, engineer.token, {
    name: 'B/2',
    template: { storeys: 3, storeyHeight: 4, sections: ['UKC 203x203x46'], Gk: 100, Qk: 40 },
  });
  stackId = created.id;
}, 60_000);

afterAll(() => {
  vi.unstubAllGlobals();
  child?.kill('SIGTERM');
  if (dataDir) rmSync(dataDir, { recursive: true, force: true });
});

beforeEach(() => setActivePinia(createPinia()));

async function openAs(user: AuthResponse, id = stackId) {
  setToken(user.token);
  const store = useStackStore();
  await store.open(id, { token: user.token, userId: user.user.id, url: baseUrl });
  await until(() => store.link === 'live');
  return store;
}

describe('stack store on the live channel', () => {
  it('opens the stack with its role, document and results', async () => {
    const store = await openAs(engineer);
    expect(store.role).toBe('lead');
    expect(store.canEdit).toBe(true);
    expect(store.doc?.nodes.some((n) => n.kind === 'lift')).toBe(true);
    expect(store.results?.lifts.length).toBeGreaterThan(0);
    store.close();
  });

  it('opens with one join on the live channel and no REST request: name, building and levels come with it', async () => {
    const fetchSpy = vi.spyOn(globalThis, 'fetch');
    try {
      const store = await openAs(engineer);
      expect(fetchSpy).not.toHaveBeenCalled();
      expect(store.name).toBe('B/2');
      expect(store.buildingId).toBe(building.id);
      expect(store.buildingName).toBe(building.name);
      const levels = await api<{ id: string; elevation: number }[]>(
        'GET',
        `/buildings/${building.id}/levels`,
        engineer.token,
      );
      expect(store.levels.map((l) => l.id)).toEqual(levels.map((l) => l.id));
      store.close();
    } finally {
      fetchSpy.mockRestore();
    }
  });

  it('names each edit; the server echoes the name to everyone and the store takes its edit back once', async () => {
    const store = await openAs(engineer);
    const watcher = connectLive(colleague.token, baseUrl);
    await joinStack(watcher, stackId);
    const heard: { version: number; editId?: string }[] = [];
    watcher.on('stack:changed', (c) => heard.push(c));
    const cap = store.doc?.nodes.find((n) => n.kind === 'cap');
    if (!cap) throw new Error('template has a cap');
    const before = store.version;
    store.edit([{ op: 'updateNode', id: cap.id, data: { Gk: 61 } }], 'Change Gk');
    store.edit([{ op: 'updateNode', id: cap.id, data: { Gk: 61 } }], 'Change Gk');
    await until(() => !store.saving && heard.length === 2);
    expect(store.version).toBe(before + 2);
    // Two edits with the same ops still carry two names.
    expect(heard.map((c) => c.version)).toEqual([before + 1, before + 2]);
    expect(new Set(heard.map((c) => c.editId)).size).toBe(2);
    heard.forEach((c) => expect(c.editId).toMatch(/^[A-Za-z0-9_-]+$/));
    watcher.disconnect();
    store.close();
  });

  it("applies an edit at once, has it acknowledged, and takes the server's new results", async () => {
    const store = await openAs(engineer);
    const lift = store.doc?.nodes.find((n) => n.kind === 'lift');
    if (!lift) throw new Error('template has a lift');
    const before = store.version;
    const u0 = store.results?.lifts.find((l) => l.liftId === lift.id)?.utilisation ?? 0;
    expect(store.edit([{ op: 'updateNode', id: lift.id, data: { section: 'UKC 152x152x23' } }], 'Change section')).toBe(
      true,
    );
    // optimistic: visible before the server answers
    expect(store.doc?.nodes.find((n) => n.id === lift.id)?.data).toMatchObject({ section: 'UKC 152x152x23' });
    await until(
      () =>
        !store.saving &&
        store.version === before + 1 &&
        store.results?.lifts.find((l) => l.liftId === lift.id)?.section === 'UKC 152x152x23',
    );
    // a lighter section works harder under the same load
    expect(store.results?.lifts.find((l) => l.liftId === lift.id)?.utilisation).toBeGreaterThan(u0);
    store.close();
  });

  it('sends edits one at a time and loses none of them', async () => {
    const store = await openAs(engineer);
    const restraints = store.doc?.nodes.filter((n) => n.kind === 'restraint') ?? [];
    const before = store.version;
    for (const [i, r] of restraints.entries())
      store.edit([{ op: 'updateNode', id: r.id, data: { Gk: 150 + i } }], 'Change Gk');
    await until(() => !store.saving);
    expect(store.version).toBe(before + restraints.length);
    const { doc } = await api<{ doc: { nodes: { id: string; data: { Gk?: number } }[] } }>(
      'GET',
      `/stacks/${stackId}`,
      engineer.token,
    );
    restraints.forEach((r, i) => expect(doc.nodes.find((n) => n.id === r.id)?.data.Gk).toBe(150 + i));
    store.close();
  });

  it("shows a colleague's edit when it lands", async () => {
    const store = await openAs(engineer);
    const other = connectLive(colleague.token, baseUrl);
    const joined = await joinStack(other, stackId);
    const cap = joined.doc.nodes.find((n) => n.kind === 'cap');
    if (!cap) throw new Error('template has a cap');
    await sendEdit(other, stackId, joined.version, [{ op: 'updateNode', id: cap.id, data: { Qk: 77 } }]);
    await until(() => (store.doc?.nodes.find((n) => n.id === cap.id)?.data as { Qk?: number } | undefined)?.Qk === 77);
    expect(store.version).toBe(joined.version + 1);
    other.disconnect();
    store.close();
  });

  it('undo sends the inverse edit and restores the value', async () => {
    const store = await openAs(engineer);
    const splice = store.doc?.nodes.find((n) => n.kind === 'splice');
    if (!splice || splice.kind !== 'splice') throw new Error('template has a splice');
    const z = splice.data.elevation;
    store.edit([{ op: 'updateNode', id: splice.id, data: { elevation: z + 0.5 } }], 'Move splice');
    await until(() => !store.saving);
    store.undo();
    await until(() => !store.saving);
    const { doc } = await api<{ doc: { nodes: { id: string; data: { elevation?: number } }[] } }>(
      'GET',
      `/stacks/${stackId}`,
      engineer.token,
    );
    expect(doc.nodes.find((n) => n.id === splice.id)?.data.elevation).toBe(z);
    expect(store.canRedo).toBe(true);
    store.close();
  });

  it('rolls back an edit the server refuses and keeps the document as the server has it', async () => {
    const store = await openAs(engineer);
    const support = store.doc?.nodes.find((n) => n.kind === 'support');
    if (!support) throw new Error('template has a support');
    const other = connectLive(colleague.token, baseUrl);
    const joined = await joinStack(other, stackId);
    // the colleague removes the support first; our update of it can no longer apply
    const gone = sendEdit(other, stackId, joined.version, [{ op: 'removeNode', id: support.id }]);
    store.edit([{ op: 'updateNode', id: support.id, data: { fixity: 'fixed' } }], 'Fix the base');
    await gone;
    await until(() => !store.saving && !store.doc?.nodes.some((n) => n.id === support.id));
    expect(store.canUndo).toBe(false);
    other.disconnect();
    store.close();
  });

  it('gives a viewer the document read-only', async () => {
    const store = await openAs(viewer);
    expect(store.isViewer).toBe(true);
    expect(store.canEdit).toBe(false);
    const lift = store.doc?.nodes.find((n) => n.kind === 'lift');
    expect(store.edit([{ op: 'removeNode', id: lift?.id ?? '' }], 'Delete')).toBe(false);
    store.close();
  });
});

describe('stack store and the building levels', () => {
  it('draws a node tied to a level at the level, and follows the level when a colleague moves it', async () => {
    const level = (name: string, elevation: number) =>
      api<Level>('POST', `/buildings/${building.id}/levels`, engineer.token, { name, elevation });
    await level('Ground', 0);
    const first = await level('Level 1', 4);
    await level('Roof', 8);
    const created = await api<{ id: number }>('POST', `/buildings/${building.id}/stacks`, engineer.token, {
      name: 'C/5',
      template: { elevations: [0, 4, 8], sections: ['UKC 203x203x46'], Gk: 100, Qk: 40 },
    });
    const store = await openAs(engineer, created.id);
    const floorOn = () =>
      store.doc?.nodes.find((n) => n.kind === 'restraint' && n.data.levelId === first.id) as
        { id: string; data: { elevation: number } } | undefined;
    expect(floorOn()?.data.elevation).toBe(4);
    const version = store.version;
    // The move writes nothing into the stack's nodes: the page places the floor on the level it hears about
    await api('PATCH', `/buildings/${building.id}/levels/${first.id}`, colleague.token, { elevation: 4.6 });
    await until(() => store.version === version + 1);
    expect(store.levels.find((l) => l.id === first.id)?.elevation).toBe(4.6);
    expect(floorOn()?.data.elevation).toBe(4.6);
    expect(store.results?.takeDown.map((r) => r.elevation)).toContain(4.6);
    store.close();
  });
});
