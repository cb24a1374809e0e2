// The grid and the floor loads as CSV: out as they stand, in with a preview naming every problem by row,
// applied only when clean; a grid re-imported keeps its line ids, so stacks stay on their crossings.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Level, StackSummary } from '../../shared/schema/api.ts';
import type { BuildingModelReply } from '../../shared/schema/building.ts';
import type {
  FloorLoadsPreview as FloorLoadsPreviewBody,
  GridPreview as GridPreviewBody,
} from '../../shared/schema/imports.ts';
import { download, upload } from '../fixtures/uploads.ts';
import { startWithLeadAndBuilding, type TestServer } from './helpers.ts';

describe('grid and floor loads as CSV', () => {
  let s: TestServer;
  let token: string;
  let buildingId: number;
  let levels: Level[];

  beforeAll(async () => {
    ({ s, token, buildingId } = await startWithLeadAndBuilding('CSV'));
    levels = [];
    for (const [name, elevation] of [
      ['Ground', 0],
      ['First', 4],
      ['Roof', 8],
    ] as const) {
      levels.push(
        (await s.api('POST', `/buildings/${buildingId}/levels`, { token, body: { name, elevation } })).body as Level,
      );
    }
    const buildups = [
      { id: 'office', name: 'Office', permanent: [{ label: 'Slab', gk: 5 }], imposed: { qk: 2.5, category: 'B' } },
      { id: 'roof', name: 'Roof', permanent: [{ label: 'Roof', gk: 4 }], imposed: { qk: 0.6, category: 'H' } },
    ];
    await s.api('PUT', `/buildings/${buildingId}/buildups`, { token, body: { buildups } });
  });
  afterAll(async () => {
    await s?.close();
  });

  const gridFile = (rows: string[]) => ['direction,name,position_m', ...rows].join('\r\n');
  const model = async () =>
    (await s.api('GET', `/buildings/${buildingId}/model`, { token })).body as BuildingModelReply;

  it('lists every problem of a grid file by row and changes nothing', async () => {
    const r = await upload(
      s,
      `/buildings/${buildingId}/imports/grid`,
      token,
      gridFile(['x,A,0', 'z,B,6', 'x,A,7', 'y,1,abc', 'y,2,0', 'y,3,0.0004']),
    );
    expect(r.status).toBe(422);
    const problems = (r.body as { error: { details: GridPreviewBody } }).error.details.problems;
    expect(problems.map((p) => [p.row, p.column])).toEqual([
      [3, 'direction'],
      [4, 'name'],
      [5, 'position_m'],
      [7, 'position_m'],
    ]);
    const apply = await upload(s, `/buildings/${buildingId}/imports/grid/apply`, token, gridFile(['x,A,0', 'z,B,6']));
    expect(apply.status).toBe(422);
    expect((await model()).version).toBe(1);
  });

  it('previews a clean grid, applies it, and gives it back as CSV', async () => {
    const file = gridFile(['x,A,0', 'x,B,6', 'x,C,13.5', 'y,1,0', 'y,2,7.5']);
    const preview = await upload(s, `/buildings/${buildingId}/imports/grid`, token, file);
    expect(preview.status).toBe(200);
    const body = preview.body as GridPreviewBody;
    expect(body.rows.map((r) => r.change)).toEqual(['new', 'new', 'new', 'new', 'new']);
    const applied = await upload(s, `/buildings/${buildingId}/imports/grid/apply`, token, file, {
      fields: { fileHash: body.fileHash },
    });
    expect(applied.status).toBe(200);
    expect((await model()).grid.x.lines.map((l) => [l.name, l.position])).toEqual([
      ['A', 0],
      ['B', 6],
      ['C', 13.5],
    ]);
    const out = await download(s, `/buildings/${buildingId}/grid.csv`, token);
    expect(out.bytes.toString('utf8').trim().split('\r\n')).toEqual([
      'direction,name,position_m',
      'x,A,0',
      'x,B,6',
      'x,C,13.5',
      'y,1,0',
      'y,2,7.5',
    ]);
  });

  it('keeps the ids of lines it finds by name, so a placed stack stays where it stands', async () => {
    const stack = (
      await s.api('POST', `/buildings/${buildingId}/stacks`, {
        token,
        body: { name: 'S', template: { elevations: [0, 4, 8], sections: ['UKC 203x203x46'] } },
      })
    ).body as StackSummary;
    const b = (await model()).grid.x.lines.find((l) => l.name === 'B')!;
    expect(
      (
        await s.api('PUT', `/stacks/${stack.id}/placement`, {
          token,
          body: { gridX: b.id, gridY: (await model()).grid.y.lines[1].id },
        })
      ).status,
    ).toBe(200);
    const file = gridFile(['x,A,0', 'x,b,6.5', 'x,C,13.5', 'y,1,0', 'y,2,7.5']);
    const preview = (await upload(s, `/buildings/${buildingId}/imports/grid`, token, file)).body as GridPreviewBody;
    expect(preview.rows[1]).toMatchObject({ name: 'b', change: 'moved' });
    expect((await upload(s, `/buildings/${buildingId}/imports/grid/apply`, token, file)).status).toBe(200);
    expect((await model()).grid.x.lines.find((l) => l.id === b.id)?.position).toBe(6.5);
  });

  it('sets floor loads by level and build-up name, with problems by row', async () => {
    const bad = await upload(
      s,
      `/buildings/${buildingId}/imports/floor-loads`,
      token,
      'level,buildup,span\r\nFirst,Offices,two-way\r\nAttic,Office,x\r\nRoof,Roof,diagonal\r\n',
    );
    expect(bad.status).toBe(422);
    expect(
      (bad.body as { error: { details: FloorLoadsPreviewBody } }).error.details.problems.map((p) => [p.row, p.column]),
    ).toEqual([
      [2, 'buildup'],
      [3, 'level'],
      [4, 'span'],
    ]);
    const file = 'level,buildup,span\r\nfirst,office,two-way\r\nRoof,Roof,\r\nGround,,\r\n';
    const preview = await upload(s, `/buildings/${buildingId}/imports/floor-loads`, token, file);
    expect(preview.status).toBe(200);
    expect((preview.body as FloorLoadsPreviewBody).rows.map((r) => [r.level, r.buildup, r.change])).toEqual([
      ['First', 'Office', 'changed'],
      ['Roof', 'Roof', 'changed'],
      ['Ground', null, 'same'],
    ]);
    const applied = await upload(s, `/buildings/${buildingId}/imports/floor-loads/apply`, token, file);
    expect(applied.body).toEqual({ applied: 2 });
    const floors = (await model()).floors;
    expect(floors.map((f) => [f.levelId, f.buildupId])).toEqual([
      [levels[1].id, 'office'],
      [levels[2].id, 'roof'],
    ]);
    const out = await download(s, `/buildings/${buildingId}/floor-loads.csv`, token);
    expect(out.bytes.toString('utf8').trim().split('\r\n')).toEqual([
      'level,buildup,span',
      'Ground,,',
      'First,Office,two-way',
      'Roof,Roof,two-way',
    ]);
  });
});
