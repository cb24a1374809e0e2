// Faults across two server processes on PostgreSQL (docs/faults.md): races the database settles (20
// parallel same-name creates, 6 parallel freezes, two leads removing each other), a mail server that
// accepts and never answers (the freeze still answers at once; the mail goes out once the mail server
// recovers, also after a process is killed mid-send and restarted, and never twice), and the issued
// package served as stored by every process and reported when tampered with.
import { createServer, type Server, type Socket } from 'node:net';
import knex, { type Knex } from 'knex';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, Building, StackSummary } from '../../shared/schema/api.ts';
import type { RevisionDetail } from '../../shared/schema/revisions.ts';
import { dropSchema } from '../server/helpers.ts';
import {
  api,
  databaseUrl,
  eventually,
  freePort,
  newTag,
  signUp,
  scaleEnv,
  scaleReady,
  startProcess,
  stopProcess,
  type Proc,
} from './procs.ts';

const describeScale = scaleReady ? describe : describe.skip;
const TEMPLATE = {
  storeys: 4,
  storeyHeight: 3.6,
  spliceEvery: 2,
  sections: ['UKC 254x254x89', 'UKC 203x203x46'],
  Gk: 120,
  Qk: 60,
};

interface Delivered {
  to: string;
  subject: string;
  attachment: Buffer | null;
}

/** A mail server on `port` that first hangs (accepts, never answers), then can be made to work. */
class FlakyMailServer {
  private hanging: Server | null = null;
  private held: Socket[] = [];
  private working: SMTPServer | null = null;
  readonly delivered: Delivered[] = [];
  constructor(readonly port: number) {}

  async hang(): Promise<void> {
    const srv = createServer((socket) => void this.held.push(socket));
    this.hanging = srv;
    await new Promise<void>((resolve) => srv.listen(this.port, '127.0.0.1', () => resolve()));
  }

  async recover(): Promise<void> {
    const srv = this.hanging;
    if (srv) {
      for (const s of this.held) s.destroy();
      await new Promise<void>((resolve) => srv.close(() => resolve()));
      this.hanging = null;
    }
    const working = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      size: 25 * 1024 * 1024,
      onData: (stream, session, callback) => {
        // Accept as soon as the data is in, as a mail server does; reading it comes after.
        const chunks: Buffer[] = [];
        const to = session.envelope.rcptTo.map((r) => r.address).join(', ');
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('end', () => {
          callback();
          void simpleParser(Buffer.concat(chunks)).then((mail) => {
            this.delivered.push({ to, subject: mail.subject ?? '', attachment: mail.attachments[0]?.content ?? null });
          });
        });
      },
    });
    this.working = working;
    await new Promise<void>((resolve) => working.listen(this.port, '127.0.0.1', () => resolve()));
  }

  async close(): Promise<void> {
    for (const s of this.held) s.destroy();
    const h = this.hanging;
    if (h) await new Promise<void>((resolve) => h.close(() => resolve()));
    const w = this.working;
    if (w) await new Promise<void>((resolve) => w.close(() => resolve()));
  }
}

describeScale('faults across two server processes', () => {
  const tag = newTag();
  let env: NodeJS.ProcessEnv;
  let mail: FlakyMailServer;
  let a: Proc;
  let b: Proc;
  let c: Proc | undefined;
  let db: Knex;
  let lead: AuthResponse;
  // The suite's mail server hangs, so no verification link arrives: addresses are verified in the database.
  const reg = (url: string, name: string) =>
    signUp(url, db, `${name}-${tag}@example.test`, name, { viaDatabase: true });

  beforeAll(async () => {
    mail = new FlakyMailServer(await freePort());
    await mail.hang();
    env = scaleEnv(tag, {
      SMTP_URL: `smtp://127.0.0.1:${mail.port}`,
      MAIL_TIMEOUT_MS: '2000',
      MAIL_RETRY_BASE_MS: '200',
      MAIL_MAX_ATTEMPTS: '100',
      MAIL_POLL_MS: '200',
      MAIL_LEASE_MS: '10000',
    });
    a = await startProcess(env);
    b = await startProcess(env);
    db = knex({ client: 'pg', connection: databaseUrl!, searchPath: [tag], pool: { min: 0, max: 2 } });
    lead = await reg(a.url, 'lead');
  });

  afterAll(async () => {
    await Promise.all([stopProcess(a), stopProcess(b), stopProcess(c)]);
    await mail?.close();
    await db?.destroy();
    if (databaseUrl) await dropSchema(databaseUrl, tag);
  });

  it('20 parallel creates of one stack name across both processes: exactly one 201, the rest 409', async () => {
    const building = (await api<Building>(a.url, 'POST', '/buildings', lead.token, { name: 'Name race block' })).body;
    const replies = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        api(i % 2 ? a.url : b.url, 'POST', `/buildings/${building.id}/stacks`, lead.token, {
          name: i % 3 ? 'Core/1' : 'CORE/1',
        }),
      ),
    );
    expect(replies.filter((r) => r.status === 201)).toHaveLength(1);
    expect(replies.filter((r) => r.status === 409)).toHaveLength(19);
    const levels = await Promise.all(
      ['Roof', 'ROOF', 'roof', 'Roof'].map((name, i) =>
        api(i % 2 ? a.url : b.url, 'POST', `/buildings/${building.id}/levels`, lead.token, { name, elevation: 30 + i }),
      ),
    );
    expect(levels.map((r) => r.status).sort()).toEqual([201, 409, 409, 409]);
    expect(await db('stacks').where({ building_id: building.id }).pluck('name')).toHaveLength(1);
  });

  it('two leads removing each other on different processes leave one lead', async () => {
    const other = await reg(b.url, 'lead2');
    const building = (await api<Building>(a.url, 'POST', '/buildings', lead.token, { name: 'Two leads block' })).body;
    expect(
      (
        await api(a.url, 'POST', `/buildings/${building.id}/members`, lead.token, {
          email: other.user.email,
          role: 'lead',
        })
      ).status,
    ).toBe(201);
    const [r1, r2] = await Promise.all([
      api(a.url, 'DELETE', `/buildings/${building.id}/members/${other.user.id}`, lead.token),
      api(b.url, 'DELETE', `/buildings/${building.id}/members/${lead.user.id}`, other.token),
    ]);
    expect([r1.status, r2.status].filter((x) => x === 204)).toHaveLength(1);
    expect([r1.status, r2.status].every((x) => [204, 403, 404].includes(x))).toBe(true);
    expect(await db('memberships').where({ building_id: building.id, role: 'lead' }).pluck('user_id')).toHaveLength(1);
  });

  it('6 parallel freezes give one 201 and five 409 while the mail server hangs, each answering within 5 s; the mail arrives once after it recovers and a process is killed and restarted', async () => {
    const engineer = await reg(a.url, 'engineer');
    const building = (await api<Building>(a.url, 'POST', '/buildings', lead.token, { name: 'Freeze race block' })).body;
    expect(
      (
        await api(a.url, 'POST', `/buildings/${building.id}/members`, lead.token, {
          email: engineer.user.email,
          role: 'engineer',
        })
      ).status,
    ).toBe(201);
    for (const name of ['F/1', 'F/2', 'F/3'])
      expect(
        (
          await api<StackSummary>(b.url, 'POST', `/buildings/${building.id}/stacks`, lead.token, {
            name,
            template: TEMPLATE,
          })
        ).status,
      ).toBe(201);

    const timed = async (url: string) => {
      const t0 = Date.now();
      const r = await api<RevisionDetail>(url, 'POST', `/buildings/${building.id}/revisions`, lead.token, {
        purpose: 'preliminary',
        note: 'race',
        afterRevisionId: null,
      });
      return { ...r, ms: Date.now() - t0 };
    };
    const replies = await Promise.all(Array.from({ length: 6 }, (_, i) => timed(i % 2 ? a.url : b.url)));
    expect(replies.map((r) => r.status).sort()).toEqual([201, 409, 409, 409, 409, 409]);
    for (const r of replies) expect(r.ms).toBeLessThan(5000);
    const rev = replies.find((r) => r.status === 201)!.body;
    expect(await db('revisions').where({ building_id: building.id }).pluck('code')).toEqual(['P01']);

    // The senders are stuck on the hanging server: kill one process mid-send (its claims are left
    // behind), then let the mail server recover and start a new process in its place.
    await eventually(
      async () =>
        Number(
          (await db('mail_queue').where({ attach_revision_id: rev.id }).max<{ m: number }[]>({ m: 'attempts' }))[0].m,
        ) >= 1,
      15_000,
    );
    a.child.kill('SIGKILL');
    await a.exited;
    await mail.recover();
    c = await startProcess(env);

    const expected = [lead.user.email, engineer.user.email].sort();
    expect(
      await eventually(async () => mail.delivered.filter((d) => d.subject.includes('P01')).length >= 2, 40_000),
    ).toBe(true);
    expect(
      await eventually(async () => {
        const detail = (await api<RevisionDetail>(c!.url, 'GET', `/revisions/${rev.id}`, lead.token)).body;
        return detail.recipients.every((x) => x.status === 'sent');
      }, 20_000),
    ).toBe(true);
    // Each member got it once, with the stored package attached.
    const got = mail.delivered.filter((d) => d.subject.includes('P01'));
    expect(got.map((d) => d.to).sort()).toEqual(expected);
    const stored = await db('revision_packages')
      .where({ revision_id: rev.id, copy: 0 })
      .first<{ bytes: Buffer; sha256: string }>('bytes', 'sha256');
    for (const d of got) expect(d.attachment?.equals(stored.bytes)).toBe(true);

    // Every process serves the stored bytes; a tampered package is reported by each.
    for (const p of [b, c]) {
      const res = await fetch(`${p.url}/api/revisions/${rev.id}/calc.pdf`, {
        headers: { Authorization: `Bearer ${engineer.token}` },
      });
      expect(res.status).toBe(200);
      expect(Buffer.from(await res.arrayBuffer()).equals(stored.bytes)).toBe(true);
      expect(res.headers.get('x-package-sha256')).toBe(stored.sha256);
    }
    const tampered = Buffer.from(stored.bytes);
    tampered[100] ^= 0x01;
    await db('revision_packages').where({ revision_id: rev.id, copy: 0 }).update({ bytes: tampered });
    for (const p of [b, c]) {
      const r = await api<{ error: { code: string } }>(p.url, 'GET', `/revisions/${rev.id}/calc.pdf`, engineer.token);
      expect(r.status).toBe(500);
      expect(r.body.error.code).toBe('package_tampered');
    }
    expect(b.child.exitCode).toBeNull();
    expect(c.child.exitCode).toBeNull();
  }, 150_000);
});
