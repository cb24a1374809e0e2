// Every writing route answered with malformed input: always 4xx with the error shape, never 5xx,
// and the database exactly as it was.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Level, StackDetail, StackSummary } from '../../shared/schema/api.ts';
import {
  addMember,
  createBuilding,
  errorCode,
  listRoutes,
  registerUser,
  startTestServer,
  TEST_PASSWORD,
  type TestServer,
} from './helpers.ts';

const TABLES = [
  'users',
  'buildings',
  'memberships',
  'invitations',
  'levels',
  'stacks',
  'stack_ops',
  'audit_log',
  'outbox',
  'mail_log',
  'mail_queue',
  'revision_packages',
  'building_models',
  'stack_positions',
  'revisions',
  'revision_steps',
  'revision_comments',
  'revision_outlines',
];
/** The tables whose rows are one per building or revision, keyed by it rather than an id of their own. */
const KEYED_BY: Record<string, string> = { building_models: 'building_id', revision_outlines: 'revision_id' };
const HUGE = JSON.stringify({ name: 'x'.repeat(1_200_000) });

interface Req {
  raw?: string;
  body?: unknown;
  path?: string;
  /** Sent without the session token. */
  anonymous?: boolean;
}

describe('malformed input on every writing route', () => {
  let s: TestServer;
  let token: string;
  let ids: { building: number; level: string; stack: number; member: number; revision: number; comment: number };
  let doc: StackDetail['doc'];

  beforeAll(async () => {
    s = await startTestServer();
    token = (await registerUser(s, 'lead')).token;
    const other = await registerUser(s, 'member');
    const b = await createBuilding(s, token);
    await addMember(s, token, b.id, other.user.email, 'engineer');
    const level = (await s.api('POST', `/buildings/${b.id}/levels`, { token, body: { name: 'L1', elevation: 3.5 } }))
      .body as Level;
    const stack = (
      await s.api('POST', `/buildings/${b.id}/stacks`, {
        token,
        body: { name: 'A/1', template: { storeys: 3, storeyHeight: 3.5, sections: ['UKC 203x203x46'] } },
      })
    ).body as StackSummary;
    doc = ((await s.api('GET', `/stacks/${stack.id}`, { token })).body as StackDetail).doc;
    // Prepared by the other member, with a comment, so the lead may check, comment, resolve and approve it.
    const prepared = await s.api('POST', `/buildings/${b.id}/revisions/prepare`, {
      token: other.token,
      body: { note: '', purpose: 'construction' },
    });
    const revision = (prepared.body as { id: number }).id;
    const commented = await s.api('POST', `/revisions/${revision}/comments`, {
      token: other.token,
      body: { stackId: stack.id, text: 'check this' },
    });
    const comment = (commented.body as { comments: { id: number }[] }).comments[0].id;
    ids = { building: b.id, level: level.id, stack: stack.id, member: other.user.id, revision, comment };
  });
  afterAll(async () => {
    await s?.close();
  });

  async function snapshot(): Promise<string> {
    const parts: unknown[] = [];
    for (const t of TABLES)
      parts.push(
        await s.ctx
          .db(t)
          .select('*')
          .orderBy(KEYED_BY[t] ?? 'id'),
      );
    return JSON.stringify(parts);
  }

  /** Shared by every body route: JSON that does not parse, the wrong top-level shape, too big. */
  const common: [string, Req][] = [
    ['invalid JSON', { raw: '{"name": ' }],
    ['a JSON array', { body: [{ name: 'x' }] }],
    ['null', { raw: 'null' }],
    ['an empty object', { body: {} }],
    ['a body over 1 MB', { raw: HUGE }],
  ];

  const restraint = doc_restraint();
  function doc_restraint() {
    return (d: StackDetail['doc'], data: Record<string, unknown>) => ({
      nodes: d.nodes.map((n) => (n.kind === 'restraint' ? { ...n, data: { ...n.data, ...data } } : n)),
      edges: d.edges,
    });
  }

  // bodyless: the route reads no body, so only its path parameters can be malformed.
  const routes: {
    name: string;
    method: string;
    path: () => string;
    bodyless?: boolean;
    cases: () => [string, Req][];
  }[] = [
    {
      name: 'POST /api/buildings',
      method: 'POST',
      path: () => '/buildings',
      cases: () => [
        ['a number for the name', { body: { name: 12 } }],
        ['an unknown field', { body: { name: 'B', colour: 'red' } }],
        ['an unknown option value', { body: { name: 'B', options: { combination: 'NaN' } } }],
        ['a 100 000-character name', { body: { name: 'n'.repeat(100_000) } }],
      ],
    },
    {
      name: 'PATCH /api/buildings/:id',
      method: 'PATCH',
      path: () => `/buildings/${ids.building}`,
      cases: () => [
        ['options of the wrong type', { body: { options: { imposedReduction: 'yes' } } }],
        ['an unknown source of buckling lengths', { body: { options: { bucklingLengths: 'eigen' } } }],
        ['an unknown field', { body: { owner: 1 } }],
        ['a bad id', { path: '/buildings/abc', body: { name: 'x' } }],
        ['an id of 1e308', { path: '/buildings/1e308', body: { name: 'x' } }],
      ],
    },
    {
      name: 'POST /api/buildings/:id/members',
      method: 'POST',
      path: () => `/buildings/${ids.building}/members`,
      cases: () => [
        ['a missing role', { body: { email: 'm@example.test' } }],
        ['a made-up role', { body: { email: 'm@example.test', role: 'owner' } }],
        ['not an e-mail address', { body: { email: 'not-an-address', role: 'viewer' } }],
      ],
    },
    {
      name: 'PATCH /api/buildings/:id/members/:memberId',
      method: 'PATCH',
      path: () => `/buildings/${ids.building}/members/${ids.member}`,
      cases: () => [
        ['a made-up role', { body: { role: 'admin' } }],
        ['a negative member id', { path: `/buildings/${ids.building}/members/-4`, body: { role: 'viewer' } }],
      ],
    },
    {
      name: 'DELETE /api/buildings/:id/members/:memberId',
      method: 'DELETE',
      bodyless: true,
      path: () => `/buildings/${ids.building}/members/${ids.member}`,
      cases: () => [
        ['NaN as the member id', { path: `/buildings/${ids.building}/members/NaN` }],
        ['a member id of 1e308', { path: `/buildings/${ids.building}/members/1e308` }],
      ],
    },
    {
      name: 'POST /api/buildings/:id/levels',
      method: 'POST',
      path: () => `/buildings/${ids.building}/levels`,
      cases: () => [
        ['an elevation of 1e308', { body: { name: 'L', elevation: 1e308 } }],
        ['NaN as a string', { body: { name: 'L', elevation: 'NaN' } }],
        ['a missing elevation', { body: { name: 'L' } }],
        ['an unknown field', { body: { name: 'L', elevation: 1, height: 3 } }],
      ],
    },
    {
      name: 'PATCH /api/buildings/:id/levels/:levelId',
      method: 'PATCH',
      path: () => `/buildings/${ids.building}/levels/${ids.level}`,
      cases: () => [
        ['an elevation of -1e308', { body: { elevation: -1e308 } }],
        ['an elevation as a string', { body: { elevation: '4.5' } }],
        ['a level id that is not a number', { path: `/buildings/${ids.building}/levels/x1`, body: { name: 'x' } }],
      ],
    },
    {
      name: 'POST /api/buildings/:id/levels/:levelId/preview',
      method: 'POST',
      path: () => `/buildings/${ids.building}/levels/${ids.level}/preview`,
      cases: () => [
        ['an elevation beyond any building', { body: { elevation: 5000 } }],
        ['an elevation as a string', { body: { elevation: '4.5' } }],
        ['an unknown field', { body: { elevation: 4, name: 'x' } }],
      ],
    },
    {
      name: 'DELETE /api/buildings/:id/levels/:levelId',
      method: 'DELETE',
      bodyless: true,
      path: () => `/buildings/${ids.building}/levels/${ids.level}`,
      cases: () => [['a level id of 0', { path: `/buildings/${ids.building}/levels/0` }]],
    },
    {
      name: 'POST /api/buildings/:id/stacks',
      method: 'POST',
      path: () => `/buildings/${ids.building}/stacks`,
      cases: () => [
        [
          'a negative storey height',
          { body: { name: 'T', template: { storeys: 3, storeyHeight: -3.5, sections: ['UKC 203x203x46'] } } },
        ],
        [
          'a storey height of 1e308',
          { body: { name: 'T', template: { storeys: 3, storeyHeight: 1e308, sections: ['UKC 203x203x46'] } } },
        ],
        [
          'NaN as a string for storeys',
          { body: { name: 'T', template: { storeys: 'NaN', storeyHeight: 3, sections: ['UKC 203x203x46'] } } },
        ],
        [
          'a fractional storey count',
          { body: { name: 'T', template: { storeys: 2.5, storeyHeight: 3, sections: ['UKC 203x203x46'] } } },
        ],
        ['no sections', { body: { name: 'T', template: { storeys: 2, storeyHeight: 3, sections: [] } } }],
        [
          'neither storeys nor elevations',
          { body: { name: 'T', template: { storeyHeight: 3, sections: ['UKC 203x203x46'] } } },
        ],
        [
          'elevations with a storey height',
          { body: { name: 'T', template: { elevations: [0, 4, 8], storeyHeight: 4, sections: ['UKC 203x203x46'] } } },
        ],
        [
          'elevations and a storey count that disagree',
          { body: { name: 'T', template: { elevations: [0, 4, 8], storeys: 5, sections: ['UKC 203x203x46'] } } },
        ],
        [
          'elevations that fall',
          { body: { name: 'T', template: { elevations: [0, 8, 4], sections: ['UKC 203x203x46'] } } },
        ],
        ['a single elevation', { body: { name: 'T', template: { elevations: [0], sections: ['UKC 203x203x46'] } } }],
        [
          'an elevation of 1e308',
          { body: { name: 'T', template: { elevations: [0, 1e308], sections: ['UKC 203x203x46'] } } },
        ],
        [
          'an elevation as a string',
          { body: { name: 'T', template: { elevations: [0, '3.5'], sections: ['UKC 203x203x46'] } } },
        ],
        [
          'elevations that are not a list',
          { body: { name: 'T', template: { elevations: { base: 0 }, sections: ['UKC 203x203x46'] } } },
        ],
        [
          'both a document and a template',
          { body: { name: 'T', doc, template: { storeys: 2, storeyHeight: 3, sections: ['UKC 203x203x46'] } } },
        ],
        ['a negative Gk in the document', { body: { name: 'T', doc: restraint(doc, { Gk: -10 }) } }],
        ['an elevation of 1e308 in the document', { body: { name: 'T', doc: restraint(doc, { elevation: 1e308 }) } }],
        [
          'a node of an unknown kind',
          { body: { name: 'T', doc: { nodes: [{ id: 'x', kind: 'beam', data: {} }], edges: [] } } },
        ],
      ],
    },
    {
      name: 'PUT /api/stacks/:id',
      method: 'PUT',
      path: () => `/stacks/${ids.stack}`,
      cases: () => [
        ['a missing baseVersion', { body: { doc } }],
        ['a negative baseVersion', { body: { doc, baseVersion: -1 } }],
        ['a baseVersion of 1e308', { body: { doc, baseVersion: 1e308 } }],
        ['NaN as a string for baseVersion', { body: { doc, baseVersion: 'NaN' } }],
        ['Gk as a string', { body: { doc: restraint(doc, { Gk: '100' }), baseVersion: 0 } }],
        ['an unknown field in node data', { body: { doc: restraint(doc, { colour: 'red' }), baseVersion: 0 } }],
        ['a stale baseVersion', { body: { doc, baseVersion: 7 } }],
        ['a stack id of -1', { path: '/stacks/-1', body: { doc, baseVersion: 0 } }],
      ],
    },
    {
      name: 'POST /api/stacks/:id/versions/:version/restore',
      method: 'POST',
      path: () => `/stacks/${ids.stack}/versions/0/restore`,
      cases: () => [
        ['a missing baseVersion', { body: {} }],
        ['a negative baseVersion', { body: { baseVersion: -1 } }],
        ['NaN as a string for baseVersion', { body: { baseVersion: 'NaN' } }],
        ['an unknown field', { body: { baseVersion: 0, doc } }],
        ['a stale baseVersion', { body: { baseVersion: 7 } }],
        [
          'a version that is not a number',
          { path: `/stacks/${ids.stack}/versions/abc/restore`, body: { baseVersion: 0 } },
        ],
        [
          'a version ahead of the stack',
          { path: `/stacks/${ids.stack}/versions/99/restore`, body: { baseVersion: 0 } },
        ],
      ],
    },
    {
      name: 'POST /api/stacks/:id/ops',
      method: 'POST',
      path: () => `/stacks/${ids.stack}/ops`,
      cases: () => [
        ['an empty ops list', { body: { baseVersion: 0, ops: [] } }],
        ['an unknown op', { body: { baseVersion: 0, ops: [{ op: 'explode', id: 'cap' }] } }],
        [
          'an update to a negative elevation far below the limit',
          { body: { baseVersion: 0, ops: [{ op: 'updateNode', id: 'cap', data: { elevation: -1e308 } }] } },
        ],
        [
          'NaN as a string in an update',
          { body: { baseVersion: 0, ops: [{ op: 'updateNode', id: 'cap', data: { Gk: 'NaN' } }] } },
        ],
        [
          'a position of 1e308',
          { body: { baseVersion: 0, ops: [{ op: 'moveNode', id: 'cap', position: { x: 1e308, y: 0 } }] } },
        ],
        ['an unknown node id', { body: { baseVersion: 0, ops: [{ op: 'removeNode', id: 'nope' }] } }],
        ['a node id with spaces', { body: { baseVersion: 0, ops: [{ op: 'removeNode', id: 'a b' }] } }],
        [
          '501 ops',
          {
            body: {
              baseVersion: 0,
              ops: Array.from({ length: 501 }, () => ({ op: 'moveNode', id: 'cap', position: { x: 0, y: 0 } })),
            },
          },
        ],
      ],
    },
    {
      name: 'PATCH /api/stacks/:id',
      method: 'PATCH',
      path: () => `/stacks/${ids.stack}`,
      cases: () => [
        ['an empty name', { body: { name: '   ' } }],
        ['a name that is an object', { body: { name: { first: 'A' } } }],
      ],
    },
    {
      name: 'DELETE /api/stacks/:id',
      method: 'DELETE',
      bodyless: true,
      path: () => `/stacks/${ids.stack}`,
      cases: () => [['a stack id that is not a number', { path: '/stacks/one' }]],
    },
    {
      name: 'PUT /api/buildings/:id/grid',
      method: 'PUT',
      path: () => `/buildings/${ids.building}/grid`,
      cases: () => {
        const line = (id: string, position: unknown) => ({ id, name: id, position });
        const grid = (xLines: unknown[], extra: Record<string, unknown> = {}) => ({
          grid: { x: { lines: xLines, ...extra }, y: { lines: [line('y1', 0)] } },
        });
        return [
          ['a position of 1e308', { body: grid([line('A', 1e308)]) }],
          ['a position as a string', { body: grid([line('A', '6')]) }],
          ['two lines of one name', { body: grid([line('A', 0), { id: 'A2', name: 'a', position: 6 }]) }],
          ['two lines at one position', { body: grid([line('A', 0), line('B', 0.0004)]) }],
          ['one id for two lines', { body: grid([line('A', 0), { id: 'A', name: 'B', position: 6 }]) }],
          ['a negative edge distance', { body: grid([line('A', 0)], { edgeBefore: -1 }) }],
          ['an id with spaces', { body: grid([line('A B', 0)]) }],
          ['a building id of 1e308', { path: '/buildings/1e308/grid', body: grid([line('A', 0)]) }],
        ];
      },
    },
    {
      name: 'PUT /api/buildings/:id/buildups',
      method: 'PUT',
      path: () => `/buildings/${ids.building}/buildups`,
      cases: () => {
        const buildup = (extra: Record<string, unknown>) => ({
          id: 'b1',
          name: 'Office',
          permanent: [{ label: 'Slab', gk: 3.5 }],
          imposed: { qk: 2.5, category: 'B' },
          ...extra,
        });
        return [
          ['a negative load', { body: { buildups: [buildup({ permanent: [{ label: 'Slab', gk: -3 }] })] } }],
          ['an unknown category', { body: { buildups: [buildup({ imposed: { qk: 2.5, category: 'Z' } })] } }],
          ['a load of 1e308', { body: { buildups: [buildup({ imposed: { qk: 1e308, category: 'B' } })] } }],
          [
            'partitions that are neither imposed nor permanent',
            { body: { buildups: [buildup({ partitions: { load: 1, as: 'both' } })] } },
          ],
          ['two build-ups of one id', { body: { buildups: [buildup({}), buildup({ name: 'Other' })] } }],
          ['two build-ups of one name', { body: { buildups: [buildup({}), buildup({ id: 'b2', name: 'office' })] } }],
        ];
      },
    },
    {
      name: 'PUT /api/buildings/:id/levels/:levelId/floor-load',
      method: 'PUT',
      path: () => `/buildings/${ids.building}/levels/${ids.level}/floor-load`,
      cases: () => [
        ['a build-up the building does not have', { body: { buildupId: 'nope' } }],
        ['an unknown span', { body: { buildupId: null, span: 'diagonal' } }],
        [
          'a line load on a line the grid does not have',
          { body: { buildupId: null, lines: [{ gridLineId: 'Q', label: 'Cladding', gk: 'NaN' }] } },
        ],
        [
          'a level of another building',
          { path: `/buildings/${ids.building}/levels/999999/floor-load`, body: { buildupId: null } },
        ],
        [
          'a level id that is not a number',
          { path: `/buildings/${ids.building}/levels/L1/floor-load`, body: { buildupId: null } },
        ],
      ],
    },
    {
      name: 'PUT /api/stacks/:id/placement',
      method: 'PUT',
      path: () => `/stacks/${ids.stack}/placement`,
      cases: () => [
        ['one grid line without the other', { body: { gridX: 'A', gridY: null } }],
        ['grid lines the building does not have', { body: { gridX: 'A', gridY: 'y1' } }],
        ['an unknown web direction', { body: { gridX: null, gridY: null, webAlong: 'z' } }],
        ['a stack id of 0', { path: '/stacks/0/placement', body: { gridX: null, gridY: null } }],
      ],
    },
    {
      name: 'POST /api/stacks/:id/positions',
      method: 'POST',
      path: () => `/stacks/${ids.stack}/positions`,
      cases: () => [
        ['one grid line without the other', { body: { gridX: 'A' } }],
        ['a grid line id with a space', { body: { gridX: 'A b', gridY: 'y1' } }],
        ['an unknown web direction', { body: { gridX: 'A', gridY: 'y1', webAlong: 'z' } }],
        ['a stack off the grid', { body: { gridX: 'A', gridY: 'y1' } }],
        ['a stack id of 0', { path: '/stacks/0/positions', body: { gridX: 'A', gridY: 'y1' } }],
      ],
    },
    {
      name: 'DELETE /api/stacks/:id/positions/:positionId',
      method: 'DELETE',
      bodyless: true,
      path: () => `/stacks/${ids.stack}/positions/1`,
      cases: () => [
        ['a position id that is not a number', { path: `/stacks/${ids.stack}/positions/one` }],
        ['a position the stack does not have', { path: `/stacks/${ids.stack}/positions/999999` }],
      ],
    },
    {
      name: 'PUT /api/stacks/:id/positions/:positionId/area-overrides',
      method: 'PUT',
      path: () => `/stacks/${ids.stack}/positions/1/area-overrides`,
      cases: () => [
        ['a position id that is not a number', { path: `/stacks/${ids.stack}/positions/one/area-overrides` }],
        ['a position the stack does not have', { body: { overrides: [] } }],
        [
          'an area and a factor',
          { body: { overrides: [{ levelId: ids.level, area: 10, factor: 0.5, reason: 'Void' }] } },
        ],
        ['no reason', { body: { overrides: [{ levelId: ids.level, factor: 0.5, reason: ' ' }] } }],
      ],
    },
    {
      name: 'PUT /api/stacks/:id/area-overrides',
      method: 'PUT',
      path: () => `/stacks/${ids.stack}/area-overrides`,
      cases: () => [
        [
          'an area and a factor',
          { body: { overrides: [{ levelId: ids.level, area: 10, factor: 0.5, reason: 'Void' }] } },
        ],
        ['no reason', { body: { overrides: [{ levelId: ids.level, factor: 0.5, reason: ' ' }] } }],
        ['a negative factor', { body: { overrides: [{ levelId: ids.level, factor: -0.5, reason: 'Void' }] } }],
        [
          'a level the building does not have',
          { body: { overrides: [{ levelId: '999999', factor: 0.5, reason: 'Void' }] } },
        ],
        [
          'two overrides of one level',
          {
            body: {
              overrides: [
                { levelId: ids.level, factor: 0.5, reason: 'Void' },
                { levelId: ids.level, area: 3, reason: 'Core' },
              ],
            },
          },
        ],
      ],
    },
    // Routes of colleagues' features: a JSON body where a CSV upload is expected, bad fields, bad ids.
    ...[
      'loads',
      'loads/apply',
      'sections',
      'sections/apply',
      'grid',
      'grid/apply',
      'floor-loads',
      'floor-loads/apply',
    ].map((kind) => ({
      name: `POST /api/buildings/:id/imports/${kind}`,
      method: 'POST',
      path: () => `/buildings/${ids.building}/imports/${kind}`,
      cases: (): [string, Req][] => [
        ['JSON instead of a CSV upload', { body: { rows: [[1, 2]] } }],
        ['a building id of 1e308', { path: `/buildings/1e308/imports/${kind}`, body: {} }],
      ],
    })),
    {
      name: 'POST /api/buildings/:id/revisions',
      method: 'POST',
      path: () => `/buildings/${ids.building}/revisions`,
      cases: () => [
        ['an unknown purpose', { body: { purpose: 'final', note: 'x' } }],
        ['a note that is a number', { body: { purpose: 'preliminary', note: 1e308 } }],
        ['acknowledgement as a string', { body: { purpose: 'preliminary', acknowledgeFailingLifts: 'NaN' } }],
        ['an unknown field', { body: { purpose: 'preliminary', code: 'P99' } }],
      ],
    },
    {
      name: 'POST /api/buildings/:id/revisions/prepare',
      method: 'POST',
      path: () => `/buildings/${ids.building}/revisions/prepare`,
      cases: () => [
        ['an unknown purpose', { body: { purpose: 'final', note: 'x' } }],
        ['a note of 100 000 characters', { body: { purpose: 'construction', note: 'n'.repeat(100_000) } }],
        ['an unknown field', { body: { purpose: 'construction', code: 'C99' } }],
      ],
    },
    // Their bodies are all optional: {} is a valid check or approval, so only wrong ones are sent.
    {
      name: 'POST /api/revisions/:id/check',
      method: 'POST',
      path: () => `/revisions/${ids.revision}/check`,
      bodyless: true,
      cases: () => [
        ['a note that is a number', { body: { note: 1e308 } }],
        ['an unknown field', { body: { note: '', approve: true } }],
        ['a JSON array', { body: [] }],
        ['NaN as the revision id', { path: '/revisions/NaN/check', body: {} }],
      ],
    },
    {
      name: 'POST /api/revisions/:id/approve',
      method: 'POST',
      path: () => `/revisions/${ids.revision}/approve`,
      bodyless: true,
      cases: () => [
        ['a reason that is a number', { body: { openCommentsReason: 5 } }],
        ['a reason of 100 000 characters', { body: { openCommentsReason: 'r'.repeat(100_000) } }],
        ['an unknown field', { body: { unchecked: true } }],
        ['a revision id of 1e308', { path: '/revisions/1e308/approve', body: {} }],
      ],
    },
    {
      name: 'POST /api/revisions/:id/comments',
      method: 'POST',
      path: () => `/revisions/${ids.revision}/comments`,
      cases: () => [
        ['no text', { body: { stackId: ids.stack, text: '' } }],
        ['a stack id that is a string', { body: { stackId: 'A/1', text: 'x' } }],
        ['a lift id that is a number', { body: { stackId: ids.stack, liftId: 3, text: 'x' } }],
        ['a stack not in the revision', { body: { stackId: 999_999, text: 'x' } }],
        ['a lift not in the stack', { body: { stackId: ids.stack, liftId: 'nowhere', text: 'x' } }],
        ['an unknown field', { body: { stackId: ids.stack, text: 'x', resolved: true } }],
      ],
    },
    {
      name: 'POST /api/revisions/:id/comments/:commentId/resolve',
      method: 'POST',
      path: () => `/revisions/${ids.revision}/comments/${ids.comment}/resolve`,
      bodyless: true,
      cases: () => [
        ['a note that is an object', { body: { note: { x: 1 } } }],
        ['an unknown field', { body: { note: '', reopen: true } }],
        ['a comment id of -1', { path: `/revisions/${ids.revision}/comments/-1/resolve`, body: {} }],
        ['a comment of no revision', { path: `/revisions/${ids.revision}/comments/999999/resolve`, body: {} }],
      ],
    },
    {
      name: 'POST /api/revisions/:id/comments/:commentId/reopen',
      method: 'POST',
      path: () => `/revisions/${ids.revision}/comments/${ids.comment}/reopen`,
      bodyless: true,
      cases: () => [
        ['a note that is a number', { body: { note: 4 } }],
        ['an unknown field', { body: { note: '', resolved: false } }],
        ['a comment id of 0', { path: `/revisions/${ids.revision}/comments/0/reopen`, body: {} }],
        ['a comment of no revision', { path: `/revisions/${ids.revision}/comments/999999/reopen`, body: {} }],
      ],
    },
    {
      name: 'POST /api/revisions/:id/resend',
      method: 'POST',
      path: () => '/revisions/1/resend',
      bodyless: true,
      cases: () => [
        ['NaN as the revision id', { path: '/revisions/NaN/resend' }],
        ['a revision id of -1', { path: '/revisions/-1/resend' }],
      ],
    },
    {
      name: 'POST /api/revisions/:id/package/redraw',
      method: 'POST',
      path: () => '/revisions/1/package/redraw',
      bodyless: true,
      cases: () => [
        ['NaN as the revision id', { path: '/revisions/NaN/package/redraw' }],
        ['a revision id of 1e308', { path: '/revisions/1e308/package/redraw' }],
      ],
    },
    {
      name: 'POST /api/admin/buildings/:id/lead',
      method: 'POST',
      path: () => `/admin/buildings/${ids.building}/lead`,
      cases: () => [
        ['no e-mail', { body: {} }],
        ['an e-mail that is a number', { body: { email: 1e308 } }],
        ['an unknown field', { body: { email: 'a@example.test', role: 'viewer' } }],
        ['a building id of NaN', { path: '/admin/buildings/NaN/lead', body: { email: 'a@example.test' } }],
      ],
    },
    ...(['stacks', 'buildings'] as const).map((scope) => ({
      name: `POST /api/${scope}/:id/sizing`,
      method: 'POST',
      path: () => `/${scope}/${scope === 'stacks' ? ids.stack : ids.building}/sizing`,
      cases: (): [string, Req][] => [
        ['an unknown series', { body: { series: 'XYZ', grade: 'S355' } }],
        ['a target of 1e308', { body: { series: 'UKC', grade: 'S355', target: 1e308 } }],
        ['a negative target', { body: { series: 'UKC', grade: 'S355', target: -0.5 } }],
        ['NaN as a string for the target', { body: { series: 'UKC', grade: 'S355', target: 'NaN' } }],
      ],
    })),
    {
      name: 'POST /api/auth/register',
      method: 'POST',
      path: () => '/auth/register',
      cases: () => [
        ['a password of 1e308', { body: { email: 'r@example.test', password: 1e308, name: 'R' } }],
        ['a password of ten spaces', { body: { email: 'r@example.test', password: ' '.repeat(10), name: 'R' } }],
        ['a password of 73 bytes', { body: { email: 'r@example.test', password: 'é'.repeat(37), name: 'R' } }],
        ['an easily guessed password', { body: { email: 'r@example.test', password: 'password123456', name: 'R' } }],
        [
          'a password that is the address',
          { body: { email: 'quillon.marsh@example.test', password: 'quillon.marsh', name: 'R' } },
        ],
        ['no e-mail address', { body: { password: 'long enough password', name: 'R' } }],
      ],
    },
    {
      name: 'POST /api/auth/verify',
      method: 'POST',
      path: () => '/auth/verify',
      cases: () => [
        ['a token that is not a JWT', { body: { token: 'not-a-token' } }],
        ['a session token instead of a verification link', { body: { token } }],
        ['a token of 5,000 characters', { body: { token: 'x'.repeat(5000) } }],
        ['a number', { body: { token: 42 } }],
      ],
    },
    {
      name: 'POST /api/auth/verify/resend',
      method: 'POST',
      path: () => '/auth/verify/resend',
      // Reads no body; the caller's address is verified already (409).
      bodyless: true,
      cases: () => [['an already verified address', {}]],
    },
    {
      name: 'POST /api/auth/logout',
      method: 'POST',
      path: () => '/auth/logout',
      bodyless: true,
      cases: () => [['no session token', { path: '/auth/logout', body: undefined, anonymous: true }]],
    },
    {
      name: 'POST /api/auth/password',
      method: 'POST',
      path: () => '/auth/password',
      cases: () => [
        [
          'a wrong current password',
          { body: { currentPassword: 'not the password at all', newPassword: 'another long passphrase' } },
        ],
        ['a weak new password', { body: { currentPassword: TEST_PASSWORD, newPassword: 'password123456' } }],
        ['a new password of 73 bytes', { body: { currentPassword: TEST_PASSWORD, newPassword: 'é'.repeat(37) } }],
        ['a number as the new password', { body: { currentPassword: TEST_PASSWORD, newPassword: 12345678901 } }],
      ],
    },
    {
      name: 'POST /api/auth/password-strength',
      method: 'POST',
      path: () => '/auth/password-strength',
      cases: () => [
        ['a password of 201 characters', { body: { password: 'x'.repeat(201) } }],
        ['a number', { body: { password: 1234567890 } }],
        ['an unknown field', { body: { password: 'x', extra: true } }],
      ],
    },
  ];

  for (const route of routes) {
    it(`${route.name}: every malformed request gets a 4xx in the error shape and changes nothing`, async () => {
      const before = await snapshot();
      const cases = [...(route.bodyless ? [] : common), ...route.cases()];
      const failures: string[] = [];
      for (const [label, req] of cases) {
        const r = await s.api(route.method, req.path ?? route.path(), {
          token: req.anonymous ? null : token,
          body: req.body,
          raw: req.raw,
        });
        const ok = r.status >= 400 && r.status < 500 && errorCode(r.body) !== undefined;
        if (!ok) failures.push(`${label}: ${r.status} ${JSON.stringify(r.body).slice(0, 200)}`);
      }
      expect(failures).toEqual([]);
      expect(await snapshot()).toBe(before);
    });
  }

  it('covers every writing route the server registers (sign-in is covered in auth.test.ts)', () => {
    const writing = listRoutes(s.app).filter((r) => !r.startsWith('GET ') && r !== 'POST /api/auth/login');
    expect(writing).toEqual(routes.map((r) => r.name).sort());
  });

  it('still reads the stack afterwards (no malformed write left a broken document behind)', async () => {
    const r = await s.api('GET', `/stacks/${ids.stack}`, { token });
    expect(r.status).toBe(200);
    expect((r.body as StackDetail).version).toBe(0);
  });
});
