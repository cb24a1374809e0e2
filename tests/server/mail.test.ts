import { createServer, type Server } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Member } from '../../shared/schema/api.ts';
import type { OutboxMessage } from '../../shared/schema/outbox.ts';
import {
  createBuilding,
  errorCode,
  eventually,
  FAST_MAIL,
  makeAdmin,
  registerUser,
  startTestServer,
  type TestServer,
} from './helpers.ts';

describe('the local SMTP fake and the dev outbox', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => {
    await s?.close();
  });

  it('starts its own SMTP fake on a free local port when SMTP_URL is unset', () => {
    expect(s.ctx.mailer.fakePort).toBeGreaterThan(0);
  });

  it('captures a message with its attachment, lists it to an admin and serves the attachment bytes', async () => {
    const admin = await registerUser(s, 'admin');
    await makeAdmin(s, admin.user.id);
    const content = Buffer.from('%PDF-1.4 invented bytes \u0000\u00ff', 'latin1');
    const sent = await s.ctx.mailer.sendMail({
      to: 'team@example.test',
      subject: 'Revision A issued',
      text: 'See the attached package.',
      attachments: [{ filename: 'package.pdf', content, contentType: 'application/pdf' }],
    });
    expect(sent).toBe(true);
    const list = (await s.api('GET', '/dev/outbox', { token: admin.token })).body as OutboxMessage[];
    const msg = list.find((m) => m.subject === 'Revision A issued');
    expect(msg?.to).toBe('team@example.test');
    expect(msg?.text.trim()).toBe('See the attached package.');
    expect(msg?.attachments).toEqual([
      { filename: 'package.pdf', contentType: 'application/pdf', size: content.length },
    ]);
    const res = await fetch(`${s.url}/api/dev/outbox/${msg?.id}/attachments/0`, {
      headers: { Authorization: `Bearer ${admin.token}` },
    });
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await res.arrayBuffer()).equals(content)).toBe(true);
    expect((await s.api('GET', `/dev/outbox/${msg?.id}/attachments/1`, { token: admin.token })).status).toBe(404);
  });

  it('keeps the outbox from anyone but a site admin', async () => {
    const user = await registerUser(s, 'plain');
    expect((await s.api('GET', '/dev/outbox')).status).toBe(401);
    const r = await s.api('GET', '/dev/outbox', { token: user.token });
    expect(r.status).toBe(403);
    expect(errorCode(r.body)).toBe('forbidden');
  });
});

describe('the dev outbox in production', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ config: { production: true } });
  });
  afterAll(async () => {
    await s?.close();
  });

  it('does not exist: 404 even for a site admin', async () => {
    const admin = await registerUser(s, 'admin');
    await makeAdmin(s, admin.user.id);
    const r = await s.api('GET', '/dev/outbox', { token: admin.token });
    expect(r.status).toBe(404);
    expect(errorCode(r.body)).toBe('not_found');
  });
});

describe('a mail server that refuses connections', () => {
  let s: TestServer;
  let dead: Server;
  beforeAll(async () => {
    // A port that accepts TCP and hangs up at once: every SMTP attempt fails.
    dead = createServer((socket) => socket.destroy());
    await new Promise<void>((r) => dead.listen(0, '127.0.0.1', () => r()));
    const { port } = dead.address() as AddressInfo;
    s = await startTestServer({ smtpUrl: `smtp://127.0.0.1:${port}`, config: { mail: FAST_MAIL } });
  });
  afterAll(async () => {
    await s?.close();
    await new Promise<void>((r) => dead.close(() => r()));
  });

  it('answers the invitation at once, retries with back-off, logs each failure and shows the lead the failed e-mail', async () => {
    const lead = await registerUser(s, 'lead');
    const b = await createBuilding(s, lead.token);
    const r = await s.api('POST', `/buildings/${b.id}/members`, {
      token: lead.token,
      body: { email: 'unreachable@example.test', role: 'viewer' },
    });
    expect(r.status).toBe(201);
    const invited = async () =>
      ((await s.api('GET', `/buildings/${b.id}/members`, { token: lead.token })).body as Member[]).find(
        (m) => m.email === 'unreachable@example.test',
      );
    await eventually(async () => (await invited())?.invitationMail?.status === 'failed');
    const shown = (await invited())?.invitationMail;
    expect(shown).toMatchObject({ status: 'failed', attempts: FAST_MAIL.maxAttempts });
    expect((shown?.error ?? '').length).toBeGreaterThan(0);
    const log = await s.ctx
      .db('mail_log')
      .where({ to: 'unreachable@example.test' })
      .orderBy('id')
      .select<{ status: string; attempts: number; error: string }[]>('status', 'attempts', 'error');
    expect(log.map((l) => [l.status, l.attempts])).toEqual([
      ['failed', 1],
      ['failed', 2],
      ['failed', 3],
    ]);
    expect(s.ctx.mailer.fakePort).toBeNull();
  });
});
