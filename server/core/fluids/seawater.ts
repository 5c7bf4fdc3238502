// Seawater at atmospheric pressure by Sharqawy, Lienhard and Zubair (2010),
// "Thermophysical properties of seawater: a review of existing correlations
// and data", Desalination and Water Treatment 16, 354-380: density Eq. (8),
// viscosity Eqs. (22)-(23) (equation numbers as recalled). Salinity S is in kg/kg (35 g/kg = 0.035).
import { TradeError } from '../shared/trade-error.js';
import { checkAbsolute } from './air.js';
import { celsiusText, EXACT, exactText } from '../shared/words.js';

/** Range where both correlations hold (the viscosity one ends at 150 g/kg); capped at 100 °C, boiling at 1 atm. */
export const SEAWATER_T_RANGE_K = [273.15, 373.15] as const;
export const SEAWATER_S_MAX = 0.15;

export interface SeawaterProperties {
  rho: number;
  mu: number;
  nu: number;
}

export function seawaterProperties(T: number, S: number): SeawaterProperties {
  checkAbsolute(T);
  if (T < SEAWATER_T_RANGE_K[0] || T > SEAWATER_T_RANGE_K[1]) {
    throw new TradeError(`seawater() covers 0 to 100 \u00b0C; got ${celsiusText(T, EXACT)}`);
  }
  if (!(S >= 0 && S <= SEAWATER_S_MAX)) {
    throw new TradeError(`seawater() covers salinities from 0 to 150 g/kg; got ${exactText(S * 1000)} g/kg`);
  }
  const t = T - 273.15;
  const rho = pureWaterDensity(t) + S * (802.0 - 2.001 * t + 1.677e-2 * t ** 2 - 3.06e-5 * t ** 3 - 1.613e-5 * S * t ** 2);
  const A = 1.541 + 1.998e-2 * t - 9.52e-5 * t ** 2;
  const B = 7.974 - 7.561e-2 * t + 4.724e-4 * t ** 2;
  const mu = pureWaterViscosity(t) * (1 + A * S + B * S * S);
  return { rho, mu, nu: mu / rho };
}

/** The paper's own fit for pure water inside Eq. (8), t in °C. */
function pureWaterDensity(t: number): number {
  return 999.9 + 2.034e-2 * t - 6.162e-3 * t ** 2 + 2.261e-5 * t ** 3 - 4.657e-8 * t ** 4;
}

/** The paper's Eq. (23), a fit to IAPWS 2008 pure-water viscosity, t in °C. */
function pureWaterViscosity(t: number): number {
  return 4.2844e-5 + 1 / (0.157 * (t + 64.993) ** 2 - 91.296);
}
