// The levels of an invented demo building: the ground, numbered floors and a roof, evenly spaced.

/** Ground, Level 1 … Level `floors` and Roof, `storeyHeight` m apart (elevations to the millimetre). */
export function storeyLevels(floors: number, storeyHeight: number): { name: string; elevation: number }[] {
  const names = ['Ground', ...Array.from({ length: floors }, (_, i) => `Level ${i + 1}`), 'Roof'];
  return names.map((name, i) => ({ name, elevation: Math.round(i * storeyHeight * 1000) / 1000 }));
}
