// Fixed values of the simplified design of columns in simple construction (nominal moments and the
// combined check). The method is the one published as NCCI SN048b (verification of columns in simple
// construction, a simplified interaction criterion) and SCI P358/P360; cited from memory.

/** Beam reactions act 100 mm from the face of the column (common practice for simple construction, from memory). */
export const REACTION_OFFSET_MM = 100;

/** At or below this ratio of the stiffnesses EI/L above and below a floor, the moment is shared equally. */
export const EQUAL_SHARE_RATIO = 1.5;

/** Weight of the minor-axis moment term in the simplified interaction (NCCI SN048b, from memory). */
export const MINOR_AXIS_FACTOR = 1.5;

/** λ̄LT = 0.9·λ̄z for rolled I and H columns in simple construction (NCCI SN048b, from memory). */
export const ROLLED_LTB_SLENDERNESS_FACTOR = 0.9;

/** Shear modulus G = E / (2(1 + ν)), ν = 0.3 (EN 1993-1-1 3.2.6(1)): 80 769 N/mm². */
export const G_STEEL = 210_000 / (2 * 1.3);
