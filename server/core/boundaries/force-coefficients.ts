// Force and moment coefficients from the loads of a simulation:
// C = F / (q A) with q = ½ ρ U², C_m = M / (q A l_ref) (definitions, e.g. Hucho,
// Aerodynamics of Road Vehicles, 4th ed., 1998, ch. 4). Axes: x streamwise
// (drag), y lateral (side force), z up (lift).
import { TradeError } from '../shared/trade-error.js';

export interface ForceCoefficients {
  q: number;
  Cd: number;
  Cs: number;
  Cl: number;
  Cm?: number;
}

export function forceCoefficients(F: readonly [number, number, number], rho: number, U: number, A: number, M?: number, l_ref?: number): ForceCoefficients {
  if (!(rho > 0)) throw new TradeError('the fluid density must be above zero');
  if (!(Math.abs(U) > 0)) throw new TradeError('the reference speed U must not be zero');
  if (!(A > 0)) throw new TradeError('the reference area A must be above zero');
  const q = 0.5 * rho * U * U;
  const r: ForceCoefficients = { q, Cd: F[0] / (q * A), Cs: F[1] / (q * A), Cl: F[2] / (q * A) };
  if (M !== undefined) {
    if (l_ref === undefined) throw new TradeError('a moment coefficient needs the reference length: give l_ref: as well as M:');
    if (!(l_ref > 0)) throw new TradeError('the reference length l_ref must be above zero');
    r.Cm = M / (q * A * l_ref);
  }
  return r;
}
