// Gas constants of the U.S. Standard Atmosphere 1976 (identical in ISO 2533:1975):
// R* = 8.31432 J/(mol K) and the sea-level molar mass M0 = 28.9644 kg/kmol,
// so that R = R*/M0 = 287.053 J/(kg K) for dry air.

export const R_UNIVERSAL = 8314.32; // J/(kmol K), USSA-1976 value
export const M_AIR = 28.9644; // kg/kmol
export const M_WATER = 18.01528; // kg/kmol, as in the CIPM-2007 air-density equation (Picard et al. 2008)
export const R_AIR = R_UNIVERSAL / M_AIR; // J/(kg K)
export const R_VAPOUR = R_UNIVERSAL / M_WATER; // J/(kg K)
export const GAMMA_AIR = 1.4;
