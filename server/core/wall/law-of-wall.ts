// Spalding's single formula for the law of the wall, from the viscous
// sublayer through the log layer, and the friction velocity it implies
// for a velocity sample at a known wall distance.
import { TradeError } from '../shared/trade-error.js';

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

/** u+ for a given y+: y+(u+) rises steadily, so Newton steps kept inside a bracket converge. */
export function spaldingUplus(yplus: number, kappa = KAPPA, b = B): number {
  if (!(Number.isFinite(yplus) && yplus >= 0)) throw new TradeError(`y+ must be zero or positive, not ${yplus}`);
  if (yplus === 0) return 0;
  const f = (u: number) => spaldingYplus(u, kappa, b) - yplus;
  // y+ ≥ u+, so the root lies in [0, y+]; the log law bounds it far from the wall too.
  let lo = 0;
  let hi = Math.min(yplus, Math.max(1, Math.log(yplus) / kappa + b + 1));
  if (f(hi) < 0) hi = yplus;
  let u = 0.5 * (lo + hi);
  for (let i = 0; i < 100; i++) {
    const fu = f(u);
    if (fu < 0) lo = u;
    else hi = u;
    const k = kappa * u;
    const slope = 1 + kappa * Math.exp(-kappa * b) * (Math.exp(k) - 1 - k - (k * k) / 2);
    let next = u - fu / slope;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - u) <= 1e-14 * Math.max(1, u)) return next;
    u = next;
  }
  return u;
}

/**
 * Friction velocity from a sample U_p at wall distance y_p: with u+ = U_p/u_τ and
 * y+ = y_p u_τ/ν, the sample Reynolds number U_p y_p/ν equals u+·y+(u+), which
 * rises with u+; solve that for u+ by bisection and return u_τ = U_p/u+.
 */
export function frictionVelocity(Up: number, yp: number, nu: number, kappa = KAPPA, b = B): { u_tau: number; yplus: number; uplus: number } {
  if (!(Up > 0)) throw new TradeError('the sampled velocity must be positive');
  if (!(yp > 0)) throw new TradeError('the wall distance must be positive');
  if (!(nu > 0)) throw new TradeError('the kinematic viscosity must be positive');
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
