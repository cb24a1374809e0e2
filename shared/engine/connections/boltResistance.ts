// Resistance of one bolt (EN 1993-1-8 3.6.1, Table 3.4), N and mm.
import type { BoltClass, BoltDiameter } from '../../schema/stack.ts';

/** γM2, resistance of bolts and of net sections in tension: EN 1993-1-8 Table 2.1 note (recommended; UK NA the same). */
export const GAMMA_M2 = 1.25;

/** Tensile stress area As (mm²) of ISO metric coarse threads, EN ISO 898-1 Table 4 (from memory). */
export const TENSILE_STRESS_AREA: Readonly<Record<BoltDiameter, number>> = {
  12: 84.3,
  16: 157,
  20: 245,
  22: 303,
  24: 353,
  27: 459,
  30: 561,
  36: 817,
};

/** Ultimate tensile strength fub (N/mm²): EN 1993-1-8 Table 3.1. */
export function boltUltimateStrength(boltClass: BoltClass): number {
  return boltClass === '8.8' ? 800 : 1000;
}

/** Ft,Rd = k2·fub·As/γM2 with k2 = 0.9 (not countersunk): EN 1993-1-8 Table 3.4. */
export function boltTensionResistance(diameter: BoltDiameter, boltClass: BoltClass): number {
  return (0.9 * boltUltimateStrength(boltClass) * TENSILE_STRESS_AREA[diameter]) / GAMMA_M2;
}

/**
 * Fv,Rd = αv·fub·As/γM2 per shear plane through the threaded part: αv = 0.6 for class 8.8, 0.5 for 10.9
 * (EN 1993-1-8 Table 3.4). Threads are taken in the shear plane, which holds whatever bolt length is supplied.
 */
export function boltShearResistance(diameter: BoltDiameter, boltClass: BoltClass): number {
  const alphaV = boltClass === '8.8' ? 0.6 : 0.5;
  return (alphaV * boltUltimateStrength(boltClass) * TENSILE_STRESS_AREA[diameter]) / GAMMA_M2;
}

/** Hole diameter d0 for normal round holes: clearance 1 mm to M14, 2 mm M16–M24, 3 mm from M27 (EN 1090-2 Table 11, from memory). */
export function holeDiameter(diameter: BoltDiameter): number {
  return diameter + (diameter <= 14 ? 1 : diameter <= 24 ? 2 : 3);
}

/** βp = 9d/(8d + 3tp) ≤ 1 for bolts through packing thicker than d/3: EN 1993-1-8 3.6.1(12), eq. 3.3. */
export function packingReduction(diameter: number, packThickness: number): number {
  if (packThickness <= diameter / 3) return 1;
  return Math.min(1, (9 * diameter) / (8 * diameter + 3 * packThickness));
}
