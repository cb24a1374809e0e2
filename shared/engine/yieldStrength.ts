import type { Annex } from '../schema/results.ts';
import type { Grade } from '../schema/stack.ts';
import { EngineError } from './errors.ts';

/** What the steel is made into, which decides the product standard. */
export type Product = 'rolled' | 'welded' | 'hot-finished' | 'cold-formed';

type Band = readonly [maxThickness: number, fy: Readonly<Partial<Record<Grade, number>>>];

// EN 10025-2:2004 Table 7, minimum ReH by nominal thickness. S420 and S460 are not EN 10025-2
// grades: their rows are the EN 10025-3 (N/NL) values, which above 63 mm are the lower of
// EN 10025-3 and EN 10025-4 (M/ML), so either product is covered.
const PLATES_AND_SECTIONS: readonly Band[] = [
  [16, { S235: 235, S275: 275, S355: 355, S420: 420, S460: 460 }],
  [40, { S235: 225, S275: 265, S355: 345, S420: 400, S460: 440 }],
  [63, { S235: 215, S275: 255, S355: 335, S420: 390, S460: 430 }],
  [80, { S235: 215, S275: 245, S355: 325, S420: 370, S460: 410 }],
  [100, { S235: 215, S275: 235, S355: 315, S420: 360, S460: 400 }],
  [150, { S235: 195, S275: 225, S355: 295 }],
];

// EN 10210-1:2006 Table A.3 (S235H … S355H) and Table B.3 (S420NH, S460NH), hot-finished hollow sections.
const HOT_FINISHED: readonly Band[] = [
  [16, { S235: 235, S275: 275, S355: 355, S420: 420, S460: 460 }],
  [40, { S235: 225, S275: 265, S355: 345, S420: 400, S460: 440 }],
  [63, { S235: 215, S275: 255, S355: 335, S420: 390, S460: 430 }],
];

// EN 10219-1:2006 Table A.3 (S235JRH … S355J2H) and Table B.3 (S420MH, S460MH); wall thickness up to 40 mm.
const COLD_FORMED: readonly Band[] = [
  [16, { S235: 235, S275: 275, S355: 355, S420: 420, S460: 460 }],
  [40, { S235: 225, S275: 265, S355: 345, S420: 400, S460: 440 }],
];

// EN 1993-1-1 Table 3.1: one value for t ≤ 40 mm and one for 40 < t ≤ 80 mm.
const TABLE_3_1_SECTIONS: readonly Band[] = [
  [40, { S235: 235, S275: 275, S355: 355, S420: 420, S460: 460 }],
  [80, { S235: 215, S275: 255, S355: 335, S420: 390, S460: 430 }],
];
const TABLE_3_1_HOT_FINISHED = TABLE_3_1_SECTIONS;
// Table 3.1 gives cold-formed hollow sections (EN 10219-1) a t ≤ 40 mm row only.
const TABLE_3_1_COLD_FORMED: readonly Band[] = [[40, { S235: 235, S275: 275, S355: 355, S420: 420, S460: 460 }]];

const SOURCES: Readonly<Record<Annex, Readonly<Record<Product, readonly [readonly Band[], string]>>>> = {
  UK: {
    rolled: [PLATES_AND_SECTIONS, 'EN 10025-2 Table 7'],
    welded: [PLATES_AND_SECTIONS, 'EN 10025-2 Table 7'],
    'hot-finished': [HOT_FINISHED, 'EN 10210-1 Table A.3'],
    'cold-formed': [COLD_FORMED, 'EN 10219-1 Table A.3'],
  },
  EN: {
    rolled: [TABLE_3_1_SECTIONS, 'EN 1993-1-1 Table 3.1'],
    welded: [TABLE_3_1_SECTIONS, 'EN 1993-1-1 Table 3.1'],
    'hot-finished': [TABLE_3_1_HOT_FINISHED, 'EN 1993-1-1 Table 3.1'],
    'cold-formed': [TABLE_3_1_COLD_FORMED, 'EN 1993-1-1 Table 3.1'],
  },
};

/** Where a yield strength was read from, for the calculation sheet. */
export function yieldStrengthSource(product: Product, annex: Annex): string {
  return SOURCES[annex][product][1];
}

/**
 * Nominal yield strength fy (N/mm²) of the thickest element t (mm). Annex 'UK' reads the product
 * standard (as the UK National Annex to EN 1993-1-1 NA.2.4 directs); annex 'EN' reads Table 3.1.
 */
export function yieldStrength(grade: Grade, t: number, product: Product, annex: Annex = 'UK'): number {
  if (!Number.isFinite(t) || t <= 0)
    throw new EngineError('invalid_input', `Thickness must be a finite number above zero, got ${t} mm.`);
  const source = SOURCES[annex]?.[product];
  if (!source)
    throw new EngineError('invalid_input', `Unknown annex "${String(annex)}" or product "${String(product)}".`);
  const [bands, name] = source;
  for (const [maxT, values] of bands) {
    if (t <= maxT) {
      const fy = values[grade];
      if (fy === undefined) break;
      return fy;
    }
  }
  throw new EngineError(
    'unsupported',
    `${name} gives no yield strength for ${grade} at a thickness of ${t} mm (${product} product).`,
  );
}
