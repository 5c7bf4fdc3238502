// Unit conversion against the exact factors of NIST SP 811 (2008), Appendix B
// (B.8 and B.9), dimension errors, and the temperature rules of the language.
import { describe, expect, it } from 'vitest';
import { renderSheet } from '../../server/pipeline/index.js';
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

  // Factors of NIST SP 811 (2008), Appendix B.9, to the seven figures it prints (from memory;
  // the conventional inch of mercury and of water are the ones taken). Tolerance: half a unit of the seventh figure.
  const sp811: Array<[string, number, string]> = [
    ['1 slug', 1.45939e1, 'slug = 1.459 390 E+01 kg ("mass")'],
    ['1 inHg', 3.386389e3, 'inch of mercury, conventional = 3.386 389 E+03 Pa ("pressure")'],
    ['1 inH2O', 2.490889e2, 'inch of water, conventional = 2.490 889 E+02 Pa ("pressure")'],
    ['1 ksi', 6.894757e6, 'kip per square inch = 6.894 757 E+06 Pa ("pressure")'],
    ['1 P', 1e-1, 'poise = 1.0 E-01 Pa s exactly ("viscosity, dynamic")'],
    ['1 poise', 1e-1, 'poise = 1.0 E-01 Pa s exactly'],
    ['1 St', 1e-4, 'stokes = 1.0 E-04 m^2/s exactly ("viscosity, kinematic")'],
    ['1 stokes', 1e-4, 'stokes = 1.0 E-04 m^2/s exactly'],
    ['1 kn', 5.144444e-1, 'knot = 5.144 444 E-01 m/s ("velocity")'],
  ];
  for (const [expr, want, source] of sp811) {
    it(`${expr} — ${source}`, async () => {
      const r = await sheet([`x = ${expr}`]);
      const halfUnit = 0.5e-6 * 10 ** Math.floor(Math.log10(want));
      expect(Math.abs(si(r, 'x') - want)).toBeLessThanOrEqual(halfUnit);
    });
  }

  it('refuses kt, which reads as kilotonne in SI and as knot in aviation, and says what to write', async () => {
    const r = await sheet(['U = 140 kt']);
    expect(r.errors).toEqual([{ line: 2, column: 9, code: 'unknown-unit', message: '"kt" reads as kilotonne in SI but as knot in aviation; write knot (or kn) for a speed, or kilotonne for a mass' }]);
    const ok = await sheet(['U = 140 knot', 'M = 2 kilotonne']);
    expect(si(ok, 'U')).toBeCloseTo((140 * 1852) / 3600, 12);
    expect(si(ok, 'M')).toBe(2e6);
  });

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
    expect(r.values.dF!.display).toBe('180 Δ°F');
  });

  it('a difference of two temperatures stays a difference through every conversion, shown as one', async () => {
    // NIST SP 811 (2008) §4.2.1.1 and B.8: a temperature interval of 1 °C is 1 K, of 1 °F is 5/9 K (from memory).
    const r = await sheet(['dT = 30 degC - 10 degC', 'dT_F = dT to degF', 'dT_C = dT to degC', 'dT_K = dT to K', 'dT_back = dT_F to degC']);
    for (const name of ['dT', 'dT_F', 'dT_C', 'dT_K', 'dT_back']) {
      expect(si(r, name)).toBeCloseTo(20, 12);
      expect(r.values[name]).toMatchObject({ unit: 'K', interval: true });
    }
    expect(r.values.dT!.display).toBe('20 Δ°C');
    expect(r.values.dT_F!.display).toBe('36 Δ°F');
    expect(r.values.dT_C!.display).toBe('20 Δ°C');
    expect(r.values.dT_K!.display).toBe('20 K');
    expect(r.errors).toEqual([]);
  });

  it('a difference is refused where an absolute temperature is needed', async () => {
    const r = await sheet(['dT = 30 degC - 10 degC', 'dT_F = dT to degF', 'a = air(T: dT_F)', 'b = dT < 30 degC', 'c = 20 degC to delta_degC']);
    expect(r.errors.map((e) => [e.line, e.code, e.message])).toEqual([
      [4, 'bad-argument', 'air(): T is a temperature difference (20 K), not a temperature; give an absolute temperature such as 20 degC or 293.15 K'],
      [5, 'unit-mismatch', 'cannot compare an absolute temperature with a temperature difference'],
      [6, 'unit-mismatch', 'an absolute temperature cannot be shown as a temperature difference; subtract a reference first, e.g. (T - 0 degC) to delta_degC'],
    ]);
  });

  it('intervals are written directly in delta_degC and delta_degF, and keep their sense in arithmetic', async () => {
    const r = await sheet([
      'rise = 36 delta_degF',
      'step = 20 delta_degC',
      'warm = 15 degC + rise',
      'half = 0.5 * step',
      'back = -step',
      'lapse = step / 2 km',
      'ratio = rise / step',
    ]);
    // 36 °F of interval = 36 × 5/9 K = 20 K (NIST SP 811 (2008) B.8; from memory).
    expect(si(r, 'rise')).toBeCloseTo(20, 12);
    expect(r.values.rise!.display).toBe('36 Δ°F');
    expect(si(r, 'step')).toBe(20);
    expect(r.values.warm).toMatchObject({ display: '35 °C' });
    expect(si(r, 'warm')).toBeCloseTo(308.15, 10);
    expect(r.values.half).toMatchObject({ display: '10 Δ°C', interval: true });
    expect(r.values.back).toMatchObject({ display: '−20 Δ°C', interval: true });
    expect(r.values.lapse).toEqual({ si: 0.01, unit: 'K/m', display: '0.01 K/m' });
    expect(r.values.ratio).toEqual({ si: 1, unit: '', display: '1' });
  });

  it('sums, means and sweeps of temperatures follow the same rules', async () => {
    const r = await sheet(['m = mean([10, 20] degC)', 's = sum([10, 20] degC)', 'd = sum([1, 2] delta_degC)', 'sweep = linspace(10 degC, 20 degC, 3)']);
    expect(r.values.m).toMatchObject({ display: '15 °C' });
    expect(si(r, 'm')).toBeCloseTo(288.15, 10);
    expect(r.values.d).toMatchObject({ display: '3 Δ°C', interval: true });
    expect(r.values.sweep!.display).toBe('[10, 15, 20] °C');
    expect(r.errors.map((e) => [e.line, e.message])).toEqual([[3, 'sum(): cannot add two absolute temperatures; subtract them for a difference, or add a difference in K']]);
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

  it('keeps units in their own namespace: a name m is the name in arithmetic', async () => {
    const r = await sheet(['m = 5 kg', 'w = m * 2', 'x = 12 metre']);
    expect(si(r, 'w')).toBe(10);
    expect(r.values.w!.unit).toBe('kg');
    expect(r.errors).toEqual([{ line: 4, column: 8, message: expect.stringMatching(/"metre" is not a known unit/), code: 'unknown-unit' }]);
  });

  it('a word after a number that is also a name on the sheet is an error with both readings', async () => {
    // L for a reference length is common practice; after a number it is the litre.
    const r = await sheet(['L = 5 m', 'half = 0.5 L', 'ok = 0.5 * L', 'V = 0.5 litre']);
    expect(r.errors).toEqual([
      {
        line: 3,
        column: 8,
        code: 'ambiguous-unit',
        message: 'in 0.5 L, "L" is read as a unit (litre), but L is also a name on this sheet (line 2: L = 5 m); write 0.5 * L to use the name, or 0.5 litre for the unit',
      },
    ]);
    expect(si(r, 'ok')).toBe(2.5);
    expect(si(r, 'V')).toBeCloseTo(5e-4, 15);
  });

  it('the same for any unit symbol a sheet defines, inside compound units too, and in prose', async () => {
    const r = await sheet(['h = 2 m', 'v = 12 m/s / h', 'g = 9.81 m/s^2', 'w = 5 g']);
    const messages = r.errors.map((e) => e.message);
    // "12 m/s / h" reads 12 m/(s h): per hour, not divided by the height.
    expect(messages[0]).toBe('in 12 m/(s h), "h" is read as a unit (hour), but h is also a name on this sheet (line 2: h = 2 m); write (12 m/s) / h to use the name, or 12 m/(s hour) for the unit');
    expect(messages[1]).toMatch(/^in 5 g, "g" is read as a unit \(gram\), but g is also a name on this sheet \(line 4: g = 9.81 m\/s\^2\); write 5 \* g to use the name, or 5 gram for the unit$/);
    const prose = await renderSheet('```basis\nL = 5 m\n```\n\nA volume of `=0.5 L`.\n');
    expect(prose.errors.map((e) => e.code)).toEqual(['ambiguous-unit']);
  });

  it('converting to a unit of another dimension is an error', async () => {
    const r = await sheet(['x = 3 m/s to Pa', 'y = 3 m to 1']);
    expect(r.errors.map((e) => e.message)).toEqual(['cannot convert m/s to Pa', 'cannot convert m to a plain number']);
  });

  it('converts to a plain number with "to 1", and reads a reciprocal unit written 1/s, as the page prints it', async () => {
    const r = await sheet(['share = 10 % to 1', 'f = 34 1/s', 'f_min = f to 1/min', 'n = [1, 2] 1/s']);
    expect(r.values.share).toEqual({ si: 0.1, unit: '', display: '0.1' });
    expect(r.values.f).toEqual({ si: 34, unit: '1/s', display: '34 1/s' });
    expect(r.values.f_min).toEqual({ si: 34, unit: '1/s', display: '2040 1/min' });
    expect(r.values.n!.items!.map((i) => i.display)).toEqual(['1 1/s', '2 1/s']);
    expect(r.errors).toEqual([]);
  });

  it('hints "^" for a power written as a digit: m/s2, s2 (mathjs itself knows m2 and m3)', async () => {
    const r = await sheet(['a = 3 m/s2', 't = 3 s2', 'b = 3 m / s2', 'A = 3 m2']);
    expect(si(r, 'A')).toBe(3);
    expect(r.values.A!.unit).toBe('m^2');
    expect(r.errors.map((e) => [e.line, e.column, e.code, e.message])).toEqual([
      [2, 9, 'unknown-unit', '"s2" is not a unit: a power of a unit is written with "^", as in m/s^2'],
      [3, 7, 'unknown-unit', '"s2" is not a known unit; a power of a unit is written with "^", as in s^2'],
      // Spaced out, "/ s2" divides by a name: with no such name it is an unknown name.
      [4, 11, 'unknown-name', '`s2` is not defined (line 4)'],
    ]);
  });
});
