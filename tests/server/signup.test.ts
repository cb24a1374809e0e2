// Sign-up that proves the address and cannot be abused (docs/access.md): verification through the mailed
// link, invitations bound to the verified address and expiring, the same answer for known and unknown
// addresses, password rules, rate limits per client, user, building and recipient, the sign-in limit
// behind a proxy with a window that ends, and links built from the configured public URL.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, BuildingSummary, Member, PasswordStrength, User } from '../../shared/schema/api.ts';
import { DEFAULT_LIMITS, loadConfig } from '../../server/config.ts';
import { signVerification } from '../../server/services/tokens.ts';
import {
  createBuilding,
  errorCode,
  GENEROUS_LIMITS,
  mailTo,
  registerUser,
  signIn,
  startTestServer,
  TEST_PASSWORD,
  verificationToken,
  type TestServer,
} from './helpers.ts';

let n = 0;
const address = (label: string) => `${label}-${++n}-${Date.now()}@example.test`;
const register = (s: TestServer, email: string, extra: { headers?: Record<string, string>; password?: string } = {}) =>
  s.api('POST', '/auth/register', {
    body: { email, password: extra.password ?? TEST_PASSWORD, name: 'Someone' },
    headers: extra.headers,
  });

describe('verification of new accounts', () => {
  let s: TestServer;
  let lead: AuthResponse;
  beforeAll(async () => {
    s = await startTestServer({ config: { publicUrl: 'https://stanchion.test' } });
    lead = await registerUser(s, 'lead');
  });
  afterAll(async () => {
    await s?.close();
  });

  it('answers a new and an existing address the same way, and mails each owner what applies to them', async () => {
    const fresh = address('fresh');
    const a = await register(s, fresh);
    const b = await register(s, lead.user.email);
    expect([a.status, b.status]).toEqual([202, 202]);
    expect(Object.keys(a.body as object).sort()).toEqual(Object.keys(b.body as object).sort());
    expect((a.body as { status: string }).status).toBe((b.body as { status: string }).status);
    expect('token' in (a.body as object)).toBe(false);
    const [link] = await mailTo(s, fresh);
    expect(link.text).toContain('https://stanchion.test/verify-email?token=');
    const owner = (await mailTo(s, lead.user.email, 1, 15_000, /already has an account/)).at(-1)!;
    expect(owner.text).toContain('already has an account');
    expect(owner.text).toContain('https://stanchion.test/sign-in');
  });

  it('lets an unverified account sign in, and verifies it through the mailed link', async () => {
    const email = address('verify');
    await register(s, email);
    const session = await signIn(s, email);
    expect(session.user.emailVerified).toBe(false);
    const r = await s.api('POST', '/auth/verify', { body: { token: await verificationToken(s, email) } });
    expect(r.status).toBe(200);
    expect((r.body as User).emailVerified).toBe(true);
    expect(((await s.api('GET', '/me', { token: session.token })).body as User).emailVerified).toBe(true);
  });

  it('refuses an altered link, a link for an address the account no longer has, and a session token', async () => {
    const email = address('altered');
    await register(s, email);
    const token = await verificationToken(s, email);
    const tampered = `${token.slice(0, -4)}AAAA`;
    for (const t of [
      tampered,
      lead.token,
      signVerification(s.ctx.config.jwtSecret, lead.user.id, 'other@example.test'),
    ]) {
      const r = await s.api('POST', '/auth/verify', { body: { token: t } });
      expect(r.status).toBe(422);
      expect(errorCode(r.body)).toBe('unprocessable');
    }
  });

  it('binds an invitation to the verified address: whoever registers it first without the mailbox gets nothing', async () => {
    const b = await createBuilding(s, lead.token, 'Invitation block');
    const invited = address('invited');
    expect(
      (
        await s.api('POST', `/buildings/${b.id}/members`, {
          token: lead.token,
          body: { email: invited, role: 'engineer' },
        })
      ).status,
    ).toBe(201);
    // An impostor registers the address but cannot read the mailbox, so never verifies.
    await register(s, invited, { password: 'the impostors passphrase' });
    const impostor = await signIn(s, invited, 'the impostors passphrase');
    expect((await s.api('GET', '/buildings', { token: impostor.token })).body).toEqual([]);
    expect((await s.api('GET', `/buildings/${b.id}`, { token: impostor.token })).status).toBe(404);
    // Adding the (unverified) account again is still only an invitation.
    const again = await s.api('POST', `/buildings/${b.id}/members`, {
      token: lead.token,
      body: { email: invited, role: 'engineer' },
    });
    expect((again.body as Member).pending).toBe(true);
    // The owner of the mailbox follows the link: now, and only now, a member.
    expect((await s.api('POST', '/auth/verify', { body: { token: await verificationToken(s, invited) } })).status).toBe(
      200,
    );
    const list = (await s.api('GET', '/buildings', { token: impostor.token })).body as BuildingSummary[];
    expect(list.map((x) => [x.id, x.role])).toEqual([[b.id, 'engineer']]);
  });

  it('lets a pending invitation expire', async () => {
    const b = await createBuilding(s, lead.token, 'Expiry block');
    const invited = address('late');
    const r = await s.api('POST', `/buildings/${b.id}/members`, {
      token: lead.token,
      body: { email: invited, role: 'viewer' },
    });
    const expiresAt = Date.parse((r.body as Member).expiresAt!);
    expect(Math.round((expiresAt - Date.now()) / 86_400_000)).toBe(14);
    await s.ctx
      .db('invitations')
      .where({ email: invited })
      .update({ expires_at: new Date(Date.now() - 1000).toISOString() });
    await register(s, invited);
    expect((await s.api('POST', '/auth/verify', { body: { token: await verificationToken(s, invited) } })).status).toBe(
      200,
    );
    const session = await signIn(s, invited);
    expect((await s.api('GET', '/buildings', { token: session.token })).body).toEqual([]);
  });

  it('quotes a building name in the invitation and never puts it in the subject', async () => {
    const phishing = 'URGENT: your bank account is locked\r\nSubject: click https://evil.test/login now';
    const b = await createBuilding(s, lead.token, phishing);
    const invited = address('spam');
    await s.api('POST', `/buildings/${b.id}/members`, { token: lead.token, body: { email: invited, role: 'viewer' } });
    const [mail] = await mailTo(s, invited);
    expect(mail.subject).toBe('You have been invited to a building in Stanchion');
    expect(mail.text).toContain(
      'Building name, as its lead wrote it: “URGENT: your bank account is locked Subject: click https://evil.test/login now”',
    );
    expect(mail.text).not.toMatch(/\nSubject:/);
  });
});

describe('passwords', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => {
    await s?.close();
  });

  it('refuses more than 72 bytes (bcrypt would compare only the first 72) with a message saying so', async () => {
    // 36 × "é" is 72 bytes: allowed; 37 is 74.
    const ok = await register(s, address('long'), { password: 'é'.repeat(20) + ' quiet ferry lantern' });
    expect(ok.status).toBe(202);
    const r = await register(s, address('long'), { password: `${'é'.repeat(37)}` });
    expect(r.status).toBe(400);
    expect(JSON.stringify(r.body)).toContain('72 bytes');
    expect(
      await s.ctx
        .db('users')
        .where({ email: `long-${n}-x` })
        .first(),
    ).toBeUndefined();
  });

  it('never lets a longer attempt in on the first 72 bytes of the password', async () => {
    const email = address('exact');
    const password = `${'quiet ferry lantern orbit '.repeat(3)}`.slice(0, 72);
    expect((await register(s, email, { password })).status).toBe(202);
    expect((await s.api('POST', '/auth/login', { body: { email, password } })).status).toBe(200);
    expect((await s.api('POST', '/auth/login', { body: { email, password: `${password}anything` } })).status).toBe(401);
  });

  it('refuses ten spaces and passwords the estimator rates easy to guess', async () => {
    const spaces = await register(s, address('spaces'), { password: ' '.repeat(10) });
    expect(spaces.status).toBe(400);
    const weak = await register(s, address('weak'), { password: 'password123456' });
    expect(weak.status).toBe(422);
    expect((weak.body as { error: { message: string } }).error.message).toMatch(/too easy to guess/);
  });

  it('rates a password for the client without storing anything', async () => {
    const weak = (await s.api('POST', '/auth/password-strength', { body: { password: 'qwertyuiop12' } }))
      .body as PasswordStrength;
    const strong = (await s.api('POST', '/auth/password-strength', { body: { password: 'quiet ferry lantern orbit' } }))
      .body as PasswordStrength;
    expect(weak.acceptable).toBe(false);
    expect(strong).toMatchObject({ acceptable: true, required: 3 });
    expect(strong.score).toBeGreaterThan(weak.score);
  });
});

describe('rate limits', () => {
  let s: TestServer;
  let lead: AuthResponse;
  const limit = (max: number) => ({ windowMs: 60_000, max });
  beforeAll(async () => {
    s = await startTestServer({
      config: {
        trustProxy: 1,
        limits: {
          ...GENEROUS_LIMITS,
          registerPerClient: limit(3),
          registerPerAddress: limit(2),
          invitesPerBuilding: limit(4),
          mailPerRecipient: limit(2),
          mailPerUser: limit(6),
        },
        loginRateLimit: { windowMs: 1500, max: 2 },
      },
    });
    lead = await registerUser(s, 'lead');
  });
  afterAll(async () => {
    await s?.close();
  });
  const from = (ip: string) => ({ 'X-Forwarded-For': ip });

  it('limits registrations per client address (the proxy forwards it) and per e-mail address', async () => {
    const statuses = [];
    for (let i = 0; i < 4; i += 1)
      statuses.push((await register(s, address('burst'), { headers: from('10.0.0.1') })).status);
    expect(statuses).toEqual([202, 202, 202, 429]);
    // Another client is counted on its own.
    expect((await register(s, address('other'), { headers: from('10.0.0.2') })).status).toBe(202);
    // One address, many clients: mails to it are limited all the same.
    const target = address('target');
    const perAddress = [];
    for (let i = 0; i < 3; i += 1)
      perAddress.push((await register(s, target, { headers: from(`10.0.1.${i}`) })).status);
    expect(perAddress).toEqual([202, 202, 429]);
    expect((await mailTo(s, target, 2)).length).toBe(2);
  });

  it('limits invitation e-mails per recipient and per building: inviting and cancelling cannot send a stream of mail', async () => {
    const b = await createBuilding(s, lead.token, 'Limits block');
    const victim = address('victim');
    const statuses = [];
    for (let i = 0; i < 3; i += 1) {
      statuses.push(
        (
          await s.api('POST', `/buildings/${b.id}/members`, {
            token: lead.token,
            body: { email: victim, role: 'viewer' },
          })
        ).status,
      );
      await s.api('DELETE', `/buildings/${b.id}/members/${encodeURIComponent(victim)}`, { token: lead.token });
    }
    expect(statuses).toEqual([201, 201, 429]);
    expect((await mailTo(s, victim, 2)).length).toBe(2);
    const r = await s.api('POST', `/buildings/${b.id}/members`, {
      token: lead.token,
      body: { email: victim, role: 'viewer' },
    });
    expect(errorCode(r.body)).toBe('rate_limited');
    // Per building: four invitation requests in all (refused ones count too), then refused whatever the address.
    const other = await s.api('POST', `/buildings/${b.id}/members`, {
      token: lead.token,
      body: { email: address('fourth'), role: 'viewer' },
    });
    expect(other.status).toBe(429);
    expect((other.body as { error: { message: string } }).error.message).toMatch(/this building/);
  });

  it('limits verification links sent again to one address', async () => {
    const email = address('resend');
    await register(s, email, { headers: from('10.0.2.1') });
    const session = await signIn(s, email);
    const statuses = [];
    for (let i = 0; i < 3; i += 1)
      statuses.push((await s.api('POST', '/auth/verify/resend', { token: session.token })).status);
    expect(statuses).toEqual([202, 202, 429]);
    expect((await mailTo(s, email, 3)).length).toBe(3);
  });

  it('keys the sign-in limit by the forwarded client, counts only failures, and lets the window end', async () => {
    const email = lead.user.email;
    const wrong = (ip: string) =>
      s.api('POST', '/auth/login', { body: { email, password: 'not the password at all' }, headers: from(ip) });
    const right = (ip: string) =>
      s.api('POST', '/auth/login', { body: { email, password: TEST_PASSWORD }, headers: from(ip) });
    // Successful sign-ins do not use up the allowance.
    for (let i = 0; i < 3; i += 1) expect((await right('10.9.0.1')).status).toBe(200);
    expect([
      (await wrong('10.9.0.1')).status,
      (await wrong('10.9.0.1')).status,
      (await wrong('10.9.0.1')).status,
    ]).toEqual([401, 401, 429]);
    expect((await right('10.9.0.1')).status).toBe(429);
    // Another client behind the same proxy is not locked out.
    expect((await right('10.9.0.2')).status).toBe(200);
    // The window ends: the right password works again.
    await new Promise((r) => setTimeout(r, 1600));
    expect((await right('10.9.0.1')).status).toBe(200);
  });
});

describe('configuration', () => {
  it('takes the public URL from PUBLIC_URL, http(s) only, and never from a request', () => {
    expect(loadConfig({ PUBLIC_URL: 'https://columns.example.test/' }, { jwtSecret: 'x'.repeat(32) }).publicUrl).toBe(
      'https://columns.example.test',
    );
    for (const bad of ['javascript:alert(1)', 'ftp://files.example.test', 'not a url', 'data:text/html,hi']) {
      expect(() => loadConfig({ PUBLIC_URL: bad }, { jwtSecret: 'x'.repeat(32) }), bad).toThrow(/PUBLIC_URL/);
    }
    expect(loadConfig({}, { jwtSecret: 'x'.repeat(32) }).publicUrl).toBe('http://localhost:3000');
  });

  it('reads the sign-up limits and invitation lifetime from the environment', () => {
    const c = loadConfig(
      { REGISTER_RATE_LIMIT: '7', MAIL_RATE_LIMIT: '9', INVITATION_DAYS: '3', TRUST_PROXY: '1' },
      { jwtSecret: 'x'.repeat(32) },
    );
    expect(c.limits.registerPerClient).toEqual({ ...DEFAULT_LIMITS.registerPerClient, max: 7 });
    expect(c.limits.mailPerUser.max).toBe(9);
    expect(c.invitationDays).toBe(3);
    expect(c.trustProxy).toBe(1);
  });
});

describe('e-mails per signed-in user', () => {
  it('limits the e-mail-sending requests of one account across buildings and routes', async () => {
    const s = await startTestServer({
      config: { limits: { ...GENEROUS_LIMITS, mailPerUser: { windowMs: 60_000, max: 2 } } },
    });
    try {
      const lead = await registerUser(s, 'lead');
      const [a, b] = [await createBuilding(s, lead.token, 'One'), await createBuilding(s, lead.token, 'Two')];
      const invite = (id: number) =>
        s.api('POST', `/buildings/${id}/members`, { token: lead.token, body: { email: address('x'), role: 'viewer' } });
      expect([(await invite(a.id)).status, (await invite(b.id)).status]).toEqual([201, 201]);
      const third = await invite(a.id);
      expect(third.status).toBe(429);
      expect((third.body as { error: { message: string } }).error.message).toMatch(/from this account/);
      // Freezing a revision mails every member: the same allowance.
      expect(
        (
          await s.api('POST', `/buildings/${b.id}/revisions`, {
            token: lead.token,
            body: { note: '', purpose: 'preliminary' },
          })
        ).status,
      ).toBe(429);
    } finally {
      await s.close();
    }
  });
});
