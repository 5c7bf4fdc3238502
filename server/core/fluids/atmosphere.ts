// International Standard Atmosphere, ISO 2533:1975 (identical to the U.S.
// Standard Atmosphere 1976 in this range), for geopotential altitude H from
// 0 to 20 km: a troposphere with lapse rate 6.5 K/km up to 11 km, then an
// isothermal layer at 216.65 K; hydrostatic pressure with g0 = 9.80665 m/s^2.
// A geometric altitude Z is turned into H = r0 Z/(r0 + Z) first (USSA-1976).
import { TradeError } from '../shared/trade-error.js';
import { airProperties } from './air.js';
import { R_AIR } from './gas-constants.js';
import { exactText } from '../shared/words.js';

export const ISA_T0 = 288.15; // K
export const ISA_P0 = 101325; // Pa
export const ISA_G0 = 9.80665; // m/s^2
const LAPSE = 0.0065; // K/m, troposphere
const H_TROPOPAUSE = 11000; // m
/** Top of the isothermal layer, geopotential. */
export const GEOPOTENTIAL_TOP = 20000; // m
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
  if (!(H >= 0 && H <= GEOPOTENTIAL_TOP)) {
    throw new TradeError(`atmosphere() covers geopotential altitudes from 0 to 20 km; got geopotential = ${exactText(H)} m`);
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

/** Geometric altitude (m) of a geopotential altitude H (m): the inverse, Z = r0 H/(r0 − H). */
export function geometricAltitude(H: number): number {
  return (EARTH_RADIUS_GEOPOTENTIAL * H) / (EARTH_RADIUS_GEOPOTENTIAL - H);
}

/** Top of the covered range as a geometric altitude, 20 063.1 m, rounded down to whole metres for the guide. */
export const GEOMETRIC_TOP = Math.floor(geometricAltitude(GEOPOTENTIAL_TOP));

export interface AtmosphereAt extends AtmosphereState {
  /** Geopotential altitude, m. */
  H: number;
  /** Geometric altitude, m. */
  Z: number;
}

/** The standard atmosphere at a geopotential or a geometric altitude; both altitudes come back. */
export function atmosphereAt(at: { geopotential: number } | { geometric: number }): AtmosphereAt {
  if ('geometric' in at) {
    const Z = at.geometric;
    if (!(Z >= 0 && Z <= geometricAltitude(GEOPOTENTIAL_TOP))) {
      throw new TradeError(`atmosphere() covers geometric altitudes from 0 to 20.063 km (geopotential 0 to 20 km); got geometric = ${exactText(Z)} m`);
    }
    // At the very top the round trip may land a hair above 20 km; the range is the same one.
    const H = Math.min(geopotentialAltitude(Z), GEOPOTENTIAL_TOP);
    return { ...standardAtmosphere(H), H, Z };
  }
  const H = at.geopotential;
  return { ...standardAtmosphere(H), H, Z: geometricAltitude(H) };
}
