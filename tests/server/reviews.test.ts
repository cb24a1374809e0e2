// Checking and approving revisions (docs/issue-workflow.md): prepared by one member, checked by another, approved
// and issued by a lead; comments on stacks and lifts hold the approval until resolved or reasoned.
import { createHash } from 'node:crypto';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse } from '../../shared/schema/api.ts';
import { reviewSchema, type RevisionReview } from '../../shared/schema/reviews.ts';
import type { RevisionDetail, RevisionSummary } from '../../shared/schema/revisions.ts';
import { addMember, errorCode, eventually, mailTo, registerUser, startTestServer, type TestServer } from './helpers.ts';
import { revisionFixture, type RevisionFixture } from './revisionsFixture.ts';
import { connect, request, type LiveClient } from './liveHelpers.ts';
import type { BuildingRevisionChanged } from '../../shared/schema/socket.ts';

const squash = (t: string) => t.replace(/\s+/g, ' ');

async function packageText(s: TestServer, token: string, id: number): Promise<{ pages: string[]; bytes: Buffer }> {
  const res = await fetch(`${s.url}/api/revisions/${id}/calc.pdf`, { headers: { Authorization: `Bearer ${token}` } });
  expect(res.status).toBe(200);
  const bytes = Buffer.from(await res.arrayBuffer());
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    return { pages: (await parser.getText()).pages.map((p) => squash(p.text)), bytes };
  } finally {
    await parser.destroy();
  }
}

describe('checking and approving a revision', () => {
  let s: TestServer;
  let f: RevisionFixture;
  let checker: AuthResponse;
  beforeAll(async () => {
    s = await startTestServer();
    f = await revisionFixture(s);
    checker = await registerUser(s, 'checker');
    await addMember(s, f.lead.token, f.buildingId, checker.user.email, 'engineer');
  });
  afterAll(async () => {
    await s?.close();
  });

  const prepare = async (token: string, purpose: 'preliminary' | 'construction', note = '') => {
    const r = await s.api('POST', `/buildings/${f.buildingId}/revisions/prepare`, { token, body: { note, purpose } });
    expect(r.status).toBe(201);
    return r.body as RevisionDetail;
  };
  const review = async (token: string, id: number) => {
    const r = await s.api('GET', `/revisions/${id}/review`, { token });
    expect(r.status).toBe(200);
    return reviewSchema.parse(r.body);
  };
  const step = (token: string, id: number, what: string, body: unknown = {}) =>
    s.api('POST', `/revisions/${id}/${what}`, { token, body });
  const comment = (token: string, id: number, stackId: number, liftId: string | null, text: string) =>
    s.api('POST', `/revisions/${id}/comments`, { token, body: { stackId, liftId, text } });
  const counts = async (id: number) => ({
    steps: Number((await s.ctx.db('revision_steps').where({ revision_id: id }).count({ n: '*' }))[0].n),
    packages: Number((await s.ctx.db('revision_packages').where({ revision_id: id }).count({ n: '*' }))[0].n),
    mail: Number((await s.ctx.db('mail_queue').where({ attach_revision_id: id }).count({ n: '*' }))[0].n),
  });

  it('an engineer prepares a construction revision: frozen and hashed, not issued, mailed or stored as a package', async () => {
    const rev = await prepare(f.engineer.token, 'construction', 'For checking');
    expect(rev.code).toBe('C01');
    expect(rev.review.state).toBe('prepared');
    expect(rev.review.prepared.name).toBe(f.engineer.user.name);
    expect(rev.review.checked).toBeNull();
    expect(rev.recipients).toEqual([]);
    expect(await counts(rev.id)).toEqual({ steps: 1, packages: 0, mail: 0 });
    // The checker reads a check copy, marked on every page and never stored.
    const { pages } = await packageText(s, checker.token, rev.id);
    expect(pages.every((p) => p.includes('CHECK COPY of revision C01'))).toBe(true);
    expect(pages[0]).toContain('awaiting check');
    expect((await counts(rev.id)).packages).toBe(0);
    // A viewer may not prepare.
    const viewer = await s.api('POST', `/buildings/${f.buildingId}/revisions/prepare`, {
      token: f.viewer.token,
      body: { note: '', purpose: 'construction' },
    });
    expect(viewer.status).toBe(403);
  });

  it('the check cannot be done by the preparer, nor by a viewer, and a construction revision is not approved unchecked', async () => {
    const [rev] = (await s.api('GET', `/buildings/${f.buildingId}/revisions`, { token: f.viewer.token }))
      .body as RevisionSummary[];
    const own = await step(f.engineer.token, rev.id, 'check');
    expect(own.status).toBe(403);
    expect(errorCode(own.body)).toBe('forbidden');
    expect((await step(f.viewer.token, rev.id, 'check')).status).toBe(403);
    const early = await step(f.lead.token, rev.id, 'approve');
    expect(early.status).toBe(409);
    expect(await counts(rev.id)).toEqual({ steps: 1, packages: 0, mail: 0 });
    // The server says who may do what: the preparer sees no check, the other engineer does.
    expect((await review(f.engineer.token, rev.id)).actions).toEqual({
      check: false,
      approve: false,
      comment: true,
      resolve: true,
    });
    expect((await review(checker.token, rev.id)).actions.check).toBe(true);
    expect((await review(f.viewer.token, rev.id)).actions).toEqual({
      check: false,
      approve: false,
      comment: false,
      resolve: false,
    });
  });

  it('the checker comments on a lift and on a stack of the revision, and checks it', async () => {
    const [rev] = (await s.api('GET', `/buildings/${f.buildingId}/revisions`, { token: f.viewer.token }))
      .body as RevisionSummary[];
    const onLift = await comment(checker.token, rev.id, f.stackIds[0], 'lift-1', 'Splice at Floor 2: show the bolts');
    expect(onLift.status).toBe(201);
    const onStack = await comment(checker.token, rev.id, f.stackIds[1], null, 'Base fixity: say why pinned');
    expect(onStack.status).toBe(201);
    const r = onStack.body as RevisionReview;
    expect(r.comments.map((c) => [c.stack, c.lift, c.resolved])).toEqual([
      ['B/2', 'L1', null],
      ['A/1', null, null],
    ]);
    expect(r.comments[0].by.name).toBe(checker.user.name);
    // A lift that is not in that stack, and a stack of no revision, are refused and store nothing.
    expect((await comment(checker.token, rev.id, f.stackIds[0], 'lift-99', 'x')).status).toBe(422);
    expect((await comment(checker.token, rev.id, 999_999, null, 'x')).status).toBe(422);
    expect((await comment(checker.token, rev.id, f.stackIds[0], null, '   ')).status).toBe(400);
    expect((await comment(f.viewer.token, rev.id, f.stackIds[0], null, 'x')).status).toBe(403);
    expect((await review(f.viewer.token, rev.id)).comments).toHaveLength(2);

    const checked = await step(checker.token, rev.id, 'check', { note: 'Checked against the load schedule' });
    expect(checked.status).toBe(200);
    const after = checked.body as RevisionReview;
    expect(after.state).toBe('checked');
    expect(after.checked?.name).toBe(checker.user.name);
    expect((await step(f.lead.token, rev.id, 'check')).status).toBe(409);
    const list = (await s.api('GET', `/buildings/${f.buildingId}/revisions`, { token: f.viewer.token }))
      .body as RevisionSummary[];
    expect(list[0].review).toMatchObject({ state: 'checked', openComments: 2, checked: { name: checker.user.name } });
  });

  it('refuses the approval while comments are open, leaving the database as it was, unless the lead says why', async () => {
    const [rev] = (await s.api('GET', `/buildings/${f.buildingId}/revisions`, { token: f.viewer.token }))
      .body as RevisionSummary[];
    const first = (await review(f.viewer.token, rev.id)).comments[0];
    const resolved = await s.api('POST', `/revisions/${rev.id}/comments/${first.id}/resolve`, {
      token: f.engineer.token,
      body: { note: 'Bolts shown on sheet 4' },
    });
    expect(resolved.status).toBe(200);
    expect((resolved.body as RevisionReview).comments[0].resolved).toMatchObject({
      name: f.engineer.user.name,
      note: 'Bolts shown on sheet 4',
    });
    const again = await s.api('POST', `/revisions/${rev.id}/comments/${first.id}/resolve`, {
      token: f.engineer.token,
      body: {},
    });
    expect(again.status).toBe(409);

    const before = await counts(rev.id);
    const refused = await step(f.lead.token, rev.id, 'approve');
    expect(refused.status).toBe(422);
    expect((refused.body as { error: { message: string } }).error.message).toMatch(/1 comment is still open/);
    expect(await counts(rev.id)).toEqual(before);
    expect((await review(f.lead.token, rev.id)).state).toBe('checked');
    // Only a lead approves.
    expect((await step(checker.token, rev.id, 'approve', { openCommentsReason: 'x' })).status).toBe(403);

    const reason = 'Pinned base agreed with the foundation designer; note to follow';
    const ok = await step(f.lead.token, rev.id, 'approve', { openCommentsReason: reason });
    expect(ok.status).toBe(200);
    const issued = ok.body as RevisionReview;
    expect(issued.state).toBe('issued');
    expect(issued.approved?.name).toBe(f.lead.user.name);
    expect(issued.openCommentsReason).toBe(reason);
    expect(issued.actions).toEqual({ check: false, approve: false, comment: false, resolve: false });

    // The issued package: prepared, checked and approved with names, the reason and the open comment on the cover.
    const { pages, bytes } = await packageText(s, f.viewer.token, rev.id);
    expect(pages[0]).toContain(`Prepared by ${f.engineer.user.name}`);
    expect(pages[0]).toContain(`Checked by ${checker.user.name}`);
    expect(pages[0]).toContain(`Approved by ${f.lead.user.name}`);
    expect(pages[0]).toContain(reason);
    expect(pages[0]).toContain('Base fixity: say why pinned');
    expect(pages.some((p) => p.includes('CHECK COPY'))).toBe(false);
    // Stored once with its SHA-256 and served as stored: the same bytes every time, and the ones mailed.
    const row = await s.ctx.db('revision_packages').where({ revision_id: rev.id, copy: 0 }).first<{ sha256: string }>();
    expect(createHash('sha256').update(bytes).digest('hex')).toBe(row.sha256);
    expect((await packageText(s, f.lead.token, rev.id)).bytes.equals(bytes)).toBe(true);
    await eventually(
      async () =>
        ((await s.api('GET', `/revisions/${rev.id}`, { token: f.lead.token })).body as RevisionDetail).mail.sent === 4,
    );
    // The issue e-mail, written from the snapshot's head and the revision's stack count (the stacks are not parsed):
    // the revision, both stacks, the sign-offs, the reason and the snapshot's hash.
    const { hash } = (await s.api('GET', `/revisions/${rev.id}`, { token: f.lead.token })).body as RevisionDetail;
    const [mail] = await mailTo(s, f.viewer.user.email, 1, 15_000, new RegExp(`Revision ${rev.code} `));
    expect(mail.subject).toMatch(new RegExp(`: revision ${rev.code} issued \\(for construction\\)$`));
    expect(mail.text).toContain(`Revision ${rev.code} of "`);
    expect(mail.text).toContain('(2 stacks) is issued for construction.');
    expect(mail.text).toContain(`checked by ${checker.user.name}`);
    expect(mail.text).toContain(reason);
    expect(mail.text).toContain(`Snapshot SHA-256: ${hash}`);
    // Closed: no more comments, and the sign-offs themselves cannot be changed, even in the database.
    expect((await comment(checker.token, rev.id, f.stackIds[0], null, 'late')).status).toBe(409);
    expect((await step(f.lead.token, rev.id, 'approve', { openCommentsReason: 'again' })).status).toBe(409);
    await expect(s.ctx.db('revision_steps').where({ revision_id: rev.id }).update({ user_name: 'x' })).rejects.toThrow(
      /final/,
    );
    await expect(s.ctx.db('revision_steps').where({ revision_id: rev.id }).delete()).rejects.toThrow(/final/);
  });

  it('reopens a resolved comment, which holds the approval again; the resolution it undoes stays in the audit log', async () => {
    const rev = await prepare(f.lead.token, 'construction');
    const c = (await comment(checker.token, rev.id, f.stackIds[0], null, 'Splice bolts?')).body as RevisionReview;
    const commentId = c.comments[0].id;
    const reopen = (token: string, body: unknown = {}) => step(token, rev.id, `comments/${commentId}/reopen`, body);
    // Open: nothing to reopen, and nothing stored.
    expect((await reopen(f.lead.token)).status).toBe(409);
    expect((await step(checker.token, rev.id, `comments/${commentId}/resolve`, { note: 'On sheet 4' })).status).toBe(
      200,
    );
    expect((await step(checker.token, rev.id, 'check')).status).toBe(200);
    expect((await reopen(f.viewer.token)).status).toBe(403);
    expect((await step(f.lead.token, rev.id, `comments/999999/reopen`, {})).status).toBe(404);
    expect((await review(f.lead.token, rev.id)).comments[0].resolved).not.toBeNull();

    const reopened = await reopen(f.lead.token, { note: 'Sheet 4 shows the old bolts' });
    expect(reopened.status).toBe(200);
    const after = reviewSchema.parse(reopened.body);
    expect(after.comments[0].resolved).toBeNull();
    expect(after.state).toBe('checked');
    const audit = await s.ctx.db('audit_log').where({ action: 'revision.reopen' }).orderBy('id', 'desc').first();
    expect(JSON.parse(audit.detail)).toMatchObject({
      revisionId: rev.id,
      commentId,
      note: 'Sheet 4 shows the old bolts',
      resolved: { by: checker.user.name, note: 'On sheet 4' },
    });
    expect((await reopen(f.lead.token)).status).toBe(409);
    // Open again, so the approval is held until it is resolved or the lead says why.
    const refused = await step(f.lead.token, rev.id, 'approve');
    expect(refused.status).toBe(422);
    expect((refused.body as { error: { message: string } }).error.message).toMatch(/1 comment is still open/);
    expect((await step(checker.token, rev.id, `comments/${commentId}/resolve`, { note: 'New bolts' })).status).toBe(
      200,
    );
    expect((await step(f.lead.token, rev.id, 'approve')).status).toBe(200);
    // Issued: the review is closed, so a comment can no longer be reopened.
    expect((await reopen(f.lead.token)).status).toBe(409);
  });

  it('approves a checked revision whose comments are all resolved without a reason', async () => {
    const rev = await prepare(f.lead.token, 'construction');
    const c = (await comment(checker.token, rev.id, f.stackIds[1], 'lift-2', 'Grade?')).body as RevisionReview;
    await s.api('POST', `/revisions/${rev.id}/comments/${c.comments[0].id}/resolve`, {
      token: checker.token,
      body: {},
    });
    expect((await step(checker.token, rev.id, 'check')).status).toBe(200);
    const ok = await step(f.lead.token, rev.id, 'approve');
    expect(ok.status).toBe(200);
    expect((ok.body as RevisionReview).openCommentsReason).toBeNull();
    const { pages } = await packageText(s, f.viewer.token, rev.id);
    expect(pages[0]).not.toContain('APPROVED WITH CHECK COMMENTS OPEN');
    expect(pages[0]).toContain(`Checked by ${checker.user.name}`);
  });

  it('issues a preliminary revision without a check, and its cover says so', async () => {
    const frozen = await s.api('POST', `/buildings/${f.buildingId}/revisions`, {
      token: f.lead.token,
      body: { note: 'For the cost plan', purpose: 'preliminary' },
    });
    expect(frozen.status).toBe(201);
    const rev = frozen.body as RevisionDetail;
    expect(rev.review).toMatchObject({ state: 'issued', unchecked: true, checked: null });
    const { pages } = await packageText(s, f.viewer.token, rev.id);
    expect(pages[0]).toContain('Preliminary — not checked');

    // Prepared as preliminary by an engineer, a lead may also issue it without a check.
    const prepared = await prepare(f.engineer.token, 'preliminary');
    const ok = await step(f.lead.token, prepared.id, 'approve');
    expect(ok.status).toBe(200);
    expect((ok.body as RevisionReview).unchecked).toBe(true);
  });

  it('sets aside a prepared revision when a newer one is prepared', async () => {
    const older = await prepare(f.engineer.token, 'construction');
    const newer = await prepare(f.engineer.token, 'construction');
    expect((await review(checker.token, older.id)).state).toBe('superseded');
    expect((await step(checker.token, older.id, 'check')).status).toBe(409);
    expect((await comment(checker.token, older.id, f.stackIds[0], null, 'x')).status).toBe(409);
    expect((await review(checker.token, newer.id)).actions.check).toBe(true);
  });

  it('puts the column schedule and its tonnage in the package as its own section', async () => {
    const [rev] = (await s.api('GET', `/buildings/${f.buildingId}/revisions`, { token: f.viewer.token }))
      .body as RevisionSummary[];
    const { pages } = await packageText(s, f.viewer.token, rev.id);
    const section = pages.filter((p) => p.includes('Column schedule'));
    expect(section.length).toBeGreaterThan(0);
    const text = section.join(' ');
    expect(text).toContain('3 Column schedule');
    expect(text).toContain('Tonnage');
    for (const stack of ['A/1', 'B/2']) expect(text).toContain(stack);
    expect(text).toContain('UKC 254x254x73');
  });
  it("tells the building's live room of every step, so members with the revisions open see them without reloading", async () => {
    const live: LiveClient = await connect(s.url, f.viewer.token);
    try {
      expect((await request(live, 'building:join', { buildingId: f.buildingId })).ok).toBe(true);
      const heard: BuildingRevisionChanged[] = [];
      live.on('building:revision-changed', (p) => heard.push(p));
      const told = (n: number) => eventually(async () => heard.length >= n, 5000);
      const rev = await prepare(f.engineer.token, 'construction', 'Live steps');
      await told(1);
      const c = await comment(checker.token, rev.id, f.stackIds[0], null, 'Base plate: show the weld');
      await told(2);
      const commentId = (c.body as RevisionReview).comments[0].id;
      expect((await step(checker.token, rev.id, `comments/${commentId}/resolve`, { note: 'Shown' })).status).toBe(200);
      await told(3);
      expect((await step(checker.token, rev.id, 'check')).status).toBe(200);
      await told(4);
      expect((await step(f.lead.token, rev.id, 'approve')).status).toBe(200);
      await told(5);
      expect(heard.map((p) => [p.revisionId, p.by.name])).toEqual([
        [rev.id, f.engineer.user.name],
        [rev.id, checker.user.name],
        [rev.id, checker.user.name],
        [rev.id, checker.user.name],
        [rev.id, f.lead.user.name],
      ]);
      // A refused step changes nothing and tells no one.
      expect((await step(f.viewer.token, rev.id, 'check')).status).toBe(403);
      await new Promise((r) => setTimeout(r, 100));
      expect(heard).toHaveLength(5);
    } finally {
      live.close();
    }
  });
});
