import { describe, expect, it } from 'vitest';
import { si } from '../../server/core/index.js';
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
  });

  it('registry entry builds Re_x from the fluid record', () => {
    const r = asRecord(call('boundary_layer', { U: si(30, 'm/s'), x: si(4, 'm'), fluid: isaAir }));
    const re = (ISA_RHO * 30 * 4) / ISA_MU;
    expect(relErr(siField(r, 'Re_x'), re)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'delta'), 0.37 * 4 * re ** -0.2)).toBeLessThan(1e-12);
    expect(textField(r, 'regime')).toBe('turbulent');
    expect([...r.fields.keys()]).toEqual(['Re_x', 'delta', 'delta_star', 'theta', 'regime']);
  });
});
