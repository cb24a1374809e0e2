import { chsProperties, rhsProperties } from './hollowSectionProperties.ts';
import { iSectionProperties } from './iSectionProperties.ts';
import type { SectionDims, SectionProperties } from './sectionTypes.ts';
import { validateDims } from './validateDims.ts';

export type { SectionProperties };

/** Gross section properties from dimensions, including root or corner radii (docs/analysis-rules.md §Member check). */
export function sectionProperties(dims: SectionDims): SectionProperties {
  const valid = validateDims(dims);
  if (valid.shape === 'I') return iSectionProperties(valid);
  if (valid.shape === 'RHS') return rhsProperties(valid);
  return chsProperties(valid);
}
