import { describe, expect, it } from 'vitest';
import { inspectStack } from '../../shared/engine/stack/inspectStack.ts';
import {
  axialStateAt,
  selfWeightPerMetre,
  takeDownRows,
  type ColumnWeight,
} from '../../shared/engine/stack/takeDown.ts';
import { buildStack } from './stack-builder.ts';

// Invented stack: base +0.000, floors at +4.000 and +8.000 (Gk 100, Qk 50 category B each), cap at +12.000
// (Gk 60, Qk 20 roof H), one lift weighing 0.5 kN/m.
const doc = buildStack({
  lifts: [{ top: 12 }],
  floors: [
    { elevation: 4, Gk: 100, Qk: 50, category: 'B' },
    { elevation: 8, Gk: 100, Qk: 50, category: 'B' },
  ],
  cap: { Gk: 60, Qk: 20, category: 'H' },
});
const weights: ColumnWeight[] = [{ bottom: 0, top: 12, perMetre: 0.5 }];
const UK = { combination: '6.10ab', annex: 'UK', imposedReduction: true } as const;

function entriesOf(document = doc) {
  const { model, errors } = inspectStack(document);
  expect(errors).toEqual([]);
  return model!.entries;
}

describe('take-down', () => {
  it('converts mass to self-weight with g = 9.81 N/kg', () => {
    // docs/analysis-rules.md §Take-down: 73.1 kg/m × 9.81 / 1000 = 0.717111 kN/m
    expect(selfWeightPerMetre(73.1)).toBeCloseTo(0.717111, 9);
  });

  it('lists the load points top to bottom with the loads that enter there', () => {
    const rows = takeDownRows(entriesOf(), weights, UK);
    expect(rows.map((r) => [r.nodeId, r.elevation, r.Gk, r.Qk, r.category])).toEqual([
      ['c', 12, 60, 20, 'H'],
      ['r2', 8, 100, 50, 'B'],
      ['r1', 4, 100, 50, 'B'],
    ]);
  });

  it('works down the stack by EN 1990 6.10a/b with the UK factors, counting storeys per category', () => {
    const rows = takeDownRows(entriesOf(), weights, UK);
    // Below the cap: G = 60, H = 20 (1 level). 6.10a = 81 + 1.5·0.7·20 = 102;
    //   6.10b lead H = 0.925·81 + 1.5·20 = 74.925 + 30 = 104.925 → governs (EN 1990 Table A1.2(B), UK NA ξ, ψ0,H 0.7)
    expect(rows[0]).toMatchObject({ sumGk: 60, NEd: expect.closeTo(104.925, 9), combination: '6.10b, leading H' });
    // Below +8.000: G = 60 + 100 + 0.5·4 = 162; B = 50 (n = 1, αn 1.0); H = 20.
    //   6.10a = 218.7 + 52.5 + 21 = 292.2; 6.10b lead B = 202.2975 + 75 + 21 = 298.2975 → governs
    expect(rows[1]).toMatchObject({ sumGk: 162, sumQkByCategory: { B: 50, H: 20 }, NEd: expect.closeTo(298.2975, 9) });
    // Below +4.000: G = 60 + 200 + 0.5·8 = 264; B = 100 on 2 levels, αn = 1.1 − 2/10 = 0.9 (UK NA); H = 20.
    //   6.10a = 356.4 + 105 + 21 = 482.4; 6.10b lead B = 329.67 + 1.5·0.9·100 + 21 = 485.67 → governs
    expect(rows[2]).toMatchObject({ sumGk: 264, NEd: expect.closeTo(485.67, 9), combination: '6.10b, leading B' });
  });

  it('works down the stack by EN 1990 6.10 with the EN factors', () => {
    const rows = takeDownRows(entriesOf(), weights, { combination: '6.10', annex: 'EN', imposedReduction: true });
    // Below +4.000, EN 1990 eq. 6.10 with ψ0,H = 0 (Table A1.1) and αn,EN(2) = 1 (EN 1991-1-1 eq. 6.2):
    //   lead B = 1.35·264 + 1.5·100 + 0 = 356.4 + 150 = 506.4; lead H = 356.4 + 30 + 105 = 491.4
    expect(rows[2].NEd).toBeCloseTo(506.4, 9);
  });

  it('adds the self-weight of the column above a section, and the loads at a point only to the column below it', () => {
    const entries = entriesOf();
    // Just above +4.000 the floor load there is not yet in the column: G = 60 + 100 + 0.5·8 = 164
    expect(axialStateAt(entries, weights, 4, false)).toMatchObject({
      sumGk: 164,
      sumQk: { B: 50, H: 20 },
      loadedLevels: { B: 1, H: 1 },
    });
    // At the base: G = 260 + 0.5·12 = 266
    expect(axialStateAt(entries, weights, 0, false).sumGk).toBeCloseTo(266, 12);
  });

  it('adds a load node to the restraint it is attached to, keeping its own category', () => {
    const withPlant = buildStack({
      lifts: [{ top: 12 }],
      floors: [
        { elevation: 4, Gk: 100, Qk: 50, category: 'B' },
        { elevation: 8, Gk: 100, Qk: 50, category: 'B' },
      ],
      cap: { Gk: 60, Qk: 20, category: 'H' },
      loads: [{ on: 'r2', label: 'Plant', Gk: 15, Qk: 30, category: 'E' }],
    });
    const rows = takeDownRows(entriesOf(withPlant), [], UK);
    expect(rows[1]).toMatchObject({
      nodeId: 'r2',
      Gk: 115,
      Qk: 80,
      category: 'B+E',
      sumQkByCategory: { B: 50, E: 30, H: 20 },
    });
  });

  it('counts as loaded only the levels that carry imposed load of that category', () => {
    // A floor with Qk = 0 does not count toward n (EN 1991-1-1 6.3.1.2(11): storeys loaded by the category)
    const partlyLoaded = buildStack({
      lifts: [{ top: 12 }],
      floors: [
        { elevation: 4, Gk: 10, Qk: 0, category: 'A' },
        { elevation: 8, Gk: 10, Qk: 5, category: 'A' },
      ],
    });
    expect(axialStateAt(entriesOf(partlyLoaded), [], 0, false).loadedLevels).toEqual({ A: 1 });
  });

  it('takes a restraint elevation from its level when the building has that level', () => {
    const atLevel = buildStack({ lifts: [{ top: 12 }], floors: [{ elevation: 4, levelId: 'lv1', Gk: 10 }] });
    const { model } = inspectStack(atLevel, { levels: { lv1: 4.25 } });
    expect(model!.entries.find((e) => e.nodeId === 'r1')!.elevation).toBe(4.25);
  });

  it('never lets the design force drop going down when one more loaded storey lowers αn', () => {
    // UK National Annex steps: αn = 0.6 for 10 storeys, 0.5 for 11. Eleven floors of 10 kN category A, no
    // permanent load, eq. 6.10: below 10 floors 1.5·0.6·100 = 90; below 11 floors 1.5·0.5·110 = 82.5, less
    // than the force above, so 90 is kept (common practice, no source).
    const floors = Array.from({ length: 11 }, (_, i) => ({ elevation: i + 1, Qk: 10, category: 'A' as const }));
    const tall = buildStack({ lifts: [{ top: 12 }], floors });
    const rows = takeDownRows(entriesOf(tall), [], { combination: '6.10', annex: 'UK', imposedReduction: true });
    expect(rows.at(-2)).toMatchObject({ nodeId: 'r2', NEd: expect.closeTo(90, 9), combination: '6.10, leading A' });
    expect(rows.at(-1)).toMatchObject({
      nodeId: 'r1',
      NEd: expect.closeTo(90, 9),
      combination: '6.10, leading A, held at the force above',
    });
  });

  it('lowers the force below a floor when imposed load is added to an unloaded floor, because αn counts loaded storeys', () => {
    // EN 1991-1-1 6.3.1.2(11) with the UK National Annex steps, eq. 6.10, category A, no permanent load.
    // Floors at +4.000 (100 kN) and +12.000 (100 kN); +8.000 unloaded: below +4.000, n = 2:
    //   1.5·0.9·200 = 270. With 1 kN at +8.000, n = 3: 1.5·0.8·201 = 241.2 (the floors above give at most 150)
    const floors = (middle: number) => [
      { elevation: 4, Qk: 100 },
      { elevation: 8, Qk: middle },
      { elevation: 12, Qk: 100 },
    ];
    const opts = { combination: '6.10', annex: 'UK', imposedReduction: true } as const;
    const bottom = (middle: number) =>
      takeDownRows(entriesOf(buildStack({ lifts: [{ top: 16 }], floors: floors(middle) })), [], opts).at(-1)!.NEd;
    expect(bottom(0)).toBeCloseTo(270, 9);
    expect(bottom(1)).toBeCloseTo(241.2, 9);
  });
});
