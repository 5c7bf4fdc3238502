// How numbers are shown: prefixes as engineers write them, and the units a
// sheet asks for in its front matter.
import { describe, expect, it } from 'vitest';
import { sheet } from './helpers.js';

describe('the unit a quantity is shown in', () => {
  it('writes a small stress in Pa, never mPa, and a large one in kPa', async () => {
    const r = await sheet(['tau = 0.4089 Pa * 1', 'q = 2300 Pa * 1', 'h = 2.3e-5 m * 1']);
    expect(r.values.tau!.display).toBe('0.4089 Pa');
    expect(r.values.q!.display).toBe('2.3 kPa');
    expect(r.values.h!.display).toBe('23 µm');
  });

  it('shows a force times a length as a moment, N·m, and a typed joule as an energy', async () => {
    // The SI Brochure (BIPM, 9th ed., 2019, §2.3.4, Table 4) lists the moment of force in N m and energy in J (from memory).
    const r = await sheet(['F = 120 N', 'M = F * 0.4 m', 'E = 3000 J', 'T = 12 kN m']);
    expect(r.values.M!.display).toBe('48 N·m');
    expect(r.values.E!.display).toBe('3 kJ');
    expect(r.values.T!.display).toBe('12 kN·m');
  });

  it('follows the units the front matter asks for, by dimension, for every value and field', async () => {
    const r = await sheet(['U = 30 m/s', 'p = 0.5 * 1.2 kg/m^3 * U^2', 'wall = first_cell(U, 4 m, fluid(rho: 1.2 kg/m^3, mu: 1.8e-5 Pa s))'], 'units:\n  Pa: kPa\n  m: mm');
    expect(r.errors).toEqual([]);
    expect(r.values.p!.display).toBe('0.54 kPa');
    expect(r.values.wall!.fields!.height!.display).toMatch(/ mm$/);
    expect(r.values.wall!.fields!.tau_w!.display).toMatch(/ kPa$/);
    expect(r.values.U!.display).toBe('30 m/s'); // a unit the sheet wrote itself is kept
  });

  it('refuses a unit that is not one of its dimension, on the line of the setting', async () => {
    const r = await sheet(['x = 1 m'], 'title: t\nunits:\n  Pa: mm\n  furlong_per_fortnight: m');
    expect(r.errors.map((e) => [e.line, e.message])).toEqual([
      [3, 'units: Pa: mm is not a unit of Pa'],
      [3, 'units: "furlong_per_fortnight" is not a unit; name the dimension by its SI unit, such as Pa, m or m/s'],
    ]);
  });
});
