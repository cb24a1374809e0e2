// Catalogue rows against a published section table, read from a stored copy: SCI P363 (steel building
// design: design data), "Universal beams, BS EN 1993-1-1:2005, BS 4-1:2005 — Advance
// UKB, Dimensions": mass per metre, h, b, tw, tf (mm). Root radii r from the dimension table of BS 4-1
// universal beams in the same kind of stored copy (914: 24.1, 914x305: 19.1, 838: 17.8, 762: 16.5,
// 686: 15.2, 610x305: 16.5, 610x229: 12.7 mm). Covers the 24 rows from 914x419x388 to 610x229x101;
// the other rows are typed from memory and checked by the mass test in catalogue.test.ts. IPE below.
import { describe, expect, it } from 'vitest';
import { findSection } from '../../shared/catalogue/index.ts';
import { sectionProperties } from '../../shared/engine/index.ts';

// designation, published mass (kg/m), h, b, tw, tf, r
const PUBLISHED: readonly [string, number, number, number, number, number, number][] = [
  ['UKB 914x419x388', 388.0, 921.0, 420.5, 21.4, 36.6, 24.1],
  ['UKB 914x419x343', 343.3, 911.8, 418.5, 19.4, 32.0, 24.1],
  ['UKB 914x305x289', 289.1, 926.6, 307.7, 19.5, 32.0, 19.1],
  ['UKB 914x305x253', 253.4, 918.4, 305.5, 17.3, 27.9, 19.1],
  ['UKB 914x305x224', 224.2, 910.4, 304.1, 15.9, 23.9, 19.1],
  ['UKB 914x305x201', 200.9, 903.0, 303.3, 15.1, 20.2, 19.1],
  ['UKB 838x292x226', 226.5, 850.9, 293.8, 16.1, 26.8, 17.8],
  ['UKB 838x292x194', 193.8, 840.7, 292.4, 14.7, 21.7, 17.8],
  ['UKB 838x292x176', 175.9, 834.9, 291.7, 14.0, 18.8, 17.8],
  ['UKB 762x267x197', 196.8, 769.8, 268.0, 15.6, 25.4, 16.5],
  ['UKB 762x267x173', 173.0, 762.2, 266.7, 14.3, 21.6, 16.5],
  ['UKB 762x267x147', 146.9, 754.0, 265.2, 12.8, 17.5, 16.5],
  ['UKB 762x267x134', 133.9, 750.0, 264.4, 12.0, 15.5, 16.5],
  ['UKB 686x254x170', 170.2, 692.9, 255.8, 14.5, 23.7, 15.2],
  ['UKB 686x254x152', 152.4, 687.5, 254.5, 13.2, 21.0, 15.2],
  ['UKB 686x254x140', 140.1, 683.5, 253.7, 12.4, 19.0, 15.2],
  ['UKB 686x254x125', 125.2, 677.9, 253.0, 11.7, 16.2, 15.2],
  ['UKB 610x305x238', 238.1, 635.8, 311.4, 18.4, 31.4, 16.5],
  ['UKB 610x305x179', 179.0, 620.2, 307.1, 14.1, 23.6, 16.5],
  ['UKB 610x305x149', 149.2, 612.4, 304.8, 11.8, 19.7, 16.5],
  ['UKB 610x229x140', 139.9, 617.2, 230.2, 13.1, 22.1, 12.7],
  ['UKB 610x229x125', 125.1, 612.2, 229.0, 11.9, 19.6, 12.7],
  ['UKB 610x229x113', 113.0, 607.6, 228.2, 11.1, 17.3, 12.7],
  ['UKB 610x229x101', 101.2, 602.6, 227.6, 10.5, 14.8, 12.7],
];

describe('UKB rows against the published dimension table', () => {
  for (const [designation, mass, h, b, tw, tf, r] of PUBLISHED) {
    it(`${designation}: dimensions as published, and the mass from them within 0.5% of ${mass} kg/m`, () => {
      const entry = findSection(designation);
      expect(entry, `${designation} is in the catalogue`).toBeDefined();
      expect(entry!.dims).toMatchObject({ shape: 'I', make: 'rolled', h, b, tw, tf, r });
      // 7850 kg/m³ (the table's density); the published mass includes the root fillets as ours does.
      expect(Math.abs(sectionProperties(entry!.dims).massPerMetre / mass - 1)).toBeLessThan(0.005);
    });
  }
});

// SCI / ArcelorMittal "orange book", "Parallel flange I sections — IPE, dimensions and properties"
// (UK National Annex edition), read from a stored copy: mass per metre (kg/m) and depth h (mm). The
// stored copy shows only these two columns, so b, tw, tf and r are checked through the mass: a
// mistyped one moves the mass computed from them.
const IPE_PUBLISHED: readonly [string, number, number][] = [
  ['IPE 100', 8.1, 100],
  ['IPE 120', 10.4, 120],
  ['IPE 140', 12.9, 140],
  ['IPE 160', 15.8, 160],
  ['IPE 180', 18.8, 180],
  ['IPE 200', 22.4, 200],
  ['IPE 220', 26.2, 220],
  ['IPE 240', 30.7, 240],
  ['IPE 270', 36.1, 270],
  ['IPE 300', 42.2, 300],
  ['IPE 330', 49.1, 330],
  ['IPE 360', 57.1, 360],
  ['IPE 400', 66.3, 400],
  ['IPE 450', 77.6, 450],
  ['IPE 500', 90.7, 500],
  ['IPE 550', 106, 550],
  ['IPE 600', 122, 600],
];

describe('IPE rows against the published table', () => {
  for (const [designation, mass, h] of IPE_PUBLISHED) {
    it(`${designation}: h = ${h} mm and the mass from the dimensions within 0.5% of ${mass} kg/m`, () => {
      const entry = findSection(designation);
      expect(entry, `${designation} is in the catalogue`).toBeDefined();
      expect(entry!.dims).toMatchObject({ h });
      expect(entry!.massPerMetre).toBe(mass);
      expect(Math.abs(sectionProperties(entry!.dims).massPerMetre / mass - 1)).toBeLessThan(0.005);
    });
  }
});
