// Every API route × every kind of caller → the expected status (docs/rights.md).
// Policy (server/middleware/access.ts):
// - anonymous callers get 401 on every route that needs an account;
// - an outsider (signed in, not a member) gets 404 for a building and everything in it, so
//   existence does not leak;
// - a site admin who is not a member reads every building like a viewer but may not change it (403);
//   the dev outbox is for site admins only (403 for everyone else);
// - viewers read; engineers also edit stacks and levels; leads also manage members, delete stacks and
//   change the building.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import type { AuthResponse, Level, StackSummary } from '../../shared/schema/api.ts';
import {
  addMember,
  createBuilding,
  makeAdmin,
  registerAndVerify,
  registerUser,
  signIn,
  startTestServer,
  TEST_PASSWORD,
  verificationToken,
  type TestServer,
} from './helpers.ts';

const ACTORS = ['anonymous', 'outsider', 'viewer', 'engineer', 'lead', 'admin'] as const;
type Actor = (typeof ACTORS)[number];

interface Fixture {
  buildingId: number;
  levelId: string;
  stackId: number;
  version: number;
  engineerId: number;
  viewerId: number;
  outboxId: number;
  /** A revision frozen once, in a building where the viewer, engineer and lead have the same roles. */
  revisionBuildingId: number;
  revisionId: number;
  /** A verification link of an account registered for the matrix. */
  verifyToken: string;
  /** A further position of the stack, where a case's `prepare` made one (typical columns). */
  positionId?: number;
  /** A revision of this building prepared by a member who is none of the actors (for cases with `review`). */
  reviewRevisionId: number;
  /** A comment on it by that member (review 'commented'), resolved by them (review 'resolved'). */
  commentId: number;
}
interface Case {
  path: (f: Fixture) => string;
  body?: (f: Fixture, actor: Actor) => unknown;
  expect: Record<Actor, number>;
  /** The route ends the caller's sessions: the actor signs in again before the next case. */
  endsSession?: boolean;
  /** Sets up what the route needs beyond the fixture, as the lead. */
  prepare?: (s: TestServer, lead: string, f: Fixture) => Promise<Partial<Fixture>>;
  /** The fixture's building gets a revision prepared by another engineer: checked, or with a comment. */
  review?: 'prepared' | 'checked' | 'commented' | 'resolved';
}

const LEAD_EMAIL = 'matrix-lead@example.test';
const LEAD_PASSWORD = 'long enough password';
const passwordOf = (actor: Actor) => (actor === 'lead' ? LEAD_PASSWORD : TEST_PASSWORD);

const all = (status: number): Record<Actor, number> => ({
  anonymous: status,
  outsider: status,
  viewer: status,
  engineer: status,
  lead: status,
  admin: status,
});
const signedIn = (status: number) => ({ ...all(status), anonymous: 401 });
const read = { anonymous: 401, outsider: 404, viewer: 200, engineer: 200, lead: 200, admin: 200 };
const edit = (ok: number) => ({ anonymous: 401, outsider: 404, viewer: 403, engineer: ok, lead: ok, admin: 403 });
const leadOnly = (ok: number) => ({ anonymous: 401, outsider: 404, viewer: 403, engineer: 403, lead: ok, admin: 403 });
const adminOnly = { anonymous: 401, outsider: 403, viewer: 403, engineer: 403, lead: 403, admin: 200 };

let unique = 0;
const fresh = () => `matrix-${++unique}-${Date.now()}@example.test`;
const template = { storeys: 2, storeyHeight: 3.5, sections: ['UKC 203x203x46'], Gk: 50, Qk: 20 };

const MATRIX_GRID = {
  x: { lines: [{ id: 'A', name: 'A', position: 0 }] },
  y: { lines: [{ id: 'y1', name: '1', position: 0 }] },
};

/** Puts the fixture's stack on A/1 of a two-crossing grid; with `position`, makes it stand at B/1 too. */
async function typicalColumn(s: TestServer, lead: string, f: Fixture, position: boolean): Promise<Partial<Fixture>> {
  const grid = {
    x: { lines: [MATRIX_GRID.x.lines[0], { id: 'B', name: 'B', position: 6 }] },
    y: MATRIX_GRID.y,
  };
  await s.api('PUT', `/buildings/${f.buildingId}/grid`, { token: lead, body: { grid } });
  await s.api('PUT', `/stacks/${f.stackId}/placement`, { token: lead, body: { gridX: 'A', gridY: 'y1' } });
  if (!position) return {};
  const r = await s.api('POST', `/stacks/${f.stackId}/positions`, { token: lead, body: { gridX: 'B', gridY: 'y1' } });
  return { positionId: (r.body as { positions: { id: number }[] }).positions[0]!.id };
}

const MATRIX: Record<string, Case> = {
  'GET /api/buildings/:id/stack-positions': {
    path: (f) => `/buildings/${f.buildingId}/stack-positions`,
    prepare: (s, lead, f) => typicalColumn(s, lead, f, true),
    expect: read,
  },
  'GET /api/stacks/:id/positions': { path: (f) => `/stacks/${f.stackId}/positions`, expect: read },
  'POST /api/stacks/:id/positions': {
    path: (f) => `/stacks/${f.stackId}/positions`,
    body: () => ({ gridX: 'B', gridY: 'y1' }),
    prepare: (s, lead, f) => typicalColumn(s, lead, f, false),
    expect: edit(201),
  },
  'DELETE /api/stacks/:id/positions/:positionId': {
    path: (f) => `/stacks/${f.stackId}/positions/${f.positionId}`,
    prepare: (s, lead, f) => typicalColumn(s, lead, f, true),
    expect: edit(200),
  },
  'PUT /api/stacks/:id/positions/:positionId/area-overrides': {
    path: (f) => `/stacks/${f.stackId}/positions/${f.positionId}/area-overrides`,
    body: () => ({ overrides: [] }),
    prepare: (s, lead, f) => typicalColumn(s, lead, f, true),
    expect: edit(200),
  },
  'GET /api/health': { path: () => '/health', expect: all(200) },
  'POST /api/auth/register': {
    path: () => '/auth/register',
    body: () => ({ email: fresh(), password: 'long enough password', name: 'New' }),
    expect: all(202),
  },
  // Public: the link's token is what proves the owner; following it twice is harmless.
  'POST /api/auth/verify': { path: () => '/auth/verify', body: (f) => ({ token: f.verifyToken }), expect: all(200) },
  // Every caller of the matrix has a verified address already.
  'POST /api/auth/verify/resend': { path: () => '/auth/verify/resend', expect: signedIn(409) },
  'POST /api/auth/logout': { path: () => '/auth/logout', expect: { ...signedIn(204) }, endsSession: true },
  'POST /api/auth/password': {
    path: () => '/auth/password',
    body: (f, actor) => ({ currentPassword: passwordOf(actor), newPassword: passwordOf(actor) }),
    expect: signedIn(200),
    endsSession: true,
  },
  'POST /api/auth/password-strength': {
    path: () => '/auth/password-strength',
    body: () => ({ password: 'long enough password' }),
    expect: all(200),
  },
  'POST /api/auth/login': {
    path: () => '/auth/login',
    body: () => ({ email: LEAD_EMAIL, password: LEAD_PASSWORD }),
    expect: all(200),
  },
  'GET /api/me': { path: () => '/me', expect: signedIn(200) },
  'GET /api/buildings': { path: () => '/buildings', expect: signedIn(200) },
  'POST /api/buildings': { path: () => '/buildings', body: () => ({ name: 'Another' }), expect: signedIn(201) },
  'GET /api/buildings/:id': { path: (f) => `/buildings/${f.buildingId}`, expect: read },
  'PATCH /api/buildings/:id': {
    path: (f) => `/buildings/${f.buildingId}`,
    body: () => ({ options: { annex: 'EN' } }),
    expect: leadOnly(200),
  },
  'GET /api/buildings/:id/members': { path: (f) => `/buildings/${f.buildingId}/members`, expect: read },
  'POST /api/buildings/:id/members': {
    path: (f) => `/buildings/${f.buildingId}/members`,
    body: () => ({ email: fresh(), role: 'viewer' }),
    expect: leadOnly(201),
  },
  'PATCH /api/buildings/:id/members/:memberId': {
    path: (f) => `/buildings/${f.buildingId}/members/${f.engineerId}`,
    body: () => ({ role: 'viewer' }),
    expect: leadOnly(200),
  },
  'DELETE /api/buildings/:id/members/:memberId': {
    path: (f) => `/buildings/${f.buildingId}/members/${f.viewerId}`,
    expect: leadOnly(204),
  },
  'GET /api/buildings/:id/levels': { path: (f) => `/buildings/${f.buildingId}/levels`, expect: read },
  'POST /api/buildings/:id/levels': {
    path: (f) => `/buildings/${f.buildingId}/levels`,
    body: () => ({ name: 'Level 9', elevation: 30 }),
    expect: edit(201),
  },
  'PATCH /api/buildings/:id/levels/:levelId': {
    path: (f) => `/buildings/${f.buildingId}/levels/${f.levelId}`,
    body: () => ({ elevation: 41 }),
    expect: edit(200),
  },
  'POST /api/buildings/:id/levels/:levelId/preview': {
    path: (f) => `/buildings/${f.buildingId}/levels/${f.levelId}/preview`,
    body: () => ({ elevation: 42 }),
    expect: edit(200),
  },
  'DELETE /api/buildings/:id/levels/:levelId': {
    path: (f) => `/buildings/${f.buildingId}/levels/${f.levelId}`,
    expect: edit(204),
  },
  'GET /api/buildings/:id/model': { path: (f) => `/buildings/${f.buildingId}/model`, expect: read },
  'PUT /api/buildings/:id/grid': {
    path: (f) => `/buildings/${f.buildingId}/grid`,
    body: () => ({ grid: MATRIX_GRID }),
    expect: edit(200),
  },
  'PUT /api/buildings/:id/buildups': {
    path: (f) => `/buildings/${f.buildingId}/buildups`,
    body: () => ({ buildups: [] }),
    expect: edit(200),
  },
  'PUT /api/buildings/:id/levels/:levelId/floor-load': {
    path: (f) => `/buildings/${f.buildingId}/levels/${f.levelId}/floor-load`,
    body: () => ({ buildupId: null }),
    expect: edit(200),
  },
  'PUT /api/stacks/:id/placement': {
    path: (f) => `/stacks/${f.stackId}/placement`,
    body: () => ({ gridX: null, gridY: null }),
    expect: edit(200),
  },
  'PUT /api/stacks/:id/area-overrides': {
    path: (f) => `/stacks/${f.stackId}/area-overrides`,
    body: () => ({ overrides: [] }),
    expect: edit(200),
  },
  'GET /api/buildings/:id/stacks': { path: (f) => `/buildings/${f.buildingId}/stacks`, expect: read },
  'POST /api/buildings/:id/stacks': {
    path: (f) => `/buildings/${f.buildingId}/stacks`,
    body: () => ({ name: 'N/1', template }),
    expect: edit(201),
  },
  'GET /api/stacks/:id': { path: (f) => `/stacks/${f.stackId}`, expect: read },
  'GET /api/stacks/:id/ops': { path: (f) => `/stacks/${f.stackId}/ops?since=0`, expect: read },
  'PUT /api/stacks/:id': {
    path: (f) => `/stacks/${f.stackId}`,
    body: (f) => ({ doc: { nodes: [], edges: [] }, baseVersion: f.version }),
    expect: edit(200),
  },
  'POST /api/stacks/:id/ops': {
    path: (f) => `/stacks/${f.stackId}/ops`,
    body: (f) => ({ baseVersion: f.version, ops: [{ op: 'moveNode', id: 'cap', position: { x: 1, y: 1 } }] }),
    expect: edit(200),
  },
  'PATCH /api/stacks/:id': {
    path: (f) => `/stacks/${f.stackId}`,
    body: () => ({ name: 'Renamed' }),
    expect: edit(200),
  },
  'DELETE /api/stacks/:id': { path: (f) => `/stacks/${f.stackId}`, expect: leadOnly(204) },
  'GET /api/sections': { path: () => '/sections?q=UKC', expect: signedIn(200) },
  // Uploads take a multipart file; the JSON body sent here reaches the handler only to be refused (400).
  'POST /api/buildings/:id/imports/loads': {
    path: (f) => `/buildings/${f.buildingId}/imports/loads`,
    body: () => ({}),
    expect: edit(400),
  },
  'POST /api/buildings/:id/imports/loads/apply': {
    path: (f) => `/buildings/${f.buildingId}/imports/loads/apply`,
    body: () => ({}),
    expect: edit(400),
  },
  'POST /api/buildings/:id/imports/sections': {
    path: (f) => `/buildings/${f.buildingId}/imports/sections`,
    body: () => ({}),
    expect: edit(400),
  },
  'POST /api/buildings/:id/imports/sections/apply': {
    path: (f) => `/buildings/${f.buildingId}/imports/sections/apply`,
    body: () => ({}),
    expect: edit(400),
  },
  'POST /api/buildings/:id/imports/grid': {
    path: (f) => `/buildings/${f.buildingId}/imports/grid`,
    body: () => ({}),
    expect: edit(400),
  },
  'POST /api/buildings/:id/imports/grid/apply': {
    path: (f) => `/buildings/${f.buildingId}/imports/grid/apply`,
    body: () => ({}),
    expect: edit(400),
  },
  'POST /api/buildings/:id/imports/floor-loads': {
    path: (f) => `/buildings/${f.buildingId}/imports/floor-loads`,
    body: () => ({}),
    expect: edit(400),
  },
  'POST /api/buildings/:id/imports/floor-loads/apply': {
    path: (f) => `/buildings/${f.buildingId}/imports/floor-loads/apply`,
    body: () => ({}),
    expect: edit(400),
  },
  'GET /api/buildings/:id/grid.csv': { path: (f) => `/buildings/${f.buildingId}/grid.csv`, expect: read },
  'GET /api/buildings/:id/floor-loads.csv': { path: (f) => `/buildings/${f.buildingId}/floor-loads.csv`, expect: read },
  'GET /api/buildings/:id/sections': { path: (f) => `/buildings/${f.buildingId}/sections`, expect: read },
  'GET /api/buildings/:id/imports/loads/template.csv': {
    path: (f) => `/buildings/${f.buildingId}/imports/loads/template.csv`,
    expect: read,
  },
  'GET /api/buildings/:id/results.csv': { path: (f) => `/buildings/${f.buildingId}/results.csv`, expect: read },
  'GET /api/buildings/:id/results.xlsx': { path: (f) => `/buildings/${f.buildingId}/results.xlsx`, expect: read },
  'GET /api/buildings/:id/robustness': { path: (f) => `/buildings/${f.buildingId}/robustness`, expect: read },
  'GET /api/stacks/:id/results.csv': { path: (f) => `/stacks/${f.stackId}/results.csv`, expect: read },
  'GET /api/stacks/:id/results.xlsx': { path: (f) => `/stacks/${f.stackId}/results.xlsx`, expect: read },
  'GET /api/buildings/:id/schedule': { path: (f) => `/buildings/${f.buildingId}/schedule`, expect: read },
  'GET /api/buildings/:id/schedule.csv': { path: (f) => `/buildings/${f.buildingId}/schedule.csv`, expect: read },
  'GET /api/buildings/:id/schedule.xlsx': { path: (f) => `/buildings/${f.buildingId}/schedule.xlsx`, expect: read },
  'GET /api/buildings/:id/schedule.dxf': { path: (f) => `/buildings/${f.buildingId}/schedule.dxf`, expect: read },
  'GET /api/stacks/:id/history': { path: (f) => `/stacks/${f.stackId}/history`, expect: read },
  'GET /api/stacks/:id/versions/:version': { path: (f) => `/stacks/${f.stackId}/versions/0`, expect: read },
  'POST /api/stacks/:id/versions/:version/restore': {
    path: (f) => `/stacks/${f.stackId}/versions/0/restore`,
    body: (f) => ({ baseVersion: f.version }),
    expect: edit(200),
  },
  'POST /api/stacks/:id/sizing': {
    path: (f) => `/stacks/${f.stackId}/sizing`,
    body: () => ({ series: 'UKC', grade: 'S355' }),
    expect: edit(200),
  },
  'POST /api/buildings/:id/sizing': {
    path: (f) => `/buildings/${f.buildingId}/sizing`,
    body: () => ({ series: 'UKC', grade: 'S355' }),
    expect: edit(200),
  },
  'POST /api/buildings/:id/revisions': {
    path: (f) => `/buildings/${f.buildingId}/revisions`,
    body: () => ({ note: 'matrix', purpose: 'preliminary' }),
    expect: leadOnly(201),
  },
  'GET /api/buildings/:id/revisions': { path: (f) => `/buildings/${f.buildingId}/revisions`, expect: read },
  'GET /api/buildings/:id/revisions/compare': {
    path: (f) => `/buildings/${f.revisionBuildingId}/revisions/compare?from=${f.revisionId}&to=current`,
    expect: read,
  },
  'GET /api/revisions/:id': { path: (f) => `/revisions/${f.revisionId}`, expect: read },
  'GET /api/revisions/:id/calc.pdf': { path: (f) => `/revisions/${f.revisionId}/calc.pdf`, expect: read },
  'POST /api/revisions/:id/resend': { path: (f) => `/revisions/${f.revisionId}/resend`, expect: leadOnly(200) },
  // Only for a tampered or lost package: the shared revision's is intact, so the lead is refused (409).
  'POST /api/revisions/:id/package/redraw': {
    path: (f) => `/revisions/${f.revisionId}/package/redraw`,
    expect: leadOnly(409),
  },
  'POST /api/buildings/:id/revisions/prepare': {
    path: (f) => `/buildings/${f.buildingId}/revisions/prepare`,
    body: () => ({ note: 'matrix', purpose: 'construction' }),
    expect: edit(201),
  },
  'GET /api/revisions/:id/review': { path: (f) => `/revisions/${f.revisionId}/review`, expect: read },
  // Prepared by another member, so the engineer and the lead may check it.
  'POST /api/revisions/:id/check': {
    path: (f) => `/revisions/${f.reviewRevisionId}/check`,
    body: () => ({}),
    review: 'prepared',
    expect: edit(200),
  },
  'POST /api/revisions/:id/comments': {
    path: (f) => `/revisions/${f.reviewRevisionId}/comments`,
    body: (f) => ({ stackId: f.stackId, liftId: null, text: 'matrix' }),
    review: 'prepared',
    expect: edit(201),
  },
  'POST /api/revisions/:id/comments/:commentId/resolve': {
    path: (f) => `/revisions/${f.reviewRevisionId}/comments/${f.commentId}/resolve`,
    body: () => ({}),
    review: 'commented',
    expect: edit(200),
  },
  'POST /api/revisions/:id/comments/:commentId/reopen': {
    path: (f) => `/revisions/${f.reviewRevisionId}/comments/${f.commentId}/reopen`,
    body: () => ({}),
    review: 'resolved',
    expect: edit(200),
  },
  'POST /api/revisions/:id/approve': {
    path: (f) => `/revisions/${f.reviewRevisionId}/approve`,
    body: () => ({}),
    review: 'checked',
    expect: leadOnly(200),
  },
  'GET /api/dev/outbox': { path: () => '/dev/outbox', expect: adminOnly },
  // Only for a building with no lead: the fixture's building has one, so even the admin is refused (409).
  'POST /api/admin/buildings/:id/lead': {
    path: (f) => `/admin/buildings/${f.buildingId}/lead`,
    body: () => ({ email: 'matrix-lead@example.test' }),
    expect: { ...adminOnly, admin: 409 },
  },
  'GET /api/dev/outbox/:id/attachments/:n': {
    path: (f) => `/dev/outbox/${f.outboxId}/attachments/0`,
    expect: adminOnly,
  },
};

interface RouteLayer {
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: RouteLayer[] };
}

/** METHOD /api/path of every route registered on the routers mounted under /api. */
function registeredRoutes(app: Express): string[] {
  const out: string[] = [];
  for (const layer of app.router.stack as RouteLayer[]) {
    for (const inner of layer.handle.stack ?? []) {
      if (!inner.route) continue;
      for (const [method, on] of Object.entries(inner.route.methods))
        if (on && method !== '_all') out.push(`${method.toUpperCase()} /api${inner.route.path}`);
    }
  }
  return out.sort();
}

describe('the role matrix', () => {
  let s: TestServer;
  const tokens = {} as Record<Exclude<Actor, 'anonymous'>, AuthResponse>;
  let verifyToken = '';
  /** Two engineers who are none of the actors: one prepares the revisions of the review cases, one checks. */
  let preparer: AuthResponse;
  let checker: AuthResponse;

  beforeAll(async () => {
    s = await startTestServer({ config: { loginRateLimit: { windowMs: 60_000, max: 10_000 } } });
    for (const actor of ['outsider', 'viewer', 'engineer', 'admin'] as const)
      tokens[actor] = await registerUser(s, actor);
    tokens.lead = await registerAndVerify(s, LEAD_EMAIL, 'Lead', LEAD_PASSWORD);
    verifyToken = await verificationToken(s, LEAD_EMAIL);
    await makeAdmin(s, tokens.admin.user.id);
    preparer = await registerUser(s, 'preparer');
    checker = await registerUser(s, 'checker');
    await s.ctx.mailer.sendMail({
      to: 'x@example.test',
      subject: 'Attachment',
      text: 'x',
      attachments: [{ filename: 'a.txt', content: Buffer.from('abc') }],
    });
  });
  afterAll(async () => {
    await s?.close();
  });

  let revision: Promise<{ revisionBuildingId: number; revisionId: number }> | null = null;
  /** Frozen revisions never change, so one serves every case (freezing renders a package). */
  function sharedRevision(): Promise<{ revisionBuildingId: number; revisionId: number }> {
    revision ??= (async () => {
      const lead = tokens.lead.token;
      const b = await createBuilding(s, lead, 'Matrix revisions');
      await addMember(s, lead, b.id, tokens.viewer.user.email, 'viewer');
      await addMember(s, lead, b.id, tokens.engineer.user.email, 'engineer');
      await s.api('POST', `/buildings/${b.id}/stacks`, { token: lead, body: { name: 'R/1', template } });
      const r = await s.api('POST', `/buildings/${b.id}/revisions`, {
        token: lead,
        body: { note: '', purpose: 'preliminary' },
      });
      return { revisionBuildingId: b.id, revisionId: (r.body as { id: number }).id };
    })();
    return revision;
  }

  /** A revision of building b prepared by `preparer`, then commented on or checked by the second engineer. */
  async function reviewFixture(
    b: number,
    stackId: number,
    review: NonNullable<Case['review']>,
  ): Promise<{ reviewRevisionId: number; commentId: number }> {
    const lead = tokens.lead.token;
    for (const m of [preparer, checker]) await addMember(s, lead, b, m.user.email, 'engineer');
    const r = await s.api('POST', `/buildings/${b}/revisions/prepare`, {
      token: preparer.token,
      body: { note: '', purpose: 'construction' },
    });
    const reviewRevisionId = (r.body as { id: number }).id;
    let commentId = 0;
    if (review === 'commented' || review === 'resolved') {
      const c = await s.api('POST', `/revisions/${reviewRevisionId}/comments`, {
        token: checker.token,
        body: { stackId, liftId: null, text: 'matrix' },
      });
      commentId = (c.body as { comments: { id: number }[] }).comments[0].id;
    }
    if (review === 'resolved')
      await s.api('POST', `/revisions/${reviewRevisionId}/comments/${commentId}/resolve`, {
        token: checker.token,
        body: {},
      });
    if (review === 'checked')
      await s.api('POST', `/revisions/${reviewRevisionId}/check`, { token: checker.token, body: {} });
    return { reviewRevisionId, commentId };
  }

  /** A fresh building per request, so a delete or a role change never affects the next case. */
  async function fixture(review?: Case['review']): Promise<Fixture> {
    const lead = tokens.lead.token;
    const b = await createBuilding(s, lead, 'Matrix');
    await addMember(s, lead, b.id, tokens.viewer.user.email, 'viewer');
    await addMember(s, lead, b.id, tokens.engineer.user.email, 'engineer');
    const level = (
      await s.api('POST', `/buildings/${b.id}/levels`, { token: lead, body: { name: 'Spare', elevation: 40 } })
    ).body as Level;
    const stack = (await s.api('POST', `/buildings/${b.id}/stacks`, { token: lead, body: { name: 'M/1', template } }))
      .body as StackSummary;
    const outbox = await s.ctx.db('outbox').where({ subject: 'Attachment' }).first<{ id: number }>('id');
    return {
      buildingId: b.id,
      levelId: level.id,
      stackId: stack.id,
      version: stack.version,
      engineerId: tokens.engineer.user.id,
      viewerId: tokens.viewer.user.id,
      outboxId: outbox.id,
      verifyToken,
      ...(await sharedRevision()),
      ...(review ? await reviewFixture(b.id, stack.id, review) : { reviewRevisionId: 0, commentId: 0 }),
    };
  }

  it('covers every registered route, and every route in it exists', () => {
    expect(registeredRoutes(s.app)).toEqual(Object.keys(MATRIX).sort());
  });

  for (const [route, c] of Object.entries(MATRIX)) {
    it(`${route}: ${ACTORS.map((a) => `${a} ${c.expect[a]}`).join(', ')}`, async () => {
      const got: Record<string, number> = {};
      for (const actor of ACTORS) {
        const base = await fixture(c.review);
        const f = { ...base, ...(await c.prepare?.(s, tokens.lead.token, base)) };
        const [method] = route.split(' ');
        const token = actor === 'anonymous' ? null : tokens[actor].token;
        got[actor] = (await s.api(method, c.path(f), { token, body: c.body?.(f, actor) })).status;
        if (c.endsSession && actor !== 'anonymous')
          tokens[actor] = await signIn(s, tokens[actor].user.email, passwordOf(actor));
      }
      expect(got).toEqual(c.expect);
    });
  }
});
