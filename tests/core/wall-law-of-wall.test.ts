import { describe, expect, it } from 'vitest';
import { num, record, si } from '../../server/core/index.js';
import { B, frictionVelocity, KAPPA, spaldingUplus } from '../../server/core/wall/law-of-wall.js';
import { asQuantity, call, relErr, stubContext } from './wall-helpers.js';

/** Spalding (1961), J. Appl. Mech. 28(3), written out here from the paper's form without the fourth-order term. */
function spaldingY(u: number, kappa: number, b: number): number {
  const k = kappa * u;
  return u + Math.exp(-kappa * b) * (Math.exp(k) - 1 - k - k ** 2 / 2 - k ** 3 / 6);
}

describe("Spalding's law of the wall", () => {
  it('states the constants κ = 0.41, B = 5.0 (Coles & Hirst 1968; from memory)', () => {
    expect(KAPPA).toBe(0.41);
    expect(B).toBe(5.0);
  });

  it('near the wall u+ → y+ (Spalding 1961: the formula tends to the viscous sublayer u+ = y+)', () => {
    expect(relErr(spaldingUplus(0.1), 0.1)).toBeLessThan(1e-6);
    // At y+ = 1 the bracket adds e^(−κB)(κu+)⁴/24 ≈ 1.5e-4.
    expect(relErr(spaldingUplus(1), 1)).toBeLessThan(5e-4);
    expect(spaldingUplus(0)).toBe(0);
  });

  it('far out it meets the log law u+ = ln(y+)/κ + B within 0.1 % (Spalding 1961, Table 1; Coles & Hirst 1968 constants)', () => {
    // The cubic's leftover terms shift y+ by a few units, so the match is close but not exact.
    for (const y of [500, 1000, 3000]) expect(relErr(spaldingUplus(y), Math.log(y) / KAPPA + B)).toBeLessThan(1e-3);
    // In the buffer layer the two differ clearly: the check above can fail.
    expect(relErr(spaldingUplus(10), Math.log(10) / KAPPA + B)).toBeGreaterThan(0.1);
  });

  it('solves the published formula: y+(u+) recomputed from the paper returns the input', () => {
    for (const y of [0.5, 5, 11.5, 30, 100, 300]) expect(relErr(spaldingY(spaldingUplus(y), KAPPA, B), y)).toBeLessThan(1e-12);
  });

  it("with the paper's own constants reproduces its printed factor 0.1108 = e^(−κB), κ = 0.4, B = 5.5 (Spalding 1961)", () => {
    for (const y of [5, 30, 100]) {
      const u = spaldingUplus(y, 0.4, 5.5);
      const k = 0.4 * u;
      const printed = u + 0.1108 * (Math.exp(k) - 1 - k - k ** 2 / 2 - k ** 3 / 6);
      expect(relErr(printed, y)).toBeLessThan(1e-4);
    }
  });

  it('friction_velocity recovers u_τ from a sample placed on the law of the wall', () => {
    const uTau = 0.5;
    const nu = 1.5e-5;
    for (const uplus of [3, 10, 15, 22]) {
      const yplus = spaldingY(uplus, KAPPA, B);
      const r = frictionVelocity(uplus * uTau, (yplus * nu) / uTau, nu);
      expect(relErr(r.u_tau, uTau)).toBeLessThan(1e-10);
      expect(relErr(r.yplus, yplus)).toBeLessThan(1e-10);
    }
  });

  it('registry entries: law_of_wall gives u+, friction_velocity gives u_τ in m/s', () => {
    const ctx = stubContext();
    expect(relErr(asQuantity(call('law_of_wall', { yplus: num(30) }, ctx)).si, spaldingUplus(30))).toBeLessThan(1e-15);
    expect(ctx.warnings).toEqual([]);
    call('law_of_wall', { yplus: num(2000) }, ctx);
    expect(ctx.warnings.join(' ')).toMatch(/beyond the log layer/);

    const water = record([['rho', si(998.2, 'kg/m^3')], ['nu', si(1.004e-6, 'm^2/s')]]);
    const yplus = spaldingY(12, KAPPA, B);
    const u = asQuantity(call('friction_velocity', { U_p: si(12 * 0.05, 'm/s'), y_p: si((yplus * 1.004e-6) / 0.05, 'm'), fluid: water }));
    expect(relErr(u.si, 0.05)).toBeLessThan(1e-10);
    expect(u.dims).toEqual(si(1, 'm/s').dims);
  });

  it('refuses what has no wall distance or sample', () => {
    expect(() => spaldingUplus(-1)).toThrow('y+ must be zero or positive, not −1');
    expect(() => spaldingUplus(Number.NaN)).toThrow('y+ must be zero or positive, not not a number');
    expect(() => frictionVelocity(0, 1e-3, 1.5e-5)).toThrow('the sampled velocity must be positive, not 0 m/s');
    expect(() => frictionVelocity(1, 0, 1.5e-5)).toThrow('the wall distance must be positive, not 0 m');
    expect(() => frictionVelocity(1, 1e-3, 0)).toThrow('the kinematic viscosity must be positive, not 0 m^2/s');
  });

  it('far from the wall y+ is solved as finely as near it', () => {
    for (const y of [2e4, 1e6]) expect(relErr(spaldingY(spaldingUplus(y), KAPPA, B), y)).toBeLessThan(1e-12);
  });
});
