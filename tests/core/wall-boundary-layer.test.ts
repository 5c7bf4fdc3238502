import { describe, expect, it } from 'vitest';
import { record, si } from '../../server/core/index.js';
import { boundaryLayer } from '../../server/core/wall/boundary-layer.js';
import { asRecord, call, ISA_MU, ISA_RHO, isaAir, relErr, siField, textField } from './wall-helpers.js';

describe('flat-plate boundary layer', () => {
  it('laminar thickness at Re_x = 2e5 follows Blasius, δ99 = 4.91 x/√Re_x (Blasius 1908; White, Viscous Fluid Flow §4-3; from memory)', () => {
    const nu = 1.5e-5;
    const x = 0.3;
    const U = (2e5 * nu) / x;
    const bl = boundaryLayer(U, x, nu);
    expect(bl.regime).toBe('laminar');
    expect(relErr(bl.Re_x, 2e5)).toBeLessThan(1e-12);
    expect(relErr(bl.delta, (4.91 * x) / Math.sqrt(2e5))).toBeLessThan(1e-12);
    expect(relErr(bl.delta_star, (1.721 * x) / Math.sqrt(2e5))).toBeLessThan(1e-12);
    expect(relErr(bl.theta, (0.664 * x) / Math.sqrt(2e5))).toBeLessThan(1e-12);
  });

  it('laminar shape factor δ*/θ is 2.59 (Blasius profile; White, Viscous Fluid Flow §4-3; from memory)', () => {
    const bl = boundaryLayer(1, 0.5, 1.5e-5);
    expect(Math.abs(bl.delta_star / bl.theta - 2.59)).toBeLessThan(0.005);
  });

  it('turbulent thickness at Re_x = 5e6 follows δ = 0.37 x Re_x^-1/5 (Prandtl one-seventh law, Schlichting Eq. 21.8; from memory)', () => {
    const nu = 1.5e-5;
    const x = 2;
    const bl = boundaryLayer((5e6 * nu) / x, x, nu);
    expect(bl.regime).toBe('turbulent');
    expect(relErr(bl.delta, 0.37 * x * 5e6 ** -0.2)).toBeLessThan(1e-12);
    // u/U = (y/δ)^(1/7) integrates to δ* = δ/8 and θ = 7δ/72, shape factor 9/7 ≈ 1.29.
    expect(relErr(bl.delta_star / bl.theta, 9 / 7)).toBeLessThan(1e-12);
    expect(bl.warnings).toEqual([]);
  });

  it('warns above the power-law range, Re_x > 1e7 (Schlichting Eq. 21.12)', () => {
    expect(boundaryLayer(40, 6, 1.5e-5).warnings.join(' ')).toMatch(/above 1e7/);
    // At the end of the range itself, no warning: U x/nu = 15 m/s × 10 m / 1.5e-5 m²/s = 1e7.
    expect(boundaryLayer(15, 10, 1.5e-5).warnings).toEqual([]);
  });

  it('registry entry builds Re_x from the fluid record', () => {
    const r = asRecord(call('boundary_layer', { U: si(30, 'm/s'), x: si(4, 'm'), fluid: isaAir }));
    const re = (ISA_RHO * 30 * 4) / ISA_MU;
    expect(relErr(siField(r, 'Re_x'), re)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'delta'), 0.37 * 4 * re ** -0.2)).toBeLessThan(1e-12);
    expect(textField(r, 'regime')).toBe('turbulent');
    expect([...r.fields.keys()]).toEqual(['Re_x', 'delta', 'delta_star', 'theta', 'regime']);
  });

  it('at Re_x = 5e5 exactly is turbulent, just below it laminar: the threshold rule of flow_regime too', () => {
    const nu = 1.5e-5;
    expect(boundaryLayer((5e5 * nu) / 1, 1, nu).regime).toBe('turbulent');
    expect(boundaryLayer((499999 * nu) / 1, 1, nu).regime).toBe('laminar');
  });

  it('refuses a Reynolds number where the layer would not be thin, with its thickness: δ = 19 m on a 1 m plate', () => {
    // 1e-6 m/s over 1 m of air (nu 1.5e-5): Re_x = 0.067 and Blasius δ99 = 4.91 x/√Re_x = 19 m.
    expect(() => boundaryLayer(1e-6, 1, 1.5e-5)).toThrow(/Re = 0.0667 is below 1e3: the boundary layer would not be thin \(Blasius δ99 = 19 x = 19 m at x = 1 m\)/);
  });

  it('refuses a negative speed with the rule for speeds, and zero, which gives no boundary layer', () => {
    expect(() => boundaryLayer(-3, 1, 1.5e-5)).toThrow("U = −3 m/s is negative; give the speed's magnitude (speeds are not signed here)");
    expect(() => boundaryLayer(0, 1, 1.5e-5)).toThrow(/U = 0 m\/s: this needs a flow/);
    expect(() => boundaryLayer(3, 0, 1.5e-5)).toThrow('the distance x = 0 m from the leading edge must be positive');
    expect(() => boundaryLayer(3, 1, 0)).toThrow('the kinematic viscosity nu = 0 m^2/s must be positive');
  });

  it('says when the flow is compressible, for a fluid with a speed of sound', () => {
    const air = record([['rho', si(ISA_RHO, 'kg/m^3')], ['mu', si(ISA_MU, 'Pa s')], ['a', si(340.294, 'm/s')]]);
    // Ma = 120/340.294 = 0.353, above 0.3 (common practice).
    const r = asRecord(call('boundary_layer', { U: si(120, 'm/s'), x: si(1, 'm'), fluid: air }));
    expect(r.warnings.join(' ')).toMatch(/Ma = 0.353 is above 0.3.*incompressible flow, so δ is only a rough estimate/);
    expect(asRecord(call('boundary_layer', { U: si(100, 'm/s'), x: si(1, 'm'), fluid: air })).warnings).toEqual([]);
  });
});
