import { describe, expect, it } from 'vitest';
import { richardsHoxey } from '../../server/core/boundaries/abl-profile.js';
import { relErr, run, runRecord, siField, tableColumns, tableRows } from './boundaries-helpers.js';

describe('atmospheric inflow after Richards & Hoxey (1993)', () => {
  const heights = [0, 2, 5, 10, 20, 50, 100, 200];

  it('gives U_ref at z_ref, k the same at every height and ε (z + z0) constant (R&H 1993 profiles)', () => {
    const r = runRecord('abl(12 m/s, 10 m, 0.3 m, heights: [0, 2, 5, 10, 20, 50, 100, 200] m)');
    expect(tableColumns(r)).toEqual(['z', 'U', 'k', 'epsilon', 'omega']);
    const rows = tableRows(r) as number[][];
    expect(rows.map((row) => row[0])).toEqual(heights);
    const at10 = rows.find((row) => row[0] === 10)!;
    expect(relErr(at10[1]!, 12)).toBeLessThan(1e-12);
    const k = siField(r, 'k');
    const u = siField(r, 'u_star');
    for (const [z, U, kz, eps, omega] of rows) {
      expect(relErr(kz!, k)).toBeLessThan(1e-12);
      // ε (z + z0) = u*³/κ at every height.
      expect(relErr(eps! * (z! + 0.3), u ** 3 / 0.41)).toBeLessThan(1e-12);
      // ω = ε/(Cμ k), the consistent k-ω form.
      expect(relErr(omega!, eps! / (0.09 * k))).toBeLessThan(1e-12);
      expect(U!).toBeGreaterThanOrEqual(0);
    }
    expect(rows[0]![1]).toBe(0); // U(0) = u*/κ ln(1) = 0: the log law reaches zero at the ground.
  });

  it('matches u*, k and ε(10 m) worked by hand for U10 = 10 m/s, z0 = 0.05 m (reference-values §8, derived)', () => {
    // u* = κ U_ref / ln((z_ref + z0)/z0) = 0.41 × 10 / ln(201) = 0.77310; k = u*²/√0.09 = 1.99229; ε(10) = u*³/(κ (10.05)) = 0.112140.
    const r = runRecord('abl(10 m/s, 10 m, 0.05 m, heights: [10] m)');
    expect(relErr(siField(r, 'u_star'), (0.41 * 10) / Math.log(10.05 / 0.05))).toBeLessThan(1e-12);
    expect(Math.abs(siField(r, 'u_star') - 0.7731)).toBeLessThan(5e-5);
    expect(Math.abs(siField(r, 'k') - 1.99229)).toBeLessThan(5e-6);
    expect(Math.abs((tableRows(r) as number[][])[0]![3]! - 0.11214)).toBeLessThan(5e-7);
  });

  it('takes κ and Cμ as stated arguments (κ = 0.40 as Richards & Norris 2011 use, reference-values §8)', () => {
    const r = runRecord('abl(10 m/s, 10 m, 0.05 m, heights: [10] m, kappa: 0.4, C_mu: 0.09)');
    expect(relErr(siField(r, 'u_star'), (0.4 * 10) / Math.log(201))).toBeLessThan(1e-12);
    expect(siField(r, 'kappa')).toBe(0.4);
    const rh = runRecord('abl(10 m/s, 10 m, 0.05 m, heights: [10] m, kappa: 0.42, C_mu: 0.013)');
    // k = u*²/√Cμ with R&H's own constants (from memory, medium-low).
    expect(relErr(siField(rh, 'k'), siField(rh, 'u_star') ** 2 / Math.sqrt(0.013))).toBeLessThan(1e-12);
    expect(rh.remarks.join(' ')).toMatch(/κ = 0\.42 and Cμ = 0\.013 to their Silsoe/);
  });

  it('states the σ_ε the profile needs with standard k-ε: 1.167 for κ = 0.41, Cμ = 0.09 (reference-values §8, derived)', () => {
    const r = runRecord('abl(10 m/s, 10 m, 0.05 m, heights: [10] m)');
    expect(r.remarks.join(' ')).toMatch(/σ_ε = κ²\/\(\(C_ε2 − C_ε1\)√Cμ\) = 1\.17/);
  });

  it('shows the caution and a profile plot', () => {
    const r = runRecord('abl(10 m/s, 10 m, 0.05 m, heights: [2, 10, 50] m)');
    expect(r.tag).toBe('caution');
    expect(r.remarks.join(' ')).toMatch(/design wind loads follow EN 1991-1-4/);
    expect(r.figure?.svg).toMatch(/^<svg[\s\S]*Richards &amp; Hoxey[\s\S]*z_ref[\s\S]*<\/svg>$/);
  });

  it('takes z0 and z_min from a terrain record and warns below z_min (EN 1991-1-4, Table 4.1)', () => {
    const terr = runRecord('terrain("III")');
    const r = runRecord('abl(10 m/s, 10 m, terr, heights: [1.5, 5, 10] m)', { terr });
    expect(siField(r, 'z0')).toBe(0.3);
    expect(r.warnings.join(' ')).toMatch(/height 1\.5 m lies below z_min = 5 m of terrain category III/);
    expect(r.figure?.svg).toMatch(/z_min \(EN 1991-1-4\)/);
    const clean = runRecord('abl(10 m/s, 10 m, terr, heights: [5, 10, 100] m)', { terr });
    expect(clean.warnings).toEqual([]);
    expect(runRecord('abl(10 m/s, 3 m, terr, heights: [10] m)', { terr }).warnings.join(' ')).toMatch(/reference height 3 m is below z_min/);
    expect(runRecord('abl(10 m/s, 10 m, terr, heights: [250] m)', { terr }).warnings.join(' ')).toMatch(/above z_max = 200 m/);
  });

  it('refuses z0 ≤ 0, z_ref ≤ 0 and heights below the ground in plain words', () => {
    expect(() => run('abl(10 m/s, 10 m, 0 m, heights: [10] m)')).toThrow(/roughness length z0 must be above zero/);
    expect(() => run('abl(10 m/s, 0 m, 0.05 m, heights: [10] m)')).toThrow(/reference height z_ref must be above the ground/);
    expect(() => run('abl(10 m/s, 10 m, 0.05 m, heights: [-1, 10] m)')).toThrow(/below the ground/);
    expect(() => run('abl(10 m/s, 10 m, "rough", heights: [10] m)')).toThrow(/z0 must be a roughness length/);
  });

  it('the profile function alone: U(z_ref) = U_ref for any roughness (R&H 1993)', () => {
    for (const z0 of [0.003, 0.01, 0.05, 0.3, 1]) {
      const p = richardsHoxey(25, 40, z0);
      expect(relErr(p.at(40).U, 25)).toBeLessThan(1e-12);
    }
  });
});
