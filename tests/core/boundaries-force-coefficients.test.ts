import { describe, expect, it } from 'vitest';
import { ISA_RHO, relErr, run, runRecord, siField } from './boundaries-helpers.js';

// Checks worked by hand from the definitions C = F/(q A), q = ½ρU², C_M = M/(q A l_ref)
// (e.g. Hucho, Aerodynamics of Road Vehicles, 4th ed., 1998, from memory), with the air
// density of the U.S. Standard Atmosphere 1976 at sea level.

describe('force coefficients', () => {
  it('divides each force component by q A, q = ½ρU² (definition; sea-level air, USSA 1976 ρ = 1.2250 kg/m³)', () => {
    const q = 0.5 * ISA_RHO * 30 * 30;
    const r = runRecord('force_coefficients([620, 15, -90] N, isa, 30 m/s, 2.2 m^2)');
    expect([...r.fields.keys()]).toEqual(['Cd', 'Cl', 'Cs', 'q', 'U', 'A']);
    expect(relErr(siField(r, 'q'), q)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'Cd'), 620 / (q * 2.2))).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'Cs'), 15 / (q * 2.2))).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'Cl'), -90 / (q * 2.2))).toBeLessThan(1e-12);
    expect(r.warnings).toEqual([]);
    expect(r.remarks.join(' ')).toMatch(/x downstream \(drag\), y lateral \(side force\), z up \(lift\)/);
  });

  it('gives Cm = M / (q A l_ref) when a moment and a reference length are given', () => {
    const q = 0.5 * ISA_RHO * 30 * 30;
    const r = runRecord('force_coefficients([620, 15, -90] N, isa, 30 m/s, 2.2 m^2, M: -150 N m, l_ref: 3.2 m)');
    expect(relErr(siField(r, 'Cm'), -150 / (q * 2.2 * 3.2))).toBeLessThan(1e-12);
    expect(siField(r, 'l_ref')).toBe(3.2);
    expect(() => run('force_coefficients([620, 15, -90] N, isa, 30 m/s, 2.2 m^2, M: -150 N m)')).toThrow(/needs the reference length: give l_ref/);
  });

  it('a drag force of 1 q A is a drag coefficient of 1 (definition)', () => {
    const r = runRecord('force_coefficients([0.5 * 1.225 * 20^2 * 3, 0, 0] N, isa, 20 m/s, 3 m^2)');
    expect(relErr(siField(r, 'Cd'), 1)).toBeLessThan(1e-12);
  });

  it('warns on a negative drag force and refuses a force without three components', () => {
    expect(runRecord('force_coefficients([-10, 0, 0] N, isa, 30 m/s, 2 m^2)').warnings.join(' ')).toMatch(/Fx is negative/);
    expect(() => run('force_coefficients([620, 15] N, isa, 30 m/s, 2.2 m^2)')).toThrow(/three components/);
    expect(() => run('force_coefficients([620, 15, 0] N, isa, 30 m/s, 0 m^2)')).toThrow(/reference area A must be above zero/);
    expect(() => run('force_coefficients([620, 15, 0] N, isa, 0 m/s, 2 m^2)')).toThrow(/reference speed U must not be zero/);
  });
});
