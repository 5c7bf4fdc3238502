// Time scales of a transient run: the step for a target Courant number,
// Δt = C Δx / U (Courant, Friedrichs & Lewy 1928, Math. Ann. 100, 32–74); the
// flow-through time L / U; and vortex shedding f = St U / D, T = 1/f (Strouhal
// number by definition; values from Roshko 1954 and Okajima 1982, see entries).
import { TradeError } from '../shared/trade-error.js';

export function courantStep(U: number, dx: number, courant: number): number {
  if (!(U > 0)) throw new TradeError('the speed U must be above zero');
  if (!(dx > 0)) throw new TradeError('the cell size dx must be above zero');
  if (!(courant > 0)) throw new TradeError('the Courant number must be above zero');
  return (courant * dx) / U;
}

export function flowThroughTime(length: number, U: number): number {
  if (!(length > 0)) throw new TradeError('the length must be above zero');
  if (!(U > 0)) throw new TradeError('the speed U must be above zero');
  return length / U;
}

export interface Shedding {
  frequency: number;
  period: number;
  /** Steps per shedding period, when a step is given. */
  steps?: number;
}

export function shedding(U: number, D: number, St: number, dt?: number): Shedding {
  if (!(U > 0)) throw new TradeError('the speed U must be above zero');
  if (!(D > 0)) throw new TradeError('the body size D must be above zero');
  if (!(St > 0)) throw new TradeError('the Strouhal number St must be above zero');
  const frequency = (St * U) / D;
  const period = 1 / frequency;
  if (dt === undefined) return { frequency, period };
  if (!(dt > 0)) throw new TradeError('the time step dt must be above zero');
  return { frequency, period, steps: period / dt };
}
