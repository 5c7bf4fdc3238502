// Dynamic viscosity of air by Sutherland's law in its two-constant form,
// mu = beta T^1.5 / (T + S), with the constants of the U.S. Standard
// Atmosphere 1976 (NOAA-S/T 76-1562): beta = 1.458e-6, S = 110.4 K.

export const SUTHERLAND_BETA = 1.458e-6; // kg/(m s K^0.5)
export const SUTHERLAND_S = 110.4; // K

/** Dynamic viscosity (Pa s) of air at T (K). */
export function sutherlandViscosity(T: number, beta = SUTHERLAND_BETA, S = SUTHERLAND_S): number {
  return (beta * Math.pow(T, 1.5)) / (T + S);
}
