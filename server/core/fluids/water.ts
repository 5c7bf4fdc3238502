// Liquid water from 0 to 100 °C: density by IAPWS-IF97 region 1 (IAPWS
// R7-97(2012)), viscosity by IAPWS R12-08 (2008) at that density.
import { TradeError } from '../shared/trade-error.js';
import { checkAbsolute } from './air.js';
import { saturationPressure } from './saturation.js';
import { waterDensity } from './water-density.js';
import { waterViscosity } from './water-viscosity.js';
import { celsiusText, EXACT, exactText, numberText } from '../shared/words.js';

export const WATER_RANGE_K = [273.15, 373.15] as const;
/** Upper pressure limit of IF97 region 1. */
const P_MAX = 100e6;
/**
 * Tolerance on the boiling check, so that 100 °C at one standard atmosphere
 * (0.03 K above the normal boiling point) stays inside the stated range.
 */
const BOILING_SLACK = 0.001;

export interface WaterProperties {
  rho: number;
  mu: number;
  nu: number;
}

export function waterProperties(T: number, p: number): WaterProperties {
  checkAbsolute(T);
  if (T < WATER_RANGE_K[0] || T > WATER_RANGE_K[1]) {
    throw new TradeError(`water() covers liquid water from 0 to 100 \u00b0C; got ${celsiusText(T, EXACT)}`);
  }
  if (!(p > 0 && p <= P_MAX)) {
    throw new TradeError(`water() covers pressures above 0 and up to 100 MPa; got p = ${exactText(p)} Pa`);
  }
  const pSat = saturationPressure(T);
  if (p < pSat * (1 - BOILING_SLACK)) {
    throw new TradeError(`at ${celsiusText(T)} water boils below ${numberText(pSat, { digits: 4 })} Pa; got p = ${exactText(p)} Pa, so this is steam, not liquid water`);
  }
  const rho = waterDensity(T, p);
  const mu = waterViscosity(T, rho);
  return { rho, mu, nu: mu / rho };
}
