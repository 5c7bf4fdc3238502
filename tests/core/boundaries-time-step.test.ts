import { describe, expect, it } from 'vitest';
import { relErr, run, runRecord, runSi, siField } from './boundaries-helpers.js';

describe('time step, flow-through time and shedding', () => {
  it('time step for a Courant number: Δt = C Δx / U (Courant, Friedrichs & Lewy 1928)', () => {
    expect(relErr(runSi('time_step(40 m/s, 5 mm)'), 0.005 / 40)).toBeLessThan(1e-12);
    expect(relErr(runSi('time_step(40 m/s, 5 mm, courant: 0.5)'), 0.5 * 0.005 / 40)).toBeLessThan(1e-12);
    // Courant number back from the step: C = U Δt / Δx.
    expect(relErr((40 * runSi('time_step(40 m/s, 5 mm, courant: 2)')) / 0.005, 2)).toBeLessThan(1e-12);
  });

  it('warns above C = 1, where explicit schemes lose stability (CFL 1928)', () => {
    expect(run('time_step(40 m/s, 5 mm, courant: 2)').warnings.join(' ')).toMatch(/explicit schemes need C ≤ 1/);
    expect(run('time_step(40 m/s, 5 mm, courant: 1)').warnings).toEqual([]);
    expect(() => run('time_step(0 m/s, 5 mm)')).toThrow(/speed U must be above zero/);
    expect(() => run('time_step(10 m/s, 0 mm)')).toThrow(/cell size dx must be above zero/);
  });

  it('flow-through time is L / U (definition)', () => {
    expect(relErr(runSi('flow_through(60 m, 30 m/s)'), 2)).toBeLessThan(1e-12);
    expect(relErr(runSi('flow_through(400 m, 110 km/h)'), 400 / (110 / 3.6))).toBeLessThan(1e-12);
  });

  it('circular cylinder: St ≈ 0.2 at subcritical Re (Roshko 1954; Williamson 1996; from memory) gives f = St U / D', () => {
    const r = runRecord('shedding(20 m/s, 0.1 m)');
    expect(siField(r, 'St')).toBe(0.2);
    expect(relErr(siField(r, 'frequency'), 40)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'period'), 0.025)).toBeLessThan(1e-12);
    expect(r.fields.has('steps')).toBe(false);
    expect(r.remarks.join(' ')).toMatch(/0\.2 for a circular cylinder.*0\.13 for a square section.*0\.132/);
  });

  it('square section: St ≈ 0.13 (Okajima 1982, from memory), with the steps per period T/Δt', () => {
    const r = runRecord('shedding(10 m/s, 2 m, St: 0.13, dt: 0.01 s)');
    const T = 2 / (0.13 * 10);
    expect(relErr(siField(r, 'period'), T)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'steps'), T / 0.01)).toBeLessThan(1e-12);
    expect(r.warnings).toEqual([]);
  });

  it('warns below about 20 steps per period (common practice) and says which step would do', () => {
    const r = runRecord('shedding(20 m/s, 0.1 m, dt: 2 ms)');
    expect(siField(r, 'steps')).toBeCloseTo(12.5, 12);
    expect(r.warnings.join(' ')).toMatch(/only 12\.5 steps per shedding period; .* take Δt ≤ T\/30 = 8\.33e−4 s/);
    expect(runRecord('shedding(20 m/s, 0.1 m, dt: 1 ms)').warnings).toEqual([]); // 25 steps
    expect(() => run('shedding(20 m/s, 0.1 m, St: 0)')).toThrow(/Strouhal number St must be above zero/);
    expect(() => run('shedding(20 m/s, 0.1 m, dt: 0 s)')).toThrow(/time step dt must be above zero/);
  });
});
