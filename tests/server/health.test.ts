import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { errorCode, startTestServer, type TestServer } from './helpers.ts';

describe('health and the app shell', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => {
    await s?.close();
  });

  it('GET /api/health reports ok, the package version and the sqlite database', async () => {
    const r = await s.api('GET', '/health');
    expect(r.status).toBe(200);
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
    expect(r.body).toEqual({ ok: true, version: pkg.version, database: 'sqlite' });
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

  it('keeps the SQLite file in DATA_DIR with foreign keys on and WAL journalling', async () => {
    expect(statSync(join(s.dataDir, 'stanchion.sqlite')).size).toBeGreaterThan(0);
    const fk = (await s.ctx.db.raw('PRAGMA foreign_keys')) as { foreign_keys: number }[];
    const wal = (await s.ctx.db.raw('PRAGMA journal_mode')) as { journal_mode: string }[];
    expect(fk[0].foreign_keys).toBe(1);
    expect(wal[0].journal_mode).toBe('wal');
  });
});
