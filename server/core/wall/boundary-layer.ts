// Flat-plate boundary-layer thicknesses at a station x from the leading edge.
// Laminar below the transition Reynolds number, turbulent (from the leading
// edge) at and above it; the regime is reported so the sheet can say which was used.
import { checkSpeed, isLaminar } from '../shared/flow.js';
import { TradeError } from '../shared/trade-error.js';
import { exactText, numberText } from '../shared/words.js';
import { checkThinLayer } from './skin-friction.js';

export interface BoundaryLayer {
  Re_x: number;
  delta: number;
  delta_star: number;
  theta: number;
  regime: 'laminar' | 'turbulent';
  warnings: string[];
}

/** Upper end of the one-seventh power law (Schlichting, Boundary-Layer Theory, Eq. 21.12). */
const POWER_LAW_MAX = 1e7;

/**
 * Laminar: Blasius (1908) similarity solution, δ99 = 4.91 x/√Re_x, δ* = 1.721 x/√Re_x,
 * θ = 0.664 x/√Re_x (White, Viscous Fluid Flow §4-3; Schlichting ch. 7; from memory).
 * Turbulent: Prandtl's one-seventh power law, δ = 0.37 x Re_x^-1/5 (Schlichting Eq. 21.8),
 * whose profile u/U = (y/δ)^(1/7) integrates to δ* = δ/8 and θ = 7δ/72.
 */
export function boundaryLayer(U: number, x: number, nu: number): BoundaryLayer {
  checkSpeed(U, 'U', true);
  if (!(x > 0)) throw new TradeError(`the distance x = ${exactText(x)} m from the leading edge must be positive`);
  if (!(nu > 0)) throw new TradeError(`the kinematic viscosity nu = ${exactText(nu)} m^2/s must be positive`);
  const Re_x = (U * x) / nu;
  checkThinLayer(Re_x, x);
  const warnings: string[] = [];
  if (isLaminar(Re_x)) {
    const s = x / Math.sqrt(Re_x);
    return { Re_x, delta: 4.91 * s, delta_star: 1.721 * s, theta: 0.664 * s, regime: 'laminar', warnings };
  }
  if (Re_x > POWER_LAW_MAX) {
    warnings.push(
      `Re_x = ${numberText(Re_x)} is above ${numberText(POWER_LAW_MAX)}, the upper end of the one-seventh power law (Schlichting, Eq. 21.12); δ is an estimate.`,
    );
  }
  const delta = 0.37 * x * Math.pow(Re_x, -0.2);
  return { Re_x, delta, delta_star: delta / 8, theta: (7 * delta) / 72, regime: 'turbulent', warnings };
}
