import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BuildingSummary, Member } from '../../shared/schema/api.ts';
import {
  addMember,
  createBuilding,
  errorCode,
  eventually,
  registerUser,
  signIn,
  startTestServer,
  TEST_PASSWORD,
  verificationToken,
  type TestServer,
} from './helpers.ts';

describe('members and invitations', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => {
    await s?.close();
  });

  it('adds an existing account by e-mail with a role, and the building appears in its list', async () => {
    const lead = await registerUser(s, 'lead');
    const eng = await registerUser(s, 'eng');
    const b = await createBuilding(s, lead.token);
    await addMember(s, lead.token, b.id, eng.user.email.toUpperCase(), 'engineer');
    const list = (await s.api('GET', '/buildings', { token: eng.token })).body as BuildingSummary[];
    expect(list.find((x) => x.id === b.id)?.role).toBe('engineer');
    const again = await s.api('POST', `/buildings/${b.id}/members`, {
      token: lead.token,
      body: { email: eng.user.email, role: 'viewer' },
    });
    expect(again.status).toBe(409);
  });

  it('invites an address with no account by e-mail quoting the building and the inviter, and makes it a member once the address is verified', async () => {
    const lead = await registerUser(s, 'lead');
    const b = await createBuilding(s, lead.token, 'Invented tower');
    const email = `newcomer-${Date.now()}@example.test`;
    const r = await s.api('POST', `/buildings/${b.id}/members`, { token: lead.token, body: { email, role: 'viewer' } });
    expect(r.status).toBe(201);
    expect(r.body).toEqual({
      userId: null,
      email,
      name: null,
      role: 'viewer',
      pending: true,
      expiresAt: expect.any(String),
      invitationMail: { status: 'pending', attempts: 0, error: null },
    });
    // Sent by the background sender from the durable outbox.
    await eventually(async () => (await s.ctx.db('outbox').where({ to: email }).first()) !== undefined);
    const mail = await s.ctx.db('outbox').where({ to: email }).first<{ subject: string; text: string }>();
    const listed = ((await s.api('GET', `/buildings/${b.id}/members`, { token: lead.token })).body as Member[]).find(
      (m) => m.email === email,
    );
    expect(listed?.invitationMail).toEqual({ status: 'sent', attempts: 1, error: null });
    // The building's name is the lead's text: quoted in the body, never in the subject.
    expect(mail.subject).not.toContain('Invented tower');
    expect(mail.text).toContain('“Invented tower”');
    expect(mail.text).toContain(`“${lead.user.name}”`);

    const reg = await s.api('POST', '/auth/register', { body: { email, password: TEST_PASSWORD, name: 'Newcomer' } });
    expect(reg.status).toBe(202);
    // Registered but not verified: the invitation waits.
    const unverified = await signIn(s, email);
    expect((await s.api('GET', '/buildings', { token: unverified.token })).body).toEqual([]);
    expect(await s.api('POST', '/auth/verify', { body: { token: await verificationToken(s, email) } })).toMatchObject({
      status: 200,
    });
    const token = unverified.token;
    const list = (await s.api('GET', '/buildings', { token })).body as BuildingSummary[];
    expect(list.map((x) => [x.id, x.role])).toEqual([[b.id, 'viewer']]);
    const members = (await s.api('GET', `/buildings/${b.id}/members`, { token })).body as Member[];
    expect(members.filter((m) => m.pending)).toEqual([]);
  });

  it('changes and cancels a pending invitation by its e-mail address', async () => {
    const lead = await registerUser(s, 'lead');
    const b = await createBuilding(s, lead.token);
    const email = `pending-${Date.now()}@example.test`;
    await addMember(s, lead.token, b.id, email, 'viewer');
    const patched = await s.api('PATCH', `/buildings/${b.id}/members/${encodeURIComponent(email)}`, {
      token: lead.token,
      body: { role: 'engineer' },
    });
    expect((patched.body as Member).role).toBe('engineer');
    expect(
      (await s.api('DELETE', `/buildings/${b.id}/members/${encodeURIComponent(email)}`, { token: lead.token })).status,
    ).toBe(204);
    const members = (await s.api('GET', `/buildings/${b.id}/members`, { token: lead.token })).body as Member[];
    expect(members.map((m) => m.email)).toEqual([lead.user.email]);
  });

  it('never removes or demotes the last lead, but allows it once there is another', async () => {
    const lead = await registerUser(s, 'lead');
    const second = await registerUser(s, 'second');
    const b = await createBuilding(s, lead.token);
    const demote = await s.api('PATCH', `/buildings/${b.id}/members/${lead.user.id}`, {
      token: lead.token,
      body: { role: 'engineer' },
    });
    expect(demote.status).toBe(422);
    expect(errorCode(demote.body)).toBe('unprocessable');
    expect((await s.api('DELETE', `/buildings/${b.id}/members/${lead.user.id}`, { token: lead.token })).status).toBe(
      422,
    );
    await addMember(s, lead.token, b.id, second.user.email, 'lead');
    expect((await s.api('DELETE', `/buildings/${b.id}/members/${lead.user.id}`, { token: lead.token })).status).toBe(
      204,
    );
    expect((await s.api('GET', `/buildings/${b.id}`, { token: lead.token })).status).toBe(404);
  });

  it('lets only a lead manage members', async () => {
    const lead = await registerUser(s, 'lead');
    const eng = await registerUser(s, 'eng');
    const b = await createBuilding(s, lead.token);
    await addMember(s, lead.token, b.id, eng.user.email, 'engineer');
    const r = await s.api('POST', `/buildings/${b.id}/members`, {
      token: eng.token,
      body: { email: 'x@example.test', role: 'lead' },
    });
    expect(r.status).toBe(403);
    expect(errorCode(r.body)).toBe('forbidden');
    expect(
      (await s.api('PATCH', `/buildings/${b.id}/members/${eng.user.id}`, { token: eng.token, body: { role: 'lead' } }))
        .status,
    ).toBe(403);
  });

  it('records an audit row for each membership change', async () => {
    const lead = await registerUser(s, 'lead');
    const b = await createBuilding(s, lead.token);
    await addMember(s, lead.token, b.id, `audit-${Date.now()}@example.test`, 'viewer');
    const actions = (
      await s.ctx.db('audit_log').where({ building_id: b.id }).orderBy('id').select<{ action: string }[]>('action')
    ).map((r) => r.action);
    expect(actions).toEqual(['building.create', 'member.invite']);
  });
});
