import type { Annex, CompressionResult, GoverningMode } from '../schema/results.ts';
import type { Grade } from '../schema/stack.ts';
import { checkAnnex, checkAxialForce, checkGrade, checkLength, checkPartialFactor } from './checkInput.ts';
import { memberSteps } from './memberSteps.ts';
import { reductionFactorFromAlpha } from './reductionFactor.ts';
import { gradeData, sectionData } from './sectionData.ts';
import type { SectionDims } from './sectionTypes.ts';

export interface CompressionInput {
  section: SectionDims | string;
  grade: Grade;
  /** Buckling lengths about y-y and z-z, mm. */
  LcrY: number;
  LcrZ: number;
  /** Design axial compression, N (≥ 0). */
  NEd: number;
  annex?: Annex;
  gammaM0?: number;
  gammaM1?: number;
}

export interface CompressionOptions {
  /** Include the working (default true). */
  steps?: boolean;
  /** The building's own sections by designation. */
  extraSections?: ReadonlyMap<string, SectionDims>;
}

/** Flexural buckling check: χ = 1 where buckling may be ignored (EN 1993-1-1 6.3.1.2(4)). */
function chiFor(lambdaBar: number, NEd: number, Ncr: number, alpha: number): number {
  // EN 1993-1-1 6.3.1.2(4): λ̄ ≤ 0.2 or NEd/Ncr ≤ 0.04
  if (lambdaBar <= 0.2 || NEd <= 0.04 * Ncr) return 1;
  // EN 1993-1-1 eq. 6.49
  return reductionFactorFromAlpha(lambdaBar, alpha);
}

/**
 * Member in axial compression to EN 1993-1-1: cross-section resistance (6.2.4) and flexural
 * buckling about both axes (6.3.1). Units N, mm, N/mm². Throws EngineError on bad input.
 */
export function checkCompression(input: CompressionInput, opts?: CompressionOptions): CompressionResult {
  const { grade, LcrY, LcrZ, NEd } = input;
  const annex = input.annex ?? 'UK';
  const gammaM0 = input.gammaM0 ?? 1.0;
  const gammaM1 = input.gammaM1 ?? 1.0;
  checkGrade(grade);
  checkAnnex(annex);
  checkLength('LcrY', LcrY);
  checkLength('LcrZ', LcrZ);
  checkAxialForce(NEd);
  if (gammaM0 !== 1) checkPartialFactor('γM0', gammaM0);
  if (gammaM1 !== 1) checkPartialFactor('γM1', gammaM1);

  const g = gradeData(sectionData(input.section, opts?.extraSections), grade, annex);

  // EN 1993-1-1 eq. 6.10 (class 1–3) / eq. 6.11 (class 4, Aeff)
  const NcRd = g.squash / gammaM0;
  // Elastic critical force for flexural buckling, Ncr = π²EI/Lcr² (EN 1993-1-1 6.3.1.2(1))
  const NcrY = g.piEIy / (LcrY * LcrY);
  const NcrZ = g.piEIz / (LcrZ * LcrZ);
  // EN 1993-1-1 eq. 6.50 (class 1–3) / eq. 6.51 (class 4): λ̄ = √(A fy / Ncr), Aeff for class 4
  const lambdaBarY = Math.sqrt(g.squash / NcrY);
  const lambdaBarZ = Math.sqrt(g.squash / NcrZ);
  const chiY = chiFor(lambdaBarY, NEd, NcrY, g.alphaY);
  const chiZ = chiFor(lambdaBarZ, NEd, NcrZ, g.alphaZ);
  // EN 1993-1-1 eq. 6.47 (class 1–3) / eq. 6.48 (class 4)
  const NbRdY = (chiY * g.squash) / gammaM1;
  const NbRdZ = (chiZ * g.squash) / gammaM1;
  const NbRd = NbRdY < NbRdZ ? NbRdY : NbRdZ;

  // The governing mode has the smallest resistance; ties go to the cross-section, then y-y.
  let governing: GoverningMode = 'cross-section';
  let resistance = NcRd;
  if (NbRdY < resistance) {
    governing = 'flexural-y';
    resistance = NbRdY;
  }
  if (NbRdZ < resistance) {
    governing = 'flexural-z';
    resistance = NbRdZ;
  }
  // EN 1993-1-1 eq. 6.9 and eq. 6.46: NEd / resistance ≤ 1
  const utilisation = NEd / resistance;

  const result: CompressionResult = {
    fy: g.fy,
    epsilon: g.epsilon,
    sectionClass: g.sectionClass,
    classGoverningElement: g.classElement,
    A: g.A,
    Aeff: g.Aeff,
    NcRd,
    NcrY,
    NcrZ,
    lambdaBarY,
    lambdaBarZ,
    curveY: g.curveY,
    curveZ: g.curveZ,
    chiY,
    chiZ,
    NbRdY,
    NbRdZ,
    NbRd,
    utilisation,
    governing,
    steps: [],
  };
  if (opts?.steps !== false) result.steps = memberSteps(g, result, { LcrY, LcrZ, NEd, gammaM0, gammaM1 });
  return result;
}
