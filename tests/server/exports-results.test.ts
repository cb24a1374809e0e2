// Results out (docs/contracts.md §Imports): per stack and per building as CSV and XLSX, units in the headers, figures
// from the stored results, checked against EN 1990 by hand and a handbook resistance.
import ExcelJS from 'exceljs';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, StackSummary } from '../../shared/schema/api.ts';
import { download, getStack, seedBuilding } from '../fixtures/uploads.ts';
import { addMember, createBuilding, registerUser, startTestServer, type TestServer } from './helpers.ts';
import { typicalColumnBuilding } from './typicalColumnFixture.ts';
import { stackResultRows } from '../../server/services/exportsResults.ts';
import { loadStackRow, parseResults } from '../../server/services/stackRows.ts';

let s: TestServer;
let lead: AuthResponse;
let viewer: AuthResponse;
let buildingId: number;
let stacks: StackSummary[];

const HEADER =
  'stack,version,lift,bottom_m,top_m,section,grade,section_class,NEd_kN,Lcr_y_m,Lcr_z_m,Nc_Rd_kN,Nb_y_Rd_kN,Nb_z_Rd_kN,utilisation,governing_check,status,governing_lift,note,tension_kN,resistance_kN';
const readCsv = (bytes: Buffer): Record<string, string>[] => parse(bytes.toString('utf8'), { columns: true });
/** Splice and base rows follow the lifts of each stack (docs/splices-and-bases.md). */
const isConnection = (row: Record<string, string>): boolean =>
  row.governing_check === 'splice tension' || row.governing_check === 'base plate';

beforeAll(async () => {
  s = await startTestServer();
  lead = await registerUser(s, 'lead');
  viewer = await registerUser(s, 'viewer');
  buildingId = (await createBuilding(s, lead.token, 'Export block')).id;
  await addMember(s, lead.token, buildingId, viewer.user.email, 'viewer');
  // No self-weight, so the design force is the floor loads alone and can be worked by hand.
  const patched = await s.api('PATCH', `/buildings/${buildingId}`, {
    token: lead.token,
    body: { options: { combination: '6.10ab', annex: 'UK', imposedReduction: true, selfWeight: false } },
  });
  expect(patched.status).toBe(200);
  ({ stacks } = await seedBuilding(s, lead.token, buildingId, ['A/10', 'A/2']));
  // A stack with errors still appears, with its message.
  const broken = await s.api('POST', `/buildings/${buildingId}/stacks`, { token: lead.token, body: { name: 'B/1' } });
  expect(broken.status).toBe(201);
});

afterAll(async () => {
  await s?.close();
});

describe('results as CSV', () => {
  it('a stack downloads one row per lift with units in the headers and the figures of its stored results', async () => {
    const r = await download(s, `/stacks/${stacks[0]!.id}/results.csv`, viewer.token);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(r.headers.get('content-disposition')).toBe('attachment; filename=A_10-results.csv');
    expect(r.bytes.toString('utf8').split('\r\n')[0]).toBe(HEADER);
    const rows = readCsv(r.bytes).filter((x) => !isConnection(x));
    const stored = await getStack(s, viewer.token, stacks[0]!.id);
    expect(rows.map((x) => x.lift)).toEqual(stored.results.lifts.map((l) => l.label));
    expect(rows.map((x) => x.lift)).toEqual(['L1', 'L2']);
    expect(rows.map((x) => Number(x.utilisation))).toEqual(
      stored.results.lifts.map((l) => Number(l.utilisation.toFixed(3))),
    );
    expect(rows.filter((x) => x.governing_lift === 'yes').map((x) => x.lift)).toEqual(
      stored.results.lifts.filter((l) => l.liftId === stored.results.governingLiftId).map((l) => l.label),
    );

    const bottom = rows[0]!;
    expect(bottom).toMatchObject({
      stack: 'A/10',
      bottom_m: '0',
      top_m: '7.7',
      section: 'UKC 254x254x89',
      grade: 'S355',
      status: 'passes',
    });
    // EN 1990 eq. 6.10a/6.10b with Table A1.2(B) and UK NA values (γG 1.35, γQ 1.5, ξ 0.925, ψ0 0.7 for B
    // and H) and EN 1991-1-1 6.3.1.2(11) UK NA αn = 1.1 − n/10 for the leading category B (n = 3):
    // four levels of Gk 100, Qk 50 (three floors B, the roof H).
    const sixTenA = 1.35 * 400 + 1.5 * 0.7 * 150 + 1.5 * 0.7 * 50;
    const sixTenB = 0.925 * 1.35 * 400 + 1.5 * (1.1 - 3 / 10) * 150 + 1.5 * 0.7 * 50;
    expect(Number(bottom.NEd_kN)).toBeCloseTo(Math.max(sixTenA, sixTenB), 2);
    expect(Number(bottom.NEd_kN)).toBeCloseTo(750, 2);
    // SCI P363 (steel building design: design data): UKC 254x254x89 in S355, Npl,Rd ≈ 3900 kN
    // (A = 113 cm², fy = 345 N/mm² for tf 17.3 mm), from memory; within 1%.
    expect(Math.abs(Number(bottom.Nc_Rd_kN) - 3900) / 3900).toBeLessThan(0.01);
    // Pinned base, restraint at +3.600: k = 1.0 (docs/analysis-rules.md §Buckling-length factors), Lcr = 3.6 m about
    // both axes.
    expect(Number(bottom.Lcr_y_m)).toBe(3.6);
    expect(Number(bottom.Lcr_z_m)).toBe(3.6);
    // Utilisation is the largest of NEd over the three resistances (docs/analysis-rules.md §Pieces), to the rounding
    // of the file.
    const u =
      Number(bottom.NEd_kN) / Math.min(Number(bottom.Nc_Rd_kN), Number(bottom.Nb_y_Rd_kN), Number(bottom.Nb_z_Rd_kN));
    expect(Number(bottom.utilisation)).toBeCloseTo(u, 3);
  });

  it('a stack downloads its splices and base after its lifts, as not given until detailed', async () => {
    const r = await download(s, `/stacks/${stacks[0]!.id}/results.csv`, viewer.token);
    const rows = readCsv(r.bytes).filter(isConnection);
    const stored = await getStack(s, viewer.token, stacks[0]!.id);
    expect(rows).toHaveLength((stored.results.splices ?? []).length + (stored.results.base ? 1 : 0));
    expect(rows.map((x) => x.governing_check)).toEqual([
      'base plate',
      ...(stored.results.splices ?? []).map(() => 'splice tension'),
    ]);
    for (const x of rows) expect(x).toMatchObject({ stack: 'A/10', status: 'not given', resistance_kN: '' });
    // The base carries the design force at the bottom of the column, as the lowest lift's row
    const bottomLift = readCsv(r.bytes).find((x) => x.lift === 'L1');
    expect(Number(rows[0]!.NEd_kN)).toBeCloseTo(Number(bottomLift!.NEd_kN), 1);
  });

  it('a building downloads every stack in grid order, a stack with errors as one row with its message', async () => {
    const r = await download(s, `/buildings/${buildingId}/results.csv`, viewer.token);
    expect(r.status).toBe(200);
    const rows = readCsv(r.bytes);
    const names = [...new Set(rows.map((x) => x.stack))];
    expect(names).toEqual(['A/2', 'A/10', 'B/1']);
    const broken = rows.filter((x) => x.stack === 'B/1');
    expect(broken).toHaveLength(1);
    expect(broken[0]).toMatchObject({ status: 'errors', lift: '' });
    expect(broken[0]!.note).not.toBe('');
  });
});

describe('a typical column (docs/typical-columns.md)', () => {
  let typicalId: number;
  let singleId: number;
  let typicalBuildingId: number;

  beforeAll(async () => {
    typicalBuildingId = (await createBuilding(s, lead.token, 'Typical block')).id;
    await addMember(s, lead.token, typicalBuildingId, viewer.user.email, 'viewer');
    const { stacks: made } = await typicalColumnBuilding(s, lead.token, typicalBuildingId, ['S1', 'S2']);
    [typicalId, singleId] = made.map((x) => x.id) as [number, number];
    const place = (id: number, gridX: string, gridY: string) =>
      s.api('PUT', `/stacks/${id}/placement`, { token: lead.token, body: { gridX, gridY } });
    expect((await place(typicalId, 'A', 'y1')).status).toBe(200);
    expect((await place(singleId, 'C', 'y1')).status).toBe(200);
    const added = await s.api('POST', `/stacks/${typicalId}/positions`, {
      token: lead.token,
      body: { gridX: 'B', gridY: 'y2' },
    });
    expect(added.status).toBe(201);
  });

  it('lists one set of rows per position, own place first, each named in the position column', async () => {
    const r = await download(s, `/stacks/${typicalId}/results.csv`, viewer.token);
    expect(r.status).toBe(200);
    expect(r.bytes.toString('utf8').split('\r\n')[0]).toBe(HEADER.replace('stack,', 'stack,position,'));
    const rows = readCsv(r.bytes);
    expect([...new Set(rows.map((x) => x.position))]).toEqual(['A/1 (own place)', 'B/2']);
    const stored = await getStack(s, viewer.token, typicalId);
    const [own, b2] = stored.results.positions!;

    // The own place: its full rows as a stack at one place has them, splices and base included.
    const ownRows = rows.filter((x) => x.position === 'A/1 (own place)');
    expect(ownRows.filter((x) => !isConnection(x)).map((x) => [x.lift, Number(x.utilisation)])).toEqual(
      own!.lifts.map((l) => [l.label, Number(l.utilisation.toFixed(3))]),
    );
    expect(ownRows.filter(isConnection).length).toBeGreaterThan(0);
    expect(ownRows.every((x) => x.Nc_Rd_kN !== '' || isConnection(x))).toBe(true);

    // B/2: per lift the utilisation, governing check and NEd its check holds, the design's section and grade.
    const atB2 = rows.filter((x) => x.position === 'B/2');
    expect(atB2.map((x) => [x.lift, Number(x.utilisation), Number(x.NEd_kN), x.governing_check])).toEqual(
      b2!.lifts.map((l) => [l.label, Number(l.utilisation.toFixed(3)), Number(l.NEd.toFixed(2)), l.governing]),
    );
    expect(atB2.map((x) => x.section)).toEqual(stored.results.lifts.map((l) => l.section));
    expect(atB2.filter((x) => x.governing_lift === 'yes').map((x) => x.lift)).toEqual([b2!.governingLiftLabel]);
    // B/2 carries the larger tributary area (25.3125 m² a level against 11.25 m² at A/1) and governs the type.
    expect(stored.results.governingPosition).toBe('B/2');
    expect(rows.filter((x) => x.note.includes('governs the type')).map((x) => [x.position, x.lift])).toEqual([
      ['B/2', b2!.governingLiftLabel],
    ]);
    expect(Number(atB2.find((x) => x.governing_lift === 'yes')!.utilisation)).toBe(Number(b2!.utilisation!.toFixed(3)));
  });

  it('lists a position the design cannot be checked at as one row with its errors', async () => {
    const row = await loadStackRow(s.ctx.db, typicalId);
    const results = parseResults(row);
    const [own, b2] = results.positions!;
    const broken = { ...b2!, utilisation: null, status: 'errors' as const, errors: ['No lift above the position'] };
    const rows = stackResultRows({
      ...row,
      results: JSON.stringify({ ...results, positions: [own, broken] }),
      results_packed: null,
    });
    expect(rows.filter((x) => x.position === 'B/2')).toEqual([
      { stack: 'A/1', version: row.version, position: 'B/2', status: 'errors', note: 'No lift above the position' },
    ]);
  });

  it('keeps the columns of a stack at one place, and names positions in the building download and workbook', async () => {
    const single = await download(s, `/stacks/${singleId}/results.csv`, viewer.token);
    expect(single.bytes.toString('utf8').split('\r\n')[0]).toBe(HEADER);
    const [x, c] = await Promise.all([
      download(s, `/buildings/${typicalBuildingId}/results.xlsx`, viewer.token),
      download(s, `/buildings/${typicalBuildingId}/results.csv`, viewer.token),
    ]);
    const rows = readCsv(c.bytes);
    // A stack on the grid is named after its own place.
    expect([...new Set(rows.map((r) => `${r.stack} ${r.position}`))]).toEqual([
      'A/1 A/1 (own place)',
      'A/1 B/2',
      'C/1 ',
    ]);
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(x.bytes as unknown as ArrayBuffer);
    const header = (book.worksheets[0]!.getRow(1).values as unknown[]).slice(1);
    expect(header.slice(0, 3)).toEqual(['stack', 'position', 'version']);
    expect(book.worksheets[0]!.rowCount).toBe(1 + rows.length);
  });
});

describe('results as XLSX', () => {
  it('the workbook has the same header and rows as the CSV and a notes sheet with the safety note', async () => {
    const [x, c] = await Promise.all([
      download(s, `/buildings/${buildingId}/results.xlsx`, viewer.token),
      download(s, `/buildings/${buildingId}/results.csv`, viewer.token),
    ]);
    expect(x.status).toBe(200);
    expect(x.headers.get('content-type')).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(x.bytes as unknown as ArrayBuffer);
    const [results, notes] = book.worksheets;
    const header = (results!.getRow(1).values as unknown[]).slice(1);
    expect(header.join(',')).toBe(HEADER);
    const csvRows = readCsv(c.bytes);
    expect(results!.rowCount).toBe(1 + csvRows.length);
    const second = (results!.getRow(2).values as unknown[]).slice(1);
    expect(second[0]).toBe(csvRows[0]!.stack);
    expect(second[14]).toBe(Number(csvRows[0]!.utilisation));
    expect(String(notes!.getCell('A1').value)).toMatch(/checked by a competent engineer/);
  });

  it('an unknown stack is a 404 in the error shape', async () => {
    const r = await s.api('GET', '/stacks/999999/results.xlsx', { token: lead.token });
    expect(r.status).toBe(404);
  });
});
