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
