import type { AnalysisOptions } from '@shared/schema/results.ts';

/** One line stating how a building's stacks are analysed, e.g. "EN 1990 eq. 6.10a/b · UK National Annex · …". */
export function optionsSummary(o: AnalysisOptions): string {
  return [
    o.combination === '6.10' ? 'EN 1990 eq. 6.10' : 'EN 1990 eqs. 6.10a/b',
    o.annex === 'UK' ? 'UK National Annex' : 'EN recommended values',
    o.imposedReduction ? 'imposed loads reduced for storeys' : 'no imposed-load reduction',
    o.selfWeight ? 'self-weight included' : 'self-weight left out',
    // Absent means on (options stored before the switch existed).
    o.nominalMoments === false ? 'axial check only' : 'nominal moments of simple construction',
    // Absent means tabulated factors (options stored before the choice existed).
    o.bucklingLengths === 'critical'
      ? 'buckling lengths from a critical buckling analysis'
      : 'tabulated buckling-length factors',
    o.consequenceClass ? `consequence class ${o.consequenceClass}` : 'consequence class not given',
    o.concreteClass ? `foundations ${o.concreteClass}` : 'concrete class not given',
  ].join(' · ');
}
