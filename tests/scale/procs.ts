// Helpers of the fault suite (tests/scale/*.test.ts): real server processes (tests/scale/serve.ts),
// a private redis-server this suite may kill and restart (never the machine's shared one), HTTP calls.
import { spawn, type ChildProcess, type ChildProcessWithoutNullStreams } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { createServer } from 'node:net';
import { createInterface } from 'node:readline';
import type { Knex } from 'knex';
import type { AuthResponse } from '../../shared/schema/api.ts';

export const databaseUrl = process.env.TEST_DATABASE_URL;
export const redisUrl = process.env.TEST_REDIS_URL;
export const scaleReady = !!databaseUrl && !!redisUrl;
export const PASSWORD = 'correct horse battery';

export interface Proc {
  url: string;
  child: ChildProcessWithoutNullStreams;
  stderr: () => string;
  /** Resolves when the process ends; its exit code or signal. */
  exited: Promise<number | string | null>;
}

export async function startProcess(env: NodeJS.ProcessEnv, timeoutMs = 30_000): Promise<Proc> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/scale/serve.ts'], {
    env: { ...process.env, ...env },
    stdio: ['pipe', 'pipe', 'pipe'],
  });
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  const exited = new Promise<number | string | null>((resolve) =>
    child.once('exit', (code, signal) => resolve(code ?? signal)),
  );
  const line = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      reject(new Error(`server process did not start within ${timeoutMs} ms: ${stderr}`));
    }, timeoutMs);
    createInterface({ input: child.stdout }).once('line', (l) => {
      clearTimeout(timer);
      resolve(l);
    });
    void exited.then((code) => reject(new Error(`server process exited with ${String(code)}: ${stderr}`)));
  });
  return { url: (JSON.parse(line) as { url: string }).url, child, stderr: () => stderr, exited };
}

export async function stopProcess(p: Proc | undefined): Promise<void> {
  if (!p || p.child.exitCode !== null || p.child.signalCode !== null) return;
  p.child.stdin.end();
  await p.exited;
}

export function scaleEnv(tag: string, extra: NodeJS.ProcessEnv = {}): NodeJS.ProcessEnv {
  return {
    DATABASE_URL: databaseUrl,
    DATABASE_SCHEMA: tag,
    REDIS_URL: redisUrl,
    REDIS_PREFIX: `stanchion-test:${tag}`,
    JWT_SECRET: randomBytes(32).toString('hex'),
    LOGIN_RATE_LIMIT: '10000',
    LOG_LEVEL: 'warn',
    ...extra,
  };
}

export const newTag = () => `t_${Date.now().toString(36)}_${randomBytes(4).toString('hex')}`;

export async function api<T>(
  url: string,
  method: string,
  path: string,
  token: string | null,
  body?: unknown,
): Promise<{ status: number; body: T; headers: Headers }> {
  const res = await fetch(`${url}/api${path}`, {
    method,
    headers: { 'Content-Type': 'application/json', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  return { status: res.status, body: (text ? JSON.parse(text) : null) as T, headers: res.headers };
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
  });
}

/** A redis-server of the suite's own on `port`, so killing it touches nobody else. */
export class OwnRedis {
  private child: ChildProcess | null = null;
  constructor(readonly port: number) {}

  get url(): string {
    return `redis://127.0.0.1:${this.port}`;
  }

  async start(): Promise<void> {
    const child = spawn(
      'redis-server',
      ['--port', String(this.port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no'],
      { stdio: ['ignore', 'pipe', 'pipe'] },
    );
    this.child = child;
    await new Promise<void>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error('redis-server did not start')), 10_000);
      createInterface({ input: child.stdout! }).on('line', (l) => {
        if (/Ready to accept connections/i.test(l)) {
          clearTimeout(timer);
          resolve();
        }
      });
      child.once('exit', (code) => reject(new Error(`redis-server exited with ${String(code)}`)));
    });
  }

  async kill(): Promise<void> {
    const child = this.child;
    if (!child || child.exitCode !== null) return;
    const gone = new Promise((resolve) => child.once('exit', resolve));
    child.kill('SIGKILL');
    await gone;
    this.child = null;
  }
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Polls until `check` holds or the time is up; returns whether it held. */
export async function eventually(check: () => Promise<boolean>, timeoutMs: number, everyMs = 100): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return true;
    await sleep(everyMs);
  }
  return false;
}

/**
 * A verified account with a session on a server process: registered over HTTP, then verified by the
 * link the process's SMTP fake stored in `outbox`, or, where the suite's mail server never answers
 * (`viaDatabase`), by marking the address verified in the database. The verification flow itself is
 * tested in tests/server/auth.test.ts.
 */
export async function signUp(
  url: string,
  db: Knex,
  email: string,
  name: string,
  opts: { viaDatabase?: boolean } = {},
): Promise<AuthResponse> {
  const r = await api(url, 'POST', '/auth/register', null, { email, password: PASSWORD, name });
  if (r.status !== 202) throw new Error(`register ${email}: ${r.status} ${JSON.stringify(r.body)}`);
  if (opts.viaDatabase) {
    await db('users').where({ email }).update({ email_verified_at: new Date().toISOString() });
  } else {
    let token = '';
    await eventually(async () => {
      const mail = await db('outbox').where({ to: email }).orderBy('id', 'desc').first<{ text: string } | undefined>();
      token = /verify-email\?token=(\S+)/.exec(mail?.text ?? '')?.[1] ?? '';
      return token !== '';
    }, 10_000);
    if (!token) throw new Error(`no verification link mailed to ${email}`);
    const v = await api(url, 'POST', '/auth/verify', null, { token: decodeURIComponent(token) });
    if (v.status !== 200) throw new Error(`verify ${email}: ${v.status} ${JSON.stringify(v.body)}`);
  }
  const s = await api<AuthResponse>(url, 'POST', '/auth/login', null, {
    email,
    password: PASSWORD,
  });
  if (s.status !== 200) throw new Error(`sign in ${email}: ${s.status} ${JSON.stringify(s.body)}`);
  return s.body;
}
