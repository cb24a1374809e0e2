// Nominal moments shared by storeys, roof beams on the cap, and the combined check one combination at a
// time. Every expected figure is worked by hand below from the EN formulas and the section properties
// of the SCI P363 tables (from memory): UKC 254x254x73 A 93.1 cm², Iy 11 400 cm⁴, Iz 3 910 cm⁴,
// Wpl,y 992 cm³, h 254.1 mm, 73.1 kg/m; UKC 152x152x23 Iy 1 250 cm⁴, Iz 400 cm⁴, Wel,y 164 cm³;
// UKC 203x203x46 A 58.7 cm², Iy 4 570 cm⁴, Iz 1 550 cm⁴, Wpl,y 497 cm³, h 203.2 mm, 46.1 kg/m. The engine
// computes the properties from the dimensions, so the checks allow 1 %.
// The rules (common practice for simple construction, the method of the design guides, from memory):
// reactions 100 mm from the face; the floor's moment is shared by the stiffnesses EI/L of the storeys
// above and below (equally when within 1.5 of each other) and not carried to the next floor; a storey
// runs from floor to floor, a splice or a lateral-only tie inside it does not end it, and a storey of
// several sections has L/EI = Σ Lᵢ/EIᵢ (members in series, elastic theory). The combined check is
// NEd/Nb,min,Rd + My,Ed/Mb,Rd + 1.5·Mz,Ed/Mz,Rd ≤ 1 (NCCI SN048b, from memory), λ̄LT = 0.9·λ̄z, χLT by
// EN 1993-1-1 6.3.2.3 (λ̄LT,0 0.4, β 0.75, curve b). Loads are invented. EN 1990 eq. 6.10a/6.10b with the
// UK National Annex: γG 1.35, ξ 0.925, γQ 1.5, ψ0 0.7 (A and, UK NA, roofs H).
import { describe, expect, it } from 'vitest';
import { floorMoments, storeyLevels } from '../../shared/engine/simple/floorMoments.ts';
import { analyseStack } from '../../shared/engine/stack/analyseStack.ts';
import { DEFAULT_ANALYSIS_OPTIONS, type PieceCheck } from '../../shared/schema/results.ts';
import { capDataSchema, type RestraintFaces, type StackDocument } from '../../shared/schema/stack.ts';
import { buildStack, withNode } from './stack-builder.ts';

const within = (actual: number | undefined, expected: number, tolerance = 0.01) => {
  expect(actual).toBeDefined();
  expect(Math.abs((actual as number) / expected - 1)).toBeLessThanOrEqual(tolerance);
};
const facesOn = (doc: StackDocument, id: string, faces: RestraintFaces): StackDocument =>
  withNode(doc, id, (n) =>
    n.kind === 'restraint' || n.kind === 'cap' ? ({ ...n, data: { ...n.data, faces } } as typeof n) : n,
  );
const pieceAt = (pieces: readonly PieceCheck[], from: number): PieceCheck =>
  pieces.find((p) => Math.abs(p.from - from) < 1e-9)!;

describe('a splice just above the floor: the storey above is mostly the light upper section', () => {
  // Support +0.000 pinned; floor +4.000 (Gk 250, Qk 180, category A) carried by one beam on the y+ flange
  // (one-sided); splice +4.500; roof cap +8.000 (Gk 60, Qk 20, H). L1 UKC 254x254x73 from 0 to 4.5 m,
  // L2 UKC 152x152x23 from 4.5 to 8.0 m, S355.
  // Reaction, eq. 6.10b: 0.925·1.35·250 + 1.5·180 = 312.19 + 270 = 582.19 kN (6.10a: 337.5 + 189 = 526.5);
  // e = 254.1/2 + 100 = 227.05 mm; M = 582.19 × 0.22705 = 132.19 kN·m.
  // Storey below: 0 to 4 m of UKC 254: I/L = 11 400/4 = 2 850 cm⁴/m.
  // Storey above, 4 to 8 m, in series: L/I = 0.5/11 400 + 3.5/1 250 = 0.0000439 + 0.0028 = 0.0028439
  //   → I/L = 351.6 cm⁴/m. Ratio 2 850/351.6 = 8.1 > 1.5: by stiffness,
  //   below 132.19 × 2 850/3 201.6 = 117.67 kN·m, above 132.19 × 351.6/3 201.6 = 14.52 kN·m.
  // (The engine shared it by the 0.5 m stub's section over the storey, 2 850 against 2 850: equal, 66.09.)
  // NEd at the base, eq. 6.10b, leading A (n = 1, αn = 1.0): self-weight 73.1·9.81·4.5 + 23.0·9.81·3.5 =
  //   3.227 + 0.790 kN; 0.925·1.35·(60 + 250 + 4.017) + 1.5·180 + 0.7·1.5·20 = 392.12 + 270 + 21 = 683.1 kN.
  // L1 piece 0–4 m, Lcr 4 m: λ̄z = √(9 310·355/(π²·210 000·3 910e4/4 000²)) = 0.8078, curve c: χz = 0.6573,
  //   Nb,z,Rd = 2 172.3 kN; λ̄LT = 0.727, ΦLT = 0.7538, χLT = 0.8560, Mb,Rd = 0.8560·992e3·355 = 301.43 kN·m.
  //   683.1/2 172.3 + 117.67/301.43 = 0.3145 + 0.3904 = 0.705 (6.10b; 6.10a gives 0.645).
  //   With the equal share it was 0.3145 + 66.09/301.43 = 0.534: the issue's "about 0.71 where the engine
  //   showed 0.53" is borne out for this layout.
  const doc = facesOn(
    buildStack({
      lifts: [
        { top: 4.5, section: 'UKC 254x254x73' },
        { top: 8, section: 'UKC 152x152x23' },
      ],
      floors: [{ elevation: 4, Gk: 250, Qk: 180 }],
      cap: { Gk: 60, Qk: 20, category: 'H' },
    }),
    'r1',
    { yPlus: { Gk: 250, Qk: 180 } },
  );
  const result = analyseStack(doc);

  it('shares the floor moment by the series stiffness of the whole storey above', () => {
    expect(result.errors).toEqual([]);
    const low = pieceAt(result.lifts[0].pieces, 0);
    within(low.combined?.MyEd, 117.67e6);
    within(low.NEd, 683.1);
    within(low.combined?.utilisation, 0.705);
    expect(low.combined?.combination).toBe('6.10b');
    within(result.lifts[0].utilisation, 0.705);
    expect(result.lifts[0].governing).toBe('combined');
  });

  it('gives both lifts of the storey above the same end moment, the smaller share', () => {
    // The 0.5 m stub of L1 and all of L2 lie in the storey +4.000 to +8.000: 14.52 kN·m each.
    within(pieceAt(result.lifts[0].pieces, 4).combined?.MyEd, 14.52e6);
    within(pieceAt(result.lifts[1].pieces, 4.5).combined?.MyEd, 14.52e6);
  });

  it('states the storeys, their stiffness and the moment applied to the lift in the working', () => {
    const steps = pieceAt(result.lifts[0].pieces, 0).combined!.steps;
    const above = steps.find((s) => s.symbol === '(I/L)y,above');
    within(above?.value as number, 351.6);
    expect(above?.description).toContain('in series');
    within(steps.find((s) => s.symbol === '(I/L)y,below')?.value as number, 2850);
    const applied = steps.find((s) => s.symbol === 'My,lift');
    within(applied?.value as number, 117.67e6);
    expect(applied?.description).toContain('+0.000 to +4.000');
    expect(steps[0]).toMatchObject({ symbol: 'combination', value: 'eq. 6.10b', clause: 'EN 1990 6.4.3.2' });
  });
});

describe('a lateral-only tie inside the storey does not end it', () => {
  // As above but UKC 254x254x73 throughout, and a tie at +6.000 (both axes, no load, no faces).
  // Storeys: 0–4 m and 4–8 m (the tie is not a floor): 2 850 against 2 850 → equal, 66.09 kN·m each side.
  // Taking the tie as the end of the length above (4–6 m: 11 400/2 = 5 700) gave the storey below
  // 132.19 × 2 850/8 550 = 44.06 kN·m: a third less than 66.09 (33 % understated).
  // NEd at the base, 6.10b: self-weight 73.1·9.81·8 = 5.737 kN; 0.925·1.35·315.74 + 270 + 21 = 685.3 kN.
  //   685.3/2 172.3 + 66.09/301.43 = 0.3155 + 0.2193 = 0.535 (with 44.06: 0.462).
  const doc = facesOn(
    buildStack({
      lifts: [{ top: 8, section: 'UKC 254x254x73' }],
      floors: [
        { elevation: 4, Gk: 250, Qk: 180 },
        { elevation: 6, id: 'tie' },
      ],
      cap: { Gk: 60, Qk: 20, category: 'H' },
    }),
    'r1',
    { yPlus: { Gk: 250, Qk: 180 } },
  );

  it('runs the storeys from floor to floor past the tie', () => {
    const floors = [
      { nodeId: 'r1', elevation: 4, category: 'A' as const, loaded: true },
      { nodeId: 'tie', elevation: 6, category: 'A' as const },
    ];
    expect(storeyLevels(floors, 0, 8)).toEqual([0, 4, 8]);
  });

  it('shares the floor moment equally and checks the storey below for half of it', () => {
    const result = analyseStack(doc);
    expect(result.errors).toEqual([]);
    const low = pieceAt(result.lifts[0].pieces, 0);
    within(low.combined?.MyEd, 66.09e6);
    within(low.combined?.utilisation, 0.535);
    // The pieces either side of the tie are both in the storey above, with its end moment
    within(pieceAt(result.lifts[0].pieces, 4).combined?.MyEd, 66.09e6);
    within(pieceAt(result.lifts[0].pieces, 6).combined?.MyEd, 66.09e6);
  });
});

describe('roof beams on the cap', () => {
  // UKC 203x203x46 S355 from +0.000 to +8.000, floor +4.000 (Gk 20, Qk 10, no faces), cap +8.000 with a
  // roof beam on one flange: Gk 60, Qk 20, category H; the cap's own load is the same 60/20.
  // Reaction, 6.10b: 0.925·1.35·60 + 1.5·20 = 74.925 + 30 = 104.925 kN (6.10a: 81 + 21 = 102);
  // e = 203.2/2 + 100 = 201.6 mm; M = 104.925 × 0.2016 = 21.153 kN·m, wholly into the top storey (no
  // column above the cap). NEd at +4.000 (bottom of the top storey), 6.10b: self-weight 46.1·9.81·4 =
  // 1.809 kN; 0.925·1.35·61.809 + 1.5·20 = 77.18 + 30 = 107.18 kN.
  // Lcr 4 m: λ̄z = √(5 870·355/(π²·210 000·1 550e4/4 000²)) = 1.0188, curve c: χz = 0.5283, Nb,z,Rd =
  // 1 102.6 kN; λ̄LT = 0.9169, ΦLT = 0.9033, χLT = 0.7500, Mb,Rd = 0.7500·497e3·355 = 132.32 kN·m (class 2:
  // flange c/t = 88.0/11.0 = 8.0 ≤ 10ε = 8.14).
  // 107.18/1 102.6 + 21.153/132.32 = 0.0972 + 0.1599 = 0.257 (6.10a: 104.44/1 102.6 + 20.563/132.32 = 0.250).
  // The storey below carries about 0.13 axially, so the top storey governs the lift and keeps its working.
  const doc = facesOn(
    buildStack({
      lifts: [{ top: 8, section: 'UKC 203x203x46' }],
      floors: [{ elevation: 4, Gk: 20, Qk: 10 }],
      cap: { Gk: 60, Qk: 20, category: 'H' },
    }),
    'c',
    { yPlus: { Gk: 60, Qk: 20 } },
  );

  it('keeps old caps valid and accepts faces on the cap', () => {
    const cap = { elevation: 8, fixity: 'pinned', Gk: 60, Qk: 20, category: 'H' };
    expect(capDataSchema.safeParse(cap).success).toBe(true);
    expect(capDataSchema.safeParse({ ...cap, faces: { yPlus: { Gk: 60, Qk: 20 } } }).success).toBe(true);
    expect(capDataSchema.safeParse({ ...cap, faces: { up: { Gk: 60, Qk: 20 } } }).success).toBe(false);
  });

  it('puts the whole roof moment into the top storey and checks it', () => {
    const result = analyseStack(doc);
    expect(result.errors).toEqual([]);
    const top = pieceAt(result.lifts[0].pieces, 4);
    within(top.combined?.MyEd, 21.153e6);
    within(top.combined?.utilisation, 0.257);
    expect(top.combined?.combination).toBe('6.10b');
    within(result.lifts[0].utilisation, 0.257);
    expect(top.combined?.steps.find((s) => s.symbol === 'My,below')?.description).toContain('roof');
    // Not carried past the floor at +4.000
    expect(pieceAt(result.lifts[0].pieces, 0).combined).toBeUndefined();
  });

  it('finds the roof moment with the cap as the end of the top storey', () => {
    const lifts = [
      {
        bottom: 0,
        top: 8,
        dims: { shape: 'I' as const, make: 'rolled' as const, h: 203.2, b: 203.6, tw: 7.2, tf: 11, r: 10.2 },
        Iy: 4570e4,
        Iz: 1550e4,
      },
    ];
    const floors = [
      { nodeId: 'r1', elevation: 4, category: 'A' as const, loaded: true },
      {
        nodeId: 'c',
        elevation: 8,
        category: 'H' as const,
        loaded: true,
        cap: true,
        faces: { yPlus: { Gk: 60, Qk: 20 } },
      },
    ];
    const [m] = floorMoments(floors, lifts, 0, 8, DEFAULT_ANALYSIS_OPTIONS, '6.10a');
    expect(m.cap).toBe(true);
    within(m.y.M, 20.563);
    expect(m.y.share).toMatchObject({ below: m.y.M, above: 0 });
    expect(m.lengthBelow).toBeCloseTo(4, 9);
  });

  it('warns when the roof beams add up to more than the cap brings in', () => {
    const result = analyseStack(facesOn(doc, 'c', { yPlus: { Gk: 60, Qk: 20 }, yMinus: { Gk: 30, Qk: 0 } }));
    expect(result.warnings.some((w) => w.nodeId === 'c' && w.message.startsWith('Cap at +8.000'))).toBe(true);
  });
});

describe('the combined check takes NEd and the reactions from the same combination', () => {
  // UKC 254x254x73 S355 from +0.000 to +8.000, self-weight off. Cap +8.000: Gk 1 000, Qk 50 (H), no faces.
  // Floor +4.000: Gk 100, Qk 100 (A); one beam on the y+ flange with Gk 20, Qk 100 (a storage bay).
  // Below the floor, ΣGk = 1 000 + 100 = 1 100 kN; the floor leads in 6.10b (n = 1, αn = 1.0):
  //   6.10a NEd = 1.35·1 100 + 1.05·100 + 1.05·50 = 1 485 + 157.5 = 1 642.5 kN
  //   6.10b NEd = 0.925·1.35·1 100 + 1.5·100 + 1.05·50 = 1 373.6 + 150 + 52.5 = 1 576.1 kN → 6.10a governs NEd
  //   6.10a R = 1.35·20 + 1.05·100 = 132 kN; 6.10b R = 0.925·1.35·20 + 1.5·100 = 174.98 kN → 6.10b governs R
  //   M/2 each side (equal storeys, one section): 6.10a 132 × 0.22705/2 = 14.985; 6.10b 19.864 kN·m
  //   6.10a: 1 642.5/2 172.3 + 14.985/301.43 = 0.7561 + 0.0497 = 0.806
  //   6.10b: 1 576.1/2 172.3 + 19.864/301.43 = 0.7256 + 0.0659 = 0.791 → 6.10a governs, 0.806
  //   Mixing 6.10a's NEd with 6.10b's reaction gave 0.7561 + 0.0659 = 0.822.
  const doc = facesOn(
    buildStack({
      lifts: [{ top: 8, section: 'UKC 254x254x73' }],
      floors: [{ elevation: 4, Gk: 100, Qk: 100 }],
      cap: { Gk: 1000, Qk: 50, category: 'H' },
    }),
    'r1',
    { yPlus: { Gk: 20, Qk: 100 } },
  );
  const result = analyseStack(doc, { selfWeight: false });
  const low = pieceAt(result.lifts[0].pieces, 0);

  it('checks each combination with its own NEd and reaction and names the one that governs', () => {
    expect(result.errors).toEqual([]);
    within(low.NEd, 1642.5);
    expect(low.combined?.combination).toBe('6.10a');
    within(low.combined?.NEdZ, 1642.5e3);
    within(low.combined?.MyEd, 14.985e6);
    within(low.combined?.utilisation, 0.806);
    expect(low.combined?.steps[0].description).toMatch(/eq\. 6\.10a 0\.80\d, eq\. 6\.10b 0\.79\d/);
  });

  it('with eq. 6.10 alone uses that one expression for both', () => {
    // 6.10: NEd = 1.35·1 100 + 1.5·100 + 1.05·50 = 1 687.5 kN; R = 1.35·20 + 1.5·100 = 177 kN, M/2 = 20.094 kN·m
    // 1 687.5/2 172.3 + 20.094/301.43 = 0.7768 + 0.0667 = 0.844
    const only = pieceAt(analyseStack(doc, { selfWeight: false, combination: '6.10' }).lifts[0].pieces, 0);
    expect(only.combined?.combination).toBe('6.10');
    within(only.combined?.utilisation, 0.844);
  });
});
