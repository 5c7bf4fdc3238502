import { describe, expect, it } from 'vitest';
import { ductLengthScale, inletTurbulence } from '../../server/core/boundaries/inlet-turbulence.js';
import { ISA_NU, relErr, run, runRecord, runSi, siField } from './boundaries-helpers.js';

const CMU = 0.09;

describe('inlet turbulence from intensity and length scale', () => {
  it('computes one inlet by hand: 10 m/s, I = 5 %, l = 0.07 m (CFD-Wiki, Turbulence free-stream boundary conditions)', () => {
    const U = 10;
    const I = 0.05;
    const l = 0.07;
    // CFD-Wiki free-stream page (VERIFIED secondary): k = 3/2 (U I)², ε = Cμ^(3/4) k^(3/2)/l.
    const k = 1.5 * (U * I) ** 2;
    const eps = (CMU ** 0.75 * k ** 1.5) / l;
    // ω = k^(1/2)/(Cμ^(1/4) l) (from memory, high); ν_t = k/ω.
    const omega = Math.sqrt(k) / (CMU ** 0.25 * l);
    const r = runRecord('inlet_turbulence(10 m/s, intensity: 5 %, length: 0.07 m, fluid: isa)');
    expect([...r.fields.keys()]).toEqual(['k', 'epsilon', 'omega', 'nut', 'nut_ratio', 'length', 'intensity', 'U', 'C_mu']);
    expect(relErr(siField(r, 'k'), k)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'epsilon'), eps)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'omega'), omega)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'nut'), k / omega)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'nut_ratio'), k / omega / ISA_NU)).toBeLessThan(1e-12);
    expect(siField(r, 'length')).toBe(0.07);
  });

  it('matches the worked values of reference-values §10 to their six printed figures', () => {
    // Reference note §10 (DERIVED from the CFD-Wiki formulas): k = 0.375, ε = 0.539052, ω = 15.9719, ν_t = 0.0234787.
    const t = inletTurbulence(10, 0.05, { length: 0.07 }, ISA_NU);
    expect(t.k).toBeCloseTo(0.375, 12);
    expect(Math.abs(t.epsilon - 0.539052)).toBeLessThan(5e-7);
    expect(Math.abs(t.omega - 15.9719)).toBeLessThan(5e-5);
    expect(Math.abs(t.nut - 0.0234787)).toBeLessThan(5e-8);
  });

  it('keeps the k-ε and k-ω forms consistent: ω = ε/(Cμ k) and ν_t = Cμ k²/ε (from memory, high)', () => {
    for (const [U, I, l] of [[3, 0.01, 0.5], [40, 0.002, 2], [1.5, 0.2, 0.01]] as const) {
      const t = inletTurbulence(U, I, { length: l }, ISA_NU);
      expect(relErr(t.omega, t.epsilon / (CMU * t.k))).toBeLessThan(1e-12);
      expect(relErr(t.nut, (CMU * t.k * t.k) / t.epsilon)).toBeLessThan(1e-12);
    }
  });

  it('states the length-scale convention: the other one, l = Cμ k^(3/2)/ε, is Cμ^(1/4) = 0.548 times ours (CFD-Wiki length-scale page)', () => {
    const r = runRecord('inlet_turbulence(10 m/s, intensity: 5 %, length: 0.07 m, fluid: isa)');
    const other = (CMU * siField(r, 'k') ** 1.5) / siField(r, 'epsilon');
    expect(relErr(other / 0.07, CMU ** 0.25)).toBeLessThan(1e-12);
    expect(r.remarks.join(' ')).toMatch(/Cμ k\^\(3\/2\)\/ε instead need 0\.548 ×/);
  });

  it('with viscosity_ratio the length is derived so that ν_t = ratio · ν, and the record says which was given', () => {
    const r = runRecord('inlet_turbulence(30 m/s, intensity: 1 %, viscosity_ratio: 10, fluid: isa)');
    expect(relErr(siField(r, 'nut'), 10 * ISA_NU)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'nut_ratio'), 10)).toBeLessThan(1e-12);
    // Feeding the derived length back gives the same state (ν_t = k/ω, CFD-Wiki ε formula).
    const back = inletTurbulence(30, 0.01, { length: siField(r, 'length') }, ISA_NU);
    expect(relErr(back.epsilon, siField(r, 'epsilon'))).toBeLessThan(1e-12);
    expect(r.fields.get('length')!.note).toMatch(/derived from the viscosity ratio/);
    expect(r.fields.get('nut_ratio')!.note).toMatch(/as given/);
    expect(r.remarks[0]).toMatch(/^Eddy-viscosity ratio given/);
  });

  it('takes Cμ as an argument', () => {
    const r = runRecord('inlet_turbulence(10 m/s, intensity: 5 %, length: 0.07 m, fluid: isa, C_mu: 0.1)');
    expect(relErr(siField(r, 'epsilon'), (0.1 ** 0.75 * 0.375 ** 1.5) / 0.07)).toBeLessThan(1e-12);
  });

  it('refuses both or neither of length and viscosity_ratio, and a percentage written as a plain number', () => {
    expect(() => run('inlet_turbulence(10 m/s, intensity: 5 %, length: 1 m, viscosity_ratio: 10, fluid: isa)')).toThrow(/not both/);
    expect(() => run('inlet_turbulence(10 m/s, intensity: 5 %, fluid: isa)')).toThrow(/give a length scale/);
    expect(() => run('inlet_turbulence(10 m/s, intensity: 5, length: 1 m, fluid: isa)')).toThrow(/500 %; write the per cent sign/);
    expect(() => run('inlet_turbulence(10 m/s, intensity: 0 %, length: 1 m, fluid: isa)')).toThrow(/intensity must be above zero/);
    expect(() => run('inlet_turbulence(10 m/s, intensity: 1 %, length: 0 m, fluid: isa)')).toThrow(/length scale must be above zero/);
  });

  it('warns above about 20 % intensity (common practice)', () => {
    expect(runRecord('inlet_turbulence(10 m/s, intensity: 30 %, length: 1 m, fluid: isa)').warnings.join(' ')).toMatch(/above about 20 %/);
    expect(runRecord('inlet_turbulence(10 m/s, intensity: 15 %, length: 1 m, fluid: isa)').warnings).toEqual([]);
  });
});

describe('duct length scale', () => {
  it('is 7 % of the hydraulic diameter (CFD-Wiki, Turbulence length scale)', () => {
    expect(relErr(runSi('duct_length_scale(0.5 m)'), 0.035)).toBeLessThan(1e-12);
    expect(relErr(ductLengthScale(1), 0.07)).toBeLessThan(1e-12);
    expect(() => ductLengthScale(0)).toThrow(/hydraulic diameter must be above zero/);
  });
});
