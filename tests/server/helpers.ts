// Test harness: a real server on an ephemeral port with a fresh SQLite file in a temp DATA_DIR.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import knex, { type Knex } from 'knex';
import type { Express } from 'express';
import type { AuthResponse, Building, Level, Role } from '../../shared/schema/api.ts';
import { startServer, type RunningServer, type StartOptions } from '../../server/server.ts';
import type { Limits } from '../../server/config.ts';
import { verifyEmail } from '../../server/services/users.ts';
import { loadStackRow, packResults, parseResults, resultsRef, storeResults } from '../../server/services/stackRows.ts';
import type { StackResult } from '../../shared/schema/results.ts';

/**
 * The scale-out run (docs/live-protocol.md §Several processes) repeats every server test on PostgreSQL and Redis:
 * vitest's 'server-pg' project sets STANCHION_TEST_ON_PG, and each test server then gets its own schema and key
 * prefix.
 */
export const onPostgres = process.env.STANCHION_TEST_ON_PG === '1' && !!process.env.TEST_DATABASE_URL;

export function scaleOutConfig(): {
  databaseUrl: string;
  databaseSchema: string;
  redisUrl: string | null;
  redisPrefix: string;
} {
  const tag = `t_${Date.now().toString(36)}_${randomBytes(4).toString('hex')}`;
  return {
    databaseUrl: process.env.TEST_DATABASE_URL!,
    databaseSchema: tag,
    redisUrl: process.env.TEST_REDIS_URL ?? null,
    redisPrefix: `stanchion-test:${tag}`,
  };
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
  api(
    method: string,
    path: string,
    opts?: { token?: string | null; body?: unknown; raw?: string; headers?: Record<string, string> },
  ): Promise<ApiReply>;
}

export interface ApiReply {
  status: number;
  body: unknown;
  headers: Headers;
}

export const TEST_PASSWORD = 'correct horse battery';

const generous = { windowMs: 60_000, max: 100_000 };
export const GENEROUS_LIMITS: Limits = {
  registerPerClient: generous,
  registerPerAddress: generous,
  mailPerUser: generous,
  invitesPerBuilding: generous,
  mailPerRecipient: generous,
  strengthPerClient: generous,
};

export async function startTestServer(opts: Omit<StartOptions, 'dataDir' | 'port'> = {}): Promise<TestServer> {
  const dataDir = mkdtempSync(join(tmpdir(), 'stanchion-test-'));
  const scale = onPostgres ? scaleOutConfig() : null;
  const server = await startServer({
    port: 0,
    dataDir,
    logLevel: 'silent',
    env: {},
    ...opts,
    // Tests register many accounts from one address: the limits are tested on their own (limits.test.ts).
    config: { bcryptRounds: 4, limits: GENEROUS_LIMITS, ...scale, ...opts.config },
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

export interface CapturedMail {
  id: number;
  to: string;
  subject: string;
  text: string;
  html: string | null;
}

/**
 * Messages the SMTP fake captured for an address, oldest first, only those whose text matches `match`
 * when given; waits up to timeoutMs for `atLeast` of them (account mail goes through the background
 * sender, so it arrives a moment after the request that queued it).
 */
export async function mailTo(
  s: TestServer,
  to: string,
  atLeast = 1,
  timeoutMs = 15_000,
  match?: RegExp,
): Promise<CapturedMail[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const rows = (
      await s.ctx.db('outbox').where({ to }).orderBy('id').select<CapturedMail[]>('id', 'to', 'subject', 'text', 'html')
    ).filter((m) => !match || match.test(m.text));
    if (rows.length >= atLeast || Date.now() > until) return rows;
    await new Promise((r) => setTimeout(r, 20));
  }
}

/** The token of the newest verification link mailed to the address (the `nth` such mail when given). */
export async function verificationToken(s: TestServer, email: string, nth = 1): Promise<string> {
  const mails = await mailTo(s, email, nth, 15_000, /verify-email\?token=/);
  const m = /verify-email\?token=([^\s]+)/.exec(mails.at(-1)?.text ?? '');
  if (!m) throw new Error(`no verification link mailed to ${email}`);
  return decodeURIComponent(m[1]);
}

/** Registers, follows the link mailed to the address, and signs in: a verified account with a session. */
export async function registerAndVerify(
  s: TestServer,
  email: string,
  name: string,
  password = TEST_PASSWORD,
): Promise<AuthResponse> {
  const r = await s.api('POST', '/auth/register', { body: { email, password, name } });
  if (r.status !== 202) throw new Error(`register failed: ${r.status} ${JSON.stringify(r.body)}`);
  if (s.ctx.mailer.fakePort === null) {
    // A test of a failing mail server: no link can arrive, so the address is verified in the database.
    const row = await s.ctx.db('users').where({ email }).first<{ id: number }>('id');
    await verifyEmail(s.ctx.db, row.id, email);
    return signIn(s, email, password);
  }
  const v = await s.api('POST', '/auth/verify', { body: { token: await verificationToken(s, email) } });
  if (v.status !== 200) throw new Error(`verify failed: ${v.status} ${JSON.stringify(v.body)}`);
  return signIn(s, email, password);
}

export async function signIn(s: TestServer, email: string, password = TEST_PASSWORD): Promise<AuthResponse> {
  const r = await s.api('POST', '/auth/login', { body: { email, password } });
  if (r.status !== 200) throw new Error(`sign-in failed: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body as AuthResponse;
}

let counter = 0;
/** Registers a fresh account, verifies its address through the captured mail and returns its session. */
export async function registerUser(s: TestServer, label = 'user'): Promise<AuthResponse> {
  counter += 1;
  const email = `${label}-${counter}-${Date.now()}@example.test`;
  return registerAndVerify(s, email, `${label} ${counter}`);
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
export async function startWithLeadAndBuilding(
  buildingName?: string,
): Promise<{ s: TestServer; token: string; buildingId: number }> {
  const s = await startTestServer();
  const token = (await registerUser(s, 'lead')).token;
  return { s, token, buildingId: (await createBuilding(s, token, buildingName)).id };
}

/** Adds levels to a building over the API, in the order given; returns them as the server answered. */
export async function createLevels(
  s: TestServer,
  token: string,
  buildingId: number,
  list: readonly (readonly [name: string, elevation: number])[],
): Promise<Level[]> {
  const levels: Level[] = [];
  for (const [name, elevation] of list) {
    const r = await s.api('POST', `/buildings/${buildingId}/levels`, { token, body: { name, elevation } });
    if (r.status !== 201) throw new Error(`create level failed: ${r.status} ${JSON.stringify(r.body)}`);
    levels.push(r.body as Level);
  }
  return levels;
}

export async function addMember(
  s: TestServer,
  leadToken: string,
  buildingId: number,
  email: string,
  role: Role,
): Promise<void> {
  const r = await s.api('POST', `/buildings/${buildingId}/members`, { token: leadToken, body: { email, role } });
  if (r.status !== 201) throw new Error(`add member failed: ${r.status} ${JSON.stringify(r.body)}`);
}

/** The error shape of docs/contracts.md §Errors: { error: { code, message, details? } }. */
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
      for (const [method, on] of Object.entries(inner.route.methods))
        if (on && method !== '_all') out.push(`${method.toUpperCase()} /api${inner.route.path}`);
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

/** A stack's results as stored (docs/contracts.md §Stored results). */
export async function storedResults(db: Knex, stackId: number): Promise<StackResult> {
  return parseResults(await loadStackRow(db, stackId));
}

/**
 * Replaces a stack's stored results by hand: packed, as the server stores them, or as JSON text, as rows stored
 * before results were packed (docs/contracts.md §Stored results).
 */
export async function replaceStoredResults(
  db: Knex,
  stackId: number,
  results: StackResult,
  form: 'packed' | 'text' = 'packed',
): Promise<void> {
  if (form === 'text') {
    await db('stacks')
      .where({ id: stackId })
      .update({ results: JSON.stringify(results), results_hash: null, engine_version: null });
    return;
  }
  const packed = packResults(results);
  await storeResults(db, [packed]);
  await db('stacks').where({ id: stackId }).update(resultsRef(packed));
}
