// Air as an ideal gas, R = R*/M0 of the U.S. Standard Atmosphere 1976,
// Sutherland viscosity (USSA-1976 constants) and a = sqrt(gamma R T), gamma = 1.4.
// Humid air: density from the partial pressures of dry air and vapour
// (Dalton's law, both ideal gases), vapour pressure = RH * p_sat(T) with
// p_sat from IAPWS-IF97 Eq. 30.
import { TradeError } from '../shared/trade-error.js';
import { GAMMA_AIR, R_AIR, R_VAPOUR } from './gas-constants.js';
import { saturationPressure } from './saturation.js';
import { sutherlandViscosity } from './sutherland.js';
import { celsiusText, EXACT, exactText, numberText } from '../shared/words.js';

export interface AirProperties {
  rho: number;
  mu: number;
  nu: number;
  a: number;
  /** Partial pressure of the water vapour, Pa. */
  vapourPressure: number;
}

/** Outside this range Sutherland's law drifts by more than about 2 % (White, Viscous Fluid Flow, 2006, Table 1-2; from memory). */
export const SUTHERLAND_RANGE_K = [170, 1900] as const;
const HUMID_RANGE_K = [273.15, 373.15] as const;
/**
 * Critical temperature of air, 132.5 K (Lemmon et al. 2000, J. Phys. Chem. Ref. Data 29(3); from memory).
 * Below it air can condense (at 1 atm it is liquid below about 79 K), so an ideal gas is no model for it.
 */
export const AIR_CRITICAL_K = 132.5;

export function airProperties(T: number, p: number, RH = 0): AirProperties {
  checkAbsolute(T);
  if (T < AIR_CRITICAL_K) {
    throw new TradeError(
      `T = ${celsiusText(T, EXACT)} is below ${celsiusText(AIR_CRITICAL_K, 5)} (${AIR_CRITICAL_K} K), the critical temperature of air: there air can be liquid ` +
        '(at 1 atm it condenses near −194 °C) and air() as an ideal gas does not hold; for a cryogenic gas give its properties with fluid(rho, mu)',
    );
  }
  if (!(p > 0)) throw new TradeError(`p = ${exactText(p)} Pa: the pressure must be above zero`);
  if (!(RH >= 0 && RH <= 1)) throw new TradeError(`RH = ${exactText(RH * 100)} % is outside 0 to 100 %`);
  let vapourPressure = 0;
  if (RH > 0) {
    if (T < HUMID_RANGE_K[0] || T > HUMID_RANGE_K[1]) {
      throw new TradeError(
        `humid air is covered from 0 to 100 \u00b0C (the saturation-pressure formula is for liquid water); got ${celsiusText(T, EXACT)}. ` +
          'Below 0 \u00b0C give RH: 0 %: at sea-level pressure the vapour changes the density by less than 0.3 % there',
      );
    }
    vapourPressure = RH * saturationPressure(T);
    if (vapourPressure >= p) {
      throw new TradeError(`the vapour pressure ${numberText(vapourPressure, { digits: 4 })} Pa at ${celsiusText(T)} reaches the total pressure ${numberText(p, { digits: 4 })} Pa: the water would boil`);
    }
  }
  const rho = (p - vapourPressure) / (R_AIR * T) + vapourPressure / (R_VAPOUR * T);
  const mu = sutherlandViscosity(T);
  return { rho, mu, nu: mu / rho, a: Math.sqrt(GAMMA_AIR * R_AIR * T), vapourPressure };
}

export function checkAbsolute(T: number, name = 'T'): void {
  if (!(T > 0)) throw new TradeError(`${name} = ${celsiusText(T, EXACT)} is ${T === 0 ? 'at' : 'below'} absolute zero`);
}
