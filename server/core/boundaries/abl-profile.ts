// Atmospheric boundary-layer inflow for k-ε after Richards & Hoxey (1993),
// "Appropriate boundary conditions for computational wind engineering models
// using the k-ε turbulence model", J. Wind Eng. Ind. Aerodyn. 46–47, 145–153:
// u* = κ U_ref / ln((z_ref + z0)/z0), U(z) = u*/κ ln((z + z0)/z0),
// k = u*²/√Cμ, ε(z) = u*³/(κ (z + z0)), and the consistent ω = ε/(Cμ k).
import { TradeError } from '../shared/trade-error.js';
import { lengthText } from '../shared/words.js';

export const KAPPA = 0.41;

export interface AblPoint {
  z: number;
  U: number;
  k: number;
  epsilon: number;
  omega: number;
}

export interface AblProfile {
  u_star: number;
  k: number;
  at(z: number): AblPoint;
}

export function richardsHoxey(U_ref: number, z_ref: number, z0: number, kappa = KAPPA, Cmu = 0.09): AblProfile {
  if (!(z0 > 0)) throw new TradeError(`the roughness length z0 must be above zero (it is ${lengthText(z0)}); pick it from terrain(...) or a site survey`);
  if (!(z_ref > 0)) throw new TradeError(`the reference height z_ref must be above the ground (it is ${lengthText(z_ref)})`);
  if (!(U_ref > 0)) throw new TradeError('the reference speed U_ref must be above zero');
  if (!(kappa > 0)) throw new TradeError('the von Kármán constant kappa must be above zero');
  if (!(Cmu > 0)) throw new TradeError('C_mu must be above zero');
  const u_star = (kappa * U_ref) / Math.log((z_ref + z0) / z0);
  const k = (u_star * u_star) / Math.sqrt(Cmu);
  return {
    u_star,
    k,
    at(z) {
      if (!(z >= 0)) throw new TradeError(`a height of ${lengthText(z)} lies below the ground; heights start at 0 m`);
      const epsilon = u_star ** 3 / (kappa * (z + z0));
      return { z, U: (u_star / kappa) * Math.log((z + z0) / z0), k, epsilon, omega: epsilon / (Cmu * k) };
    },
  };
}
