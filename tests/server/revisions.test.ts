import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type {
  RevisionComparison,
  RevisionDetail,
  RevisionSummary,
  FreezeRefusal,
} from '../../shared/schema/revisions.ts';
import type { StackSummary } from '../../shared/schema/api.ts';
import { errorCode, registerUser, startTestServer, type TestServer } from './helpers.ts';
import { revisionFixture, setLiftSection, type RevisionFixture } from './revisionsFixture.ts';
import { canonicalJson } from '../../server/services/snapshot.ts';
import { loadSnapshotHead } from '../../server/services/revisions.ts';

const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

async function pdfBytes(s: TestServer, token: string, id: number): Promise<Buffer> {
  const res = await fetch(`${s.url}/api/revisions/${id}/calc.pdf`, { headers: { Authorization: `Bearer ${token}` } });
  expect(res.status).toBe(200);
  expect(res.headers.get('content-type')).toBe('application/pdf');
  return Buffer.from(await res.arrayBuffer());
}

describe('freezing revisions', () => {
  let s: TestServer;
  let f: RevisionFixture;
  let first: RevisionDetail;
  beforeAll(async () => {
    s = await startTestServer();
    f = await revisionFixture(s);
  });
  afterAll(async () => {
    await s?.close();
  });

  it('refuses a freeze by an engineer or a viewer (403) and hides the building from outsiders (404)', async () => {
    const body = { note: 'try', purpose: 'preliminary' };
    for (const who of [f.engineer, f.viewer]) {
      const r = await s.api('POST', `/buildings/${f.buildingId}/revisions`, { token: who.token, body });
      expect(r.status).toBe(403);
      expect(errorCode(r.body)).toBe('forbidden');
    }
    const outsider = await registerUser(s, 'outsider');
    expect((await s.api('POST', `/buildings/${f.buildingId}/revisions`, { token: outsider.token, body })).status).toBe(
      404,
    );
    expect((await s.api('GET', `/buildings/${f.buildingId}/revisions`, { token: f.lead.token })).body).toEqual([]);
  });

  it('lets the lead freeze P01: every stack, the levels and options, with a SHA-256 of the stored snapshot', async () => {
    const r = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
      token: f.lead.token,
      body: { note: 'For coordination', purpose: 'preliminary' },
    });
    expect(r.status).toBe(201);
    first = r.body as RevisionDetail;
    expect(first.code).toBe('P01');
    expect(first.stacks.map((x) => x.name)).toEqual(['A/1', 'B/2']);
    expect(first.levels).toHaveLength(5);
    expect(first.frozenBy.name).toBe(f.lead.user.name);
    expect(first.hash).toMatch(/^[0-9a-f]{64}$/);
    const row = await s.ctx.db('revisions').where({ id: first.id }).first<{ snapshot: string }>('snapshot');
    expect(sha256(row.snapshot)).toBe(first.hash);
    // Written and digested a stack at a time (server/services/snapshot.ts), the text is still the canonical form:
    // keys sorted at every depth, as canonicalJson writes the whole at once.
    expect(row.snapshot).toBe(canonicalJson(JSON.parse(row.snapshot)));
    // A file name needs only the head of the snapshot, read without parsing the stacks.
    const whole = JSON.parse(row.snapshot) as { building: unknown; code: string };
    expect(await loadSnapshotHead(s.ctx.db, first.id)).toEqual({ building: whole.building, code: 'P01' });
    // The freeze's reply is made from the snapshot in hand; reading the stored text gives the same detail (but for
    // the e-mail, which may be sent meanwhile).
    const withoutMail = ({ mail: _mail, ...rest }: RevisionDetail) => rest;
    const read = (await s.api('GET', `/revisions/${first.id}`, { token: f.lead.token })).body as RevisionDetail;
    expect(withoutMail(read)).toEqual(withoutMail(first));
  });

  it('reads a revision from the outline kept at the freeze, and draws a missing or stale outline again', async () => {
    const withoutMail = ({ mail: _mail, ...rest }: RevisionDetail) => rest;
    const outline = () =>
      s.ctx.db('revision_outlines').where({ revision_id: first.id }).first<{ hash: string; outline: string }>();
    const read = async () =>
      withoutMail((await s.api('GET', `/revisions/${first.id}`, { token: f.viewer.token })).body as RevisionDetail);
    const kept = await outline();
    expect(kept?.hash).toBe(first.hash);
    expect(JSON.parse(kept!.outline).stacks).toEqual(first.stacks);
    // The read takes the outline as kept: a changed outline under the right hash is what the page shows.
    const marked = JSON.parse(kept!.outline) as RevisionDetail;
    marked.stacks[0].name = 'as kept';
    await s.ctx
      .db('revision_outlines')
      .where({ revision_id: first.id })
      .update({ outline: JSON.stringify(marked) });
    expect((await read()).stacks[0].name).toBe('as kept');
    // An outline drawn from another snapshot (its hash differs) is drawn again from the revision's own, and kept.
    await s.ctx
      .db('revision_outlines')
      .where({ revision_id: first.id })
      .update({ hash: 'f'.repeat(64) });
    expect(await read()).toEqual(withoutMail(first));
    expect((await outline())?.hash).toBe(first.hash);
    expect(JSON.parse((await outline())!.outline).stacks).toEqual(first.stacks);
    // A revision frozen before outlines were kept has none until it is first read.
    await s.ctx.db('revision_outlines').where({ revision_id: first.id }).delete();
    expect(await read()).toEqual(withoutMail(first));
    expect(JSON.parse((await outline())!.outline)).toEqual(JSON.parse(kept!.outline));
  });

  it('keeps the revision content, hash and package when the stacks are edited afterwards', async () => {
    const pdfBefore = await pdfBytes(s, f.viewer.token, first.id);
    const rowBefore = await s.ctx.db('revisions').where({ id: first.id }).first<{ snapshot: string }>('snapshot');
    await setLiftSection(s, f.engineer.token, f.stackIds[0], 'lift-1', 'UKC 305x305x97');
    const after = (await s.api('GET', `/revisions/${first.id}`, { token: f.viewer.token })).body as RevisionDetail;
    expect(after.hash).toBe(first.hash);
    expect(after.stacks).toEqual(first.stacks);
    const rowAfter = await s.ctx.db('revisions').where({ id: first.id }).first<{ snapshot: string }>('snapshot');
    expect(rowAfter.snapshot).toBe(rowBefore.snapshot);
    expect(rowAfter.snapshot).not.toContain('UKC 305x305x97');
    // Regenerated from the snapshot with its frozen dates: byte for byte the same file.
    expect((await pdfBytes(s, f.viewer.token, first.id)).equals(pdfBefore)).toBe(true);
  });

  it('refuses UPDATE and DELETE on frozen rows in the database itself', async () => {
    await expect(s.ctx.db.raw('UPDATE revisions SET note = ? WHERE id = ?', ['tampered', first.id])).rejects.toThrow(
      /frozen/,
    );
    await expect(s.ctx.db.raw('DELETE FROM revisions WHERE id = ?', [first.id])).rejects.toThrow(/frozen/);
    await expect(s.ctx.db('revisions').where({ id: first.id }).update({ hash: 'x' })).rejects.toThrow(/frozen/);
    const row = await s.ctx.db('revisions').where({ id: first.id }).first<{ note: string }>('note');
    expect(row.note).toBe('For coordination');
  });

  it('numbers preliminary issues P01, P02… and construction issues C01, C02…', async () => {
    const freeze = async (purpose: string) =>
      (
        (
          await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
            token: f.lead.token,
            body: { note: '', purpose },
          })
        ).body as RevisionDetail
      ).code;
    expect(await freeze('preliminary')).toBe('P02');
    expect(await freeze('construction')).toBe('C01');
    expect(await freeze('construction')).toBe('C02');
    const list = (await s.api('GET', `/buildings/${f.buildingId}/revisions`, { token: f.viewer.token }))
      .body as RevisionSummary[];
    expect(list.map((r) => r.code)).toEqual(['C02', 'C01', 'P02', 'P01']);
  });

  it('compares a revision with the current state: the changed section and the lift utilisation that moved', async () => {
    const r = await s.api('GET', `/buildings/${f.buildingId}/revisions/compare?from=${first.id}&to=current`, {
      token: f.viewer.token,
    });
    expect(r.status).toBe(200);
    const cmp = r.body as RevisionComparison;
    expect(cmp.to.code).toBe('current');
    const stack = cmp.stacks.find((x) => x.stackId === f.stackIds[0]);
    expect(stack?.change).toBe('changed');
    const node = stack?.nodes.find((n) => n.nodeId === 'lift-1');
    expect(node?.fields).toEqual([{ field: 'section', from: 'UKC 254x254x73', to: 'UKC 305x305x97' }]);
    // Lifts are named as the results name them, not by the graph's node id.
    expect(node?.label).toBe('Lift L1');
    const lift = stack?.lifts.find((l) => l.liftId === 'lift-1');
    expect(lift?.label).toBe('L1');
    expect(lift?.section).toEqual({ from: 'UKC 254x254x73', to: 'UKC 305x305x97' });
    // A heavier section of the same family carries the same load at a lower utilisation.
    expect(lift?.to).toBeLessThan(lift?.from ?? 0);
    expect(cmp.unchangedStacks).toBe(1);
  });

  it('compares two revisions of the building and refuses a revision of another building', async () => {
    const list = (await s.api('GET', `/buildings/${f.buildingId}/revisions`, { token: f.lead.token }))
      .body as RevisionSummary[];
    const p02 = list.find((r) => r.code === 'P02');
    const cmp = (
      await s.api('GET', `/buildings/${f.buildingId}/revisions/compare?from=${first.id}&to=${p02?.id}`, {
        token: f.lead.token,
      })
    ).body as RevisionComparison;
    expect(cmp.stacks.map((x) => x.stackId)).toEqual([f.stackIds[0]]);
    const other = await revisionFixture(s, 'Other block');
    const r = await s.api('GET', `/buildings/${other.buildingId}/revisions/compare?from=${first.id}`, {
      token: other.lead.token,
    });
    expect(r.status).toBe(404);
  });

  it('refuses (422, with the reasons) to freeze while a stack has validation errors', async () => {
    const bad = (
      await s.api('POST', `/buildings/${f.buildingId}/stacks`, { token: f.lead.token, body: { name: 'Z/9' } })
    ).body as StackSummary;
    const r = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
      token: f.lead.token,
      body: { note: '', purpose: 'preliminary' },
    });
    expect(r.status).toBe(422);
    const reasons = (r.body as { error: { details: FreezeRefusal } }).error.details.reasons;
    expect(reasons.length).toBeGreaterThan(0);
    expect(reasons.every((x) => x.stack === 'Z/9' && x.message.length > 0)).toBe(true);
    expect((await s.api('DELETE', `/stacks/${bad.id}`, { token: f.lead.token })).status).toBe(204);
  });

  it('freezes failing lifts only with the acknowledgement and a note saying why', async () => {
    // A light column under heavy floors: far beyond its resistance (invented loads).
    const heavy = { storeys: 4, storeyHeight: 3.6, spliceEvery: 2, sections: ['UKC 152x152x23'], Gk: 900, Qk: 500 };
    const st = (
      await s.api('POST', `/buildings/${f.buildingId}/stacks`, {
        token: f.lead.token,
        body: { name: 'F/1', template: heavy },
      })
    ).body as StackSummary;
    expect(st.status).toBe('fails');
    const url = `/buildings/${f.buildingId}/revisions`;
    const refused = await s.api('POST', url, { token: f.lead.token, body: { note: 'ok', purpose: 'preliminary' } });
    expect(refused.status).toBe(422);
    expect((refused.body as { error: { details: FreezeRefusal } }).error.details.reasons[0].stack).toBe('F/1');
    const noNote = await s.api('POST', url, {
      token: f.lead.token,
      body: { note: '', purpose: 'preliminary', acknowledgeFailingLifts: true },
    });
    expect(noNote.status).toBe(422);
    const ok = await s.api('POST', url, {
      token: f.lead.token,
      body: {
        note: 'F/1 is being re-sized; issued for the cost plan',
        purpose: 'preliminary',
        acknowledgeFailingLifts: true,
      },
    });
    expect(ok.status).toBe(201);
    const rev = ok.body as RevisionDetail;
    expect(rev.failingLifts).toBeGreaterThan(0);
    expect(rev.acknowledgement).toContain('F/1');
    expect(rev.acknowledgement).toContain(f.lead.user.name);
  });
});
