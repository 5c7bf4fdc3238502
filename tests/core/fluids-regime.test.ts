import { describe, expect, it } from 'vitest';
import { createRegistry, TradeError, shown, si, type Value } from '../../server/core/index.js';
import { flatPlateRegime } from '../../server/core/fluids/regime.js';
import { compressibilityWarnings } from '../../server/core/shared/flow.js';
import { asRecord, call, field, near, nearRel, siOfValue } from './fluids-helpers.js';

// ISA sea level: rho0 = 1.2250 kg/m^3 (USSA-1976; Kutz Table 6), mu0 = 1.7894e-5 Pa s and
// a0 = 340.294 m/s (stdatm.m constants quoting USSA-1976).
const RHO0 = 1.225;
const MU0 = 1.7894e-5;
const A0 = 340.294;

function seaLevelAir(): Value {
  return call('air', { T: shown(15, 'degC'), p: si(101325, 'Pa'), RH: shown(0, '%') }).value;
}

describe('similarity numbers', () => {
  it('Re = rho U L / mu with the ISA sea-level values', () => {
    const Re = siOfValue(call('reynolds', { U: si(10, 'm/s'), L: si(1, 'm'), fluid: seaLevelAir() }).value);
    // Both inputs are printed to 5 figures, so agreement within 1e-4 is what they support.
    nearRel(Re, (RHO0 * 10 * 1) / MU0, 1e-4);
  });

  it('Re from a kinematic viscosity given instead of a fluid', () => {
    // ITTC 7.5-02-01-03: fresh water at 15 °C, nu = 1.13858e-6 m^2/s.
    const Re = siOfValue(call('reynolds', { U: si(2, 'm/s'), L: si(1.5, 'm'), nu: si(1.13858e-6, 'm^2/s') }).value);
    nearRel(Re, (2 * 1.5) / 1.13858e-6, 1e-12);
  });

  it('q = rho U^2 / 2 with the ISA sea-level density', () => {
    const q = siOfValue(call('dynamic_pressure', { U: si(30, 'm/s'), fluid: seaLevelAir() }).value);
    nearRel(q, 0.5 * RHO0 * 30 * 30, 0.5e-4 / RHO0);
  });

  it('Ma = U / a, warning above 0.3 (common practice)', () => {
    const below = call('mach', { U: si(0.25 * A0, 'm/s'), fluid: seaLevelAir() });
    near(siOfValue(below.value), 0.25, 0.0005 / A0);
    expect(below.warnings).toEqual([]);
    const above = call('mach', { U: si(0.35 * A0, 'm/s'), fluid: seaLevelAir() });
    expect(above.warnings.join(' ')).toMatch(/above 0\.3/);
  });

  it('names the regime of compressible flow: above 0.3, supersonic from 1, hypersonic from 5 (common practice)', () => {
    expect(compressibilityWarnings(0.3)).toEqual([]);
    expect(compressibilityWarnings(0.31)).toEqual(['Ma = 0.31 is above 0.3: density changes exceed about 5 %, so use a compressible solver set-up']);
    expect(compressibilityWarnings(1).join(' ')).toMatch(/^Ma = 1: supersonic flow/);
    expect(compressibilityWarnings(4.99).join(' ')).toMatch(/supersonic/);
    expect(compressibilityWarnings(5).join(' ')).toMatch(/^Ma = 5: hypersonic flow, far outside an incompressible set-up \(check the speed and its unit\)/);
  });
});

describe('flow_regime', () => {
  // Transition on a smooth flat plate near Re_x = 5e5 (common practice). A plate is called
  // turbulent once transition lies within the first 10 % of its length (our rule, from the same figure).
  const nu = MU0 / RHO0;
  const regimeAt = (Re: number): string => {
    const r = asRecord(call('flow_regime', { U: si(10, 'm/s'), L: si((Re * nu) / 10, 'm'), fluid: seaLevelAir() }).value);
    const v = r.fields.get('regime')!.value;
    return v.kind === 'string' ? v.value : '';
  };

  it('laminar below 5e5, transitional above, turbulent from 5e6', () => {
    expect(regimeAt(4e5)).toBe('laminar');
    expect(regimeAt(1e6)).toBe('transitional');
    expect(regimeAt(1e7)).toBe('turbulent');
  });

  it('laminar below 5e5, not at it: the same comparison as boundary_layer and skin_friction', () => {
    expect(flatPlateRegime(499999).regime).toBe('laminar');
    expect(flatPlateRegime(5e5).regime).toBe('transitional');
    expect(flatPlateRegime(5e5).explanation).toMatch(/transition expected about 100 % of the length/);
    // Through the entry, with a fluid whose nu is exact: U L/nu = 10 m/s × 0.75 m / 1.5e-5 m²/s = 5e5.
    const exact = call('fluid', { rho: si(1, 'kg/m^3'), mu: si(1.5e-5, 'Pa s') }).value;
    const r = asRecord(call('flow_regime', { U: si(10, 'm/s'), L: si(0.75, 'm'), fluid: exact }).value);
    expect(r.fields.get('regime')!.value).toEqual({ kind: 'string', value: 'transitional' });
  });

  it('turbulent once transition lies within the first 10 % of the length (our rule), transitional before', () => {
    // Transition at Re_x = 5e5: a share of 5e5/Re of the length is laminar.
    expect(flatPlateRegime(4.9e6).regime).toBe('transitional'); // 10.2 % laminar
    expect(flatPlateRegime(5.1e6).regime).toBe('turbulent'); // 9.8 % laminar
    expect(flatPlateRegime(4.9e6).laminarShare).toBeCloseTo(5e5 / 4.9e6, 15);
    expect(flatPlateRegime(4e5).laminarShare).toBe(1);
  });

  it('returns Re, Ma, q and regime, with a compressibility warning above Ma 0.3', () => {
    const { value } = call('flow_regime', { U: si(120, 'm/s'), L: si(2, 'm'), fluid: seaLevelAir() });
    const r = asRecord(value);
    expect([...r.fields.keys()]).toEqual(['Re', 'Ma', 'q', 'regime']);
    near(field(value, 'Ma'), 120 / A0, 0.0005 / A0);
    expect(r.warnings.join(' ')).toMatch(/compressible/);
  });

  it('gives no Mach number for a liquid and says why', () => {
    const water = call('water', { T: shown(8, 'degC'), p: si(101325, 'Pa') }).value;
    const r = asRecord(call('flow_regime', { U: si(2, 'm/s'), L: si(1.2, 'm'), fluid: water }).value);
    expect(r.fields.has('Ma')).toBe(false);
    expect(r.remarks.join(' ')).toMatch(/no Mach number/);
  });
});

describe('fluid() and bad calls', () => {
  it('a fluid of the sheet’s own serves wherever a fluid is asked for', () => {
    const oil = call('fluid', { rho: si(870, 'kg/m^3'), mu: si(0.03, 'Pa s') }).value;
    expect(asRecord(oil).tag).toBe('fluid');
    nearRel(field(oil, 'nu'), 0.03 / 870, 1e-12);
    const Re = siOfValue(call('reynolds', { U: si(1, 'm/s'), L: si(0.1, 'm'), fluid: oil }).value);
    nearRel(Re, (870 * 1 * 0.1) / 0.03, 1e-12);
  });

  it('reynolds wants a fluid or nu, not both and not neither', () => {
    const args = { U: si(10, 'm/s'), L: si(1, 'm') };
    expect(() => call('reynolds', args)).toThrow(/fluid .* or nu/);
    expect(() => call('reynolds', { ...args, fluid: seaLevelAir(), nu: si(1.5e-5, 'm^2/s') })).toThrow(/not both/);
  });

  it('mach refuses a fluid without a speed of sound', () => {
    const water = call('water', { T: shown(8, 'degC'), p: si(101325, 'Pa') }).value;
    expect(() => call('mach', { U: si(2, 'm/s'), fluid: water })).toThrow(/speed of sound/);
  });

  it('speeds are magnitudes: a negative U is refused by reynolds, mach and dynamic_pressure alike; zero gives zero', () => {
    const rule = "U = −10 m/s is negative; give the speed's magnitude (speeds are not signed here)";
    expect(() => call('reynolds', { U: si(-10, 'm/s'), L: si(1, 'm'), fluid: seaLevelAir() })).toThrow(rule);
    expect(() => call('mach', { U: si(-10, 'm/s'), fluid: seaLevelAir() })).toThrow(rule);
    expect(() => call('dynamic_pressure', { U: si(-10, 'm/s'), fluid: seaLevelAir() })).toThrow(rule);
    expect(() => call('flow_regime', { U: si(-10, 'm/s'), L: si(1, 'm'), fluid: seaLevelAir() })).toThrow(rule);
    expect(siOfValue(call('reynolds', { U: si(0, 'm/s'), L: si(1, 'm'), fluid: seaLevelAir() }).value)).toBe(0);
    expect(siOfValue(call('dynamic_pressure', { U: si(0, 'm/s'), fluid: seaLevelAir() }).value)).toBe(0);
    expect(siOfValue(call('mach', { U: si(0, 'm/s'), fluid: seaLevelAir() }).value)).toBe(0);
    expect(() => call('reynolds', { U: si(Number.POSITIVE_INFINITY, 'm/s'), L: si(1, 'm'), fluid: seaLevelAir() })).toThrow('U = infinity m/s is not a finite speed');
    expect(() => call('mach', { U: si(Number.NaN, 'm/s'), fluid: seaLevelAir() })).toThrow('U = not a number m/s is not a finite speed');
  });

  it('refuses a temperature where a length belongs, and a non-positive length', () => {
    expect(() => call('reynolds', { U: si(10, 'm/s'), L: shown(20, 'degC'), fluid: seaLevelAir() })).toThrow(TradeError);
    expect(() => call('reynolds', { U: si(10, 'm/s'), L: si(0, 'm'), fluid: seaLevelAir() })).toThrow('the length L = 0 m must be above zero');
    expect(() => call('reynolds', { U: si(10, 'm/s'), L: si(1, 'm'), nu: si(-1e-6, 'm^2/s') })).toThrow('the kinematic viscosity nu = −1e−6 m^2/s must be above zero');
  });

  it('refuses a record that is not a fluid', () => {
    const regime = call('flow_regime', { U: si(10, 'm/s'), L: si(1, 'm'), fluid: seaLevelAir() }).value;
    expect(() => call('dynamic_pressure', { U: si(10, 'm/s'), fluid: regime })).toThrow(/rho/);
  });
});

describe('registration', () => {
  it('every fluid function is in the registry with a source and an example', () => {
    const reg = createRegistry();
    for (const name of ['air', 'atmosphere', 'water', 'seawater', 'fluid', 'reynolds', 'mach', 'dynamic_pressure', 'flow_regime']) {
      const f = reg.get(name);
      expect(f, name).toBeDefined();
      expect(f!.source.length).toBeGreaterThan(0);
      expect(f!.example.startsWith(`${name}(`)).toBe(true);
    }
  });
});
