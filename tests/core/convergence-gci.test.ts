// The grid convergence index against the worked example of Celik, Ghia,
// Roache, Freitas, Coleman & Raad (2008), "Procedure for estimation and
// reporting of uncertainty due to discretization in CFD applications",
// J. Fluids Eng. 130(7), 078001, Table 1, column 1 (from memory, high: the
// paper was not at hand; every printed output recomputes from the inputs, see
// shared/notes/reference-values.md §4). Each value is compared to half a unit
// of the last digit the paper prints.
import { describe, expect, it } from 'vitest';
import { list, num, si, shown, TradeError } from '../../server/core/index.js';
import { gci, observedOrder } from '../../server/core/convergence/gci.js';
import { boolField, call, siField } from './convergence-helpers.js';

const nums = (xs: number[]) => list(xs.map(num));
/** |actual − printed| within half a unit of the printed last digit. */
function printed(actual: number, value: number, lastDigit: number): void {
  expect(Math.abs(actual - value), `${actual} against the printed ${value}`).toBeLessThanOrEqual(lastDigit / 2 + 1e-12);
}

describe('Celik et al. (2008), Table 1, column 1: 2-D grids of 18000, 8000 and 4500 cells', () => {
  const r = call('gci', { phi: nums([6.063, 5.972, 5.863]), cells: nums([18000, 8000, 4500]), dim: num(2) });

  it('every printed output, to the digits printed', () => {
    printed(siField(r, 'r21'), 1.5, 0.1); // printed 1.5
    printed(siField(r, 'r32'), 1.333, 0.001); // printed 1.333
    printed(siField(r, 'p'), 1.53, 0.01); // printed 1.53
    printed(siField(r, 'phi_ext'), 6.1685, 0.0001); // printed 6.1685
    printed(siField(r, 'e_a') * 100, 1.5, 0.1); // printed 1.5 %
    printed(siField(r, 'e_ext') * 100, 1.7, 0.1); // printed 1.7 %
    printed(siField(r, 'gci_fine') * 100, 2.2, 0.1); // printed 2.2 %
  });

  it('converges monotonically and is in the asymptotic range', () => {
    expect(boolField(r, 'oscillatory')).toBe(false);
    expect(boolField(r, 'asymptotic')).toBe(true);
    expect(r.warnings).toEqual([]);
  });

  it('gives the same with representative cell sizes instead of cell counts', () => {
    const h = [18000, 8000, 4500].map((n) => Math.sqrt(1 / n));
    const byH = call('gci', { phi: nums([6.063, 5.972, 5.863]), h: list(h.map((x) => si(x, 'm'))) });
    for (const f of ['r21', 'r32', 'p', 'phi_ext', 'gci_fine']) expect(siField(byH, f)).toBeCloseTo(siField(r, f), 12);
  });

  it('keeps the unit of the values for the extrapolated one', () => {
    const withUnit = call('gci', { phi: list([6.063, 5.972, 5.863].map((x) => si(x, 'm'))), cells: nums([18000, 8000, 4500]), dim: num(2) });
    const v = withUnit.fields.get('phi_ext')!.value;
    expect(v.kind === 'quantity' && v.dims).toEqual(si(1, 'm').dims);
  });
});

describe('oscillatory convergence, a case of our own checked by hand (not a published case)', () => {
  // φ = 1.00, 0.98, 1.01 on h = 1, 2, 4: ε21 = −0.02, ε32 = +0.03, ε32/ε21 = −1.5, s = −1.
  // With r21 = r32 = 2, q(p) = ln[(2^p + 1)/(2^p + 1)] = 0, so p = ln 1.5 / ln 2 = 0.405465/0.693147 = 0.584963,
  // r21^p = 1.5; φ_ext = (1.5 × 1.00 − 0.98)/(1.5 − 1) = 1.04; e_a = 0.02 = 2 %;
  // e_ext = 0.04/1.04 = 3.8462 %; GCI_fine = 1.25 × 0.02/0.5 = 5 %;
  // e_a32 = 0.03/0.98 = 0.030612, GCI32 = 1.25 × 0.030612/0.5 = 7.6531 %; ratio = 0.076531/(1.5 × 0.05) = 1.0204.
  const r = call('gci', { phi: nums([1.0, 0.98, 1.01]), h: nums([1, 2, 4]) });

  it('follows the procedure\'s arithmetic', () => {
    expect(siField(r, 'p')).toBeCloseTo(0.584963, 6);
    expect(siField(r, 'phi_ext')).toBeCloseTo(1.04, 12);
    expect(siField(r, 'e_a')).toBeCloseTo(0.02, 12);
    expect(siField(r, 'e_ext')).toBeCloseTo(0.038462, 6);
    expect(siField(r, 'gci_fine')).toBeCloseTo(0.05, 12);
    expect(siField(r, 'gci_medium')).toBeCloseTo(0.076531, 6);
    expect(siField(r, 'ratio')).toBeCloseTo(1.0204, 4);
  });

  it('is flagged oscillatory, with a warning that says what to do', () => {
    expect(boolField(r, 'oscillatory')).toBe(true);
    expect(r.warnings.join(' ')).toMatch(/oscillatory convergence.*add a grid/);
  });
});

describe('the fixed-point iteration for the observed order', () => {
  it('solves p = |ln|ε32/ε21| + q(p)| / ln r21 with q(p) = ln[(r21^p − s)/(r32^p − s)]', () => {
    const { p } = observedOrder(1.5, 4 / 3, (5.863 - 5.972) / (5.972 - 6.063), 1);
    const q = Math.log((Math.pow(1.5, p) - 1) / (Math.pow(4 / 3, p) - 1));
    expect(Math.abs(Math.log(109 / 91) + q) / Math.log(1.5)).toBeCloseTo(p, 12);
  });

  it('recovers the order of an exact power-law error', () => {
    // φ(h) = 2 + 0.3 h^1.7 on unequal ratios: the observed order is 1.7.
    const h = [0.01, 0.017, 0.025] as const;
    const phi = h.map((x) => 2 + 0.3 * Math.pow(x, 1.7)) as [number, number, number];
    const g = gci({ phi, h });
    expect(g.p).toBeCloseTo(1.7, 10);
    expect(g.phi_ext).toBeCloseTo(2, 10);
  });
});

describe('inputs that cannot make a study', () => {
  const bad = (args: Parameters<typeof call>[1]) => () => call('gci', args);
  it('plain words for each', () => {
    expect(bad({ phi: nums([1, 1, 1.1]), cells: nums([8e6, 4e6, 2e6]) })).toThrow('φ1 and φ2 are equal');
    expect(bad({ phi: nums([1, 1.1, 1.2]), cells: nums([2e6, 4e6, 8e6]) })).toThrow(/fine to coarse/);
    expect(bad({ phi: nums([1, 1.1, 1.2]) })).toThrow(/give cells/);
    expect(bad({ phi: nums([1, 1.1, 1.2]), cells: nums([8, 4, 2]), h: nums([1, 2, 4]) })).toThrow('give either cells or h, not both');
    expect(bad({ phi: nums([1, 1.1]), cells: nums([8, 4, 2]) })).toThrow(/three values/);
    expect(bad({ phi: list([si(1, 'm'), si(1.1, 's'), si(1.2, 'm')]), h: nums([1, 2, 4]) })).toThrow(/must share one unit/);
    expect(bad({ phi: list([shown(20, 'degC'), shown(21, 'degC'), shown(22.5, 'degC')]), h: nums([1, 2, 4]) })).toThrow(/give it in K/);
    expect(bad({ phi: nums([1, 1.1, 1.2]), cells: nums([8, 4, 2]), dim: num(4) })).toThrow('dim must be 1, 2 or 3, not 4');
  });

  it('warns when the grids are too close (Celik et al. 2008 ask for r above 1.3)', () => {
    const r = call('gci', { phi: nums([1.0, 1.02, 1.05]), cells: nums([10e6, 8e6, 6e6]), dim: num(3) });
    expect(r.warnings.join(' ')).toMatch(/r21 = 1.077 is below 1.3/);
  });

  it('refuses an order that cannot be observed', () => {
    // Equal differences on equal ratios: p = 0, and no extrapolation exists.
    expect(() => call('gci', { phi: nums([1, 1.1, 1.2]), h: nums([1, 2, 4]) })).toThrow(TradeError);
  });
});
