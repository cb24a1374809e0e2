/** Modulus of elasticity, N/mm² (EN 1993-1-1 3.2.6(1)). */
export const E_STEEL = 210_000;

/** Density of steel, kg/m³ (EN 1991-1-1 Table A.4; the basis of tabulated section masses). */
export const STEEL_DENSITY = 7850;
