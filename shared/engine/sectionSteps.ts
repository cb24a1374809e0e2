import type { CalcStep } from '../schema/results.ts';
import type { GradeData, SectionData } from './sectionData.ts';

// Values are kept unrounded in engine units; the calculation sheet and the UI format them.

/** Working that depends only on the section, grade and annex: properties, fy, class, Aeff, curves. */
export function sectionSteps(data: SectionData, g: Omit<GradeData, 'steps'>): CalcStep[] {
  const { props, dims } = data;
  const source =
    dims.shape === 'I'
      ? dims.make === 'rolled'
        ? 'EN 10365 / BS 4-1 dimensions'
        : 'plate dimensions'
      : `EN ${dims.make === 'hot-finished' ? '10210-2' : '10219-2'} Annex B`;
  const steps: CalcStep[] = [
    { symbol: 'section', value: data.designation, unit: '', clause: source },
    { symbol: 'A', value: props.A, unit: 'mm²', clause: source, description: 'gross area' },
    { symbol: 'Iy', value: props.Iy, unit: 'mm⁴', clause: source, description: 'second moment of area, major axis' },
    { symbol: 'Iz', value: props.Iz, unit: 'mm⁴', clause: source, description: 'second moment of area, minor axis' },
    {
      symbol: 't',
      value: props.tMax,
      unit: 'mm',
      clause: 'EN 1993-1-1 3.2.1',
      description: 'thickest element, sets fy',
    },
    { symbol: 'fy', value: g.fy, unit: 'N/mm²', clause: g.fySource, description: 'nominal yield strength' },
    { symbol: 'ε', value: g.epsilon, unit: '', clause: 'EN 1993-1-1 Table 5.2', description: 'ε = √(235/fy)' },
  ];
  for (const e of g.classification.elements) {
    const measure = e.kind === 'tube' ? 'd/t' : 'c/t';
    steps.push({
      symbol: `${measure} ${e.element}`,
      value: e.ratio,
      unit: '',
      clause: 'EN 1993-1-1 Table 5.2',
      description: `class ${e.sectionClass}; limits ${e.limits.map((l) => l.toFixed(2)).join(' / ')}`,
    });
  }
  steps.push({
    symbol: 'class',
    value: g.classification.sectionClass,
    unit: '',
    clause: 'EN 1993-1-1 5.5.2',
    description: `set by the ${g.classification.governing.element}`,
  });
  for (const red of g.reductions) {
    const eq = red.kSigma === 4 ? 'eq. 4.2' : 'eq. 4.3';
    steps.push(
      {
        symbol: `kσ ${red.element}`,
        value: red.kSigma,
        unit: '',
        clause: `EN 1993-1-5 Table ${red.kSigma === 4 ? '4.1' : '4.2'}`,
        description: 'uniform compression, ψ = 1',
      },
      { symbol: `λ̄p ${red.element}`, value: red.lambdaP, unit: '', clause: 'EN 1993-1-5 4.4(2)' },
      { symbol: `ρ ${red.element}`, value: red.rho, unit: '', clause: `EN 1993-1-5 ${eq}` },
    );
  }
  if (g.classification.sectionClass === 4) {
    steps.push({
      symbol: 'Aeff',
      value: g.Aeff,
      unit: 'mm²',
      clause: 'EN 1993-1-1 6.2.2.5',
      description: 'effective area in uniform compression',
    });
  }
  steps.push(
    { symbol: 'curve y-y', value: g.curves.y, unit: '', clause: 'EN 1993-1-1 Table 6.2', description: g.curves.row },
    { symbol: 'curve z-z', value: g.curves.z, unit: '', clause: 'EN 1993-1-1 Table 6.2', description: g.curves.row },
    { symbol: 'αy', value: g.alphaY, unit: '', clause: 'EN 1993-1-1 Table 6.1' },
    { symbol: 'αz', value: g.alphaZ, unit: '', clause: 'EN 1993-1-1 Table 6.1' },
  );
  return steps;
}
