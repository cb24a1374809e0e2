// Loads from floors by area: the build-up sums, the split between the column's faces, line loads on an edge
// line and αA. Hand figures written out beside each check (common practice, no source, unless named).
import { describe, expect, it } from 'vitest';
import { alphaA } from '../../shared/engine/building/alphaA.ts';
import { areaLoads } from '../../shared/engine/building/floorLoad.ts';
import { floorLoadsKey, stackFloorLoads } from '../../shared/engine/building/stackFloorLoads.ts';
import { designAxialForce } from '../../shared/engine/stack/combination.ts';
import type { BuildingModel } from '../../shared/schema/building.ts';
import { OFFICE, ROOF, officeModel } from './building-model-fixtures.ts';

describe('area loads of a build-up', () => {
  it('sums the permanent items and adds movable partitions to the imposed load (EN 1991-1-1 6.3.1.2(8))', () => {
    // gk = 3.5 + 1.2 + 0.5 + 0.3 = 5.5; qk = 2.5 + 1.0 = 3.5 kN/m²
    const a = areaLoads(OFFICE);
    expect(a.gk).toBeCloseTo(5.5, 12);
    expect(a.qk).toBeCloseTo(3.5, 12);
    expect(a.category).toBe('B');
  });
  it('adds partitions the build-up calls permanent to the permanent load', () => {
    const a = areaLoads({ ...OFFICE, partitions: { load: 1.0, as: 'permanent' } });
    expect(a.gk).toBeCloseTo(6.5, 12);
    expect(a.qk).toBeCloseTo(2.5, 12);
  });
  it('a roof build-up carries category H', () => {
    expect(areaLoads(ROOF)).toMatchObject({ gk: 4, qk: 0.6, category: 'H' });
  });
});

describe('what a floor brings into a column', () => {
  it('B/2, floor spanning both ways, web along x: totals from the area and faces from the bays each side', () => {
    const loads = stackFloorLoads(officeModel({ floors: ['L1'] }), { gridX: 'B', gridY: 'y2', webAlong: 'x' }, 7);
    const l1 = loads.get('L1')!;
    // A = 50.625 m²: Gk = 5.5 × 50.625 = 278.4375 kN, Qk = 3.5 × 50.625 = 177.1875 kN
    expect(l1.area).toBeCloseTo(50.625, 12);
    expect(l1.Gk).toBeCloseTo(278.4375, 9);
    expect(l1.Qk).toBeCloseTo(177.1875, 9);
    // Half of each side's floor each way: +x ½·3.75·7.5 = 14.0625, −x ½·3·7.5 = 11.25, ±y ½·3.75·6.75 = 12.65625 m².
    // Web along x puts the flange faces (y) towards ±x.
    expect(l1.faces.yPlus!.Gk).toBeCloseTo(5.5 * 14.0625, 9);
    expect(l1.faces.yMinus!.Gk).toBeCloseTo(5.5 * 11.25, 9);
    expect(l1.faces.zPlus!.Qk).toBeCloseTo(3.5 * 12.65625, 9);
    expect(l1.faces.zMinus!.Qk).toBeCloseTo(3.5 * 12.65625, 9);
    const sum = Object.values(l1.faces).reduce((s, f) => s + f.Gk, 0);
    expect(sum).toBeCloseTo(l1.Gk, 9);
  });

  it('turning the web along y swaps flange and web faces', () => {
    const l1 = stackFloorLoads(officeModel({ floors: ['L1'] }), { gridX: 'B', gridY: 'y2', webAlong: 'y' }, 7).get(
      'L1',
    )!;
    expect(l1.faces.zPlus!.Gk).toBeCloseTo(5.5 * 14.0625, 9);
    expect(l1.faces.yPlus!.Gk).toBeCloseTo(5.5 * 12.65625, 9);
  });

  it('a floor spanning onto beams along x reaches the column only through the flange faces', () => {
    const model = officeModel({ floors: ['L1'] });
    model.floors[0].span = 'x';
    const l1 = stackFloorLoads(model, { gridX: 'B', gridY: 'y2', webAlong: 'x' }, 7).get('L1')!;
    // +x: 3.75 × 7.5 = 28.125 m², −x: 3 × 7.5 = 22.5 m²
    expect(l1.faces.yPlus!.Gk).toBeCloseTo(5.5 * 28.125, 9);
    expect(l1.faces.yMinus!.Gk).toBeCloseTo(5.5 * 22.5, 9);
    expect(l1.faces.zPlus).toBeUndefined();
  });

  it('cladding of 8 kN/m on edge line D: D/2 takes 8 × (3.75 + 3.75) = 60 kN on its web faces, B/2 none', () => {
    const model = officeModel({ floors: ['L1'] }, [{ gridLineId: 'D', label: 'Cladding', gk: 8, qk: 0 }]);
    const d2 = stackFloorLoads(model, { gridX: 'D', gridY: 'y2', webAlong: 'x' }, 1).get('L1')!;
    // Area 39.375 m²: 5.5 × 39.375 = 216.5625 + 60 = 276.5625 kN
    expect(d2.Gk).toBeCloseTo(276.5625, 9);
    expect(d2.lineGk).toBeCloseTo(60, 12);
    // The cladding beam runs along D (plan y): 30 kN on each of the ±y sides, the web faces z here.
    const areaZPlus = 0.5 * 3.75 * 5.25;
    expect(d2.faces.zPlus!.Gk).toBeCloseTo(5.5 * areaZPlus + 30, 9);
    const b2 = stackFloorLoads(model, { gridX: 'B', gridY: 'y2', webAlong: 'x' }, 2).get('L1')!;
    expect(b2.lineGk).toBe(0);
  });

  it('an override for a void scales the area and each face alike, and carries its reason', () => {
    const model = officeModel({ floors: ['L1', 'L2'] });
    model.overrides['7'] = [{ levelId: 'L2', factor: 0.5, reason: 'Stair void' }];
    const loads = stackFloorLoads(model, { gridX: 'B', gridY: 'y2', webAlong: 'x' }, 7);
    // L2: 0.5 × 50.625 = 25.3125 m² → Gk = 5.5 × 25.3125 = 139.21875 kN; L1 untouched
    expect(loads.get('L2')!.Gk).toBeCloseTo(139.21875, 9);
    expect(loads.get('L2')!.faces.yPlus!.Gk).toBeCloseTo(5.5 * 14.0625 * 0.5, 9);
    expect(loads.get('L2')!.overrideReason).toBe('Stair void');
    expect(loads.get('L1')!.Gk).toBeCloseTo(278.4375, 9);
  });

  it('a stack off the grid gets nothing', () => {
    expect(stackFloorLoads(officeModel({ floors: ['L1'] }), { gridX: null, gridY: null, webAlong: 'x' }, 1).size).toBe(
      0,
    );
  });
});

describe('αA, the reduction for the area carried (EN 1991-1-1 6.3.1.2(10))', () => {
  it('EN eq. 6.1: αA = 5/7·0.7 + 10/A, at most 1.0, at least 0.6 for C and D', () => {
    expect(alphaA(50, 'EN', 'B')).toBeCloseTo(0.5 + 0.2, 12); // 5/7 × 0.7 = 0.5
    expect(alphaA(20, 'EN', 'B')).toBe(1);
    expect(alphaA(1000, 'EN', 'C')).toBe(0.6);
  });
  it('UK NA eq. NA.1 (from memory): αA = 1 − A/1000, at least 0.75', () => {
    expect(alphaA(100, 'UK', 'B')).toBeCloseTo(0.9, 12);
    expect(alphaA(400, 'UK', 'B')).toBe(0.75);
  });
  it('a column takes αA instead of αn where it is smaller, never both (UK NA, from memory)', () => {
    const UK = { combination: '6.10ab', annex: 'UK', imposedReduction: true } as const;
    // One storey of B, Qk 100 on 200 m², Gk 100: αn(1) = 1.0, αA = 1 − 0.2 = 0.8.
    // 6.10a = 135 + 1.5·0.7·100 = 240; 6.10b = 0.925·135 + 1.5·0.8·100 = 124.875 + 120 = 244.875 → governs
    const f = designAxialForce({ sumGk: 100, sumQk: { B: 100 }, loadedLevels: { B: 1 }, loadedArea: { B: 200 } }, UK);
    expect(f.NEd).toBeCloseTo(244.875, 9);
    expect(f.combination).toBe('6.10b, leading B (αA)');
    // Three storeys on 150 m²: αn = 0.8 < αA = 0.85, so αn: 124.875 + 1.5·0.8·100 = 244.875, labelled plainly
    const g = designAxialForce({ sumGk: 100, sumQk: { B: 100 }, loadedLevels: { B: 3 }, loadedArea: { B: 150 } }, UK);
    expect(g.combination).toBe('6.10b, leading B');
    // The EN annex gives columns αn alone (EN 1991-1-1 6.2.2(2)): 0.85·135 + 1.5·1.0·100 = 264.75 with ξ 0.85
    const h = designAxialForce(
      { sumGk: 100, sumQk: { B: 100 }, loadedLevels: { B: 1 }, loadedArea: { B: 200 } },
      { ...UK, annex: 'EN' },
    );
    expect(h.NEd).toBeCloseTo(264.75, 9);
  });
});

describe("the key of a place's floor loads", () => {
  // Invented: a regular 6 × 5 grid at 7.5 m (0.25 m of slab beyond every edge line), cladding on x line x0 on
  // the lower floor, an area set by hand for stack 7 on the upper floor. A building-wide re-analysis takes two
  // places with one key as one column (docs/building-model.md), so the key must never join different loads.
  const line = (p: string, i: number) => ({ id: `${p}${i}`, name: `${p}${i}`, position: i * 7.5 });
  const model: BuildingModel = {
    grid: {
      x: { lines: Array.from({ length: 6 }, (_, i) => line('x', i)), edgeBefore: 0.25, edgeAfter: 0.25 },
      y: { lines: Array.from({ length: 5 }, (_, i) => line('y', i)), edgeBefore: 0.25, edgeAfter: 0.25 },
    },
    buildups: [OFFICE, ROOF],
    floors: [
      {
        levelId: 'f1',
        buildupId: 'office',
        span: 'two-way',
        lines: [{ gridLineId: 'x0', label: 'Cladding', gk: 8, qk: 0 }],
      },
      { levelId: 'f2', buildupId: 'roof', span: 'x', lines: [] },
    ],
    overrides: { '7': [{ levelId: 'f2', factor: 0.5, reason: 'Void' }] },
  };
  const places = Array.from({ length: 6 * 5 * 2 }, (_, i) => ({
    stackId: i,
    placement: {
      gridX: `x${i % 6}`,
      gridY: `y${Math.floor(i / 6) % 5}`,
      webAlong: i < 30 ? ('x' as const) : ('y' as const),
    },
  }));

  it('is the same only where the loads are the same, and joins the interior columns', () => {
    const loads = places.map((p) => [...stackFloorLoads(model, p.placement, p.stackId)]);
    const keys = places.map((p) => floorLoadsKey(model, p.placement, p.stackId));
    for (let a = 0; a < places.length; a++)
      for (let b = a + 1; b < places.length; b++) if (keys[a] === keys[b]) expect(loads[a]).toEqual(loads[b]);
    // Not vacuous: the 12 interior places of each web direction share one key, the void's column has its own.
    const interior = (p: (typeof places)[number]) => !/x0|x5|y0|y4/.test(`${p.placement.gridX}${p.placement.gridY}`);
    expect(
      new Set(
        places
          .filter((p) => interior(p) && p.stackId !== 7 && p.placement.webAlong === 'x')
          .map((p) => keys[p.stackId]),
      ).size,
    ).toBe(1);
    expect(keys[7]).not.toBe(keys[8]);
    expect(loads[7]).not.toEqual(loads[8]);
    // The cladding line: a column on x0 differs from its mirror on x5, which carries none.
    expect(keys[6]).not.toBe(keys[11]);
    expect(loads[6]).not.toEqual(loads[11]);
    expect(floorLoadsKey(model, { gridX: null, gridY: null, webAlong: 'x' }, 1)).toBe('off the grid');
  });
});
