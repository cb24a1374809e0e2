// Base plate under axial compression by the effective-area method (EN 1993-1-8 6.2.5), N and mm.
import type { Annex, CalcStep } from '../../schema/results.ts';
import type { BasePlate, ConcreteClass, SectionDims } from '../../schema/stack.ts';
import { yieldStrength } from '../yieldStrength.ts';
import { alphaCC, characteristicStrength, designCompressiveStrength, GAMMA_C } from './concreteStrength.ts';
import { effectiveBearingArea, widthForArea } from './effectiveBearingArea.ts';
import { GAMMA_M0 } from './plateTension.ts';

/** βj = 2/3 where the grout is at least 0.2 of the foundation's strength and no thicker than 0.2·min(b, l): EN 1993-1-8 6.2.5(7). */
export const BETA_J = 2 / 3;

export interface BasePlateCheck {
  fcd: number;
  fjd: number;
  fy: number;
  c: number;
  Aeff: number;
  NjRd: number;
  /** Thickness the force needs (mm), null when the plate is too small in plan whatever its thickness. */
  tRequired: number | null;
  utilisation: number;
  notes: string[];
  steps: CalcStep[];
}

/**
 * fjd = βj·FRdu/(beff·leff) with FRdu = Ac0·fcd·√(Ac1/Ac0) (EN 1992-1-1 eq. 6.63). The foundation's size is not
 * known here, so Ac1 = Ac0 and fjd = βj·fcd: the lower bound, safe for any foundation.
 */
export function checkBasePlate(
  NEd: number,
  dims: SectionDims,
  plate: BasePlate,
  concrete: ConcreteClass,
  annex: Annex,
): BasePlateCheck {
  const notes: string[] = [];
  const fck = characteristicStrength(concrete);
  const fcd = designCompressiveStrength(concrete, annex);
  const fjd = BETA_J * fcd;
  const fy = yieldStrength(plate.grade, plate.t, 'rolled', annex);
  // EN 1993-1-8 eq. 6.5
  const c = plate.t * Math.sqrt(fy / (3 * fjd * GAMMA_M0));
  const size = { b: plate.b, l: plate.l };
  const Aeff = effectiveBearingArea(dims, c, size);
  // EN 1993-1-8 6.2.5(3): the bearing resistance of the effective area
  const NjRd = Aeff * fjd;
  const cNeeded = widthForArea(dims, NEd / fjd, size);
  // EN 1993-1-8 eq. 6.5 solved for t
  const tRequired = cNeeded === null ? null : cNeeded * Math.sqrt((3 * fjd * GAMMA_M0) / fy);
  if (plate.grout > 0.2 * Math.min(plate.b, plate.l)) {
    notes.push(
      'The grout is thicker than 0.2·min(b, l): βj = 2/3 does not hold (EN 1993-1-8 6.2.5(7)); a separate check of the grout is needed',
    );
  }
  notes.push('Grout of characteristic strength at least 0.2 fck of the foundation assumed (EN 1993-1-8 6.2.5(7))');
  if (cNeeded === null) notes.push('The plate is too small in plan for this force whatever its thickness');
  const footprint = dims.shape === 'CHS' ? { b: dims.d, l: dims.d } : { b: dims.b, l: dims.h };
  if (plate.b < footprint.b || plate.l < footprint.l) notes.push('The plate is smaller than the column footprint');
  const steps: CalcStep[] = [
    { symbol: 'NEd', value: NEd, unit: 'N', clause: 'EN 1990 6.4.3.2', description: 'Design compression at the base' },
    { symbol: 'fck', value: fck, unit: 'N/mm²', clause: 'EN 1992-1-1 Table 3.1', description: concrete },
    {
      symbol: 'αcc',
      value: alphaCC(annex),
      unit: '',
      clause: annex === 'UK' ? 'UK NA to EN 1992-1-1 3.1.6(1)' : 'EN 1992-1-1 3.1.6(1)',
    },
    { symbol: 'γc', value: GAMMA_C, unit: '', clause: 'EN 1992-1-1 Table 2.1N' },
    { symbol: 'fcd', value: fcd, unit: 'N/mm²', clause: 'EN 1992-1-1 eq. 3.15', description: 'αcc·fck/γc' },
    { symbol: 'βj', value: BETA_J, unit: '', clause: 'EN 1993-1-8 6.2.5(7)' },
    {
      symbol: 'fjd',
      value: fjd,
      unit: 'N/mm²',
      clause: 'EN 1993-1-8 eq. 6.6, EN 1992-1-1 eq. 6.63',
      description: 'βj·fcd, foundation no larger than the plate (Ac1 = Ac0)',
    },
    {
      symbol: 'fy',
      value: fy,
      unit: 'N/mm²',
      clause: annex === 'UK' ? 'EN 10025-2 Table 7' : 'EN 1993-1-1 Table 3.1',
      description: `${plate.grade} plate, t = ${plate.t} mm`,
    },
    { symbol: 'γM0', value: GAMMA_M0, unit: '', clause: 'EN 1993-1-1 6.1' },
    { symbol: 'c', value: c, unit: 'mm', clause: 'EN 1993-1-8 eq. 6.5', description: 't·√(fy/(3·fjd·γM0))' },
    {
      symbol: 'Aeff',
      value: Aeff,
      unit: 'mm²',
      clause: 'EN 1993-1-8 6.2.5(4), Figure 6.4',
      description: `Within c of the footprint, on a ${plate.b} × ${plate.l} mm plate`,
    },
    { symbol: 'Nj,Rd', value: NjRd, unit: 'N', clause: 'EN 1993-1-8 6.2.5(3)', description: 'Aeff·fjd' },
    {
      symbol: 't,req',
      value: tRequired ?? 'plate too small',
      unit: tRequired === null ? '' : 'mm',
      clause: 'EN 1993-1-8 eq. 6.5',
      description: 'Thickness whose c gives Aeff·fjd = NEd',
    },
    { symbol: 'NEd/Nj,Rd', value: NEd / NjRd, unit: '', clause: 'EN 1993-1-8 6.2.5' },
  ];
  return { fcd, fjd, fy, c, Aeff, NjRd, tRequired, utilisation: NEd / NjRd, notes, steps };
}
