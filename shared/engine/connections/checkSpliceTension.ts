// Resistance of a flange cover-plate splice to axial tension (EN 1993-1-8 3.6, EN 1993-1-1 6.2.3), N and mm.
import type { Annex, CalcStep } from '../../schema/results.ts';
import type { SpliceDetail } from '../../schema/stack.ts';
import {
  boltShearResistance,
  boltTensionResistance,
  GAMMA_M2,
  holeDiameter,
  packingReduction,
  TENSILE_STRESS_AREA,
} from './boltResistance.ts';
import { plateTension } from './plateTension.ts';

export interface SpliceTension {
  /** Per bolt, single shear (N). */
  FvRd: number;
  betaP: number;
  boltGroup: number;
  plates: number;
  NtRd: number;
  steps: CalcStep[];
}

/**
 * Two flange cover plates, `number` bolts through each flange on each side of the joint, in single shear. The bolts of a
 * cover-plate splice carry the tension in shear; Ft,Rd (Table 3.4) is printed for end-plate details. Bearing of the bolts
 * on the plies, block tearing and the column flanges' net section are left to the connection design (see notes).
 */
export function spliceTensionResistance(detail: SpliceDetail, packThickness: number, annex: Annex): SpliceTension {
  const { plate, bolts } = detail;
  const d0 = holeDiameter(bolts.diameter);
  // Bolts in pairs either side of the web: two holes across each cover plate
  const holes = bolts.number >= 2 ? 2 : 1;
  const FvRd = boltShearResistance(bolts.diameter, bolts.class);
  const betaP = packingReduction(bolts.diameter, packThickness);
  const boltGroup = 2 * bolts.number * betaP * FvRd;
  const one = plateTension(plate.width, plate.thickness, plate.grade, holes, d0, annex);
  const plates = 2 * one.NtRd;
  const NtRd = Math.min(boltGroup, plates);
  const steps: CalcStep[] = [
    {
      symbol: 'As',
      value: TENSILE_STRESS_AREA[bolts.diameter],
      unit: 'mm²',
      clause: 'EN ISO 898-1',
      description: `M${bolts.diameter} class ${bolts.class}`,
    },
    { symbol: 'γM2', value: GAMMA_M2, unit: '', clause: 'EN 1993-1-8 Table 2.1' },
    {
      symbol: 'Fv,Rd',
      value: FvRd,
      unit: 'N',
      clause: 'EN 1993-1-8 Table 3.4',
      description: 'αv·fub·As/γM2, single shear through the thread',
    },
    {
      symbol: 'Ft,Rd',
      value: boltTensionResistance(bolts.diameter, bolts.class),
      unit: 'N',
      clause: 'EN 1993-1-8 Table 3.4',
      description: '0.9·fub·As/γM2, for end-plate details',
    },
    { symbol: 'βp', value: betaP, unit: '', clause: 'EN 1993-1-8 eq. 3.3', description: `Packs ${packThickness} mm` },
    {
      symbol: 'Fbolts',
      value: boltGroup,
      unit: 'N',
      clause: 'EN 1993-1-8 3.7',
      description: `2 flanges × ${bolts.number} bolts × βp·Fv,Rd`,
    },
    { symbol: 'd0', value: d0, unit: 'mm', clause: 'EN 1090-2 Table 11' },
    {
      symbol: 'Anet',
      value: one.Anet,
      unit: 'mm²',
      clause: 'EN 1993-1-1 6.2.2.2',
      description: `(${plate.width} − ${holes}·d0)·${plate.thickness} per plate`,
    },
    {
      symbol: 'Npl,Rd',
      value: one.NplRd,
      unit: 'N',
      clause: 'EN 1993-1-1 eq. 6.6',
      description: `A·fy/γM0 per plate, fy = ${one.fy} N/mm²`,
    },
    {
      symbol: 'Nu,Rd',
      value: one.NuRd,
      unit: 'N',
      clause: 'EN 1993-1-1 eq. 6.7',
      description: `0.9·Anet·fu/γM2 per plate, fu = ${one.fu} N/mm²`,
    },
    {
      symbol: 'Fplates',
      value: plates,
      unit: 'N',
      clause: 'EN 1993-1-1 6.2.3(2)',
      description: '2 plates × min(Npl,Rd, Nu,Rd)',
    },
    {
      symbol: 'Nt,Rd',
      value: NtRd,
      unit: 'N',
      clause: 'EN 1993-1-8 2.5',
      description: 'The lesser of the bolts and the plates',
    },
  ];
  return { FvRd, betaP, boltGroup, plates, NtRd, steps };
}
