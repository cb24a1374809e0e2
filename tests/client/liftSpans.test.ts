import { describe, expect, it } from 'vitest';
import { templateLiftSpans } from '@/components/building/liftSpans.ts';

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
});
