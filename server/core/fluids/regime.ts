// Similarity numbers of a flow: Re = U L / nu, Ma = U / a, q = rho U^2 / 2,
// and a plain-words flat-plate regime. Thresholds are common practice and
// shared with the near-wall family (core/shared/flow.ts): transition at
// Re_x = 5e5 on a smooth flat plate, compressibility above Ma = 0.3.
import { checkSpeed, isLaminar, RE_TRANSITION } from '../shared/flow.js';
import { TradeError } from '../shared/trade-error.js';
import { exactText, numberText } from '../shared/words.js';

/** Above this share of laminar run the plate is called transitional rather than turbulent. */
export const LAMINAR_SHARE_TURBULENT = 0.1;

export function reynoldsNumber(U: number, L: number, nu: number): number {
  checkSpeed(U, 'U', false);
  if (!(L > 0)) throw new TradeError(`the length L = ${exactText(L)} m must be above zero`);
  if (!(nu > 0)) throw new TradeError(`the kinematic viscosity nu = ${exactText(nu)} m^2/s must be above zero`);
  return (U * L) / nu;
}

export function machNumber(U: number, a: number): number {
  checkSpeed(U, 'U', false);
  if (!(a > 0)) throw new TradeError(`the speed of sound a = ${exactText(a)} m/s must be above zero`);
  return U / a;
}

export function dynamicPressure(U: number, rho: number): number {
  checkSpeed(U, 'U', false);
  if (!(rho > 0)) throw new TradeError(`the density rho = ${exactText(rho)} kg/m^3 must be above zero`);
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
  const re = numberText(Re, { notation: 'sci' });
  if (isLaminar(Re)) {
    return { regime: 'laminar', laminarShare, explanation: `Re = ${re} stays below ${numberText(RE_TRANSITION, { notation: 'sci' })}: a smooth flat plate of this length stays laminar` };
  }
  const where = `transition expected about ${numberText(laminarShare * 100, { digits: 2 })} % of the length from the leading edge`;
  if (laminarShare > LAMINAR_SHARE_TURBULENT) {
    return { regime: 'transitional', laminarShare, explanation: `Re = ${re}: ${where}, so a large laminar part remains` };
  }
  return { regime: 'turbulent', laminarShare, explanation: `Re = ${re}: ${where}; the boundary layer is turbulent over most of the length` };
}
