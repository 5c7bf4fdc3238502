// The fluid entries' own rules: when a bare number gets a unit hint, where the
// Sutherland-range warning starts, what fluid() refuses, and the words of mach
// and dynamic_pressure. Values are checked against their sources in the other files.
import { describe, expect, it } from 'vitest';
import { num, shown, si } from '../../server/core/index.js';
import { asRecord, call, field, nearRel, siOfValue } from './fluids-helpers.js';

describe('air() and seawater() with bare numbers', () => {
  it('take a bare fraction up to 1 as it is, and hint a unit only above', () => {
    const bare = call('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: num(0.5) }).value;
    const withUnit = call('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: shown(50, '%') }).value;
    expect(field(bare, 'rho')).toBe(field(withUnit, 'rho'));
    expect(field(call('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: num(1) }).value, 'rho')).toBe(
      field(call('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: shown(100, '%') }).value, 'rho'),
    );
    const salt = call('seawater', { T: shown(15, 'degC'), S: num(0.15) }).value;
    expect(field(salt, 'rho')).toBe(field(call('seawater', { T: shown(15, 'degC'), S: shown(150, 'g/kg') }).value, 'rho'));
  });
});

describe("air()'s Sutherland-range warning (170 to 1900 K; White, Viscous Fluid Flow, Table 1-2, from memory)", () => {
  const warnings = (T: number) => asRecord(call('air', { T: si(T, 'K'), p: si(101325, 'Pa'), RH: shown(0, '%') }).value).warnings;
  it('holds at both ends and starts past them', () => {
    expect(warnings(170)).toEqual([]);
    expect(warnings(1900)).toEqual([]);
    expect(warnings(169.9)).toHaveLength(1);
    expect(warnings(1900.5)).toEqual(["T = 1627 °C is outside 170 to 1900 K, where Sutherland's law holds within about 2 %"]);
  });
});

describe('fluid()', () => {
  it('refuses a density, viscosity or speed of sound that is not above zero, showing it', () => {
    expect(() => call('fluid', { rho: si(0, 'kg/m^3'), mu: si(1e-3, 'Pa s') })).toThrow('rho = 0 kg/m^3: the density must be above zero');
    expect(() => call('fluid', { rho: si(1000, 'kg/m^3'), mu: si(-1e-3, 'Pa s') })).toThrow('mu = −0.001 Pa s: the viscosity must be above zero');
    expect(() => call('fluid', { rho: si(1000, 'kg/m^3'), mu: si(1e-3, 'Pa s'), a: si(0, 'm/s') })).toThrow('a = 0 m/s: the speed of sound must be above zero');
  });

  it('gives nu = mu/rho and keeps a speed of sound when given', () => {
    const oil = call('fluid', { rho: si(870, 'kg/m^3'), mu: si(0.03, 'Pa s'), a: si(1400, 'm/s') }).value;
    nearRel(field(oil, 'nu'), 0.03 / 870, 1e-15);
    expect(field(oil, 'a')).toBe(1400);
  });
});

describe('mach() and dynamic_pressure()', () => {
  const water = call('water', { T: shown(10, 'degC'), p: si(101325, 'Pa') }).value;
  it('mach names what it needs of the fluid', () => {
    expect(() => call('mach', { U: si(2, 'm/s'), fluid: water })).toThrow(
      'mach() needs a fluid with a speed of sound a, such as air() or atmosphere(); fluid(rho, mu, a: …) also takes one',
    );
  });

  it('dynamic pressure is a pressure, q = ρU²/2 (Bernoulli, definition)', () => {
    const q = call('dynamic_pressure', { U: si(3, 'm/s'), fluid: water }).value;
    expect(q.kind === 'quantity' && q.dims).toEqual(si(1, 'Pa').dims);
    nearRel(siOfValue(q), 0.5 * field(water, 'rho') * 9, 1e-15);
  });

  it('flow_regime raises no warning below Ma 0.3', () => {
    const air = call('air', { T: shown(15, 'degC'), p: si(101325, 'Pa'), RH: shown(0, '%') }).value;
    expect(asRecord(call('flow_regime', { U: si(50, 'm/s'), L: si(1, 'm'), fluid: air }).value).warnings).toEqual([]);
  });
});
