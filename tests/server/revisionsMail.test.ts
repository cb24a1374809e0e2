import { createServer, type Server } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { OutboxMessage } from '../../shared/schema/outbox.ts';
import type { RevisionDetail } from '../../shared/schema/revisions.ts';
import { eventually, FAST_MAIL, makeAdmin, registerUser, startTestServer, type TestServer } from './helpers.ts';
import { revisionFixture, type RevisionFixture } from './revisionsFixture.ts';

describe('e-mail on freeze (local SMTP fake)', () => {
  let s: TestServer;
  let f: RevisionFixture;
  beforeAll(async () => {
    s = await startTestServer({ config: { publicUrl: 'https://stanchion.test' } });
    f = await revisionFixture(s);
  });
  afterAll(async () => {
    await s?.close();
  });

  it('sends every member one message with a link and the calculation package attached, and records each as sent', async () => {
    // The link comes from the configured public URL: a crafted Origin header never reaches the mail.
    const r = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
      token: f.lead.token,
      body: { note: 'Mail test', purpose: 'preliminary' },
      headers: { Origin: 'javascript:alert(1)//' },
    });
    expect(r.status).toBe(201);
    const frozen = r.body as RevisionDetail;
    const members = [f.lead, f.engineer, f.viewer].map((m) => m.user.email).sort();
    // The freeze answers once committed; the mail goes out from the durable outbox just after.
    expect(frozen.recipients.map((x) => x.email)).toEqual(members);
    const detail = async () =>
      (await s.api('GET', `/revisions/${frozen.id}`, { token: f.lead.token })).body as RevisionDetail;
    await eventually(async () => (await detail()).mail.sent === 3);
    const rev = await detail();
    expect(rev.recipients.map((x) => [x.email, x.status, x.attempts])).toEqual(members.map((e) => [e, 'sent', 1]));
    expect(rev.mail).toEqual({ pending: 0, sent: 3, failed: 0 });

    const admin = await registerUser(s, 'admin');
    await makeAdmin(s, admin.user.id);
    const outbox = ((await s.api('GET', '/dev/outbox', { token: admin.token })).body as OutboxMessage[]).filter((m) =>
      m.subject.includes('P01'),
    );
    expect(outbox.map((m) => m.to).sort()).toEqual(members);
    for (const m of outbox) {
      expect(m.text).toContain(`https://stanchion.test/buildings/${f.buildingId}/revisions`);
      expect(`${m.text}${m.html}`).not.toContain('javascript:');
      expect(m.text).toContain(rev.hash);
      expect(m.attachments).toHaveLength(1);
      expect(m.attachments[0].contentType).toBe('application/pdf');
      expect(m.attachments[0].filename).toMatch(/P01-calculations\.pdf$/);
    }
    // The attachment is the package the download route serves.
    const res = await fetch(`${s.url}/api/dev/outbox/${outbox[0].id}/attachments/0`, {
      headers: { Authorization: `Bearer ${admin.token}` },
    });
    const attached = Buffer.from(await res.arrayBuffer());
    const download = await fetch(`${s.url}/api/revisions/${rev.id}/calc.pdf`, {
      headers: { Authorization: `Bearer ${f.viewer.token}` },
    });
    expect(attached.equals(Buffer.from(await download.arrayBuffer()))).toBe(true);
  });

  it('lets only the lead ask for a resend', async () => {
    const rev = (
      (await s.api('GET', `/buildings/${f.buildingId}/revisions`, { token: f.lead.token })).body as RevisionDetail[]
    )[0];
    expect((await s.api('POST', `/revisions/${rev.id}/resend`, { token: f.engineer.token })).status).toBe(403);
    const r = await s.api('POST', `/revisions/${rev.id}/resend`, { token: f.lead.token });
    expect(r.status).toBe(200);
    // Everyone already has it: nothing is sent twice.
    expect((r.body as RevisionDetail).recipients.every((x) => x.status === 'sent' && x.attempts === 1)).toBe(true);
  });
});

describe('e-mail on freeze when the mail server refuses', () => {
  let s: TestServer;
  let dead: Server;
  let f: RevisionFixture;
  beforeAll(async () => {
    // Accepts TCP and hangs up at once: every SMTP attempt fails.
    dead = createServer((socket) => socket.destroy());
    await new Promise<void>((r) => dead.listen(0, '127.0.0.1', () => r()));
    s = await startTestServer({
      smtpUrl: `smtp://127.0.0.1:${(dead.address() as AddressInfo).port}`,
      config: { mail: FAST_MAIL },
    });
    f = await revisionFixture(s);
  });
  afterAll(async () => {
    await s?.close();
    await new Promise<void>((r) => dead.close(() => r()));
  });

  it('keeps the revision, retries with back-off, marks each recipient failed with the reason, and a resend tries again', async () => {
    const r = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
      token: f.lead.token,
      body: { note: '', purpose: 'preliminary' },
    });
    expect(r.status).toBe(201);
    const frozen = r.body as RevisionDetail;
    expect(frozen.code).toBe('P01');
    const detail = async () =>
      (await s.api('GET', `/revisions/${frozen.id}`, { token: f.lead.token })).body as RevisionDetail;
    await eventually(async () => (await detail()).mail.failed === 3);
    const rev = await detail();
    expect(
      rev.recipients.every(
        (x) => x.status === 'failed' && x.attempts === FAST_MAIL.maxAttempts && (x.error ?? '').length > 0,
      ),
    ).toBe(true);
    const again = (await s.api('POST', `/revisions/${rev.id}/resend`, { token: f.lead.token })).body as RevisionDetail;
    expect(again.recipients.every((x) => x.status === 'pending')).toBe(true);
    await eventually(async () => (await detail()).mail.failed === 3);
    expect(
      (await detail()).recipients.every((x) => x.status === 'failed' && x.attempts === 2 * FAST_MAIL.maxAttempts),
    ).toBe(true);
    expect(again.hash).toBe(rev.hash);
  });
});
