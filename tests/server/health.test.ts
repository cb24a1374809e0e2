import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { clientBuildNeeded, clientStep, viteScript } from '../../scripts/start.ts';
import { DEMO_BUILDING, DEMO_PASSWORD, DEMO_STACKS, seedDemoIfEmpty } from '../../seeds/demo.ts';
import type { AuthResponse, BuildingSummary, StackSummary } from '../../shared/schema/api.ts';
import { errorCode, onPostgres, startTestServer, type TestServer } from './helpers.ts';

describe('health and the app shell', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => {
    await s?.close();
  });

  it('GET /api/health reports ok, the package version and the database in use', async () => {
    const r = await s.api('GET', '/health');
    expect(r.status).toBe(200);
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
    expect(r.body).toEqual({ ok: true, version: pkg.version, database: onPostgres ? 'postgres' : 'sqlite' });
  });

  it('answers an unknown /api route with a JSON 404 in the error shape', async () => {
    const r = await s.api('GET', '/no-such-thing');
    expect(r.status).toBe(404);
    expect(errorCode(r.body)).toBe('not_found');
  });

  it('sends security headers from helmet and no x-powered-by', async () => {
    const r = await s.api('GET', '/health');
    expect(r.headers.get('x-content-type-options')).toBe('nosniff');
    expect(r.headers.get('x-powered-by')).toBeNull();
  });

  it('generates the JWT secret once into DATA_DIR with mode 600', () => {
    const st = statSync(join(s.dataDir, 'jwt-secret'));
    expect(st.mode & 0o777).toBe(0o600);
    expect(st.size).toBeGreaterThan(32);
  });

  it.skipIf(onPostgres)('keeps the SQLite file in DATA_DIR with foreign keys on and WAL journalling', async () => {
    expect(statSync(join(s.dataDir, 'stanchion.sqlite')).size).toBeGreaterThan(0);
    const fk = (await s.ctx.db.raw('PRAGMA foreign_keys')) as { foreign_keys: number }[];
    const wal = (await s.ctx.db.raw('PRAGMA journal_mode')) as { journal_mode: string }[];
    expect(fk[0].foreign_keys).toBe(1);
    expect(wal[0].journal_mode).toBe('wal');
  });
});

describe('npm start decides when to rebuild the client', () => {
  const root = mkdtempSync(join(tmpdir(), 'stanchion-start-'));
  const touch = (path: string, when: Date) => {
    mkdirSync(dirname(join(root, path)), { recursive: true });
    writeFileSync(join(root, path), 'x');
    utimesSync(join(root, path), when, when);
  };
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('builds when dist/index.html is missing, not when it is newer than every source, and again after a source changes', () => {
    touch('src/main.ts', new Date('2025-01-01T00:00:00Z'));
    touch('shared/engine/x.ts', new Date('2025-01-01T00:00:00Z'));
    touch('index.html', new Date('2025-01-01T00:00:00Z'));
    touch('vite.config.ts', new Date('2025-01-01T00:00:00Z'));
    for (const dir of ['src', 'shared/engine', 'shared', ''])
      utimesSync(join(root, dir), new Date('2025-01-01T00:00:00Z'), new Date('2025-01-01T00:00:00Z'));
    expect(clientBuildNeeded(root)).toBe(true);
    touch('dist/index.html', new Date('2025-01-02T00:00:00Z'));
    expect(clientBuildNeeded(root)).toBe(false);
    touch('shared/engine/x.ts', new Date('2025-01-03T00:00:00Z'));
    expect(clientBuildNeeded(root)).toBe(true);
  });

  it('without Vite (a production install) serves a stale dist/ and stops when there is none', () => {
    expect(viteScript(root)).toBeNull();
    expect(clientStep(root, false)).toBe('serve-stale');
    expect(clientStep(root, true)).toBe('build');
    touch('dist/index.html', new Date('2025-01-04T00:00:00Z'));
    expect(clientStep(root, false)).toBe('serve');
    rmSync(join(root, 'dist'), { recursive: true });
    expect(clientStep(root, false)).toBe('missing');
  });

  it('finds the Vite of a development install', () => {
    const script = viteScript(fileURLToPath(new URL('../..', import.meta.url)));
    expect(script).toMatch(/node_modules\/vite\/bin\/vite\.js$/);
    expect(statSync(script as string).isFile()).toBe(true);
  });
});

describe('serving the built client', () => {
  let s: TestServer;
  const dist = mkdtempSync(join(tmpdir(), 'stanchion-dist-'));
  beforeAll(async () => {
    mkdirSync(join(dist, 'assets'));
    writeFileSync(join(dist, 'index.html'), '<!doctype html><title>client shell</title>');
    writeFileSync(join(dist, 'assets', 'main-abc123.js'), 'console.log(1)');
    s = await startTestServer({ config: { distDir: dist } });
  });
  afterAll(async () => {
    await s?.close();
    rmSync(dist, { recursive: true, force: true });
  });

  it('answers a client route with index.html, not cached', async () => {
    const res = await fetch(`${s.url}/buildings/12/stacks/3`);
    expect(res.status).toBe(200);
    expect(await res.text()).toContain('client shell');
    expect(res.headers.get('cache-control')).toBe('no-cache');
  });

  it('serves hashed assets with a one-year immutable cache', async () => {
    const res = await fetch(`${s.url}/assets/main-abc123.js`);
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
  });

  it('still answers unknown /api routes with JSON, never the client shell', async () => {
    const r = await s.api('GET', '/buildings/1/nothing-here');
    expect(r.status).toBe(404);
    expect(errorCode(r.body)).toBe('not_found');
  });
});

describe('first start with the demo seed', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ seed: true });
  });
  afterAll(async () => {
    await s?.close();
  });

  it('lets each demo account sign in with the demo password and see the demo building with its role', async () => {
    for (const [email, role] of [
      ['lead@stanchion.test', 'lead'],
      ['engineer@stanchion.test', 'engineer'],
      ['viewer@stanchion.test', 'viewer'],
      ['admin@stanchion.test', 'viewer'],
    ]) {
      const login = await s.api('POST', '/auth/login', { body: { email, password: DEMO_PASSWORD } });
      expect(login.status).toBe(200);
      const { token, user } = login.body as AuthResponse;
      expect(user.isAdmin).toBe(email.startsWith('admin'));
      const list = (await s.api('GET', '/buildings', { token })).body as BuildingSummary[];
      expect(list.map((b) => [b.name, b.role])).toEqual([[DEMO_BUILDING.name, role]]);
    }
  });

  it('seeds 6–10 levels and stacks whose documents analyse without errors and pass', async () => {
    const { token } = (
      await s.api('POST', '/auth/login', { body: { email: 'lead@stanchion.test', password: DEMO_PASSWORD } })
    ).body as AuthResponse;
    const [building] = (await s.api('GET', '/buildings', { token })).body as BuildingSummary[];
    const levels = (await s.api('GET', `/buildings/${building.id}/levels`, { token })).body as unknown[];
    expect(levels.length).toBeGreaterThanOrEqual(6);
    expect(levels.length).toBeLessThanOrEqual(10);
    const stacks = (await s.api('GET', `/buildings/${building.id}/stacks`, { token })).body as StackSummary[];
    expect(stacks.map((x) => x.name).sort()).toEqual(DEMO_STACKS.map((x) => x.name).sort());
    for (const st of stacks) {
      expect(st.status).toBe('passes');
      expect(st.utilisation).toBeGreaterThan(0.2);
    }
  });

  it('does not seed again on a second start', async () => {
    expect(await seedDemoIfEmpty(s.ctx.db, 4)).toBe(false);
  });
});
