// Everything about a section that does not depend on the member length or the load, memoised per
// section, grade and annex: checkCompression only adds Ncr, λ̄, χ and the resistances.
import { resolveSection } from '../catalogue/index.ts';
import type { Annex, BucklingCurve, CalcStep, SectionClass } from '../schema/results.ts';
import type { Grade } from '../schema/stack.ts';
import { bucklingCurve, type CurvePair } from './bucklingCurve.ts';
import { classifySection, type Classification } from './classifySection.ts';
import { E_STEEL } from './constants.ts';
import { effectiveArea, type ElementReduction } from './effectiveArea.ts';
import { imperfectionFactor } from './imperfectionFactor.ts';
import { sectionProperties } from './sectionProperties.ts';
import type { SectionDims, SectionProperties } from './sectionTypes.ts';
import { sectionSteps } from './sectionSteps.ts';
import { yieldStrength, yieldStrengthSource, type Product } from './yieldStrength.ts';

/** Flat record (one hidden class for every section) so that the hot path reads monomorphic fields. */
export interface GradeData {
  A: number;
  sectionClass: SectionClass;
  classElement: string;
  curveY: BucklingCurve;
  curveZ: BucklingCurve;
  fy: number;
  fySource: string;
  epsilon: number;
  classification: Classification;
  Aeff: number;
  reductions: ElementReduction[];
  curves: CurvePair;
  alphaY: number;
  alphaZ: number;
  /** Aeff·fy, N (A·fy for class 1–3). */
  squash: number;
  /** π²E·Iy and π²E·Iz, N·mm². */
  piEIy: number;
  piEIz: number;
  /** Working that does not depend on length or load. */
  steps: readonly CalcStep[];
}

export interface SectionData {
  designation: string;
  dims: SectionDims;
  props: SectionProperties;
  product: Product;
  grades: Record<Annex, Partial<Record<Grade, GradeData>>>;
  /** For a building's own section: the dimensions object it was built from. */
  own?: SectionDims;
}

const CATALOGUE_CACHE = new Map<string, SectionData>();
const EXTRA_CACHE = new WeakMap<ReadonlyMap<string, SectionDims>, Map<string, SectionData>>();
/** Bound of the caches keyed by caller text or dimensions, so that they cannot grow without limit. */
const MAX_CACHED_DIMS = 5000;
const DIMS_CACHE = new Map<string, SectionData>();

function buildSectionData(designation: string, dims: SectionDims): SectionData {
  return { designation, dims, props: sectionProperties(dims), product: dims.make, grades: { UK: {}, EN: {} } };
}

/** Exact cache key of dimensions (the designation rounds them for display). */
function dimsKey(d: SectionDims): string {
  if (d.shape === 'I') return `I|${d.make}|${d.h}|${d.b}|${d.tw}|${d.tf}|${d.r}`;
  if (d.shape === 'RHS') return `RHS|${d.make}|${d.h}|${d.b}|${d.t}`;
  return `CHS|${d.make}|${d.d}|${d.t}`;
}

/**
 * Section data for a designation or dimensions, memoised. A building's own sections are cached per
 * map and re-read when the map now holds other dimensions under that name. Throws EngineError for
 * unknown or invalid sections.
 */
export function sectionData(section: string | SectionDims, extra?: ReadonlyMap<string, SectionDims>): SectionData {
  if (typeof section !== 'string') {
    const { designation, dims } = resolveSection(section);
    const key = dimsKey(dims);
    let data = DIMS_CACHE.get(key);
    if (!data) {
      if (DIMS_CACHE.size >= MAX_CACHED_DIMS) DIMS_CACHE.clear();
      data = buildSectionData(designation, dims);
      DIMS_CACHE.set(key, data);
    }
    return data;
  }
  if (extra && extra.size > 0) {
    let cache = EXTRA_CACHE.get(extra);
    if (!cache) {
      cache = new Map<string, SectionData>();
      EXTRA_CACHE.set(extra, cache);
    }
    const own = extra.get(section);
    let data = cache.get(section);
    if (!data || data.own !== own) {
      const { designation, dims } = resolveSection(section, extra);
      data = { ...buildSectionData(designation, dims), own };
      cache.set(section, data);
    }
    return data;
  }
  let data = CATALOGUE_CACHE.get(section);
  if (!data) {
    const { designation, dims } = resolveSection(section);
    // Keyed by the text as given (spellings vary), so bound it like the dimensions cache
    if (CATALOGUE_CACHE.size >= MAX_CACHED_DIMS) CATALOGUE_CACHE.clear();
    data = buildSectionData(designation, dims);
    CATALOGUE_CACHE.set(section, data);
  }
  return data;
}

/** Yield strength, class, effective area and curves of a section in one grade under one annex, memoised. */
export function gradeData(data: SectionData, grade: Grade, annex: Annex): GradeData {
  const cached = data.grades[annex][grade];
  if (cached) return cached;
  const fy = yieldStrength(grade, data.props.tMax, data.product, annex);
  // EN 1993-1-1 Table 5.2: ε = √(235/fy)
  const epsilon = Math.sqrt(235 / fy);
  const classification = classifySection(data.dims, epsilon);
  const { Aeff, reductions } = effectiveArea(data.dims, data.props.A, classification, epsilon);
  const curves = bucklingCurve(data.dims, grade);
  const partial: Omit<GradeData, 'steps'> = {
    A: data.props.A,
    sectionClass: classification.sectionClass,
    classElement: classification.governing.element,
    curveY: curves.y,
    curveZ: curves.z,
    fy,
    fySource: yieldStrengthSource(data.product, annex),
    epsilon,
    classification,
    Aeff,
    reductions,
    curves,
    alphaY: imperfectionFactor(curves.y),
    alphaZ: imperfectionFactor(curves.z),
    squash: Aeff * fy,
    piEIy: Math.PI * Math.PI * E_STEEL * data.props.Iy,
    piEIz: Math.PI * Math.PI * E_STEEL * data.props.Iz,
  };
  // The section working is shared by every result of this section: frozen so that no caller can alter it
  const result: GradeData = Object.assign(partial, { steps: sectionSteps(data, partial).map((s) => Object.freeze(s)) });
  data.grades[annex][grade] = result;
  return result;
}
