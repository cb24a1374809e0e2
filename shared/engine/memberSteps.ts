import type { CalcStep, CompressionResult } from '../schema/results.ts';
import { phiFactor } from './reductionFactor.ts';
import type { GradeData } from './sectionData.ts';
import { BUCKLING_LENGTH_RULE } from './stack/bucklingLengthFactor.ts';

// Values are kept unrounded in engine units; the calculation sheet and the UI format them.
// Symbols and clauses are constants so that a check on a hot path allocates only the steps.

interface MemberInput {
  LcrY: number;
  LcrZ: number;
  NEd: number;
  gammaM0: number;
  gammaM1: number;
}

const axisLabels = (a: 'y' | 'z') => ({
  Lcr: `Lcr,${a}`,
  Ncr: `Ncr,${a}`,
  lambda: `λ̄${a}`,
  phi: `Φ${a}`,
  chi: `χ${a}`,
  Nb: `Nb,${a},Rd`,
});
const LABELS = { y: axisLabels('y'), z: axisLabels('z') };
const IGNORED = 'buckling may be ignored (λ̄ ≤ 0.2 or NEd/Ncr ≤ 0.04)';

function pushAxisSteps(
  out: CalcStep[],
  axis: 'y' | 'z',
  Lcr: number,
  Ncr: number,
  lambdaBar: number,
  alpha: number,
  chi: number,
  NbRd: number,
  NEd: number,
  class4: boolean,
): void {
  const s = LABELS[axis];
  const ignored = lambdaBar <= 0.2 || NEd <= 0.04 * Ncr;
  out.push(
    { symbol: s.Lcr, value: Lcr, unit: 'mm', clause: BUCKLING_LENGTH_RULE, description: 'buckling length' },
    { symbol: s.Ncr, value: Ncr, unit: 'N', clause: 'EN 1993-1-1 6.3.1.2(1)', description: 'Ncr = π²EI/Lcr²' },
    { symbol: s.lambda, value: lambdaBar, unit: '', clause: class4 ? 'EN 1993-1-1 eq. 6.51' : 'EN 1993-1-1 eq. 6.50' },
    { symbol: s.phi, value: phiFactor(lambdaBar, alpha), unit: '', clause: 'EN 1993-1-1 6.3.1.2(1)' },
    ignored
      ? { symbol: s.chi, value: 1, unit: '', clause: 'EN 1993-1-1 6.3.1.2(4)', description: IGNORED }
      : { symbol: s.chi, value: chi, unit: '', clause: 'EN 1993-1-1 eq. 6.49' },
    { symbol: s.Nb, value: NbRd, unit: 'N', clause: class4 ? 'EN 1993-1-1 eq. 6.48' : 'EN 1993-1-1 eq. 6.47' },
  );
}

// EN 1993-1-1 6.1(1) Note 2B: recommended γM0 = γM1 = 1.0 (also the UK National Annex values)
const GAMMA_M0_1: CalcStep = Object.freeze({ symbol: 'γM0', value: 1, unit: '', clause: 'EN 1993-1-1 6.1(1)' });
const GAMMA_M1_1: CalcStep = Object.freeze({ symbol: 'γM1', value: 1, unit: '', clause: 'EN 1993-1-1 6.1(1)' });

const GOVERNED_BY = {
  'cross-section': 'governed by the cross-section resistance',
  'flexural-y': 'governed by flexural buckling about y-y',
  'flexural-z': 'governed by flexural buckling about z-z',
} as const;

/** The section working followed by the length- and load-dependent working of one check. */
export function memberSteps(g: GradeData, res: CompressionResult, input: MemberInput): CalcStep[] {
  const class4 = res.sectionClass === 4;
  const out = g.steps.slice();
  out.push(
    input.gammaM0 === 1 ? GAMMA_M0_1 : { symbol: 'γM0', value: input.gammaM0, unit: '', clause: 'EN 1993-1-1 6.1(1)' },
    input.gammaM1 === 1 ? GAMMA_M1_1 : { symbol: 'γM1', value: input.gammaM1, unit: '', clause: 'EN 1993-1-1 6.1(1)' },
    { symbol: 'Nc,Rd', value: res.NcRd, unit: 'N', clause: class4 ? 'EN 1993-1-1 eq. 6.11' : 'EN 1993-1-1 eq. 6.10' },
  );
  pushAxisSteps(out, 'y', input.LcrY, res.NcrY, res.lambdaBarY, g.alphaY, res.chiY, res.NbRdY, input.NEd, class4);
  pushAxisSteps(out, 'z', input.LcrZ, res.NcrZ, res.lambdaBarZ, g.alphaZ, res.chiZ, res.NbRdZ, input.NEd, class4);
  out.push(
    { symbol: 'NEd', value: input.NEd, unit: 'N', clause: 'EN 1990 6.4.3.2', description: 'design axial force' },
    {
      symbol: 'utilisation',
      value: res.utilisation,
      unit: '',
      clause: 'EN 1993-1-1 eq. 6.9, 6.46',
      description: GOVERNED_BY[res.governing],
    },
  );
  return out;
}
