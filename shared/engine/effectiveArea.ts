import { EngineError } from './errors.ts';
import type { Classification, ClassifiedElement } from './classifySection.ts';
import type { SectionDims } from './sectionTypes.ts';

/** Reduction of one class 4 plate element in uniform compression. */
export interface ElementReduction {
  element: string;
  kSigma: number;
  lambdaP: number;
  rho: number;
  /** Area lost by all elements of this kind, mm². */
  lost: number;
}

/** Reduction factor ρ of a plate in uniform compression, ψ = 1 (EN 1993-1-5 4.4(2)). */
export function plateReduction(
  ratio: number,
  epsilon: number,
  kind: 'internal' | 'outstand',
): { kSigma: number; lambdaP: number; rho: number } {
  // EN 1993-1-5 Table 4.1 (internal, ψ = 1) and Table 4.2 (outstand, ψ = 1)
  const kSigma = kind === 'internal' ? 4.0 : 0.43;
  // EN 1993-1-5 4.4(2): λ̄p = (b̄/t) / (28.4 ε √kσ)
  const lambdaP = ratio / (28.4 * epsilon * Math.sqrt(kSigma));
  let rho: number;
  if (kind === 'internal') {
    // EN 1993-1-5 eq. 4.2 with ψ = 1: ρ = 1 for λ̄p ≤ 0.673, else (λ̄p − 0.055(3 + ψ))/λ̄p²
    rho = lambdaP <= 0.5 + Math.sqrt(0.085 - 0.055) ? 1 : (lambdaP - 0.055 * 4) / (lambdaP * lambdaP);
  } else {
    // EN 1993-1-5 eq. 4.3: ρ = 1 for λ̄p ≤ 0.748, else (λ̄p − 0.188)/λ̄p²
    rho = lambdaP <= 0.748 ? 1 : (lambdaP - 0.188) / (lambdaP * lambdaP);
  }
  return { kSigma, lambdaP, rho: Math.min(rho, 1) };
}

/**
 * Effective area Aeff of a class 4 section in uniform compression (EN 1993-1-1 6.2.2.5,
 * EN 1993-1-5 4.4): each class 4 element keeps ρ·c of its width c. Doubly symmetric sections
 * have no shift of the neutral axis, so no additional moment arises (EN 1993-1-1 6.2.2.5(4)).
 */
export function effectiveArea(
  dims: SectionDims,
  A: number,
  classification: Classification,
  epsilon: number,
): { Aeff: number; reductions: ElementReduction[] } {
  if (classification.sectionClass < 4) return { Aeff: A, reductions: [] };
  if (dims.shape === 'CHS') {
    throw new EngineError(
      'unsupported',
      `A circular hollow section with d/t = ${classification.governing.ratio.toFixed(1)} is class 4; its local buckling is outside EN 1993-1-1 (see EN 1993-1-6) and is not checked here.`,
    );
  }
  const reductions: ElementReduction[] = [];
  let Aeff = A;
  for (const e of classification.elements) {
    if (e.sectionClass < 4) continue;
    if (dims.shape === 'I' && dims.make === 'welded' && e.kind === 'outstand') {
      throw new EngineError(
        'unsupported',
        `The flange outstands of this welded section are class 4 (c/t = ${e.ratio.toFixed(1)} > 14ε = ${e.limits[2].toFixed(1)}); welded class 4 flanges are not checked here. Choose thicker flanges.`,
      );
    }
    const kind = e.kind === 'outstand' ? 'outstand' : 'internal';
    const { kSigma, lambdaP, rho } = plateReduction(e.ratio, epsilon, kind);
    const lost = reducedArea(e, rho);
    Aeff -= lost;
    reductions.push({ element: e.element, kSigma, lambdaP, rho, lost });
  }
  return { Aeff, reductions };
}

function reducedArea(e: ClassifiedElement, rho: number): number {
  return e.count * (1 - rho) * e.c * e.t;
}
