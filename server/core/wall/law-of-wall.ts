// Spalding's single formula for the law of the wall, from the viscous
// sublayer through the log layer, and the friction velocity it implies
// for a velocity sample at a known wall distance.
import { TradeError } from '../shared/trade-error.js';
import { exactText } from '../shared/words.js';

/** Log-law constants of Coles & Hirst (1968), used with Spalding's form (from memory). */
export const KAPPA = 0.41;
export const B = 5.0;

/**
 * Spalding (1961), "A single formula for the law of the wall", J. Appl. Mech. 28(3):
 * y+ = u+ + e^(−κB) [e^(κu+) − 1 − κu+ − (κu+)²/2 − (κu+)³/6], the form without the
 * fourth-order term, which the paper says fits equally well.
 */
export function spaldingYplus(uplus: number, kappa = KAPPA, b = B): number {
  const k = kappa * uplus;
  return uplus + Math.exp(-kappa * b) * (Math.exp(k) - 1 - k - (k * k) / 2 - (k * k * k) / 6);
}

/** u+ for a given y+: y+(u+) rises steadily and y+ ≥ u+, so the root lies in [0, y+] and bisection finds it. */
export function spaldingUplus(yplus: number, kappa = KAPPA, b = B): number {
  if (!(Number.isFinite(yplus) && yplus >= 0)) throw new TradeError(`y+ must be zero or positive, not ${exactText(yplus)}`);
  let lo = 0;
  let hi = yplus;
  for (let i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (spaldingYplus(mid, kappa, b) < yplus) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * Friction velocity from a sample U_p at wall distance y_p: with u+ = U_p/u_τ and
 * y+ = y_p u_τ/ν, the sample Reynolds number U_p y_p/ν equals u+·y+(u+), which
 * rises with u+; solve that for u+ by bisection and return u_τ = U_p/u+.
 */
export function frictionVelocity(Up: number, yp: number, nu: number, kappa = KAPPA, b = B): { u_tau: number; yplus: number; uplus: number } {
  if (!(Up > 0)) throw new TradeError(`the sampled velocity must be positive, not ${exactText(Up)} m/s`);
  if (!(yp > 0)) throw new TradeError(`the wall distance must be positive, not ${exactText(yp)} m`);
  if (!(nu > 0)) throw new TradeError(`the kinematic viscosity must be positive, not ${exactText(nu)} m^2/s`);
  const rep = (Up * yp) / nu;
  const g = (u: number) => u * spaldingYplus(u, kappa, b) - rep;
  let lo = 0;
  let hi = Math.sqrt(rep); // u+·y+ ≥ u+², so the root is at most √Re_p
  for (let i = 0; i < 300 && hi - lo > 1e-15 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (g(mid) < 0) lo = mid;
    else hi = mid;
  }
  const uplus = 0.5 * (lo + hi);
  return { u_tau: Up / uplus, yplus: rep / uplus, uplus };
}
