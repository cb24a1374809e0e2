// Level loads from CSV (docs/contracts.md §Imports): bad files are refused row by row and never touch the building; a
// good file changes exactly the named restraints in one transaction and every client in the stack hears it.
import { randomBytes } from 'node:crypto';
import { isDeepStrictEqual } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, StackSummary } from '../../shared/schema/api.ts';
import type { ApplyResult, ImportProblem, LoadsPreview } from '../../shared/schema/imports.ts';
import type { StackJoinAck } from '../../shared/schema/socket.ts';
import { download, getStack, nodeAt, seedBuilding, snapshot, upload } from '../fixtures/uploads.ts';
import { addMember, createBuilding, errorCode, registerUser, startTestServer, type TestServer } from './helpers.ts';
import { connect, next, request, type LiveClient } from './liveHelpers.ts';

let s: TestServer;
let lead: AuthResponse;
let engineer: AuthResponse;
let viewer: AuthResponse;
let outsider: AuthResponse;
let buildingId: number;
let stacks: StackSummary[];
const open: LiveClient[] = [];

const HEADER = 'stack,level,Gk_kN,Qk_kN,category';
const csv = (...rows: string[]) => [HEADER, ...rows].join('\n') + '\n';
const preview = (body: string | Uint8Array, token = engineer.token) =>
  upload(s, `/buildings/${buildingId}/imports/loads`, token, body);
const apply = (body: string | Uint8Array, fields: Record<string, string> = {}, token = engineer.token) =>
  upload(s, `/buildings/${buildingId}/imports/loads/apply`, token, body, { fields });

function problemsOf(body: unknown): ImportProblem[] {
  return (body as { error: { details: LoadsPreview } }).error.details.problems;
}

beforeAll(async () => {
  s = await startTestServer();
  lead = await registerUser(s, 'lead');
  engineer = await registerUser(s, 'engineer');
  viewer = await registerUser(s, 'viewer');
  outsider = await registerUser(s, 'outsider');
  buildingId = (await createBuilding(s, lead.token, 'Import block')).id;
  await addMember(s, lead.token, buildingId, engineer.user.email, 'engineer');
  await addMember(s, lead.token, buildingId, viewer.user.email, 'viewer');
  ({ stacks } = await seedBuilding(s, lead.token, buildingId));
});

afterAll(async () => {
  for (const c of open) c.close();
  await s?.close();
});

describe('bad files: 4xx with row-level problems, building unchanged', () => {
  const cases: {
    name: string;
    body: () => string | Uint8Array;
    status: number;
    expect: (p: ImportProblem[]) => void;
  }[] = [
    {
      name: 'wrong headers',
      body: () => 'stack,floor,G,Q,category\nA/1,Level 1,120,60,B\n',
      status: 422,
      expect: (p) => {
        expect(p.every((x) => x.row === 1)).toBe(true);
        expect(p.map((x) => x.column)).toEqual(expect.arrayContaining(['floor', 'G', 'Q', 'level', 'Gk_kN', 'Qk_kN']));
      },
    },
    {
      name: 'wrong delimiter (semicolons)',
      body: () => 'stack;level;Gk_kN;Qk_kN;category\nA/1;Level 1;120;60;B\n',
      status: 422,
      expect: (p) => expect(p).toEqual([{ row: 1, column: null, message: expect.stringMatching(/semicolons/) }]),
    },
    {
      name: 'text in numeric columns',
      body: () => csv('A/1,Level 1,lots,60,B', 'A/2,Level 1,120,12;5,B', 'B/1,Level 1,120,60,B'),
      status: 422,
      expect: (p) =>
        expect(p).toEqual([
          { row: 2, column: 'Gk_kN', message: '"lots" is not a number (use a point for decimals, e.g. 12.5)' },
          { row: 3, column: 'Qk_kN', message: '"12;5" is not a number (use a point for decimals, e.g. 12.5)' },
        ]),
    },
    {
      name: 'an unknown stack',
      body: () => csv('A/1,Level 1,120,60,B', 'Z/9,Level 1,120,60,B'),
      status: 422,
      expect: (p) => expect(p).toEqual([{ row: 3, column: 'stack', message: 'No stack "Z/9" in this building' }]),
    },
    {
      name: 'an unknown level, a level without a restraint, negative load, unknown category, a duplicate',
      body: () =>
        csv(
          'A/1,Level 9,120,60,B',
          'A/1,Ground,120,60,B',
          'A/2,Level 1,-5,60,B',
          'A/2,Level 2,120,60,F',
          'B/1,Level 1,120,60,B',
          'B/1,level 1,130,60,B',
        ),
      status: 422,
      expect: (p) =>
        expect(p).toEqual([
          { row: 2, column: 'level', message: 'No level "Level 9" in this building' },
          { row: 3, column: 'level', message: 'Stack A/1 has no restraint at level Ground' },
          { row: 4, column: 'Gk_kN', message: 'Gk_kN must not be negative' },
          { row: 5, column: 'category', message: expect.stringMatching(/^"F" is not an imposed-load category/) },
          { row: 7, column: 'level', message: 'Row 6 already gives the loads of stack B/1 at level Level 1' },
        ]),
    },
    {
      name: 'a row with too many values',
      body: () => csv('A/1,Level 1,120,60,B,extra'),
      status: 422,
      expect: (p) => expect(p).toEqual([{ row: 2, column: null, message: 'This row has 6 values; the header has 5' }]),
    },
    {
      name: 'several bad rows of different kinds: every one reported in one answer, in file order',
      body: () => csv('A/1,Level 1,120,60,B,extra', 'A/2,Level 1,lots,60,B', 'B/1,Level 1', 'A/1,Level 9,120,60,B'),
      status: 422,
      expect: (p) =>
        expect(p).toEqual([
          { row: 2, column: null, message: 'This row has 6 values; the header has 5' },
          { row: 3, column: 'Gk_kN', message: '"lots" is not a number (use a point for decimals, e.g. 12.5)' },
          { row: 4, column: null, message: 'This row has 2 values; the header has 5' },
          { row: 5, column: 'level', message: 'No level "Level 9" in this building' },
        ]),
    },
    {
      name: 'broken quoting on two rows: both reported',
      body: () => csv('A/1,"Level 1"x,120,60,B', 'A/2,Level 1,120,60,B', 'B/1,"Level 1"y,120,60,B'),
      status: 422,
      expect: (p) =>
        expect(p).toEqual([
          { row: 2, column: null, message: expect.stringMatching(/^The file cannot be read as CSV here/) },
          { row: 4, column: null, message: expect.stringMatching(/^The file cannot be read as CSV here/) },
        ]),
    },
    {
      name: 'an empty file',
      body: () => '',
      status: 422,
      expect: (p) =>
        expect(p).toEqual([{ row: 1, column: null, message: expect.stringMatching(/^The file is empty/) }]),
    },
    {
      name: 'a header and no rows',
      body: () => `${HEADER}\n`,
      status: 422,
      expect: (p) => expect(p).toEqual([{ row: 2, column: null, message: 'The file has a header but no rows' }]),
    },
    {
      name: 'a binary file',
      body: () => new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, ...randomBytes(2000)]),
      status: 422,
      // The first NUL byte follows the signature's two line feeds: line 3.
      expect: (p) => expect(p).toEqual([{ row: 3, column: null, message: expect.stringMatching(/binary data/) }]),
    },
    {
      name: 'text that is not UTF-8',
      body: () =>
        Buffer.concat([Buffer.from(`${HEADER}\nA/1,Level 1,120,60,B\n`), Buffer.from([0x41, 0xff, 0xfe, 0x2c, 0x0a])]),
      status: 422,
      expect: (p) => expect(p).toEqual([{ row: 3, column: null, message: expect.stringMatching(/not UTF-8/) }]),
    },
  ];

  for (const c of cases) {
    it(`${c.name}: preview and apply both refuse it with ${c.status} and row-level problems`, async () => {
      const before = await snapshot(s, buildingId);
      for (const send of [preview, apply]) {
        const r = await send(c.body());
        expect(r.status).toBe(c.status);
        expect(errorCode(r.body)).toBe('unprocessable');
        c.expect(problemsOf(r.body));
      }
      expect(await snapshot(s, buildingId)).toEqual(before);
    });
  }

  it('a 20 MB file is refused with 413 in the error shape and the building unchanged', async () => {
    const before = await snapshot(s, buildingId);
    const row = 'A/1,Level 1,120,60,B\n';
    const big = csv(row.repeat(Math.ceil((20 * 1024 * 1024) / row.length)));
    expect(big.length).toBeGreaterThanOrEqual(20 * 1024 * 1024);
    for (const send of [preview, apply]) {
      const r = await send(big);
      expect(r.status).toBe(413);
      expect(errorCode(r.body)).toBe('payload_too_large');
    }
    expect(await snapshot(s, buildingId)).toEqual(before);
  });

  it('a request without the file field, or with the file under another name, is a 400', async () => {
    const noFile = await s.api('POST', `/buildings/${buildingId}/imports/loads`, { token: engineer.token, body: {} });
    expect(noFile.status).toBe(400);
    const wrongField = await upload(
      s,
      `/buildings/${buildingId}/imports/loads`,
      engineer.token,
      csv('A/1,Level 1,1,1,B'),
      { field: 'upload' },
    );
    expect(wrongField.status).toBe(400);
    expect(errorCode(wrongField.body)).toBe('bad_request');
  });

  it('a viewer may not import (403) and an outsider does not see the building (404)', async () => {
    const before = await snapshot(s, buildingId);
    expect((await preview(csv('A/1,Level 1,1,1,B'), viewer.token)).status).toBe(403);
    expect((await apply(csv('A/1,Level 1,1,1,B'), {}, viewer.token)).status).toBe(403);
    expect((await preview(csv('A/1,Level 1,1,1,B'), outsider.token)).status).toBe(404);
    expect(await snapshot(s, buildingId)).toEqual(before);
  });
});

describe('a good file', () => {
  it('previews exactly the rows that change, with before and after, and stores nothing', async () => {
    const before = await snapshot(s, buildingId);
    const r = await preview(csv('A/1,Level 1,135.5,62.5,B', 'A/1,Level 2,100,50,B', 'B/1,roof,40,15,h'));
    expect(r.status).toBe(200);
    const p = r.body as LoadsPreview;
    expect(p.problems).toEqual([]);
    expect(p.rows).toBe(3);
    expect(p.unchanged).toBe(1);
    expect(p.changes).toEqual([
      {
        row: 2,
        stack: 'A/1',
        stackId: stacks[0]!.id,
        level: 'Level 1',
        restraintId: 'restraint-1',
        before: { Gk: 100, Qk: 50, category: 'B' },
        after: { Gk: 135.5, Qk: 62.5, category: 'B' },
      },
      {
        row: 4,
        stack: 'B/1',
        stackId: stacks[2]!.id,
        level: 'Roof',
        restraintId: 'cap',
        before: { Gk: 100, Qk: 50, category: 'H' },
        after: { Gk: 40, Qk: 15, category: 'H' },
      },
    ]);
    expect(p.basis).toEqual([
      { stackId: stacks[0]!.id, version: before[0]!.version },
      { stackId: stacks[2]!.id, version: before[2]!.version },
    ]);
    expect(await snapshot(s, buildingId)).toEqual(before);
  });

  it('applies exactly the named restraints in one go, and every client in the stack receives stack:changed', async () => {
    const a1 = stacks[0];
    const watchers = await Promise.all([connect(s.url, lead.token), connect(s.url, viewer.token)]);
    open.push(...watchers);
    for (const w of watchers) expect((await request<StackJoinAck>(w, 'stack:join', { stackId: a1!.id })).ok).toBe(true);
    const heard = watchers.map((w) => next(w, 'stack:changed', (c) => c.stackId === a1!.id));

    const file = csv('A/1,Level 1,150,75,C', 'A/1,Level 3,90,30,B', 'A/2,Level 2,100,50,B');
    const before = await snapshot(s, buildingId);
    const p = (await preview(file)).body as LoadsPreview;
    const r = await apply(file, { fileHash: p.fileHash, basis: JSON.stringify(p.basis) });
    expect(r.status).toBe(200);
    const result = r.body as ApplyResult;
    expect(result.applied).toBe(2);
    expect(result.stacks).toEqual([{ stackId: a1!.id, version: before[0]!.version + 1 }]);

    const after = await snapshot(s, buildingId);
    // Only A/1 moved on; in it, only the two named restraints differ, and only in their loads.
    expect(after.slice(1)).toEqual(before.slice(1));
    const changed = after[0]!.doc.nodes.filter((n, i) => !isDeepStrictEqual(n, before[0]!.doc.nodes[i]));
    expect(changed.map((n) => n.id).sort()).toEqual(['restraint-1', 'restraint-3']);
    expect(nodeAt(after[0]!.doc, 3.6)?.data).toMatchObject({
      Gk: 150,
      Qk: 75,
      category: 'C',
      levelId: expect.any(String),
      axes: 'both',
      fixity: 'pinned',
    });
    expect(nodeAt(after[0]!.doc, 10.8)?.data).toMatchObject({ Gk: 90, Qk: 30, category: 'B' });
    expect(after[0]!.doc.edges).toEqual(before[0]!.doc.edges);

    for (const h of heard) {
      const c = await h;
      expect(c.version).toBe(before[0]!.version + 1);
      expect(c.by.userId).toBe(engineer.user.id);
      expect(c.ops).toEqual([
        { op: 'updateNode', id: 'restraint-1', data: { Gk: 150, Qk: 75, category: 'C' } },
        { op: 'updateNode', id: 'restraint-3', data: { Gk: 90, Qk: 30, category: 'B' } },
      ]);
      expect(c.results.errors).toEqual([]);
    }
    // The stored results are those of the new loads (what GET /stacks/:id returns).
    const stored = await getStack(s, engineer.token, a1!.id);
    expect(stored.version).toBe(before[0]!.version + 1);
    expect(stored.results.governingLiftId).not.toBeNull();
  });

  it('refuses (409) to apply a preview when a stack has changed since, and changes nothing', async () => {
    const a2 = stacks[1]!;
    const file = csv('A/2,Level 1,111,55,B');
    const p = (await preview(file)).body as LoadsPreview;
    const detail = await getStack(s, lead.token, a2.id);
    const edit = await s.api('POST', `/stacks/${a2.id}/ops`, {
      token: lead.token,
      body: { baseVersion: detail.version, ops: [{ op: 'updateNode', id: 'lift-1', data: { note: 'checked' } }] },
    });
    expect(edit.status).toBe(200);
    const before = await snapshot(s, buildingId);
    const r = await apply(file, { fileHash: p.fileHash, basis: JSON.stringify(p.basis) });
    expect(r.status).toBe(409);
    expect(errorCode(r.body)).toBe('conflict');
    const other = await apply(csv('A/2,Level 1,112,55,B'), { fileHash: p.fileHash });
    expect(other.status).toBe(409);
    expect(await snapshot(s, buildingId)).toEqual(before);
  });

  it('refuses a malformed basis field with 400', async () => {
    const r = await apply(csv('A/2,Level 1,1,1,B'), { basis: 'not json' });
    expect(r.status).toBe(400);
    expect(errorCode(r.body)).toBe('validation_failed');
  });
});

describe('round trip', () => {
  it('the downloaded template re-imports to the same loads: first with no change, then restoring edited loads', async () => {
    const t = await download(s, `/buildings/${buildingId}/imports/loads/template.csv`, viewer.token);
    expect(t.status).toBe(200);
    expect(t.headers.get('content-type')).toMatch(/^text\/csv/);
    const text = t.bytes.toString('utf8');
    const lines = text.trim().split(/\r?\n/);
    expect(lines[0]).toBe(HEADER);
    // Three stacks × (three floors + the roof cap); the ground level holds the support, not a restraint.
    expect(lines).toHaveLength(1 + 3 * 4);
    expect(lines).toContain('A/1,Level 1,150,75,C');

    const same = (await preview(t.bytes)).body as LoadsPreview;
    expect(same.changes).toEqual([]);
    expect(same.unchanged).toBe(12);

    const original = await snapshot(s, buildingId);
    const edited = await apply(csv('A/1,Level 1,1.25,0.5,A', 'B/1,Level 2,0.1,0.2,E'));
    expect(edited.status).toBe(200);
    expect((edited.body as ApplyResult).applied).toBe(2);

    const restored = await apply(t.bytes);
    expect(restored.status).toBe(200);
    expect((restored.body as ApplyResult).applied).toBe(2);
    const after = await snapshot(s, buildingId);
    after.forEach((st, i) => expect(st.doc).toEqual(original[i]!.doc));
    const again = await download(s, `/buildings/${buildingId}/imports/loads/template.csv`, viewer.token);
    expect(again.bytes.toString('utf8')).toBe(text);
  });
});

describe('formula-looking names', () => {
  it('the template writes a name that a spreadsheet would run as a formula as text, and it still re-imports', async () => {
    const made = await s.api('POST', `/buildings/${buildingId}/stacks`, {
      token: lead.token,
      body: { name: '=C/3', template: { storeys: 1, storeyHeight: 3.6, sections: ['UKC 203x203x46'], Gk: 10, Qk: 5 } },
    });
    expect(made.status).toBe(201);
    const t = await download(s, `/buildings/${buildingId}/imports/loads/template.csv`, viewer.token);
    const lines = t.bytes.toString('utf8').trim().split(/\r?\n/);
    // OWASP "CSV injection": a leading apostrophe makes spreadsheets show the cell as text.
    expect(lines).toContain("'=C/3,Level 1,10,5,H");
    expect(lines.some((l) => l.startsWith('=C/3'))).toBe(false);
    const again = (await preview(t.bytes)).body as LoadsPreview;
    expect(again.problems).toEqual([]);
    expect(again.changes).toEqual([]);
    expect(again.unchanged).toBe(lines.length - 1);
  });
});
