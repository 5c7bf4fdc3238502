import { describe, expect, it } from 'vitest';
import { TradeError, shown, si } from '../../server/core/index.js';
import { atmosphereAt, geometricAltitude, geopotentialAltitude, standardAtmosphere } from '../../server/core/fluids/atmosphere.js';
import { asRecord, call, field, near, nearRel } from './fluids-helpers.js';

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

describe('the isothermal layer, 11 to 20 km', () => {
  // Carmichael, Public Domain Aeronautical Software, "A Table of the Standard Atmosphere to 20 km
  // in SI units" (repo kurtsansom/pdas, docs/source/atmosTable2SI.rst), by geometric altitude in
  // 0.5 km steps; sigma = rho/1.225 printed to four decimals, so half a unit of the fourth is the
  // tolerance. (Its pressure column is whole pascals and lies 0.2 to 1.1 Pa below the equations of
  // the standard at every altitude, so it is not used to the last pascal.)
  const pdasSigma: Array<[number, number]> = [
    [11.5, 0.2755], [12, 0.2546], [12.5, 0.2354], [13, 0.2176], [13.5, 0.2012], [14, 0.186],
    [14.5, 0.172], [15, 0.159], [15.5, 0.147], [16, 0.1359], [16.5, 0.1256], [17, 0.1162],
    [17.5, 0.1074], [18, 0.0993], [18.5, 0.0918], [19, 0.0849], [19.5, 0.0785], [20, 0.0726],
  ];
  for (const [km, sigma] of pdasSigma) {
    it(`geometric ${km} km: rho/rho0 = ${sigma} and T = 216.65 K (PDAS table)`, () => {
      const s = atmosphereAt({ geometric: km * 1000 });
      near(s.rho / 1.225, sigma, 0.00005);
      // Isothermal at 216.65 K from H = 11 to 20 km: a defining value (crnslab page, citing ICAO Doc 7488/2 and USSA-1976).
      near(s.T, 216.65, 1e-9);
    });
  }

  // DERIVED from the standard's equations with its VERIFIED constants (crnslab page): the isothermal
  // layer's p = p11 exp(−g0 (H − 11 km)/(R T11)), p11 = 22 632 Pa, T11 = 216.65 K, g0 = 9.80665 m/s²,
  // R = R*/M0 = 8314.32/28.9644. p11 is printed to five figures, so the tolerance is its half unit
  // carried through: 0.5/22632 relative.
  const R = 8314.32 / 28.9644;
  const derived = (H: number) => 22632 * Math.exp((-9.80665 * (H - 11000)) / (R * 216.65));
  for (const H of [12000, 15000, 18000, 20000]) {
    it(`geopotential ${H / 1000} km: p = ${derived(H).toFixed(1)} Pa (derived from the standard's equations)`, () => {
      nearRel(standardAtmosphere(H).p, derived(H), 0.5 / 22632);
      // Ideal gas at the layer temperature: rho = p/(R T).
      nearRel(standardAtmosphere(H).rho, derived(H) / (R * 216.65), 0.5 / 22632);
    });
  }

  it('the top of the layer, geopotential 20 km: p = 5474.89 Pa (USSA-1976, base pressure of the next layer; from memory)', () => {
    near(standardAtmosphere(20000).p, 5474.89, 0.005);
  });
});

describe('geometric and geopotential altitude', () => {
  it('are related by H = r0 Z/(r0 + Z) with r0 = 6 356 766 m (USSA-1976; crnslab page), both ways', () => {
    for (const Z of [1000, 11000, 20000]) {
      nearRel(geopotentialAltitude(Z), (6356766 * Z) / (6356766 + Z), 1e-15);
      nearRel(geometricAltitude(geopotentialAltitude(Z)), Z, 1e-12);
    }
    // The top of the covered range, geopotential 20 km, is geometric 20 063.1 m (the same relation).
    near(geometricAltitude(20000), (6356766 * 20000) / (6356766 - 20000), 1e-6);
  });

  it('atmosphereAt gives both altitudes back, whichever was given', () => {
    const byZ = atmosphereAt({ geometric: 15000 });
    nearRel(byZ.H, geopotentialAltitude(15000), 1e-15);
    expect(byZ.Z).toBe(15000);
    const byH = atmosphereAt({ geopotential: 15000 });
    expect(byH.H).toBe(15000);
    nearRel(byH.Z, geometricAltitude(15000), 1e-15);
  });

  it('covers geometric altitudes up to the geometric height of geopotential 20 km, and no further', () => {
    near(atmosphereAt({ geometric: geometricAltitude(20000) }).T, 216.65, 1e-9);
    expect(() => atmosphereAt({ geometric: geometricAltitude(20000) + 0.01 })).toThrow(/geometric altitudes from 0 to 20.063 km/);
    expect(() => atmosphereAt({ geometric: -1 })).toThrow(/got geometric = −1 m/);
  });
});

describe('atmosphere() as a worksheet function', () => {
  it('returns a fluid record with T, p, rho, mu, nu, a and both altitudes, and says which was given', () => {
    const { value } = call('atmosphere', { geometric: shown(5, 'km') });
    const r = asRecord(value);
    expect(r.tag).toBe('fluid');
    expect([...r.fields.keys()]).toEqual(['T', 'p', 'rho', 'mu', 'nu', 'a', 'H', 'Z']);
    // Kutz Table 6 at geometric 5 km (the rows above): T = 255.68 K, rho = 0.7364 kg/m^3, p = 0.5405 bar.
    near(field(value, 'T'), 255.68, 0.005);
    near(field(value, 'rho'), 0.7364, 0.00005);
    near(field(value, 'p') / 1e5, 0.5405, 0.00005);
    expect(r.remarks.join(' ')).toMatch(/at geometric altitude Z = 5000 m \(geopotential H = 4996.07 m\)/);
  });

  it('at a geopotential altitude (what a bare first argument is) says so too', () => {
    const { value } = call('atmosphere', { geopotential: shown(5, 'km') });
    // The geopotential column of USSA-1976 at 5 km: T = 255.65 K (lapse 6.5 K/km, crnslab page).
    near(field(value, 'T'), 255.65, 0.005);
    expect(asRecord(value).remarks.join(' ')).toMatch(/at geopotential altitude H = 5000 m \(geometric Z = 5003.94 m\)/);
  });

  it('refuses altitudes outside 0 to 20 km, showing the value given in full', () => {
    expect(() => call('atmosphere', { geopotential: si(25000, 'm') })).toThrow(TradeError);
    expect(() => call('atmosphere', { geopotential: si(-100, 'm') })).toThrow(/0 to 20 km/);
    expect(() => call('atmosphere', { geopotential: si(20000.001, 'm') })).toThrow('got geopotential = 20000.001 m');
  });

  it('wants exactly one altitude', () => {
    expect(() => call('atmosphere', {})).toThrow(/give an altitude: geopotential: … or geometric: …/);
    expect(() => call('atmosphere', { geopotential: si(1, 'km'), geometric: si(1, 'km') })).toThrow(/not both/);
  });

  it('refuses a temperature where an altitude belongs', () => {
    expect(() => call('atmosphere', { geopotential: shown(15, 'degC') })).toThrow(TradeError);
  });
});
