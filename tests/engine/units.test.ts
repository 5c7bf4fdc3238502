// Unit conversion against the exact factors of NIST SP 811 (2008), Appendix B
// (B.8 and B.9), dimension errors, and the temperature rules of the language.
import { describe, expect, it } from 'vitest';
import { sheet, si } from './helpers.js';

describe('NIST SP 811 (2008) Appendix B exact factors', () => {
  const cases: Array<[string, number, string]> = [
    ['1 ft', 0.3048, 'foot = 0.3048 m exactly (B.9, "length")'],
    ['1 in', 0.0254, 'inch = 0.0254 m exactly (B.9)'],
    ['1 psi', 6894.757, 'pound-force per square inch = 6.894757 E+03 Pa (B.9, "pressure")'],
    ['1 knot', 1852 / 3600, 'knot (nautical mile per hour) = 1852/3600 m/s exactly (B.9, "velocity")'],
    ['1 atm', 101325, 'standard atmosphere = 1.01325 E+05 Pa exactly (B.9)'],
    ['1 mph', 0.44704, 'mile per hour = 0.44704 m/s exactly (B.9)'],
    ['1 bar', 1e5, 'bar = 1.0 E+05 Pa exactly (B.9)'],
    ['1 km/h', 1 / 3.6, 'kilometre per hour = 0.2777778 m/s (B.9)'],
    ['1 L/min', 1e-3 / 60, 'litre per minute = 1.666667 E-05 m^3/s (B.9)'],
    ['1 cP', 1e-3, 'centipoise = 1.0 E-03 Pa s exactly (B.9, "viscosity, dynamic")'],
    ['1 cSt', 1e-6, 'centistokes = 1.0 E-06 m^2/s exactly (B.9, "viscosity, kinematic")'],
  ];
  for (const [expr, want, source] of cases) {
    it(`${expr} — ${source}`, async () => {
      const r = await sheet([`x = ${expr}`]);
      // psi is given to 7 digits in SP 811; the others exactly.
      expect(si(r, 'x')).toBeCloseTo(want, expr.includes('psi') ? 3 : 12);
      expect(Math.abs(si(r, 'x') / want - 1)).toBeLessThan(expr.includes('psi') ? 5e-7 : 1e-12);
    });
  }

  it('rpm is 2π rad per minute (angles are dimensionless, SI Brochure 2019, 2.3.3)', async () => {
    const r = await sheet(['w = 3000 rpm']);
    expect(si(r, 'w')).toBeCloseTo((3000 * 2 * Math.PI) / 60, 10);
  });

  it('round-trips a conversion', async () => {
    const r = await sheet(['U = 110 km/h', 'back = (U to mph) to km/h', 'check back == U "round trip"']);
    expect(r.checks[0]!.passed).toBe(true);
    expect(r.values.back!.display).toBe('110 km/h');
  });
});

describe('temperatures', () => {
  it('15 degC is 288.15 K inside a quotient (ideal gas, R = 287.05 J/(kg K))', async () => {
    // USSA 1976 sea level: rho = p/(R T) = 101325/(287.05 * 288.15) = 1.2250 kg/m^3.
    const r = await sheet(['T = 15 degC', 'R = 287.05 J/(kg K)', 'p = 101325 Pa', 'rho = p / (R * T)']);
    expect(si(r, 'T')).toBeCloseTo(288.15, 10);
    expect(si(r, 'rho')).toBeCloseTo(1.225, 3);
  });

  it('a difference of two temperatures is a difference in kelvin', async () => {
    const r = await sheet(['dT = 20 degC - 15 degC', 'dF = 212 degF - 32 degF']);
    expect(si(r, 'dT')).toBeCloseTo(5, 12);
    expect(r.values.dT!.unit).toBe('K');
    // 180 °F span = 100 K (NIST SP 811 B.9: degree Fahrenheit interval = 5/9 K).
    expect(si(r, 'dF')).toBeCloseTo(100, 10);
  });

  it('degF converts to kelvin (NIST SP 811 (2008) B.8: T/K = (t/°F + 459.67)/1.8)', async () => {
    const r = await sheet(['T = 68 degF', 'c = T to degC']);
    expect(si(r, 'T')).toBeCloseTo((68 + 459.67) / 1.8, 10);
    expect(r.values.c!.display).toBe('20 °C');
  });

  it('never adds two absolute temperatures, but adds a difference', async () => {
    const r = await sheet(['bad = 15 degC + 20 degC', 'warm = 15 degC + 5 K']);
    expect(r.errors[0]!.message).toMatch(/cannot add two absolute temperatures/);
    expect(si(r, 'warm')).toBeCloseTo(293.15, 10);
    expect(r.values.warm!.display).toBe('20 °C');
  });
});

describe('dimensions', () => {
  it('refuses to add m/s to Pa, in plain words with the place', async () => {
    const r = await sheet(['x = 12 m/s + 3 Pa']);
    expect(r.errors).toEqual([{ line: 2, column: 5, message: 'cannot add m/s to Pa', code: 'unit-mismatch' }]);
  });

  it('a dimensionless result is a plain number', async () => {
    const r = await sheet(['Re = 1.225 kg/m^3 * 12 m/s * 4.2 m / 1.8e-5 Pa s']);
    expect(r.values.Re!.unit).toBe('');
    expect(si(r, 'Re')).toBeCloseTo((1.225 * 12 * 4.2) / 1.8e-5, 3);
  });

  it('a percentage is a fraction', async () => {
    const r = await sheet(['I = 5 %', 'k = 1.5 * (10 m/s * I)^2']);
    expect(si(r, 'I')).toBe(0.05);
    // k = 3/2 (U I)^2 = 0.375 m^2/s^2 (CFD-Wiki, turbulence free-stream boundary conditions).
    expect(si(r, 'k')).toBeCloseTo(0.375, 12);
    expect(r.values.k!.unit).toBe('m^2/s^2');
  });

  it('keeps units in their own namespace: a name m does not change 12 m', async () => {
    const r = await sheet(['m = 5 kg', 'L = 12 m', 'w = m * 2']);
    expect(si(r, 'L')).toBe(12);
    expect(r.values.L!.unit).toBe('m');
    expect(si(r, 'w')).toBe(10);
  });

  it('converting to a unit of another dimension is an error', async () => {
    const r = await sheet(['x = 3 m/s to Pa']);
    expect(r.errors[0]!.message).toBe('cannot convert m/s to Pa');
  });
});
