import { describe, expect, it } from 'vitest';
import { num, si, str } from '../../server/core/index.js';
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

  it('carries the skin-friction range warnings into the record', () => {
    const r = asRecord(call('first_cell', { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(1), method: str('ittc1957'), placement: str('centroid') }));
    expect(r.warnings.join(' ')).toMatch(/mean coefficient/);
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
    expect(() => call('first_cell', { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(0), ...defaults })).toThrow(/target y\+ must be positive/);
  });
});
