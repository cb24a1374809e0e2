// Tension resistance of a plate with bolt holes (EN 1993-1-1 6.2.3), N and mm.
import type { Annex } from '../../schema/results.ts';
import type { Grade } from '../../schema/stack.ts';
import { yieldStrength } from '../yieldStrength.ts';
import { GAMMA_M2 } from './boltResistance.ts';

/** γM0: EN 1993-1-1 6.1 note 2B (recommended 1.00; UK NA the same). */
export const GAMMA_M0 = 1.0;

/**
 * Minimum tensile strength fu (N/mm²) of plate. UK annex: EN 10025-2 Table 7 (3 < t ≤ 100 mm) and EN 10025-3 for
 * S420/S460; EN annex: EN 1993-1-1 Table 3.1 (t ≤ 40 mm, 40 < t ≤ 80 mm). From memory.
 */
export function plateUltimateStrength(grade: Grade, t: number, annex: Annex): number {
  if (annex === 'UK') return { S235: 360, S275: 410, S355: 470, S420: 520, S460: 540 }[grade];
  return t <= 40
    ? { S235: 360, S275: 430, S355: 490, S420: 520, S460: 540 }[grade]
    : { S235: 360, S275: 410, S355: 470, S420: 500, S460: 530 }[grade];
}

export interface PlateTension {
  fy: number;
  fu: number;
  A: number;
  Anet: number;
  NplRd: number;
  NuRd: number;
  NtRd: number;
}

/**
 * Nt,Rd = min(Npl,Rd, Nu,Rd): Npl,Rd = A·fy/γM0 (EN 1993-1-1 eq. 6.6), Nu,Rd = 0.9·Anet·fu/γM2 (eq. 6.7),
 * the net area less `holes` holes of diameter d0 across the width (6.2.2.2).
 */
export function plateTension(
  width: number,
  t: number,
  grade: Grade,
  holes: number,
  d0: number,
  annex: Annex,
): PlateTension {
  const fy = yieldStrength(grade, t, 'rolled', annex);
  const fu = plateUltimateStrength(grade, t, annex);
  const A = width * t;
  const Anet = Math.max(0, (width - holes * d0) * t);
  const NplRd = (A * fy) / GAMMA_M0;
  const NuRd = (0.9 * Anet * fu) / GAMMA_M2;
  return { fy, fu, A, Anet, NplRd, NuRd, NtRd: Math.min(NplRd, NuRd) };
}
