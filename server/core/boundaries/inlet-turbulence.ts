// Turbulence at an inlet from an intensity and a length scale (or an eddy-
// viscosity ratio): k = 3/2 (U I)², ε = Cμ^(3/4) k^(3/2) / ℓ, ω = k^(1/2) / (Cμ^(1/4) ℓ),
// ν_t = k / ω; CFD-Wiki, "Turbulence free-stream boundary conditions" (k, ε;
// ω = ε/(Cμ k) from memory). Duct length scale ℓ = 0.07 D_h: CFD-Wiki,
// "Turbulence length scale". ℓ here is the one in the ε formula above; the
// other convention, ℓ = Cμ k^(3/2)/ε, is Cμ^(1/4) (0.548) times it.
import { TradeError } from '../shared/trade-error.js';
import { numberText, percentText } from '../shared/words.js';

export const C_MU = 0.09;
/** ℓ = 0.07 D_h in a fully developed pipe or duct flow (CFD-Wiki, "Turbulence length scale"). */
export const DUCT_LENGTH_FACTOR = 0.07;

export type LengthGiven = { length: number } | { ratio: number };

export interface InletTurbulence {
  k: number;
  epsilon: number;
  omega: number;
  nut: number;
  nut_ratio: number;
  length: number;
  /** Which of length and viscosity ratio was given; the other is derived. */
  given: 'length' | 'ratio';
}

export function inletTurbulence(U: number, intensity: number, scale: LengthGiven, nu: number, Cmu = C_MU): InletTurbulence {
  if (!(Math.abs(U) > 0)) throw new TradeError('the inlet speed U must not be zero');
  if (!(intensity > 0)) throw new TradeError('the turbulence intensity must be above zero, e.g. intensity: 1 %');
  if (intensity > 1) {
    throw new TradeError(`an intensity of ${numberText(intensity)} is ${percentText(intensity)}; write the per cent sign if you meant ${numberText(intensity)} %`);
  }
  if (!(nu > 0)) throw new TradeError('the fluid\u2019s kinematic viscosity must be above zero');
  if (!(Cmu > 0)) throw new TradeError('C_mu must be above zero');
  const k = 1.5 * (U * intensity) ** 2;
  let length: number;
  if ('length' in scale) {
    if (!(scale.length > 0)) throw new TradeError('the length scale must be above zero');
    length = scale.length;
  } else {
    if (!(scale.ratio > 0)) throw new TradeError('the viscosity ratio must be above zero');
    // ν_t = ratio · ν and ν_t = k/ω = Cμ^(1/4) k^(1/2) ℓ give ℓ.
    length = (scale.ratio * nu) / (Cmu ** 0.25 * Math.sqrt(k));
  }
  const epsilon = (Cmu ** 0.75 * k ** 1.5) / length;
  const omega = Math.sqrt(k) / (Cmu ** 0.25 * length);
  const nut = k / omega;
  return { k, epsilon, omega, nut, nut_ratio: nut / nu, length, given: 'length' in scale ? 'length' : 'ratio' };
}

export function ductLengthScale(Dh: number): number {
  if (!(Dh > 0)) throw new TradeError('the hydraulic diameter must be above zero');
  return DUCT_LENGTH_FACTOR * Dh;
}
