import { describe, expect, it } from 'vitest';
import { liftSpans, templateLiftSpans } from '@/components/building/liftSpans.ts';

describe('template lift spans', () => {
  it('splices every n storeys and lets the top lift take the storeys left over', () => {
    // 5 storeys of 3.6 m spliced every 2: lifts over storeys 1–2, 3–4 and 5 (arithmetic, no source needed).
    expect(templateLiftSpans(5, 3.6, 2, 0).map((s) => [s.index, s.bottom, Number(s.top.toFixed(3))])).toEqual([
      [1, 0, 7.2],
      [2, 7.2, 14.4],
      [3, 14.4, 18],
    ]);
  });

  it('starts from the base elevation', () => {
    expect(templateLiftSpans(2, 4, 2, -1.5)).toEqual([{ index: 1, bottom: -1.5, top: 6.5 }]);
  });

  it('gives no lifts for input a template cannot use', () => {
    expect(templateLiftSpans(Number.NaN, 3.6, 2, 0)).toEqual([]);
    expect(templateLiftSpans(4, 0, 2, 0)).toEqual([]);
  });

  it('gives no lifts for a splice spacing that is not a whole number of storeys', () => {
    expect(templateLiftSpans(4, 3.6, 1.5, 0)).toEqual([]);
    expect(templateLiftSpans(4.5, 3.6, 2, 0)).toEqual([]);
  });
});

describe('lift spans over given floors', () => {
  it('names the level at each end of a lift and keeps their own elevations', () => {
    // Invented levels 4.5 m, 3.5 m and 4.2 m apart, spliced every 2 storeys.
    const floors = [
      { name: 'Ground', elevation: 0 },
      { name: 'Level 1', elevation: 4.5 },
      { name: 'Level 2', elevation: 8 },
      { name: 'Roof', elevation: 12.2 },
    ];
    expect(liftSpans(floors, 2)).toEqual([
      { index: 1, bottom: 0, top: 8, bottomName: 'Ground', topName: 'Level 2' },
      { index: 2, bottom: 8, top: 12.2, bottomName: 'Level 2', topName: 'Roof' },
    ]);
  });

  it('gives no lifts for fewer than two floors', () => {
    expect(liftSpans([{ name: 'Ground', elevation: 0 }], 2)).toEqual([]);
  });
});
