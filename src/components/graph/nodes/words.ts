// How node values read on the graph and in the forms. Plain trade words.
import type { Axes, Category, Fixity } from '@shared/schema/stack.ts';

export const FIXITY_WORD: Record<Fixity | 'free', string> = { pinned: 'pinned', partial: 'partially fixed', fixed: 'fixed', free: 'free' };

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

function round(kN: number): string {
  return Number.isInteger(kN) ? String(kN) : kN.toFixed(1);
}
