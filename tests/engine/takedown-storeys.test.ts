// The take-down reports, per level, the number of loaded storeys n and the αn applied to the leading
// imposed action, so the screen and the package can show how NEd was reached (EN 1991-1-1 6.3.1.2(11)).
import { describe, expect, it } from 'vitest';
import { analyseStack } from '../../shared/engine/stack/analyseStack.ts';
import { buildStack } from './stack-builder.ts';

// Invented stack: four floors of category B at +4, +8, +12, +16 (Gk 100, Qk 50 each), roof cap at +20 (H).
const doc = buildStack({
  lifts: [{ top: 20 }],
  floors: [4, 8, 12, 16].map((elevation) => ({ elevation, Gk: 100, Qk: 50, category: 'B' as const })),
  cap: { Gk: 60, Qk: 20, category: 'H' },
});

describe('take-down: storeys and αn per level', () => {
  it('UK National Annex: αn = 1.1 − n/10 for the leading category B, n counted per level', () => {
    const rows = analyseStack(doc, { annex: 'UK', combination: '6.10', imposedReduction: true }).takeDown;
    // UK NA to EN 1991-1-1, NA.2.6 eq. NA.2: n = 1 → 1.0, n = 2 → 0.9, n = 3 → 0.8
    // Below +8.000: B = 150 on 3 storeys. Lead B: 1.5·0.8·150 + 1.5·0.7·20 = 180 + 21 = 201;
    //   lead H: 1.5·20 + 1.5·0.7·150 = 30 + 157.5 = 187.5 → B leads, n = 3, αn = 0.8.
    // Below +4.000: B = 200 on 4 storeys, αn = 0.7. Lead B: 1.5·0.7·200 + 21 = 231; lead H: 30 + 1.5·0.7·200 = 240
    //   → the roof load leads (EN 1990 eq. 6.10, UK NA ψ0,H = 0.7) and is not reduced: n = 1 (one roof), αn = 1.
    expect(rows.map((r) => [r.elevation, r.n])).toEqual([
      [20, 1],
      [16, 1],
      [12, 2],
      [8, 3],
      [4, 1],
    ]);
    expect(rows[4]).toMatchObject({ combination: '6.10, leading H', alphaN: 1 });
    expect(rows[3]).toMatchObject({ combination: '6.10, leading B', alphaN: expect.closeTo(0.8, 12) });
    expect(rows[2].alphaN).toBeCloseTo(0.9, 12);
    // Below the roof the leading action is the roof load (category H): no reduction (6.3.1.2(11) is for A–D)
    expect(rows[0]).toMatchObject({ combination: '6.10, leading H', n: 1, alphaN: 1 });
  });

  it('EN 1991-1-1 eq. 6.2: αn = (2 + (n − 2)ψ0)/n with ψ0 = 0.7 for category B', () => {
    const rows = analyseStack(doc, { annex: 'EN', combination: '6.10', imposedReduction: true }).takeDown;
    // n = 4: (2 + 2·0.7)/4 = 0.85; n = 3: (2 + 0.7)/3 = 0.9; n ≤ 2: 1 (EN 1991-1-1 eq. 6.2, Table A1.1 ψ0 = 0.7)
    expect(rows[4]).toMatchObject({ n: 4, alphaN: expect.closeTo(0.85, 12) });
    expect(rows[3]).toMatchObject({ n: 3, alphaN: expect.closeTo(0.9, 12) });
    expect(rows[2]).toMatchObject({ n: 2, alphaN: 1 });
  });

  it('reports αn = 1 when the reduction is switched off, with n still counted', () => {
    const rows = analyseStack(doc, { annex: 'UK', combination: '6.10', imposedReduction: false }).takeDown;
    expect(rows[4]).toMatchObject({ n: 4, alphaN: 1 });
  });
});
