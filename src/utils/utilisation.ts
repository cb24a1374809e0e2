// Our own three-band scale for utilisation (common practice, no source): comfortable up to 0.85,
// close to the limit up to 1.00, over the limit above it. The legend on every table states it.
export type UtilisationBand = 'ok' | 'near' | 'over';

export const NEAR_LIMIT_FROM = 0.85;
export const LIMIT = 1.0;

export function utilisationBand(u: number): UtilisationBand {
  if (u > LIMIT) return 'over';
  if (u > NEAR_LIMIT_FROM) return 'near';
  return 'ok';
}

/** Quasar colour names for each band (brand palette, quasar-variables.sass). */
export const BAND_COLOUR: Record<UtilisationBand, string> = { ok: 'positive', near: 'warning', over: 'negative' };

export const BAND_LABEL: Record<UtilisationBand, string> = {
  ok: `up to ${NEAR_LIMIT_FROM.toFixed(2)}`,
  near: `${NEAR_LIMIT_FROM.toFixed(2)} to ${LIMIT.toFixed(2)}`,
  over: `over ${LIMIT.toFixed(2)}`,
};
