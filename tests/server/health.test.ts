import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { clientBuildNeeded } from '../../scripts/start.ts';
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
    for (const dir of ['src', 'shared/engine', 'shared', '']) utimesSync(join(root, dir), new Date('2025-01-01T00:00:00Z'), new Date('2025-01-01T00:00:00Z'));
    expect(clientBuildNeeded(root)).toBe(true);
    touch('dist/index.html', new Date('2025-01-02T00:00:00Z'));
    expect(clientBuildNeeded(root)).toBe(false);
    touch('shared/engine/x.ts', new Date('2025-01-03T00:00:00Z'));
    expect(clientBuildNeeded(root)).toBe(true);
  });
});
