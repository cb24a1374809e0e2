// Tributary areas from the grid, each against a hand figure (common practice, no source: half the bay to
// each side of the column, and the slab beyond an edge line up to the edge).
import { describe, expect, it } from 'vitest';
import { sideWidths, tributaryArea } from '../../shared/engine/building/tributaryArea.ts';
import type { Grid } from '../../shared/schema/building.ts';
import { GRID } from './building-model-fixtures.ts';

const REGULAR: Grid = {
  x: { lines: ['A', 'B', 'C'].map((n, i) => ({ id: n, name: n, position: 6 * i })), edgeBefore: 0, edgeAfter: 0 },
  y: { lines: ['1', '2', '3'].map((n, i) => ({ id: `y${n}`, name: n, position: 6 * i })), edgeBefore: 0, edgeAfter: 0 },
};

describe('tributary area on a regular 6 m × 6 m grid', () => {
  it('an internal column takes half of each bay each way: (3 + 3)(3 + 3) = 36 m²', () => {
    expect(tributaryArea(REGULAR, 'B', 'y2')!.area).toBeCloseTo(36, 12);
  });
  it('an edge column with no slab beyond the line: (0 + 3)(3 + 3) = 18 m²', () => {
    expect(tributaryArea(REGULAR, 'A', 'y2')!.area).toBeCloseTo(18, 12);
  });
  it('a corner column: (0 + 3)(0 + 3) = 9 m²', () => {
    expect(tributaryArea(REGULAR, 'A', 'y1')!.area).toBeCloseTo(9, 12);
  });
});

describe('tributary area on an irregular grid with a cantilever and slab edges', () => {
  it('B/2 between bays of 6 and 7.5 m: (6/2 + 7.5/2)(7.5/2 + 7.5/2) = 6.75 × 7.5 = 50.625 m²', () => {
    const t = tributaryArea(GRID, 'B', 'y2')!;
    expect(t.widths).toEqual({ xMinus: 3, xPlus: 3.75, yMinus: 3.75, yPlus: 3.75 });
    expect(t.area).toBeCloseTo(50.625, 12);
  });
  it('D/2 on the edge with a 1.5 m cantilever: (7.5/2 + 1.5)(7.5) = 5.25 × 7.5 = 39.375 m²', () => {
    expect(tributaryArea(GRID, 'D', 'y2')!.area).toBeCloseTo(39.375, 12);
  });
  it('A/1 at a corner with 0.3 m of slab beyond A and none beyond 1: (0.3 + 3)(0 + 3.75) = 12.375 m²', () => {
    expect(tributaryArea(GRID, 'A', 'y1')!.area).toBeCloseTo(12.375, 12);
  });
  it('D/3 at the opposite corner: (3.75 + 1.5)(3.75 + 0.2) = 5.25 × 3.95 = 20.7375 m²', () => {
    expect(tributaryArea(GRID, 'D', 'y3')!.area).toBeCloseTo(20.7375, 12);
  });
  it('reads the lines in order of position, whatever order they are listed in', () => {
    const shuffled: Grid = { ...GRID, x: { ...GRID.x, lines: [...GRID.x.lines].reverse() } };
    expect(sideWidths(shuffled.x, 'C')).toEqual({ before: 3.75, after: 3.75 });
  });
  it('is null for a line the grid does not have', () => {
    expect(tributaryArea(GRID, 'E', 'y2')).toBeNull();
  });
});

describe('an area set by hand', () => {
  it('a void over half the bay as a factor: 0.5 × 50.625 = 25.3125 m², the grid figure kept beside it', () => {
    const t = tributaryArea(GRID, 'B', 'y2', { levelId: 'L1', factor: 0.5, reason: 'Stair void' })!;
    expect(t.area).toBeCloseTo(25.3125, 12);
    expect(t.gridArea).toBeCloseTo(50.625, 12);
    expect(t.override?.reason).toBe('Stair void');
  });
  it('a core as an area: 12 m² replaces the grid figure', () => {
    expect(tributaryArea(GRID, 'B', 'y2', { levelId: 'L1', area: 12, reason: 'Core wall takes the rest' })!.area).toBe(
      12,
    );
  });
});
