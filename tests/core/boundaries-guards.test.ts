// The time-scale and force-coefficient functions refuse a size that cannot
// be, in their own words, when called directly (the worksheet entries check
// their arguments first, so these guards protect other callers). Zero is
// refused as well as a negative value: Δt = C Δx / U, L / U, f = St U / D and
// C = F / (½ ρ U² A) have no meaning there (definitions); likewise the inlet
// turbulence estimate and the Richards & Hoxey (1993) atmospheric profile.
import { describe, expect, it } from 'vitest';
import { courantStep, flowThroughTime, shedding } from '../../server/core/boundaries/time-step.js';
import { forceCoefficients } from '../../server/core/boundaries/force-coefficients.js';
import { inletTurbulence } from '../../server/core/boundaries/inlet-turbulence.js';
import { richardsHoxey } from '../../server/core/boundaries/abl-profile.js';

describe('time scales', () => {
  it('Courant step: U, dx and C above zero', () => {
    // Δt = C Δx / U, the Courant number's definition (Courant, Friedrichs & Lewy, 1928): 1 × 0.01 m / 10 m/s.
    expect(courantStep(10, 0.01, 1)).toBeCloseTo(1e-3, 15);
    expect(() => courantStep(0, 0.01, 1)).toThrow('the speed U must be above zero');
    expect(() => courantStep(10, 0, 1)).toThrow('the cell size dx must be above zero');
    expect(() => courantStep(10, 0.01, 0)).toThrow('the Courant number must be above zero');
    expect(() => courantStep(10, 0.01, -1)).toThrow('the Courant number must be above zero');
  });

  it('flow-through time: length and U above zero', () => {
    expect(flowThroughTime(20, 10)).toBe(2); // L / U by definition: 20 m at 10 m/s
    expect(() => flowThroughTime(0, 10)).toThrow('the length must be above zero');
    expect(() => flowThroughTime(-1, 10)).toThrow('the length must be above zero');
    expect(() => flowThroughTime(20, 0)).toThrow('the speed U must be above zero');
  });

  it('shedding: U, D, St and dt above zero', () => {
    expect(shedding(10, 0.1, 0.2).frequency).toBeCloseTo(20, 12); // f = St U / D, the Strouhal number's definition
    expect(() => shedding(0, 0.1, 0.2)).toThrow('the speed U must be above zero');
    expect(() => shedding(10, 0, 0.2)).toThrow('the body size D must be above zero');
    expect(() => shedding(10, -0.1, 0.2)).toThrow('the body size D must be above zero');
    expect(() => shedding(10, 0.1, 0)).toThrow('the Strouhal number St must be above zero');
    expect(() => shedding(10, 0.1, 0.2, 0)).toThrow('the time step dt must be above zero');
  });
});

describe('force coefficients', () => {
  it('ρ and l_ref above zero, U not zero, A above zero', () => {
    // C = F / (½ ρ U² A), the coefficient's definition: q = ½ × 1 × 2² = 2, q A = 1.
    expect(forceCoefficients([1, 0, 0], 1, 2, 0.5).Cd).toBeCloseTo(1, 15);
    expect(() => forceCoefficients([1, 0, 0], 0, 2, 0.5)).toThrow('the fluid density must be above zero');
    expect(() => forceCoefficients([1, 0, 0], -1, 2, 0.5)).toThrow('the fluid density must be above zero');
    expect(() => forceCoefficients([1, 0, 0], 1, 0, 0.5)).toThrow('the reference speed U must not be zero');
    expect(() => forceCoefficients([1, 0, 0], 1, 2, 0)).toThrow('the reference area A must be above zero');
    expect(() => forceCoefficients([1, 0, 0], 1, 2, 0.5, 1)).toThrow('a moment coefficient needs the reference length');
    expect(() => forceCoefficients([1, 0, 0], 1, 2, 0.5, 1, 0)).toThrow('the reference length l_ref must be above zero');
    expect(forceCoefficients([1, 0, 0], 1, 2, 0.5, 1, 2).Cm).toBeCloseTo(0.5, 15); // C_m = M / (q A l_ref) by definition: 1 / (1 × 2)
  });
});

describe('inlet turbulence and the atmospheric profile', () => {
  const nu = 1.5e-5;
  it('inlet: U not zero, intensity in (0, 1], ν, C_mu and the viscosity ratio above zero', () => {
    // k = 3/2 (U I)² (CFD-Wiki, "Turbulence free-stream boundary conditions", as in boundaries-inlet-turbulence.test.ts): U = 10, I = 5 % gives 0.375.
    expect(inletTurbulence(10, 0.05, { length: 0.1 }, nu).k).toBeCloseTo(0.375, 12);
    expect(inletTurbulence(10, 1, { length: 0.1 }, nu).k).toBeCloseTo(150, 10); // the same relation at 100 %, which is allowed: 3/2 × 10²
    expect(() => inletTurbulence(0, 0.05, { length: 0.1 }, nu)).toThrow('the inlet speed U must not be zero');
    expect(() => inletTurbulence(10, 0.05, { length: 0.1 }, 0)).toThrow('the fluid\u2019s kinematic viscosity must be above zero');
    expect(() => inletTurbulence(10, 0.05, { length: 0.1 }, nu, 0)).toThrow('C_mu must be above zero');
    expect(() => inletTurbulence(10, 0.05, { ratio: 0 }, nu)).toThrow('the viscosity ratio must be above zero');
  });

  it('profile: U_ref, kappa and C_mu above zero', () => {
    expect(() => richardsHoxey(0, 10, 0.03)).toThrow('the reference speed U_ref must be above zero');
    expect(() => richardsHoxey(10, 10, 0.03, 0)).toThrow('the von Kármán constant kappa must be above zero');
    expect(() => richardsHoxey(10, 10, 0.03, 0.41, 0)).toThrow('C_mu must be above zero');
  });
});

describe('which inlet scale was given', () => {
  it('says length or ratio', () => {
    expect(inletTurbulence(10, 0.05, { length: 0.1 }, 1.5e-5).given).toBe('length');
    expect(inletTurbulence(10, 0.05, { ratio: 10 }, 1.5e-5).given).toBe('ratio');
  });
});
