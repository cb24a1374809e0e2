// Company sections from CSV (docs/contracts.md §Imports): checked row by row like the loads, listed beside the
// catalogue, and used by the analysis of the building's stacks (which are re-analysed when a section they use
// changes).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, StackSummary } from '../../shared/schema/api.ts';
import type { ApplyResult, CompanySectionHit, ImportProblem, SectionsPreview } from '../../shared/schema/imports.ts';
import type { StackJoinAck } from '../../shared/schema/socket.ts';
import { getStack, TEMPLATE, upload } from '../fixtures/uploads.ts';
import { addMember, createBuilding, errorCode, registerUser, startTestServer, type TestServer } from './helpers.ts';
import { connect, next, request, type LiveClient } from './liveHelpers.ts';

let s: TestServer;
let lead: AuthResponse;
let engineer: AuthResponse;
let buildingId: number;
const open: LiveClient[] = [];

const HEADER = 'designation,shape,make,h_mm,b_mm,tw_mm,tf_mm,r_mm,d_mm,t_mm';
const csv = (...rows: string[]) => [HEADER, ...rows].join('\n') + '\n';
// BS 4-1 dimensions of UKC 203x203x46 (h 203.2, b 203.6, tw 7.2, tf 11.0, r 10.2 mm), from memory of
// SCI P363 (steel building design: design data), under a name of our own.
const OWN_COLUMN = 'OWN 203 COL,I,rolled,203.2,203.6,7.2,11.0,10.2,,';
const preview = (body: string) =>
  upload(s, `/buildings/${buildingId}/imports/sections`, engineer.token, body, { fileName: 'sections.csv' });
const apply = (body: string, fields: Record<string, string> = {}) =>
  upload(s, `/buildings/${buildingId}/imports/sections/apply`, engineer.token, body, { fields });
const problemsOf = (body: unknown): ImportProblem[] =>
  (body as { error: { details: SectionsPreview } }).error.details.problems;
const storedCount = async () =>
  Number(
    (await s.ctx.db('company_sections').where({ building_id: buildingId }).count<{ n: number }[]>({ n: '*' }))[0]!.n,
  );

async function newStack(name: string, section: string): Promise<StackSummary> {
  const r = await s.api('POST', `/buildings/${buildingId}/stacks`, {
    token: lead.token,
    body: { name, template: { ...TEMPLATE, sections: [section] } },
  });
  expect(r.status).toBe(201);
  return r.body as StackSummary;
}

beforeAll(async () => {
  s = await startTestServer();
  lead = await registerUser(s, 'lead');
  engineer = await registerUser(s, 'engineer');
  buildingId = (await createBuilding(s, lead.token, 'Sections block')).id;
  await addMember(s, lead.token, buildingId, engineer.user.email, 'engineer');
});

afterAll(async () => {
  for (const c of open) c.close();
  await s?.close();
});

describe('bad section files', () => {
  it('refuses every bad row with its row and column, and stores nothing', async () => {
    const file = csv(
      'UKC 203x203x46,I,rolled,203.2,203.6,7.2,11.0,10.2,,',
      'BOX 1,Z,rolled,100,100,5,5,5,,',
      'TUBE 1,CHS,extruded,,,,,,114.3,6',
      'TUBE 2,CHS,hot-finished,120,,,,,114.3,6',
      'THICK 1,I,welded,200,200,10,100,,,',
      'THIN 1,RHS,cold-formed,200,100,,,,,abc',
      'OWN 1,SHS,hot-finished,150,,,,,,8',
      'own 1,SHS,hot-finished,150,,,,,,10',
      'WIDE 1,I,rolled,300,200,-8,12,10,,',
    );
    for (const send of [preview, apply]) {
      const r = await send(file);
      expect(r.status).toBe(422);
      expect(errorCode(r.body)).toBe('unprocessable');
      expect(problemsOf(r.body)).toEqual([
        {
          row: 2,
          column: 'designation',
          message: '"UKC 203x203x46" is a standard section in the catalogue; give your own section another name',
        },
        { row: 3, column: 'shape', message: '"Z" is not a shape; use I, SHS, RHS or CHS' },
        {
          row: 4,
          column: 'make',
          message: '"extruded" is not a make of CHS sections; use hot-finished or cold-formed',
        },
        { row: 5, column: 'h_mm', message: 'h_mm is not a dimension of CHS sections; leave it empty' },
        { row: 6, column: null, message: expect.stringMatching(/leave no web/) },
        { row: 7, column: 't_mm', message: '"abc" is not a number (use a point for decimals, e.g. 12.5)' },
        { row: 9, column: 'designation', message: 'Row 8 already defines "own 1"' },
        { row: 10, column: 'tw_mm', message: 'tw_mm must not be negative' },
      ]);
    }
    expect(await storedCount()).toBe(0);
  });

  it('refuses a file with the wrong columns', async () => {
    const r = await preview('name,shape,make\nX,I,rolled\n');
    expect(r.status).toBe(422);
    expect(problemsOf(r.body)).toEqual([
      { row: 1, column: 'name', message: expect.stringMatching(/^Unknown column "name"/) },
      { row: 1, column: 'designation', message: expect.stringMatching(/^Column designation is missing/) },
    ]);
  });
});

describe('a good section file', () => {
  it('previews, applies, lists the section with its mass, and re-analyses the stacks that use it', async () => {
    const own = await newStack('C/1', 'OWN 203 COL');
    const catalogue = await newStack('C/2', 'UKC 203x203x46');
    const before = await getStack(s, lead.token, own.id);
    expect(before.results.errors[0]?.message).toMatch(/"OWN 203 COL" is not a section/);

    const watcher = await connect(s.url, lead.token);
    open.push(watcher);
    expect((await request<StackJoinAck>(watcher, 'stack:join', { stackId: own.id })).ok).toBe(true);
    const heard = next(watcher, 'stack:changed', (c) => c.stackId === own.id);

    const file = csv(OWN_COLUMN, 'OWN SHS 1,SHS,hot-finished,150,,,,,,8', 'OWN TUBE,CHS,cold-formed,,,,,,168.3,6.3');
    const p = await preview(file);
    expect(p.status).toBe(200);
    const shown = p.body as SectionsPreview;
    expect(shown.changes.map((c) => [c.row, c.designation, c.before])).toEqual([
      [2, 'OWN 203 COL', null],
      [3, 'OWN SHS 1', null],
      [4, 'OWN TUBE', null],
    ]);
    expect(shown.changes[1]!.after).toEqual({ shape: 'RHS', make: 'hot-finished', h: 150, b: 150, t: 8 });
    expect(await storedCount()).toBe(0);

    const r = await apply(file, { fileHash: shown.fileHash });
    expect(r.status).toBe(200);
    expect((r.body as ApplyResult).applied).toBe(3);
    expect((r.body as ApplyResult).stacks).toEqual([{ stackId: own.id, version: before.version + 1 }]);

    const listed = (await s.api('GET', `/buildings/${buildingId}/sections?q=own%20203`, { token: lead.token }))
      .body as CompanySectionHit[];
    expect(listed.map((h) => h.designation)).toEqual(['OWN 203 COL']);
    // SCI P363 (steel building design: design data): UKC 203x203x46 is 46.1 kg/m (from memory); computed from dimensions within 2%.
    expect(Math.abs(listed[0]!.massPerMetre - 46.1) / 46.1).toBeLessThan(0.02);

    const changed = await heard;
    expect(changed.results.errors).toEqual([]);
    const after = await getStack(s, lead.token, own.id);
    const twin = await getStack(s, lead.token, catalogue.id);
    // The same dimensions under our own name give the catalogue section's utilisation, lift by lift.
    expect(after.results.lifts.map((l) => l.utilisation)).toEqual(twin.results.lifts.map((l) => l.utilisation));
  });

  it('re-importing the same file changes nothing; a changed dimension updates the section and re-analyses its stacks', async () => {
    const same = (await preview(csv(OWN_COLUMN))).body as SectionsPreview;
    expect(same.changes).toEqual([]);
    expect(same.unchanged).toBe(1);

    const stacks = (await s.api('GET', `/buildings/${buildingId}/stacks`, { token: lead.token }))
      .body as StackSummary[];
    const own = stacks.find((x) => x.name === 'C/1')!;
    const thicker = csv('OWN 203 COL,I,rolled,203.2,203.6,7.2,14.0,10.2,,');
    const r = await apply(thicker);
    expect(r.status).toBe(200);
    expect((r.body as ApplyResult).stacks).toEqual([{ stackId: own.id, version: own.version + 1 }]);
    const after = await getStack(s, lead.token, own.id);
    // Thicker flanges carry more: the governing utilisation falls.
    expect(after.results.lifts[0]!.utilisation).toBeLessThan(own.utilisation!);
  });
});
