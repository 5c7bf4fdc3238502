// International Standard Atmosphere, ISO 2533:1975 (identical to the U.S.
// Standard Atmosphere 1976 in this range), for geopotential altitude H from
// 0 to 20 km: a troposphere with lapse rate 6.5 K/km up to 11 km, then an
// isothermal layer at 216.65 K; hydrostatic pressure with g0 = 9.80665 m/s^2.
import { TradeError } from '../shared/trade-error.js';
import { airProperties } from './air.js';
import { R_AIR } from './gas-constants.js';
import { numberText } from '../shared/words.js';

export const ISA_T0 = 288.15; // K
export const ISA_P0 = 101325; // Pa
export const ISA_G0 = 9.80665; // m/s^2
const LAPSE = 0.0065; // K/m, troposphere
const H_TROPOPAUSE = 11000; // m
const H_TOP = 20000; // m, top of the isothermal layer
/** Radius used by USSA-1976 to relate geometric and geopotential altitude. */
export const EARTH_RADIUS_GEOPOTENTIAL = 6356766; // m

export interface AtmosphereState {
  T: number;
  p: number;
  rho: number;
  mu: number;
  nu: number;
  a: number;
}

export function standardAtmosphere(H: number): AtmosphereState {
  if (!(H >= 0 && H <= H_TOP)) {
    throw new TradeError(`atmosphere() covers geopotential altitudes from 0 to 20 km; got h = ${numberText(H, { digits: 4 })} m`);
  }
  const T = H <= H_TROPOPAUSE ? ISA_T0 - LAPSE * H : ISA_T0 - LAPSE * H_TROPOPAUSE;
  const p = H <= H_TROPOPAUSE ? troposphereP(H) : troposphereP(H_TROPOPAUSE) * Math.exp((-ISA_G0 * (H - H_TROPOPAUSE)) / (R_AIR * T));
  const { rho, mu, nu, a } = airProperties(T, p, 0);
  return { T, p, rho, mu, nu, a };
}

function troposphereP(H: number): number {
  const T = ISA_T0 - LAPSE * H;
  return ISA_P0 * Math.pow(T / ISA_T0, ISA_G0 / (R_AIR * LAPSE));
}

/** Geopotential altitude (m) of a geometric altitude Z (m), USSA-1976. */
export function geopotentialAltitude(Z: number): number {
  return (EARTH_RADIUS_GEOPOTENTIAL * Z) / (EARTH_RADIUS_GEOPOTENTIAL + Z);
}
