import type { CatalogueEntry, Series } from './types.ts';

/** [serial size, kg/m, h, b, tw, tf, r] of a UK rolled section. */
export type UkRow = readonly [serial: string, mass: number, h: number, b: number, tw: number, tf: number, r: number];
/** [size, h, b, tw, tf, r, kg/m] of a European rolled section. */
export type EuroRow = readonly [size: number, h: number, b: number, tw: number, tf: number, r: number, mass: number];

export function rolledRows(series: 'UKC' | 'UKB', rows: readonly UkRow[]): CatalogueEntry[] {
  return rows.map(([serial, mass, h, b, tw, tf, r]) => ({
    designation: `${series} ${serial}x${mass}`,
    series,
    dims: { shape: 'I', make: 'rolled', h, b, tw, tf, r },
    massPerMetre: mass,
  }));
}

export function euroRows(series: Series, name: (size: number) => string, rows: readonly EuroRow[]): CatalogueEntry[] {
  return rows.map(([size, h, b, tw, tf, r, mass]) => ({
    designation: name(size),
    series,
    dims: { shape: 'I', make: 'rolled', h, b, tw, tf, r },
    massPerMetre: mass,
  }));
}
