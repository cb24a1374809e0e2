// Page geometry, type sizes and colours of the calculation package (A4 portrait, points).
import { fileURLToPath } from 'node:url';

export const PAGE = { width: 595.28, height: 841.89 } as const;
export const MARGIN = { left: 48, right: 36, top: 62, bottom: 78 } as const;
/** The right-hand margin column that carries clause and equation references. */
export const REF_COLUMN = { x: 446, width: PAGE.width - MARGIN.right - 446 } as const;
/** Body text runs from the left margin to just short of the reference column. */
export const BODY = { x: MARGIN.left, width: REF_COLUMN.x - 10 - MARGIN.left, right: REF_COLUMN.x - 10 } as const;
export const FULL_WIDTH = PAGE.width - MARGIN.left - MARGIN.right;
export const CONTENT_BOTTOM = PAGE.height - MARGIN.bottom;

export const FONT = { regular: 'Body', bold: 'Body-Bold' } as const;
export const FONT_FILES = {
  [FONT.regular]: fileURLToPath(new URL('../../assets/fonts/DejaVuSans.ttf', import.meta.url)),
  [FONT.bold]: fileURLToPath(new URL('../../assets/fonts/DejaVuSans-Bold.ttf', import.meta.url)),
} as const;

export const SIZE = { title: 20, h1: 14, h2: 11, body: 8.5, table: 7.5, small: 6.5 } as const;
export const ROW_HEIGHT = 11;

export const COLOUR = {
  ink: '#1b1f24',
  muted: '#5b6570',
  rule: '#b9c0c7',
  band: '#eef1f4',
  accent: '#1f4e79',
  pass: '#2e7d4f',
  near: '#b7791f',
  fail: '#b3261e',
} as const;

/** Utilisation bands for drawing (common practice, no source): ≤ 0.9 comfortable, ≤ 1.0 close, > 1.0 fails. */
export function utilisationColour(u: number | null): string {
  if (u === null) return COLOUR.muted;
  if (u > 1) return COLOUR.fail;
  if (u > 0.9) return COLOUR.near;
  return COLOUR.pass;
}
