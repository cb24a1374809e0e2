// Access that ends when it should, on the live channel (docs/access.md), over real socket.io-client
// connections: a removed member stops receiving at once, a demoted one can no longer edit, a socket whose
// token expires is closed and cannot edit, and signing out or changing the password ends every session.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, StackSummary } from '../../shared/schema/api.ts';
import type { SessionEnded, StackChanged } from '../../shared/schema/socket.ts';
import { signToken } from '../../server/services/tokens.ts';
import {
  addMember,
  createBuilding,
  errorCode,
  registerUser,
  startTestServer,
  TEST_PASSWORD,
  type TestServer,
} from './helpers.ts';
import { connect, next, request, type LiveClient } from './liveHelpers.ts';

let s: TestServer;
let lead: AuthResponse;
let buildingId: number;
const template = { storeys: 3, storeyHeight: 3.6, sections: ['UKC 203x203x46'], Gk: 50, Qk: 20 };

const open: LiveClient[] = [];
async function client(token: string): Promise<LiveClient> {
  const c = await connect(s.url, token);
  open.push(c);
  return c;
}

async function newStack(name: string): Promise<number> {
  const r = await s.api('POST', `/buildings/${buildingId}/stacks`, { token: lead.token, body: { name, template } });
  expect(r.status).toBe(201);
  return (r.body as StackSummary).id;
}

async function member(label: string, role: 'viewer' | 'engineer'): Promise<AuthResponse> {
  const m = await registerUser(s, label);
  await addMember(s, lead.token, buildingId, m.user.email, role);
  return m;
}

/** Every stack:changed the socket receives. */
function collect(c: LiveClient): StackChanged[] {
  const got: StackChanged[] = [];
  c.on('stack:changed', (p) => got.push(p));
  return got;
}

const closed = (c: LiveClient, timeoutMs = 5000) =>
  new Promise<string>((resolve, reject) => {
    if (c.disconnected) return resolve('already');
    const t = setTimeout(() => reject(new Error('socket still open')), timeoutMs);
    c.once('disconnect', (reason) => {
      clearTimeout(t);
      resolve(reason);
    });
  });

beforeAll(async () => {
  s = await startTestServer();
  lead = await registerUser(s, 'lead');
  buildingId = (await createBuilding(s, lead.token, 'Access block')).id;
});

afterAll(async () => {
  for (const c of open) c.close();
  await s?.close();
});

describe('membership changes reach open sockets at once', () => {
  it('a removed member stops receiving stack and building events from the next edit on', async () => {
    const stackId = await newStack('R/1');
    const gone = await member('removed', 'engineer');
    const leadSocket = await client(lead.token);
    const goneSocket = await client(gone.token);
    expect((await request(leadSocket, 'stack:join', { stackId })).ok).toBe(true);
    expect((await request(goneSocket, 'stack:join', { stackId })).ok).toBe(true);
    expect((await request(goneSocket, 'building:join', { buildingId })).ok).toBe(true);
    const heard = collect(goneSocket);
    const heardBuilding: number[] = [];
    goneSocket.on('building:stack-changed', (p) => heardBuilding.push(p.version));
    goneSocket.on('building:stacks-changed', (p) => heardBuilding.push(...p.stacks.map((x) => x.version)));
    const revoked = next(goneSocket, 'access:revoked');

    // One edit while still a member: received.
    const v1 = next(leadSocket, 'stack:changed', (p) => p.version === 1);
    const first = await request<{ version: number }>(leadSocket, 'stack:edit', {
      stackId,
      baseVersion: 0,
      ops: [{ op: 'moveNode', id: 'cap', position: { x: 1, y: 1 } }],
    });
    expect(first.ok).toBe(true);
    await v1;
    await new Promise((r) => setTimeout(r, 100));
    expect(heard.map((p) => p.version)).toEqual([1]);

    expect(
      (await s.api('DELETE', `/buildings/${buildingId}/members/${gone.user.id}`, { token: lead.token })).status,
    ).toBe(204);
    expect(await revoked).toEqual({ buildingId });

    // The very next edit is not received, on the stack room or the building room.
    const v2 = next(leadSocket, 'stack:changed', (p) => p.version === 2);
    const second = await request(leadSocket, 'stack:edit', {
      stackId,
      baseVersion: 1,
      ops: [{ op: 'moveNode', id: 'cap', position: { x: 2, y: 2 } }],
    });
    expect(second.ok).toBe(true);
    await v2;
    await new Promise((r) => setTimeout(r, 200));
    expect(heard.map((p) => p.version)).toEqual([1]);
    expect(heardBuilding).toEqual([1]);

    // And every event of theirs is refused as for any outsider (404, existence does not leak).
    const join = await request(goneSocket, 'stack:join', { stackId });
    expect(join.ok).toBe(false);
    if (!join.ok) expect(join.error.code).toBe('not_found');
    const edit = await request(goneSocket, 'stack:edit', {
      stackId,
      baseVersion: 2,
      ops: [{ op: 'moveNode', id: 'cap', position: { x: 3, y: 3 } }],
    });
    expect(edit.ok).toBe(false);
    expect((await s.ctx.db('stacks').where({ id: stackId }).first<{ version: number }>('version')).version).toBe(2);
  });

  it('a member demoted to viewer can no longer edit from a socket opened as engineer', async () => {
    const stackId = await newStack('D/1');
    const demoted = await member('demoted', 'engineer');
    const socket = await client(demoted.token);
    expect((await request(socket, 'stack:join', { stackId })).ok).toBe(true);
    const ok = await request(socket, 'stack:edit', {
      stackId,
      baseVersion: 0,
      ops: [{ op: 'moveNode', id: 'cap', position: { x: 1, y: 1 } }],
    });
    expect(ok.ok).toBe(true);
    expect(
      (
        await s.api('PATCH', `/buildings/${buildingId}/members/${demoted.user.id}`, {
          token: lead.token,
          body: { role: 'viewer' },
        })
      ).status,
    ).toBe(200);
    const refused = await request(socket, 'stack:edit', {
      stackId,
      baseVersion: 1,
      ops: [{ op: 'moveNode', id: 'cap', position: { x: 2, y: 2 } }],
    });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.error.code).toBe('forbidden');
  });
});

describe('sessions end', () => {
  it('a socket whose token expires is told, closed, and its last edit refused', async () => {
    const stackId = await newStack('E/1');
    const eng = await member('expiring', 'engineer');
    // A session token that lives two seconds, signed as the server signs any.
    const short = signToken(s.ctx.config.jwtSecret, eng.user.id, 0, 2);
    const socket = await client(short);
    expect((await request(socket, 'stack:join', { stackId })).ok).toBe(true);
    const ended = next(socket, 'session:ended', () => true, 6000);
    const reason = closed(socket, 6000);
    expect(((await ended) as SessionEnded).reason).toBe('expired');
    expect(await reason).toBe('io server disconnect');
    // Reconnecting with the expired token is refused at the handshake.
    await expect(connect(s.url, short)).rejects.toThrow(/expired/);
    expect((await s.ctx.db('stacks').where({ id: stackId }).first<{ version: number }>('version')).version).toBe(0);
  });

  it('an edit sent after the token expired is refused even before the timer closes the socket', async () => {
    const stackId = await newStack('E/2');
    const eng = await member('late', 'engineer');
    const socket = await client(signToken(s.ctx.config.jwtSecret, eng.user.id, 0, 1));
    // jwt expiry has a one-second resolution: wait until it has certainly passed, then edit at once.
    await new Promise((r) => setTimeout(r, 1100));
    const r = await request(
      socket,
      'stack:edit',
      { stackId, baseVersion: 0, ops: [{ op: 'moveNode', id: 'cap', position: { x: 5, y: 5 } }] },
      2000,
    ).catch(() => null);
    // Either the timer closed the socket first (no reply) or the event was refused with 401.
    if (r) {
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error.code).toBe('unauthenticated');
    }
    expect((await s.ctx.db('stacks').where({ id: stackId }).first<{ version: number }>('version')).version).toBe(0);
  });

  it('signing out ends every session: REST refuses the old token and open sockets are closed', async () => {
    const eng = await member('signout', 'engineer');
    const socketA = await client(eng.token);
    const socketB = await client(eng.token);
    const endedA = next(socketA, 'session:ended');
    const closedB = closed(socketB);
    expect((await s.api('POST', '/auth/logout', { token: eng.token })).status).toBe(204);
    expect(((await endedA) as SessionEnded).reason).toBe('signed-out');
    expect(await closedB).toBe('io server disconnect');
    const me = await s.api('GET', '/me', { token: eng.token });
    expect(me.status).toBe(401);
    expect(errorCode(me.body)).toBe('unauthenticated');
    await expect(connect(s.url, eng.token)).rejects.toThrow(/ended/);
    // Signing in again gives a working session.
    const again = await s.api('POST', '/auth/login', { body: { email: eng.user.email, password: TEST_PASSWORD } });
    expect((await s.api('GET', '/me', { token: (again.body as AuthResponse).token })).status).toBe(200);
  });

  it('a socket of a signed-out user on another server process is refused on its next event', async () => {
    // Stands in for a process that missed the disconnect: the version is raised in the database only.
    const stackId = await newStack('S/1');
    const eng = await member('elsewhere', 'engineer');
    const socket = await client(eng.token);
    await s.ctx.db('users').where({ id: eng.user.id }).increment('token_version', 1);
    const r = await request(socket, 'stack:edit', {
      stackId,
      baseVersion: 0,
      ops: [{ op: 'moveNode', id: 'cap', position: { x: 1, y: 1 } }],
    });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.code).toBe('unauthenticated');
    await closed(socket);
    expect(socket.disconnected).toBe(true);
  });

  it('changing the password ends the other sessions and returns a new one', async () => {
    const eng = await member('password', 'engineer');
    const socket = await client(eng.token);
    const closing = closed(socket);
    const r = await s.api('POST', '/auth/password', {
      token: eng.token,
      body: { currentPassword: TEST_PASSWORD, newPassword: 'a quite different passphrase' },
    });
    expect(r.status).toBe(200);
    expect(await closing).toBe('io server disconnect');
    expect((await s.api('GET', '/me', { token: eng.token })).status).toBe(401);
    expect((await s.api('GET', '/me', { token: (r.body as AuthResponse).token })).status).toBe(200);
    const old = await s.api('POST', '/auth/login', { body: { email: eng.user.email, password: TEST_PASSWORD } });
    expect(old.status).toBe(401);
  });
});
