import { describe, expect, it } from 'vitest';
import { TradeError, shown, si } from '../../server/core/index.js';
import { geopotentialAltitude, standardAtmosphere } from '../../server/core/fluids/atmosphere.js';
import { call, field, near } from './fluids-helpers.js';

describe('standard atmosphere against handbook tables', () => {
  // Kutz (ed.), Mechanical Engineers' Handbook Vol. 4, "Thermophysical Properties of Fluids",
  // Table 6 "Thermophysical Properties of the U.S. Standard Atmosphere". The table is by
  // geometric altitude Z, so the test converts Z to geopotential H = r0 Z/(r0 + Z),
  // r0 = 6 356 766 m (USSA-1976). Tolerances are half a unit of the printed last digit.
  // The table's speed-of-sound column is not used: its 5 km entry (320.6 m/s) lies
  // above sqrt(1.4 R T) = 320.55 m/s at the table's own T = 255.68 K by more than its rounding.
  const kutzTable6 = [
    { Z: 0, T: 288.15, pBar: 1.0133, rho: 1.225 },
    { Z: 1000, T: 281.65, pBar: 0.8988, rho: 1.1117 },
    { Z: 5000, T: 255.68, pBar: 0.5405, rho: 0.7364 },
    { Z: 11000, T: 216.77, pBar: 0.227, rho: 0.3648 },
  ];
  for (const row of kutzTable6) {
    it(`Z = ${row.Z} m (Kutz Table 6)`, () => {
      const H = (6356766 * row.Z) / (6356766 + row.Z);
      const s = standardAtmosphere(H);
      near(s.T, row.T, 0.005);
      near(s.p / 1e5, row.pBar, 0.00005);
      near(s.rho, row.rho, 0.00005);
    });
  }

  it('tropopause at geopotential 11 km: T, p and rho of the USSA-1976 table', () => {
    const s = standardAtmosphere(11000);
    // T = 216.65 K and p = 22 632 Pa are defining values (crnslab "Standard Atmosphere", citing ICAO Doc 7488/2 and USSA-1976).
    near(s.T, 216.65, 0.005);
    near(s.p, 22632, 0.5);
    // rho = 3.6392E-1 kg/m^3: USSA-1976 table at H = 11 km, from memory.
    near(s.rho, 0.36392, 0.000005);
  });

  it('sea-level viscosity and speed of sound', () => {
    const s = standardAtmosphere(0);
    // mu0 = 1.7894e-5 Pa s and a0 = 340.294 m/s: sea-level constants ML and AL of stdatm.m (repo radioflyer28/NexGenAirlifter), quoting USSA-1976.
    near(s.mu, 1.7894e-5, 0.00005e-5);
    near(s.a, 340.294, 0.0005);
    // rho0 = 1.2250 kg/m^3: USSA-1976 sea-level density (Kutz Table 6; PDAS table).
    near(s.rho, 1.225, 0.00005);
    // nu0 = 1.46e-5 m^2/s: Carmichael, PDAS "A Table of the Standard Atmosphere to 86 km in SI units", 0 km.
    near(s.nu, 1.46e-5, 0.005e-5);
  });

  it('geopotential altitude of geometric 11 km (USSA-1976 relation H = r0 Z/(r0 + Z))', () => {
    // Kutz Table 6 prints T = 216.77 K at Z = 11 km, which the lapse rate 6.5 K/km reaches at H = 10 981 m.
    near(288.15 - 0.0065 * geopotentialAltitude(11000), 216.77, 0.005);
  });
});

describe('atmosphere() as a worksheet function', () => {
  it('returns a fluid record with T, p, rho, mu, nu, a', () => {
    const { value } = call('atmosphere', { h: shown(5, 'km') });
    expect(value.kind === 'record' && value.tag).toBe('fluid');
    // The same 5 km point as the geopotential column of USSA-1976: T = 255.65 K (lapse 6.5 K/km, crnslab page).
    near(field(value, 'T'), 255.65, 0.005);
    for (const name of ['p', 'rho', 'mu', 'nu', 'a']) expect(field(value, name)).toBeGreaterThan(0);
  });

  it('refuses altitudes outside 0 to 20 km', () => {
    expect(() => call('atmosphere', { h: si(25000, 'm') })).toThrow(TradeError);
    expect(() => call('atmosphere', { h: si(-100, 'm') })).toThrow(/0 to 20 km/);
  });

  it('refuses a temperature where an altitude belongs', () => {
    expect(() => call('atmosphere', { h: shown(15, 'degC') })).toThrow(TradeError);
  });

  it('names a missing altitude', () => {
    expect(() => call('atmosphere', {})).toThrow(/missing argument h/);
  });
});
