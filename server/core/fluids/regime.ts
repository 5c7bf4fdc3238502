// Similarity numbers of a flow: Re = U L / nu, Ma = U / a, q = rho U^2 / 2,
// and a plain-words flat-plate regime. Thresholds are common practice:
// transition near Re_x = 5e5 on a smooth flat plate, and compressibility
// effects worth modelling above Ma = 0.3 (density change near 5 %).
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';

export const RE_TRANSITION = 5e5;
/** Above this share of laminar run the plate is called transitional rather than turbulent. */
export const LAMINAR_SHARE_TURBULENT = 0.1;
export const MACH_INCOMPRESSIBLE = 0.3;

export function reynoldsNumber(U: number, L: number, nu: number): number {
  if (!(L > 0)) throw new TradeError(`the length L = ${numberText(L, { digits: 4 })} m must be above zero`);
  if (!(nu > 0)) throw new TradeError(`the kinematic viscosity nu = ${numberText(nu, { digits: 4 })} m^2/s must be above zero`);
  return (Math.abs(U) * L) / nu;
}

export function machNumber(U: number, a: number): number {
  if (!(a > 0)) throw new TradeError(`the speed of sound a = ${numberText(a, { digits: 4 })} m/s must be above zero`);
  return Math.abs(U) / a;
}

export function dynamicPressure(U: number, rho: number): number {
  if (!(rho > 0)) throw new TradeError(`the density rho = ${numberText(rho, { digits: 4 })} kg/m^3 must be above zero`);
  return 0.5 * rho * U * U;
}

export type Regime = 'laminar' | 'transitional' | 'turbulent';

export interface RegimeVerdict {
  regime: Regime;
  /** Where transition is expected, as a share of the length (1 when the plate stays laminar). */
  laminarShare: number;
  explanation: string;
}

/** Flat-plate regime at the end of a run of length L. */
export function flatPlateRegime(Re: number): RegimeVerdict {
  const laminarShare = Math.min(1, RE_TRANSITION / Re);
  if (Re <= RE_TRANSITION) {
    return { regime: 'laminar', laminarShare, explanation: `Re = ${numberText(Re, { notation: 'sci' })} stays below ${numberText(RE_TRANSITION, { notation: 'sci' })}: a smooth flat plate of this length stays laminar` };
  }
  const where = `transition expected about ${numberText(laminarShare * 100, { digits: 2 })} % of the length from the leading edge`;
  if (laminarShare > LAMINAR_SHARE_TURBULENT) {
    return { regime: 'transitional', laminarShare, explanation: `Re = ${numberText(Re, { notation: 'sci' })}: ${where}, so a large laminar part remains` };
  }
  return { regime: 'turbulent', laminarShare, explanation: `Re = ${numberText(Re, { notation: 'sci' })}: ${where}; the boundary layer is turbulent over most of the length` };
}

/** Warnings about compressibility, or none below Ma 0.3. */
export function compressibilityWarnings(Ma: number): string[] {
  if (Ma >= 1) return [`Ma = ${numberText(Ma, { digits: 3 })}: supersonic flow; shocks form and an incompressible set-up does not apply`];
  if (Ma > MACH_INCOMPRESSIBLE) return [`Ma = ${numberText(Ma, { digits: 3 })} is above 0.3: density changes exceed about 5 %, so use a compressible solver set-up`];
  return [];
}
