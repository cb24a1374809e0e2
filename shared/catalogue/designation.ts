import type { SectionDims } from '../schema/stack.ts';

/** A dimension in mm as designations print it: "10", "6.3", "219.1". */
export function formatMm(n: number): string {
  return String(Math.round(n * 100) / 100);
}

const SERIES_ALIASES: Readonly<Record<string, string>> = {
  UC: 'UKC',
  UB: 'UKB',
  UKC: 'UKC',
  UKB: 'UKB',
  SHS: 'SHS',
  RHS: 'RHS',
  CHS: 'CHS',
};

/**
 * Canonical lookup key of a designation: upper case, one separator "X" between dimensions (× * x),
 * numbers without trailing zeros ("8.0" → "8"), and the usual spellings of a series folded into
 * ours ("HEB300", "HE 300B" → "HE 300 B"; "UC" → "UKC").
 */
export function designationKey(text: string): string {
  let key = text
    .normalize('NFKC')
    .trim()
    .toUpperCase()
    .replace(/[×*]/g, 'X')
    .replace(/\s*X\s*(?=[\d.])/g, 'X')
    .replace(/\s+/g, ' ')
    .replace(/\d+(?:\.\d+)?/g, (n) => String(Number(n)));
  const euro = /^HE ?([ABM]) ?(\d+)$/.exec(key) ?? /^HE ?(\d+) ?([ABM])$/.exec(key);
  if (euro) {
    const [size, letter] = /\d/.test(euro[1]!) ? [euro[1], euro[2]] : [euro[2], euro[1]];
    return `HE ${size} ${letter}`;
  }
  const ipe = /^IPE ?(\d+)$/.exec(key);
  if (ipe) return `IPE ${ipe[1]}`;
  const uk = /^(UKC|UKB|UC|UB|SHS|RHS|CHS) ?(.*)$/.exec(key);
  if (uk) key = `${SERIES_ALIASES[uk[1]!]} ${uk[2]}`.trim();
  return key;
}

/** Designation of a section given by its dimensions, e.g. "I 300x200x8x12 (welded)". */
export function dimsDesignation(dims: SectionDims): string {
  if (dims.shape === 'I') {
    const base = `I ${[dims.h, dims.b, dims.tw, dims.tf].map(formatMm).join('x')}`;
    return dims.make === 'welded' ? `${base} (welded)` : `${base} r${formatMm(dims.r)} (rolled)`;
  }
  if (dims.shape === 'RHS') {
    const series = dims.h === dims.b ? 'SHS' : 'RHS';
    return `${series} ${[dims.h, dims.b, dims.t].map(formatMm).join('x')} (${dims.make})`;
  }
  return `CHS ${formatMm(dims.d)}x${formatMm(dims.t)} (${dims.make})`;
}
