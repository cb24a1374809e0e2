import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_OPTIONS } from '../../shared/schema/results.ts';
import { floorMoments, type ColumnLength, type MomentFloor } from '../../shared/engine/simple/floorMoments.ts';
import { netDesignReaction, reactionFactors } from '../../shared/engine/simple/netDesignReaction.ts';
import { pieceMoments } from '../../shared/engine/simple/pieceMoments.ts';
import { reactionEccentricity } from '../../shared/engine/simple/reactionEccentricity.ts';
import { shareMoment } from '../../shared/engine/simple/shareMoment.ts';
import { faceWarnings } from '../../shared/engine/simple/faceWarnings.ts';
import { UKC_254_73 } from './stack-builder.ts';

// The rules checked here are those of the issue and the simplified method for columns in simple
// construction (reaction 100 mm from the face; moment shared by EI/L, equally when the ratio ≤ 1.5; not
// carried to the next floor): common practice for simple construction (SCI P358/P360 method), from memory.
// Every expected value is worked by hand in the comment beside it.

describe('reactionEccentricity: reaction 100 mm from the face', () => {
  it('puts flange reactions at h/2 + 100 and web reactions at tw/2 + 100 for an I section', () => {
    // UKC 254x254x73 (BS 4-1, from memory): h = 254.1, tw = 8.6 → ey = 127.05 + 100, ez = 4.3 + 100
    const e = reactionEccentricity(UKC_254_73);
    expect(e.y).toBeCloseTo(227.05, 6);
    expect(e.z).toBeCloseTo(104.3, 6);
  });

  it('puts a hollow section’s side-wall reactions at b/2 + 100, and a tube’s at d/2 + 100', () => {
    expect(reactionEccentricity({ shape: 'RHS', make: 'hot-finished', h: 300, b: 200, t: 10 })).toEqual({
      y: 250,
      z: 200,
    });
    expect(reactionEccentricity({ shape: 'CHS', make: 'hot-finished', d: 219.1, t: 8 })).toEqual({
      y: 209.55,
      z: 209.55,
    });
  });
});

describe('netDesignReaction: worst pattern of imposed load across two opposite faces', () => {
  it('with eq. 6.10 takes γG on both faces and γQ·Qk on one face only', () => {
    // EN 1990 eq. 6.10, γG 1.35, γQ 1.5: faces (Gk 60, Qk 40) and (Gk 50, Qk 30):
    // plus loaded: 1.35·10 + 1.5·40 = 73.5; minus loaded: |13.5 − 45| = 31.5 → 73.5
    const factors = reactionFactors({ combination: '6.10', annex: 'UK' }, 'A');
    const r = netDesignReaction({ Gk: 60, Qk: 40 }, { Gk: 50, Qk: 30 }, factors);
    expect(r.value).toBeCloseTo(73.5, 9);
    expect(r.loadedFace).toBe('plus');
  });

  it('loads the lighter face when its imposed load outweighs the permanent imbalance', () => {
    // eq. 6.10: (Gk 55, Qk 0) against (Gk 50, Qk 40): plus loaded 6.75; minus loaded |6.75 − 60| = 53.25
    const factors = reactionFactors({ combination: '6.10', annex: 'UK' }, 'A');
    const r = netDesignReaction({ Gk: 55, Qk: 0 }, { Gk: 50, Qk: 40 }, factors);
    expect(r.value).toBeCloseTo(53.25, 9);
    expect(r.loadedFace).toBe('minus');
  });

  it('with eq. 6.10a/6.10b under the UK annex takes the larger of the two expressions', () => {
    // EN 1990 eq. 6.10a: 1.35·60 + 0.7·1.5·40 = 81 + 42 = 123; eq. 6.10b with ξ = 0.925 (UK NA):
    // 0.925·1.35·60 + 1.5·40 = 74.925 + 60 = 134.925 → 134.925 from 6.10b
    const factors = reactionFactors({ combination: '6.10ab', annex: 'UK' }, 'A');
    const r = netDesignReaction({ Gk: 60, Qk: 40 }, undefined, factors);
    expect(r.value).toBeCloseTo(134.925, 9);
    expect(r.expression).toBe('EN 1990 eq. 6.10b');
  });

  it('is zero for balanced permanent load with no imposed load', () => {
    const factors = reactionFactors({ combination: '6.10', annex: 'EN' }, 'B');
    expect(netDesignReaction({ Gk: 40, Qk: 0 }, { Gk: 40, Qk: 0 }, factors).value).toBe(0);
  });
});

describe('shareMoment: by stiffness EI/L, equally when the ratio is 1.5 or less', () => {
  it('shares equally at a ratio of exactly 1.5', () => {
    // k above 3, below 2: ratio 1.5 ≤ 1.5 → 20 / 2 each
    expect(shareMoment(20, 3, 2)).toEqual({ above: 10, below: 10, rule: 'equal' });
  });

  it('shares in proportion to EI/L above a ratio of 1.5', () => {
    // k above 1, below 2 (ratio 2): above 30·1/3 = 10, below 30·2/3 = 20
    const s = shareMoment(30, 1, 2);
    expect(s.rule).toBe('stiffness');
    expect(s.above).toBeCloseTo(10, 12);
    expect(s.below).toBeCloseTo(20, 12);
  });

  it('gives the whole moment to the only column length there is', () => {
    expect(shareMoment(12, 0, 5)).toEqual({ above: 0, below: 12, rule: 'one side' });
  });
});

describe('floorMoments and pieceMoments on a column by hand', () => {
  // Hand-worked: UKC 254x254x73 through two storeys, floors at +4.0 (faces) and +7.0, cap +10.0.
  // Floor +4.0: y+ (Gk 60, Qk 40), no y−, eq. 6.10: Ry = 1.35·60 + 1.5·40 = 141 kN; My = 141·0.22705 = 32.014 kN·m.
  // Lengths: below 4.0 m, above 3.0 m, same section: I/L ratio = (1/3)/(1/4) = 1.333 ≤ 1.5 → 16.007 each.
  const lifts: ColumnLength[] = [{ bottom: 0, top: 10, dims: UKC_254_73, Iy: 1.14e8, Iz: 3.91e7 }];
  const floors: MomentFloor[] = [
    { nodeId: 'r1', elevation: 4, category: 'A', faces: { yPlus: { Gk: 60, Qk: 40 } } },
    { nodeId: 'r2', elevation: 7, category: 'A', loaded: true },
  ];
  const options = { ...DEFAULT_ANALYSIS_OPTIONS, combination: '6.10' as const };
  const moments = floorMoments(floors, lifts, 0, 10, options, '6.10');

  it('finds the net moment at the floor and shares it equally when EI/L differ by 1.5 or less', () => {
    expect(moments).toHaveLength(1);
    const m = moments[0];
    expect(m.lengthBelow).toBeCloseTo(4, 9);
    expect(m.lengthAbove).toBeCloseTo(3, 9);
    expect(m.y.M).toBeCloseTo(32.014, 3);
    expect(m.y.share.rule).toBe('equal');
    expect(m.y.share.above).toBeCloseTo(16.007, 3);
    expect(m.z.M).toBe(0);
  });

  it('shares by EI/L when a heavier section sits above the floor', () => {
    // Above: Iy = 2.22e8 over 3.0 m → 7.4e7; below: 1.14e8 over 4.0 m → 2.85e7; ratio 2.6 > 1.5:
    // above 32.014·7.4/10.25 = 23.112, below 32.014·2.85/10.25 = 8.901
    const two: ColumnLength[] = [
      { bottom: 0, top: 4, dims: UKC_254_73, Iy: 1.14e8, Iz: 3.91e7 },
      { bottom: 4, top: 10, dims: UKC_254_73, Iy: 2.22e8, Iz: 7.3e7 },
    ];
    const [m] = floorMoments(floors, two, 0, 10, options, '6.10');
    expect(m.y.share.rule).toBe('stiffness');
    expect(m.y.share.above).toBeCloseTo(23.112, 2);
    expect(m.y.share.below).toBeCloseTo(8.901, 2);
  });

  it('applies a floor’s moment to the lengths either side of it and to no other', () => {
    const elevations = floors.map((f) => f.elevation);
    expect(pieceMoments(0, 4, elevations, moments).My).toBeCloseTo(16.007, 3);
    // A piece cut at a splice inside the storey still belongs to the length that ends at the floor
    expect(pieceMoments(4, 5.2, elevations, moments).My).toBeCloseTo(16.007, 3);
    expect(pieceMoments(5.2, 7, elevations, moments).My).toBeCloseTo(16.007, 3);
    // Above the next floor: not carried down (or up) the stack
    expect(pieceMoments(7, 10, elevations, moments).My).toBe(0);
  });
});

describe('faceWarnings', () => {
  it('warns when the face reactions add up to more than the load the floor brings in', () => {
    const issues = faceWarnings([
      { nodeId: 'r1', elevation: 4, Gk: 100, Qk: 50, faces: { yPlus: { Gk: 60, Qk: 30 }, zMinus: { Gk: 50, Qk: 10 } } },
    ]);
    expect(issues).toHaveLength(1);
    expect(issues[0].nodeId).toBe('r1');
    expect(issues[0].message).toContain('+4.000');
  });

  it('is silent when the faces are a part of the floor load', () => {
    expect(
      faceWarnings([{ nodeId: 'r1', elevation: 4, Gk: 100, Qk: 50, faces: { yPlus: { Gk: 60, Qk: 30 } } }]),
    ).toEqual([]);
  });
});
