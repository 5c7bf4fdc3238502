// Rules of the free stream that several families apply, each defined once:
// the flat-plate transition threshold, the sign of a speed, and when
// compressibility matters.
import { TradeError } from './trade-error.js';
import { exactText, numberText } from './words.js';

/**
 * Transition of a smooth flat plate at zero pressure gradient, Re_x = 5e5, as
 * White, Fluid Mechanics §7.4 (Eq. 7.49a) takes it (common practice).
 */
export const RE_TRANSITION = 5e5;

/** The one comparison with the threshold: laminar below 5e5, turbulent at and above. */
export function isLaminar(re: number): boolean {
  return re < RE_TRANSITION;
}

/**
 * Speeds are magnitudes: a negative speed is refused everywhere (its direction
 * belongs to the set-up, not to the number), in the same words. Zero is refused
 * where the result would need a flow (`positive`).
 */
export function checkSpeed(U: number, name: string, positive: boolean): void {
  if (!Number.isFinite(U)) throw new TradeError(`${name} = ${exactText(U)} m/s is not a finite speed`);
  if (U < 0) throw new TradeError(`${name} = ${exactText(U)} m/s is negative; give the speed's magnitude (speeds are not signed here)`);
  if (positive && U === 0) throw new TradeError(`${name} = 0 m/s: this needs a flow, so the speed must be above zero`);
}

/** Above this Mach number density changes exceed about 5 % (common practice). */
export const MACH_INCOMPRESSIBLE = 0.3;
/** From about this Mach number the flow is hypersonic: air is no longer an ideal gas of constant γ behind shocks (common practice). */
export const MACH_HYPERSONIC = 5;

/** Warnings about compressibility, or none at or below Ma 0.3. */
export function compressibilityWarnings(Ma: number): string[] {
  const ma = numberText(Ma);
  if (Ma >= MACH_HYPERSONIC) {
    return [`Ma = ${ma}: hypersonic flow, far outside an incompressible set-up (check the speed and its unit); shocks and real-gas effects need a compressible, high-temperature model`];
  }
  if (Ma >= 1) return [`Ma = ${ma}: supersonic flow; shocks form and an incompressible set-up does not apply`];
  if (Ma > MACH_INCOMPRESSIBLE) return [`Ma = ${ma} is above 0.3: density changes exceed about 5 %, so use a compressible solver set-up`];
  return [];
}
