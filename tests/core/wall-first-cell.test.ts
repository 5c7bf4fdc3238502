import { describe, expect, it } from 'vitest';
import { num, record, si, str } from '../../server/core/index.js';
import { bandOf, firstCell } from '../../server/core/wall/first-cell.js';
import { asQuantity, asRecord, call, ISA_MU, ISA_RHO, isaAir, relErr, siField, stubContext, textField } from './wall-helpers.js';

const defaults = { method: str('schlichting'), placement: str('centroid') };

describe('first cell for a target y+', () => {
  it('follows the chain by hand: 10 m/s over 1 m of sea-level air (USSA 1976), y+ = 1 at the centre', () => {
    // Re = ρUL/μ; cf by Schlichting (footnote to Eq. 21.16); τ_w = ½ρU²cf; u_τ = √(τ_w/ρ); l = ν/u_τ (Pope 2000, §7.1).
    const U = 10;
    const L = 1;
    const re = (ISA_RHO * U * L) / ISA_MU;
    const cf = (2 * Math.log10(re) - 0.65) ** -2.3;
    const tau = 0.5 * ISA_RHO * U * U * cf;
    const uTau = Math.sqrt(tau / ISA_RHO);
    const lVisc = ISA_MU / ISA_RHO / uTau;

    const r = asRecord(call('first_cell', { U: si(U, 'm/s'), L: si(L, 'm'), fluid: isaAir, yplus: num(1), ...defaults }));
    expect([...r.fields.keys()]).toEqual(['Re', 'cf', 'tau_w', 'u_tau', 'l_visc', 'height', 'centroid', 'band']);
    expect(relErr(siField(r, 'Re'), re)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'cf'), cf)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'tau_w'), tau)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'u_tau'), uTau)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'l_visc'), lVisc)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'centroid'), lVisc)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'height'), 2 * lVisc)).toBeLessThan(1e-12);
    expect(textField(r, 'band')).toBe('viscous sublayer');
    expect(r.remarks.join(' ')).toMatch(/Resolve the wall/);
    expect(r.remarks.join(' ')).toContain('c_f by schlichting (Schlichting, Boundary-Layer Theory (7th ed.), footnote to Eq. (21.16): c_f = (2 log10 Re_x - 0.65)^-2.3) at Re built on L');
  });

  it('with placement "height" the cell top meets the target', () => {
    const c = firstCell(10, 1, ISA_RHO, ISA_MU / ISA_RHO, 30, 'schlichting', 'height');
    expect(relErr(c.height, 30 * c.l_visc)).toBeLessThan(1e-12);
    expect(relErr(c.centroid, c.height / 2)).toBeLessThan(1e-12);
  });

  it('names the bands by Pope (2000) §7.1.4 limits 5 and 30, and about 300 (common practice)', () => {
    expect(bandOf(1)).toBe('viscous sublayer');
    expect(bandOf(4.99)).toBe('viscous sublayer');
    expect(bandOf(5)).toBe('buffer layer');
    expect(bandOf(29.9)).toBe('buffer layer');
    expect(bandOf(30)).toBe('log layer');
    expect(bandOf(300)).toBe('log layer');
    expect(bandOf(300.1)).toBe('outer layer');
    expect(bandOf(50)).toBe('log layer');
    expect(bandOf(500)).toBe('outer layer');
  });

  it('flags a buffer-layer target and advises wall functions for the log layer', () => {
    const buffer = asRecord(call('first_cell', { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(12), ...defaults }));
    expect(buffer.warnings.join(' ')).toMatch(/buffer layer/);
    const log = asRecord(call('first_cell', { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(50), ...defaults }));
    expect(log.warnings).toEqual([]);
    expect(textField(log, 'band')).toBe('log layer');
    expect(log.remarks.join(' ')).toMatch(/Wall functions/);
  });

  it('with the ITTC line, which has only a mean coefficient, uses it and says so', () => {
    const r = asRecord(call('first_cell', { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(1), method: str('ittc1957'), placement: str('centroid') }));
    expect(r.warnings.join(' ')).toMatch(/ittc1957 gives only the mean coefficient over the length Re is built on/);
    const re = (ISA_RHO * 30 * 4) / ISA_MU;
    // 8th ITTC 1957 line, C_F = 0.075/(log10 Re − 2)² (Morrall, NPL Ship Report 142, 1970).
    expect(relErr(siField(r, 'cf'), 0.075 / (Math.log10(re) - 2) ** 2)).toBeLessThan(1e-12);
  });

  it('a turbulent fit on a laminar plate warns with the laminar method to use', () => {
    // 2 m/s over 1 m of sea-level air: Re_L = 1.4e5, below the 5e5 transition (common practice).
    const r = asRecord(call('first_cell', { U: si(2, 'm/s'), L: si(1, 'm'), fluid: isaAir, yplus: num(1), ...defaults }));
    expect(r.warnings.join(' ')).toMatch(/below 5e5, where a smooth flat plate is laminar.*use method: "blasius"/);
  });

  it('refuses 1 cm/s over 1 cm (Re ≈ 7): no flat-plate skin friction applies there', () => {
    expect(() => call('first_cell', { U: si(0.01, 'm/s'), L: si(0.01, 'm'), fluid: isaAir, yplus: num(1), ...defaults })).toThrow(/is below 1e3: the boundary layer would not be thin/);
  });

  it('says when the flow is compressible or far beyond it (Ma ≈ 290), for a fluid with a speed of sound', () => {
    const air = record([['rho', si(ISA_RHO, 'kg/m^3')], ['mu', si(ISA_MU, 'Pa s')], ['a', si(340.294, 'm/s')]]);
    const fast = asRecord(call('first_cell', { U: si(1e5, 'm/s'), L: si(4, 'm'), fluid: air, yplus: num(1), ...defaults }));
    expect(fast.warnings.join(' ')).toMatch(/Ma = 294: hypersonic flow.*check the speed and its unit.*incompressible flow/);
    const transonic = asRecord(call('first_cell', { U: si(300, 'm/s'), L: si(4, 'm'), fluid: air, yplus: num(1), ...defaults }));
    expect(transonic.warnings.join(' ')).toMatch(/Ma = 0.882 is above 0.3: .* compressible solver set-up/);
    const ctx = stubContext();
    call('yplus', { height: si(1e-5, 'm'), U: si(300, 'm/s'), L: si(4, 'm'), fluid: air, method: str('schlichting'), placement: str('centroid') }, ctx);
    expect(ctx.warnings.join(' ')).toMatch(/Ma = 0.882 .* so y\+ is only a rough estimate/);
  });

  it('refuses a negative or zero speed, with the rule for speeds', () => {
    expect(() => call('first_cell', { U: si(-30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(1), ...defaults })).toThrow(/U = −30 m\/s is negative; give the speed's magnitude/);
    expect(() => call('first_cell', { U: si(0, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(1), ...defaults })).toThrow(/this needs a flow/);
    expect(() => call('first_cell', { U: si(30, 'm/s'), L: si(-4, 'm'), fluid: isaAir, yplus: num(1), ...defaults })).toThrow('the reference length L = −4 m must be positive');
  });

  it('yplus() inverts first_cell for both placements', () => {
    for (const placement of ['centroid', 'height']) {
      const args = { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, method: str('schlichting'), placement: str(placement) };
      const r = asRecord(call('first_cell', { ...args, yplus: num(2.5) }));
      const back = asQuantity(call('yplus', { ...args, height: si(siField(r, 'height'), 'm') }, stubContext()));
      expect(relErr(back.si, 2.5)).toBeLessThan(1e-12);
    }
  });

  it('rejects a non-positive target y+ in plain words', () => {
    expect(() => call('first_cell', { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(0), ...defaults })).toThrow('the target y+ must be positive, not 0');
    const args = { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, method: str('schlichting'), placement: str('centroid') };
    expect(() => call('yplus', { ...args, height: si(-1e-5, 'm') })).toThrow('the first-cell height must be positive, not −1e−5 m');
  });
});
