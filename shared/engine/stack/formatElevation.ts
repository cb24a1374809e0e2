/** Elevation as engineers print it on sections: signed, three decimals ("+8.000", "-1.500"). */
export function formatElevation(elevation: number): string {
  const rounded = Math.round(elevation * 1000) / 1000;
  return `${rounded < 0 ? '-' : '+'}${Math.abs(rounded).toFixed(3)}`;
}
