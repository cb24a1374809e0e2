// Test harness: a real server on an ephemeral port with a fresh SQLite file in a temp DATA_DIR.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import knex from 'knex';
import type { Express } from 'express';
import type { AuthResponse, Building, Role } from '../../shared/schema/api.ts';
import { startServer, type RunningServer, type StartOptions } from '../../server/server.ts';

/**
 * The scale-out run (issue 13) repeats every server test on PostgreSQL and Redis: vitest's 'server-pg'
 * project sets STANCHION_TEST_ON_PG, and each test server then gets its own schema and key prefix.
 */
export const onPostgres = process.env.STANCHION_TEST_ON_PG === '1' && !!process.env.TEST_DATABASE_URL;

export function scaleOutConfig(): { databaseUrl: string; databaseSchema: string; redisUrl: string | null; redisPrefix: string } {
  const tag = `t_${Date.now().toString(36)}_${randomBytes(4).toString('hex')}`;
  return { databaseUrl: process.env.TEST_DATABASE_URL!, databaseSchema: tag, redisUrl: process.env.TEST_REDIS_URL ?? null, redisPrefix: `stanchion-test:${tag}` };
}

export async function dropSchema(databaseUrl: string, schema: string): Promise<void> {
  const db = knex({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: 1 } });
  try {
    await db.raw('DROP SCHEMA IF EXISTS ?? CASCADE', [schema]);
  } finally {
    await db.destroy();
  }
}

export interface TestServer extends RunningServer {
  dataDir: string;
  /** fetch against the server with JSON in and out. */
  api(method: string, path: string, opts?: { token?: string | null; body?: unknown; raw?: string; headers?: Record<string, string> }): Promise<ApiReply>;
}

export interface ApiReply {
  status: number;
  body: unknown;
  headers: Headers;
}

export const TEST_PASSWORD = 'correct horse battery';

export async function startTestServer(opts: Omit<StartOptions, 'dataDir' | 'port'> = {}): Promise<TestServer> {
  const dataDir = mkdtempSync(join(tmpdir(), 'stanchion-test-'));
  const scale = onPostgres ? scaleOutConfig() : null;
  const server = await startServer({
    port: 0,
    dataDir,
    logLevel: 'silent',
    env: {},
    ...opts,
    config: { bcryptRounds: 4, ...scale, ...opts.config },
  });
  const api: TestServer['api'] = async (method, path, o = {}) => {
    const headers: Record<string, string> = { ...o.headers };
    if (o.token) headers.Authorization = `Bearer ${o.token}`;
    let body: string | undefined;
    if (o.raw !== undefined) body = o.raw;
    else if (o.body !== undefined) body = JSON.stringify(o.body);
    if (body !== undefined) headers['Content-Type'] ??= 'application/json';
    const res = await fetch(`${server.url}/api${path}`, { method, headers, body });
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : undefined;
    } catch {
      // Non-JSON replies stay as text so a test can assert on them.
    }
    return { status: res.status, body: parsed, headers: res.headers };
  };
  return {
    ...server,
    dataDir,
    api,
    async close() {
      await server.close();
      rmSync(dataDir, { recursive: true, force: true });
      if (scale) await dropSchema(scale.databaseUrl, scale.databaseSchema);
    },
  };
}

let counter = 0;
/** Registers a fresh account and returns its token and user. */
export async function registerUser(s: TestServer, label = 'user'): Promise<AuthResponse> {
  counter += 1;
  const email = `${label}-${counter}-${Date.now()}@example.test`;
  const r = await s.api('POST', '/auth/register', { body: { email, password: TEST_PASSWORD, name: `${label} ${counter}` } });
  if (r.status !== 201) throw new Error(`register failed: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body as AuthResponse;
}

export async function makeAdmin(s: TestServer, userId: number): Promise<void> {
  await s.ctx.db('users').where({ id: userId }).update({ is_admin: true });
}

export async function createBuilding(s: TestServer, token: string, name = 'Test building'): Promise<Building> {
  const r = await s.api('POST', '/buildings', { token, body: { name } });
  if (r.status !== 201) throw new Error(`create building failed: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body as Building;
}

/** A fresh test server with one lead and one building of theirs: where most server tests start. */
export async function startWithLeadAndBuilding(buildingName?: string): Promise<{ s: TestServer; token: string; buildingId: number }> {
  const s = await startTestServer();
  const token = (await registerUser(s, 'lead')).token;
  return { s, token, buildingId: (await createBuilding(s, token, buildingName)).id };
}

export async function addMember(s: TestServer, leadToken: string, buildingId: number, email: string, role: Role): Promise<void> {
  const r = await s.api('POST', `/buildings/${buildingId}/members`, { token: leadToken, body: { email, role } });
  if (r.status !== 201) throw new Error(`add member failed: ${r.status} ${JSON.stringify(r.body)}`);
}

/** The error shape of SPEC §7: { error: { code, message, details? } }. */
export function errorCode(body: unknown): string | undefined {
  if (typeof body !== 'object' || body === null || !('error' in body)) return undefined;
  const e = (body as { error: { code?: unknown; message?: unknown } }).error;
  return typeof e.code === 'string' && typeof e.message === 'string' ? e.code : undefined;
}

interface RouteLayer {
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: RouteLayer[] };
}

/** "METHOD /api/path" of every route registered on the routers mounted under /api, sorted. */
export function listRoutes(app: Express): string[] {
  const out: string[] = [];
  for (const layer of app.router.stack as RouteLayer[]) {
    for (const inner of layer.handle.stack ?? []) {
      if (!inner.route) continue;
      for (const [method, on] of Object.entries(inner.route.methods)) if (on && method !== '_all') out.push(`${method.toUpperCase()} /api${inner.route.path}`);
    }
  }
  return out.sort();
}

/** Polls until `check` holds (work done in the background, such as the mail outbox); fails after timeoutMs. */
export async function eventually(check: () => Promise<boolean>, timeoutMs = 25_000, everyMs = 50): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, everyMs));
  }
  throw new Error(`condition not met within ${timeoutMs} ms`);
}

/** Mail settings that retry quickly, for tests of the outbox. */
export const FAST_MAIL = { timeoutMs: 2000, retryBaseMs: 20, maxAttempts: 3, pollMs: 20, leaseMs: 10_000 };
