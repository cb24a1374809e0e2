// Rolled I and H sections. The rows are data, in tables/rolled.json, one array per series; this module says
// where they come from and turns each row into a catalogue entry. h, b, tw, tf, r in mm, mass in kg/m.
//
// UKC, universal columns: BS 4-1:2005 range plus the sizes marked "+" in SCI P363 (steel building design:
// design data): the 356x406 sizes from 744 to 1299 kg/m (the EN 10365 HD 400 series) and the heavier 203 and
// 152 serial sizes, typed from memory of those tables. 356x406x900 and heavier have h/b > 1.2 with tf > 100 mm,
// for which EN 1993-1-1 Table 6.2 gives no buckling curve; the engine refuses them as unsupported.
//
// UKB, universal beams: BS 4-1:2005 range from 914x419 down to 127x76, as tabulated in SCI P363, typed from
// memory of those tables; the rows from 914x419x388 to 610x229x101 are also checked against a stored copy of
// the published table (tests/engine/catalogue-published.test.ts). The 1016x305 and other sizes marked "+" (not
// in BS 4-1) are not included.
//
// HE A, HE B, HE M and IPE: EN 10365:2017 dimensions (the former EURONORM 53 / DIN 1025 series), typed from
// memory of the product tables; the IPE depths and masses are also checked against a stored copy of a published
// table (tests/engine/catalogue-published.test.ts).
//
// Every row is checked by the mass test (computed vs designation or nominal mass ±2%, catalogue.test.ts).
import { z } from 'zod';
import tables from './tables/rolled.json' with { type: 'json' };
import type { CatalogueEntry, Series } from './types.ts';

const mm = z.number().positive();
/** UK rows: [serial size, kg/m, h, b, tw, tf, r]. */
const ukRows = z.array(z.tuple([z.string().regex(/^\d+x\d+$/), mm, mm, mm, mm, mm, mm]));
/** European rows: [size, h, b, tw, tf, r, kg/m]. */
const euroRows = z.array(z.tuple([z.number().int().positive(), mm, mm, mm, mm, mm, mm]));
const rolledTables = z.strictObject({
  UKC: ukRows,
  UKB: ukRows,
  'HE A': euroRows,
  'HE B': euroRows,
  'HE M': euroRows,
  IPE: euroRows,
});
const rows = rolledTables.parse(tables);

function entry(
  designation: string,
  series: Series,
  mass: number,
  h: number,
  b: number,
  tw: number,
  tf: number,
  r: number,
) {
  return {
    designation,
    series,
    dims: { shape: 'I', make: 'rolled', h, b, tw, tf, r },
    massPerMetre: mass,
  } satisfies CatalogueEntry;
}

function ukSeries(series: 'UKC' | 'UKB'): CatalogueEntry[] {
  return rows[series].map(([serial, mass, h, b, tw, tf, r]) =>
    entry(`${series} ${serial}x${mass}`, series, mass, h, b, tw, tf, r),
  );
}

function euroSeries(series: 'HE A' | 'HE B' | 'HE M' | 'IPE', name: (size: number) => string): CatalogueEntry[] {
  return rows[series].map(([size, h, b, tw, tf, r, mass]) => entry(name(size), series, mass, h, b, tw, tf, r));
}

export const UKC: readonly CatalogueEntry[] = ukSeries('UKC');
export const UKB: readonly CatalogueEntry[] = ukSeries('UKB');
export const HE_A: readonly CatalogueEntry[] = euroSeries('HE A', (n) => `HE ${n} A`);
export const HE_B: readonly CatalogueEntry[] = euroSeries('HE B', (n) => `HE ${n} B`);
export const HE_M: readonly CatalogueEntry[] = euroSeries('HE M', (n) => `HE ${n} M`);
export const IPE: readonly CatalogueEntry[] = euroSeries('IPE', (n) => `IPE ${n}`);
