// χLT for the major-axis moment of a column in simple construction (EN 1993-1-1 6.3.2).
import type { Annex, BucklingCurve } from '../../schema/results.ts';
import { E_STEEL } from '../constants.ts';
import { imperfectionFactor } from '../imperfectionFactor.ts';
import type { SectionDims, SectionProperties } from '../sectionTypes.ts';
import { G_STEEL, ROLLED_LTB_SLENDERNESS_FACTOR } from './constants.ts';

export interface LtbInput {
  dims: SectionDims;
  props: SectionProperties;
  fy: number;
  /** Modulus used for Mb,Rd (Wpl,y for class 1–2, Wel,y for class 3), mm³. */
  Wy: number;
  /** Minor-axis slenderness of the column length (EN 1993-1-1 eq. 6.50). */
  lambdaBarZ: number;
  /** Length between lateral restraints, mm (used only where Mcr is computed). */
  Lcr: number;
  annex: Annex;
}

export interface LtbReduction {
  lambdaBarLT: number;
  chiLT: number;
  curve: BucklingCurve | null;
  /** λ̄LT,0 and β of the method used (6.3.2.3 for rolled I; 6.3.2.2 otherwise, λ̄LT,0 = 0.2, β = 1). */
  lambdaLT0: number;
  beta: number;
  /** How λ̄LT was found and the rule for the curve, for the calculation sheet. */
  slendernessRule: string;
  curveRule: string;
}

/** χLT = 1/(ΦLT + √(ΦLT² − β·λ̄LT²)), ΦLT = 0.5[1 + αLT(λ̄LT − λ̄LT,0) + β·λ̄LT²] (EN 1993-1-1 6.3.2.2, 6.3.2.3). */
function chiLTFor(
  lambdaBarLT: number,
  curve: BucklingCurve,
  lambdaLT0: number,
  beta: number,
  rolledMethod: boolean,
): number {
  // EN 1993-1-1 6.3.2.2(4): no reduction up to λ̄LT,0
  if (lambdaBarLT <= lambdaLT0) return 1;
  const phi = 0.5 * (1 + imperfectionFactor(curve) * (lambdaBarLT - lambdaLT0) + beta * lambdaBarLT * lambdaBarLT);
  const chi = 1 / (phi + Math.sqrt(phi * phi - beta * lambdaBarLT * lambdaBarLT));
  // EN 1993-1-1 eq. 6.56: χLT ≤ 1; eq. 6.57 (rolled sections method) also χLT ≤ 1/λ̄LT²
  return Math.min(chi, 1, rolledMethod ? 1 / (lambdaBarLT * lambdaBarLT) : 1);
}

/** Rolled I: EN 1993-1-1 Table 6.5 (recommended) or the UK National Annex NA.2.17 (h/b > 3.1 curve d). */
function rolledCurve(h: number, b: number, annex: Annex): BucklingCurve {
  if (h / b <= 2) return 'b';
  return annex === 'UK' && h / b > 3.1 ? 'd' : 'c';
}

export function lateralTorsionalReduction(input: LtbInput): LtbReduction {
  const { dims, props, fy, Wy, lambdaBarZ, Lcr } = input;
  if (dims.shape === 'CHS' || (dims.shape === 'RHS' && dims.h === dims.b)) {
    // EN 1993-1-1 6.3.2.1(2): square and circular hollow sections are not susceptible to LTB
    const rule = 'square or circular hollow section, not susceptible (EN 1993-1-1 6.3.2.1(2))';
    return { lambdaBarLT: 0, chiLT: 1, curve: null, lambdaLT0: 0.2, beta: 1, slendernessRule: rule, curveRule: rule };
  }
  if (dims.shape === 'RHS') {
    // Closed section, warping negligible, uniform moment: Mcr = (π/L)·√(E·Iz·G·It) (elastic theory, common practice)
    const Mcr = (Math.PI / Lcr) * Math.sqrt(E_STEEL * props.Iz * G_STEEL * props.It);
    // EN 1993-1-1 eq. 6.56: λ̄LT = √(Wy·fy/Mcr); Table 6.4 'other cross-sections' → curve d
    const lambdaBarLT = Math.sqrt((Wy * fy) / Mcr);
    return {
      lambdaBarLT,
      chiLT: chiLTFor(lambdaBarLT, 'd', 0.2, 1, false),
      curve: 'd',
      lambdaLT0: 0.2,
      beta: 1,
      slendernessRule: 'λ̄LT = √(Wy·fy/Mcr), Mcr = (π/L)√(E·Iz·G·It) for a closed section under uniform moment',
      curveRule: 'EN 1993-1-1 Table 6.4, other cross-sections',
    };
  }
  if (dims.make === 'rolled') {
    // λ̄LT = 0.9·λ̄z for rolled I/H columns in simple construction (NCCI SN048b, from memory); EN 1993-1-1 6.3.2.3,
    // λ̄LT,0 = 0.4 and β = 0.75 (recommended, kept by the UK NA); f taken as 1 (on the safe side)
    const lambdaBarLT = ROLLED_LTB_SLENDERNESS_FACTOR * lambdaBarZ;
    const curve = rolledCurve(dims.h, dims.b, input.annex);
    return {
      lambdaBarLT,
      chiLT: chiLTFor(lambdaBarLT, curve, 0.4, 0.75, true),
      curve,
      lambdaLT0: 0.4,
      beta: 0.75,
      slendernessRule: 'λ̄LT = 0.9·λ̄z, rolled I or H column in simple construction (NCCI SN048b)',
      curveRule:
        input.annex === 'UK' ? 'EN 1993-1-1 Table 6.5 with UK NA NA.2.17, rolled I' : 'EN 1993-1-1 Table 6.5, rolled I',
    };
  }
  // Welded I: λ̄LT = λ̄z bounds the true value (Mcr ≥ Ncr,z·hs/2 for a doubly symmetric I under uniform
  // moment, and Wpl,y < A·hs/2), common practice, no source; EN 1993-1-1 6.3.2.2 with Table 6.4
  const curve: BucklingCurve = dims.h / dims.b <= 2 ? 'c' : 'd';
  return {
    lambdaBarLT: lambdaBarZ,
    chiLT: chiLTFor(lambdaBarZ, curve, 0.2, 1, false),
    curve,
    lambdaLT0: 0.2,
    beta: 1,
    slendernessRule: 'λ̄LT = λ̄z, an upper bound for a welded doubly symmetric I',
    curveRule: 'EN 1993-1-1 Table 6.4, welded I',
  };
}
