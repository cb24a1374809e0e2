// The issued package is drawn once and served as stored (docs/faults.md): verified against its SHA-256
// on every read; a tampered or lost package is reported as such and can only be re-drawn as a new,
// marked copy; a revision frozen before packages were stored gets its package drawn once, on first
// download. A mail server that accepts and never answers does not hold the freeze.
import { createHash } from 'node:crypto';
import { createServer, type Server, type Socket } from 'node:net';
import type { AddressInfo } from 'node:net';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RevisionDetail } from '../../shared/schema/revisions.ts';
import { errorCode, eventually, FAST_MAIL, startTestServer, type TestServer } from './helpers.ts';
import { revisionFixture, type RevisionFixture } from './revisionsFixture.ts';

const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');

async function download(
  s: TestServer,
  token: string,
  revisionId: number,
  copy?: number,
): Promise<{ status: number; bytes: Buffer; body: unknown }> {
  const res = await fetch(`${s.url}/api/revisions/${revisionId}/calc.pdf${copy === undefined ? '' : `?copy=${copy}`}`, {
    headers: { Authorization: `Bearer ${token}` },
  });
  const bytes = Buffer.from(await res.arrayBuffer());
  const json = res.headers.get('content-type')?.includes('json') ? (JSON.parse(bytes.toString()) as unknown) : null;
  return { status: res.status, bytes, body: json };
}

async function pdfText(bytes: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

describe('stored calculation packages', () => {
  let s: TestServer;
  let f: RevisionFixture;
  const freeze = async (note: string) =>
    (
      await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
        token: f.lead.token,
        body: { note, purpose: 'preliminary' },
      })
    ).body as RevisionDetail;
  const storedRow = (revisionId: number, copy = 0) =>
    s.ctx
      .db('revision_packages')
      .where({ revision_id: revisionId, copy })
      .first<{ id: number; bytes: Buffer | null; sha256: string | null; reason: string | null } | undefined>();

  beforeAll(async () => {
    s = await startTestServer();
    f = await revisionFixture(s);
  });
  afterAll(async () => {
    await s?.close();
  });

  it('draws the package once after the freeze, stores it with its SHA-256 and serves those bytes', async () => {
    const rev = await freeze('stored');
    await eventually(async () => (await storedRow(rev.id))?.sha256 != null);
    const row = (await storedRow(rev.id))!;
    const got = await download(s, f.viewer.token, rev.id);
    expect(got.status).toBe(200);
    expect(got.bytes.equals(Buffer.from(row.bytes!))).toBe(true);
    expect(sha(got.bytes)).toBe(row.sha256);
  });

  it('serves the stored bytes, not a new drawing, after the package code changes', async () => {
    const rev = await freeze('served as stored');
    await eventually(async () => (await storedRow(rev.id))?.sha256 != null);
    // What the package code of an older release drew is stood in for by other bytes with their own
    // hash: were the route to draw again with today's code, these bytes would not come back.
    const issued = Buffer.from('%PDF-1.7 bytes drawn by an older release of the package code');
    await s.ctx
      .db('revision_packages')
      .where({ revision_id: rev.id, copy: 0 })
      .update({ bytes: issued, sha256: sha(issued), size: issued.length });
    const got = await download(s, f.engineer.token, rev.id);
    expect(got.status).toBe(200);
    expect(got.bytes.equals(issued)).toBe(true);
  });

  it('reports a tampered package, refuses to re-draw an intact one, and makes a marked re-drawn copy', async () => {
    const rev = await freeze('tampered');
    await eventually(async () => (await storedRow(rev.id))?.sha256 != null);
    expect((await s.api('POST', `/revisions/${rev.id}/package/redraw`, { token: f.lead.token })).status).toBe(409);
    const row = (await storedRow(rev.id))!;
    const bytes = Buffer.from(row.bytes!);
    bytes[bytes.length >> 1] ^= 0xff;
    await s.ctx.db('revision_packages').where({ id: row.id }).update({ bytes });
    const got = await download(s, f.viewer.token, rev.id);
    expect(got.status).toBe(500);
    expect(errorCode(got.body)).toBe('package_tampered');
    expect((await s.api('POST', `/revisions/${rev.id}/package/redraw`, { token: f.engineer.token })).status).toBe(403);
    const redraw = await s.api('POST', `/revisions/${rev.id}/package/redraw`, { token: f.lead.token });
    expect(redraw.status).toBe(201);
    expect(redraw.body).toMatchObject({ copy: 1 });
    const copy = await download(s, f.viewer.token, rev.id, 1);
    expect(copy.status).toBe(200);
    expect(await pdfText(copy.bytes)).toMatch(/RE-DRAWN COPY 1 of revision P\d+/);
    // The issued package stays reported as tampered; the copy never stands in for it.
    expect(errorCode((await download(s, f.viewer.token, rev.id)).body)).toBe('package_tampered');
  });

  it('reports a lost package as missing', async () => {
    const rev = await freeze('lost');
    await eventually(async () => (await storedRow(rev.id))?.sha256 != null);
    await s.ctx.db('revision_packages').where({ revision_id: rev.id, copy: 0 }).update({ bytes: null });
    const got = await download(s, f.viewer.token, rev.id);
    expect(got.status).toBe(500);
    expect(errorCode(got.body)).toBe('package_missing');
  });

  it('draws the package of a revision frozen before packages were stored once, on first download, and keeps it', async () => {
    const rev = await freeze('older revision');
    await eventually(async () => (await storedRow(rev.id))?.sha256 != null);
    await s.ctx.db('revision_packages').where({ revision_id: rev.id }).delete();
    const first = await download(s, f.viewer.token, rev.id);
    expect(first.status).toBe(200);
    const row = (await storedRow(rev.id))!;
    expect(row.reason).toMatch(/frozen before packages were stored/);
    expect(sha(first.bytes)).toBe(row.sha256);
    const second = await download(s, f.lead.token, rev.id);
    expect(second.bytes.equals(first.bytes)).toBe(true);
  });
});

describe('a mail server that accepts and never answers', () => {
  let s: TestServer;
  let hang: Server;
  const held: Socket[] = [];
  let f: RevisionFixture;

  beforeAll(async () => {
    hang = createServer((socket) => void held.push(socket));
    await new Promise<void>((r) => hang.listen(0, '127.0.0.1', () => r()));
    s = await startTestServer({
      smtpUrl: `smtp://127.0.0.1:${(hang.address() as AddressInfo).port}`,
      config: { mail: { ...FAST_MAIL, timeoutMs: 300, maxAttempts: 20 } },
    });
    f = await revisionFixture(s);
  });
  afterAll(async () => {
    await s?.close();
    for (const c of held) c.destroy();
    await new Promise<void>((r) => hang.close(() => r()));
  });

  it('does not hold the freeze: it answers within 5 s and the recipients wait, retried, as pending', async () => {
    const t0 = Date.now();
    const r = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
      token: f.lead.token,
      body: { note: 'hanging mail', purpose: 'preliminary' },
    });
    expect(r.status).toBe(201);
    expect(Date.now() - t0).toBeLessThan(5000);
    const id = (r.body as RevisionDetail).id;
    await eventually(async () =>
      ((await s.api('GET', `/revisions/${id}`, { token: f.lead.token })).body as RevisionDetail).recipients.every(
        (x) => x.attempts >= 2,
      ),
    );
    const rev = (await s.api('GET', `/revisions/${id}`, { token: f.lead.token })).body as RevisionDetail;
    expect(rev.recipients.every((x) => x.status === 'pending' && /timeout|never received/i.test(x.error ?? ''))).toBe(
      true,
    );
  });
});
