import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import jwt from 'jsonwebtoken';
import type { User } from '../../shared/schema/api.ts';
import {
  errorCode,
  mailTo,
  registerUser,
  signIn,
  startTestServer,
  TEST_PASSWORD,
  verificationToken,
  type TestServer,
} from './helpers.ts';

describe('accounts', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ config: { loginRateLimit: { windowMs: 60_000, max: 5 } } });
  });
  afterAll(async () => {
    await s?.close();
  });

  it('registers with a normalised e-mail address, mails a verification link, and signs in with a token that GET /api/me accepts', async () => {
    const r = await s.api('POST', '/auth/register', {
      body: { email: '  Mixed.Case@Example.TEST ', password: TEST_PASSWORD, name: 'Mixed' },
    });
    expect(r.status).toBe(202);
    expect(r.body).toEqual({ status: 'verification-sent', email: 'mixed.case@example.test' });
    expect(await verificationToken(s, 'mixed.case@example.test')).toMatch(/^[\w-]+\.[\w-]+\.[\w-]+$/);
    const { token, user } = await signIn(s, 'mixed.case@example.test');
    expect(user).toEqual({
      id: expect.any(Number),
      email: 'mixed.case@example.test',
      name: 'Mixed',
      isAdmin: false,
      emailVerified: false,
    });
    const me = await s.api('GET', '/me', { token });
    expect(me.status).toBe(200);
    expect((me.body as User).email).toBe('mixed.case@example.test');
  });

  it('stores a bcrypt hash, never the password', async () => {
    const row = await s.ctx
      .db('users')
      .where({ email: 'mixed.case@example.test' })
      .first<{ password_hash: string }>('password_hash');
    expect(row.password_hash).toMatch(/^\$2[aby]\$04\$/);
    expect(row.password_hash).not.toContain(TEST_PASSWORD);
  });

  it('makes no second account on the same address, whatever its case, and answers as for a new one', async () => {
    const r = await s.api('POST', '/auth/register', {
      body: { email: 'MIXED.case@example.test', password: TEST_PASSWORD, name: 'Again' },
    });
    expect(r.status).toBe(202);
    expect(r.body).toEqual({ status: 'verification-sent', email: 'mixed.case@example.test' });
    // PostgreSQL answers a count as a string, SQLite as a number.
    const [{ n }] = await s.ctx
      .db('users')
      .where({ email: 'mixed.case@example.test' })
      .count<{ n: number | string }[]>({
        n: '*',
      });
    expect(Number(n)).toBe(1);
    // The owner is told instead, with no verification link.
    const mails = await mailTo(s, 'mixed.case@example.test', 2);
    expect(mails.at(-1)?.text).toContain('already has an account');
    expect(mails.at(-1)?.text).not.toContain('verify-email');
  });

  it('refuses a password shorter than 10 characters', async () => {
    const r = await s.api('POST', '/auth/register', {
      body: { email: 'short@example.test', password: '123456789', name: 'Short' },
    });
    expect(r.status).toBe(400);
    expect(errorCode(r.body)).toBe('validation_failed');
  });

  it('logs in with the right password and gives the same message for a wrong password and an unknown address', async () => {
    const ok = await s.api('POST', '/auth/login', {
      body: { email: 'Mixed.Case@example.test', password: TEST_PASSWORD },
    });
    expect(ok.status).toBe(200);
    const wrongPassword = await s.api('POST', '/auth/login', {
      body: { email: 'mixed.case@example.test', password: 'not the password' },
    });
    const unknown = await s.api('POST', '/auth/login', {
      body: { email: 'nobody@example.test', password: TEST_PASSWORD },
    });
    expect(wrongPassword.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrongPassword.body).toEqual(unknown.body);
  });

  it('issues tokens that expire after 12 hours', async () => {
    const { token } = await registerUser(s, 'expiry');
    const claims = jwt.decode(token) as { iat: number; exp: number };
    expect(claims.exp - claims.iat).toBe(12 * 3600);
  });

  it('answers 401 for a missing, forged or expired token', async () => {
    const { user } = await registerUser(s, 'forged');
    const forged = jwt.sign({}, 'not-the-server-secret-at-all', { subject: String(user.id), expiresIn: '1h' });
    const expired = jwt.sign({ exp: Math.floor(Date.now() / 1000) - 10 }, s.ctx.config.jwtSecret, {
      subject: String(user.id),
    });
    for (const token of [null, forged, expired, 'garbage']) {
      const r = await s.api('GET', '/me', { token });
      expect(r.status).toBe(401);
      expect(errorCode(r.body)).toBe('unauthenticated');
    }
  });

  it('unauthenticated GET /api/buildings is 401', async () => {
    const r = await s.api('GET', '/buildings');
    expect(r.status).toBe(401);
    expect(errorCode(r.body)).toBe('unauthenticated');
  });

  it('rate-limits sign-in attempts from one client with 429 in the error shape', async () => {
    // The limit is 5 per window in this server; earlier tests used some of them.
    const replies: number[] = [];
    for (let i = 0; i < 7; i++) {
      replies.push(
        (await s.api('POST', '/auth/login', { body: { email: 'nobody@example.test', password: 'whatever12' } })).status,
      );
    }
    expect(replies).toContain(429);
    const last = await s.api('POST', '/auth/login', {
      body: { email: 'mixed.case@example.test', password: TEST_PASSWORD },
    });
    expect(last.status).toBe(429);
    expect(errorCode(last.body)).toBe('rate_limited');
  });
});

// Two processes behind one load balancer must not give a client two allowances
// (docs/live-protocol.md §Several processes). Runs wherever Redis is configured for tests (always in .ci/run);
// says so when it is not.
const redisUrl = process.env.TEST_REDIS_URL;
if (!redisUrl) console.warn('TEST_REDIS_URL is not set: the shared sign-in limit across processes is not tested here');
describe.skipIf(!redisUrl)('the sign-in limit shared through Redis', () => {
  const servers: TestServer[] = [];
  afterAll(async () => {
    for (const s of servers) await s.close();
  });

  it('counts attempts on one process against the other', async () => {
    const redisPrefix = `stanchion-test:login-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;
    const config = { redisUrl: redisUrl!, redisPrefix, loginRateLimit: { windowMs: 60_000, max: 4 } };
    servers.push(await startTestServer({ config }), await startTestServer({ config }));
    const [a, b] = servers;
    const attempt = (s: TestServer) =>
      s.api('POST', '/auth/login', { body: { email: 'nobody@example.test', password: 'whatever12' } });
    // Two wrong passwords on each process use up the shared allowance of four.
    for (const s of [a, b, a, b]) expect((await attempt(s)).status).toBe(401);
    for (const s of [a, b]) {
      const r = await attempt(s);
      expect(r.status).toBe(429);
      expect(errorCode(r.body)).toBe('rate_limited');
    }
  });
});

describe('malformed bodies on the auth routes', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => {
    await s?.close();
  });

  const cases: [string, { raw?: string; body?: unknown; headers?: Record<string, string> }, number][] = [
    ['invalid JSON', { raw: '{"email": "a@b.test", ' }, 400],
    ['a JSON array', { body: [1, 2, 3] }, 400],
    ['a bare JSON string', { raw: '"just a string"' }, 400],
    ['null', { raw: 'null' }, 400],
    ['wrong types', { body: { email: 42, password: true, name: [] } }, 400],
    ['missing fields', { body: {} }, 400],
    ['unknown fields', { body: { email: 'x@y.test', password: TEST_PASSWORD, name: 'X', isAdmin: true } }, 400],
    ['a huge string', { body: { email: `${'a'.repeat(100_000)}@b.test`, password: TEST_PASSWORD, name: 'X' } }, 400],
    [
      'a body over the 1 MB limit',
      { raw: JSON.stringify({ email: 'x@y.test', password: 'p'.repeat(1_100_000), name: 'X' }) },
      413,
    ],
    [
      'form encoding instead of JSON',
      { raw: 'email=x@y.test', headers: { 'Content-Type': 'application/x-www-form-urlencoded' } },
      400,
    ],
    [
      'a prototype-pollution attempt',
      { raw: '{"__proto__": {"isAdmin": true}, "email": "p@q.test", "password": "long enough pw", "name": "P"}' },
      400,
    ],
  ];

  for (const route of ['/auth/register', '/auth/login']) {
    for (const [label, req, status] of cases) {
      it(`POST /api${route} with ${label} → ${status} with the error shape`, async () => {
        const r = await s.api('POST', route, req);
        expect(r.status).toBe(status);
        expect(errorCode(r.body)).toBeDefined();
      });
    }
  }

  it('created no account from any malformed body', async () => {
    const n = await s.ctx.db('users').count<{ n: number }[]>({ n: '*' });
    expect(Number(n[0].n)).toBe(0);
  });
});
