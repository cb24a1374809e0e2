// How node values read on the graph and in the forms. Plain trade words.
import type { Axes, Category, FaceName, Fixity, RestraintFaces } from '@shared/schema/stack.ts';

export const FIXITY_WORD: Record<Fixity | 'free', string> = {
  pinned: 'pinned',
  partial: 'partially fixed',
  fixed: 'fixed',
  free: 'free',
};

export const AXES_WORD: Record<Axes, string> = { both: 'both axes', y: 'y-y only', z: 'z-z only' };

/** EN 1991-1-1 Table 6.1 categories of use; H = roofs (Table 6.9). */
export const CATEGORY_WORD: Record<Category, string> = {
  A: 'A – domestic and residential',
  B: 'B – offices',
  C: 'C – areas where people may congregate',
  D: 'D – shopping areas',
  E: 'E – storage',
  H: 'H – roofs',
};

/** "G 120 kN · Q 45 kN (B)": characteristic loads as entered. */
export function loadsText(Gk: number, Qk: number, category: Category): string {
  return `Gk ${round(Gk)} kN · Qk ${round(Qk)} kN (${category})`;
}

const FACE_SHORT: Record<FaceName, string> = { yPlus: 'y+', yMinus: 'y−', zPlus: 'z+', zMinus: 'z−' };

/** "y+ 60/20 kN": the faces that carry a beam reaction, Gk/Qk; empty when none does. */
export function facesText(faces: RestraintFaces | undefined): string {
  if (!faces) return '';
  const parts = (Object.keys(FACE_SHORT) as FaceName[]).flatMap((k) => {
    const f = faces[k];
    return f && (f.Gk > 0 || f.Qk > 0) ? [`${FACE_SHORT[k]} ${round(f.Gk)}/${round(f.Qk)}`] : [];
  });
  return parts.length ? `${parts.join(' · ')} kN` : '';
}

function round(kN: number): string {
  return Number.isInteger(kN) ? String(kN) : kN.toFixed(1);
}
