// The column schedule (docs/column-schedule.md): rows per lift named by the building's levels, the tonnage checked
// against a sum worked here from the section dimensions, and the downloads (CSV, XLSX, DXF read back by a
// general-purpose DXF reader).
import ExcelJS from 'exceljs';
import { parse } from 'csv-parse/sync';
import DxfParser from 'dxf-parser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthResponse, StackSummary } from '../../shared/schema/api.ts';
import type { ColumnSchedule } from '../../shared/schedule/columnSchedule.ts';
import { download, getStack, seedBuilding } from '../fixtures/uploads.ts';
import { addMember, createBuilding, registerUser, startTestServer, type TestServer } from './helpers.ts';

let s: TestServer;
let lead: AuthResponse;
let viewer: AuthResponse;
let buildingId: number;
let stacks: StackSummary[];

/**
 * Rolled I-section dimensions (mm) as the product tables give them, from memory: BS 4-1 for the UKC, EURONORM 53 for
 * HE 200 B; with the nominal mass (kg/m) the tables print.
 */
const TABLE: Record<string, { h: number; b: number; tw: number; tf: number; r: number; nominal: number }> = {
  'UKC 254x254x89': { h: 260.3, b: 256.3, tw: 10.3, tf: 17.3, r: 12.7, nominal: 88.9 },
  'UKC 203x203x46': { h: 203.2, b: 203.6, tw: 7.2, tf: 11.0, r: 10.2, nominal: 46.1 },
  'HE 200 B': { h: 200, b: 200, tw: 9, tf: 15, r: 18, nominal: 61.3 },
};

/** Area of a rolled I: two flanges, the web between them and the four root fillets (each r² − πr²/4). */
const iArea = (d: { h: number; b: number; tw: number; tf: number; r: number }) =>
  2 * d.b * d.tf + (d.h - 2 * d.tf) * d.tw + (4 - Math.PI) * d.r ** 2;
// EN 1991-1-1 Table A.4: steel 77.0–78.5 kN/m³; 7850 kg/m³ is the density the tables' masses rest on.
const kgPerMetre = (designation: string) => iArea(TABLE[designation]!) * 1e-6 * 7850;

beforeAll(async () => {
  s = await startTestServer();
  lead = await registerUser(s, 'lead');
  viewer = await registerUser(s, 'viewer');
  buildingId = (await createBuilding(s, lead.token, 'Schedule block')).id;
  await addMember(s, lead.token, buildingId, viewer.user.email, 'viewer');
  ({ stacks } = await seedBuilding(s, lead.token, buildingId, ['A/10', 'A/2']));
  const other = await s.api('POST', `/buildings/${buildingId}/stacks`, {
    token: lead.token,
    body: {
      name: 'C/1',
      template: { storeys: 4, storeyHeight: 3.6, spliceEvery: 4, sections: ['HE 200 B'], Gk: 60, Qk: 30 },
    },
  });
  expect(other.status).toBe(201);
  stacks.push(other.body as StackSummary);
  // A stack without lifts cannot be scheduled and is named as left out.
  expect(
    (await s.api('POST', `/buildings/${buildingId}/stacks`, { token: lead.token, body: { name: 'B/1' } })).status,
  ).toBe(201);
});

afterAll(async () => {
  await s?.close();
});

async function schedule(): Promise<ColumnSchedule> {
  const r = await s.api('GET', `/buildings/${buildingId}/schedule`, { token: viewer.token });
  expect(r.status).toBe(200);
  return r.body as ColumnSchedule;
}

describe('the column schedule', () => {
  it('lists every lift in grid order with its levels, section, grade, splices, base and utilisation', async () => {
    const sch = await schedule();
    expect([...new Set(sch.rows.map((r) => r.stack))]).toEqual(['A/2', 'A/10', 'C/1']);
    expect(sch.gaps.map((g) => g.stack)).toEqual(['B/1']);
    const a2 = sch.rows.filter((r) => r.stack === 'A/2');
    expect(a2.map((r) => r.lift)).toEqual(['L1', 'L2']);
    // The template splices 0.5 m above every second floor (tests/fixtures/uploads.ts): at +7.700 m.
    expect(a2[0]).toMatchObject({
      fromLevel: 'Ground',
      toLevel: 'Level 2 + 0.500 m',
      section: 'UKC 254x254x89',
      grade: 'S355',
      bottomJoint: 'base',
    });
    expect(a2[1]).toMatchObject({
      fromLevel: 'Level 2 + 0.500 m',
      section: 'UKC 203x203x46',
      bottomJoint: 'splice',
      baseFixity: '',
    });
    expect(a2[0]!.splices).toBe('Level 2 + 0.500 m');
    const stored = await getStack(s, viewer.token, stacks.find((x) => x.name === 'A/2')!.id);
    const support = stored.doc.nodes.find((n) => n.kind === 'support');
    expect(a2[0]!.baseFixity).toBe(support?.kind === 'support' ? support.data.fixity : 'missing');
    expect(a2.map((r) => r.utilisation)).toEqual(stored.results.lifts.map((l) => l.utilisation));
    expect(sch.rows.find((r) => r.stack === 'C/1')).toMatchObject({ series: 'HE B', splices: 'none' });
    // A/2 and A/10 come from the same template: one type; C/1 differs in every lift.
    expect(sch.types).toEqual([
      { type: 'T1', stacks: ['A/2', 'A/10'] },
      { type: 'T2', stacks: ['C/1'] },
    ]);
    expect(new Set(sch.rows.filter((r) => r.stack.startsWith('A/')).map((r) => r.type))).toEqual(new Set(['T1']));
  });

  it('tonnage equals Σ mass per metre × lift length worked from the section dimensions', async () => {
    const sch = await schedule();
    let independent = 0;
    let nominal = 0;
    let liftCount = 0;
    for (const summary of stacks) {
      const detail = await getStack(s, viewer.token, summary.id);
      for (const lift of detail.results.lifts) {
        const node = detail.doc.nodes.find((n) => n.id === lift.liftId);
        if (node?.kind !== 'lift' || typeof node.data.section !== 'string')
          throw new Error('lift without a catalogue section');
        const designation = lift.section;
        independent += kgPerMetre(designation) * (lift.top - lift.bottom);
        nominal += TABLE[designation]!.nominal * (lift.top - lift.bottom);
        liftCount += 1;
      }
      // The lifts run from the base to the top without gaps: their lengths add up to the column's height.
      const lifts = detail.results.lifts;
      const height = Math.max(...lifts.map((l) => l.top)) - Math.min(...lifts.map((l) => l.bottom));
      expect(lifts.reduce((sum, l) => sum + l.top - l.bottom, 0)).toBeCloseTo(height, 9);
    }
    expect(sch.rows).toHaveLength(liftCount);
    expect(sch.tonnage.total).toBeCloseTo(independent, 6);
    // The tables' nominal masses differ from A·ρ by the rounding of the printed figures only (< 2 %).
    expect(Math.abs(sch.tonnage.total - nominal) / nominal).toBeLessThan(0.02);
    // Worked for A/2 alone: UKC 254x254x89 over 7.7 m, UKC 203x203x46 above it to the top.
    const a2 = sch.rows.filter((r) => r.stack === 'A/2');
    expect(a2[0]!.mass).toBeCloseTo(kgPerMetre('UKC 254x254x89') * 7.7, 6);
    // Level bands and series × grade each split the same total.
    expect(sch.tonnage.byLevel.map((l) => l.level)).toEqual(['Ground', 'Level 1', 'Level 2', 'Level 3', 'Roof']);
    expect(sch.tonnage.byLevel.reduce((sum, l) => sum + l.mass, 0)).toBeCloseTo(independent, 6);
    expect(sch.tonnage.bySeriesGrade.reduce((sum, g) => sum + g.mass, 0)).toBeCloseTo(independent, 6);
    // Ground to Level 1 (3.6 m) holds UKC 254x254x89 in A/2 and A/10 and HE 200 B in C/1.
    const ground = 2 * 3.6 * kgPerMetre('UKC 254x254x89') + 3.6 * kgPerMetre('HE 200 B');
    expect(sch.tonnage.byLevel[0]!.mass).toBeCloseTo(ground, 6);
    expect(sch.tonnage.bySeriesGrade.map((g) => `${g.series} ${g.grade}`)).toEqual(['HE B S355', 'UKC S355']);
  });

  it('downloads as CSV and XLSX with the rows, the tonnage and the safety note', async () => {
    const sch = await schedule();
    const csv = await download(s, `/buildings/${buildingId}/schedule.csv`, viewer.token);
    expect(csv.status).toBe(200);
    expect(csv.headers.get('content-disposition')).toBe('attachment; filename=Schedule_block-column-schedule.csv');
    const [table, tonnage] = csv.bytes.toString('utf8').split('\r\n\r\n');
    const rows = parse(table!, { columns: true }) as Record<string, string>[];
    expect(rows.map((r) => `${r.stack} ${r.lift} ${r.section}`)).toEqual(
      sch.rows.map((r) => `${r.stack} ${r.lift} ${r.section}`),
    );
    const total = (parse(tonnage!, { columns: true }) as Record<string, string>[]).find((r) => r.tonnage === 'Total');
    expect(Number(total?.tonnes)).toBeCloseTo(sch.tonnage.total / 1000, 3);
    expect(csv.bytes.toString('utf8')).toContain('Not scheduled: B/1');

    const xlsx = await download(s, `/buildings/${buildingId}/schedule.xlsx`, viewer.token);
    expect(xlsx.status).toBe(200);
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(xlsx.bytes as unknown as ArrayBuffer);
    const sheet = book.getWorksheet('Column schedule')!;
    expect(sheet.rowCount).toBe(sch.rows.length + 1);
    expect(String(sheet.getRow(2).getCell(9).value)).toBe(sch.rows[0]!.section);
    expect(book.getWorksheet('Tonnage')!.getRow(2).getCell(2).value).toBeCloseTo(sch.tonnage.total / 1000, 3);
  });

  it('downloads as a DXF table that a DXF reader opens, one line of texts per schedule row', async () => {
    const sch = await schedule();
    const r = await download(s, `/buildings/${buildingId}/schedule.dxf`, viewer.token);
    expect(r.status).toBe(200);
    const dxf = new DxfParser().parseSync(r.bytes.toString('utf8'));
    expect(dxf).not.toBeNull();
    const texts = dxf!.entities.filter((e) => e.type === 'TEXT') as unknown as {
      text: string;
      startPoint: { x: number; y: number };
    }[];
    const byLine = new Map<number, string[]>();
    for (const t of texts) byLine.set(t.startPoint.y, [...(byLine.get(t.startPoint.y) ?? []), t.text]);
    const lines = [...byLine.entries()].sort((a, b) => b[0] - a[0]).map(([, cells]) => cells);
    const header = lines.findIndex((cells) => cells.includes('Section') && cells.includes('Stack'));
    expect(header).toBeGreaterThanOrEqual(0);
    for (const [i, row] of sch.rows.entries()) {
      expect(lines[header + 1 + i]).toEqual(
        expect.arrayContaining([
          row.stack,
          row.lift,
          row.section,
          row.grade,
          row.fromLevel,
          row.utilisation.toFixed(2),
        ]),
      );
    }
    expect(texts.map((t) => t.text)).toContain(`Total: ${(sch.tonnage.total / 1000).toFixed(3)} t`);
    expect(dxf!.entities.filter((e) => e.type === 'LINE').length).toBeGreaterThan(sch.rows.length);
  });
});
