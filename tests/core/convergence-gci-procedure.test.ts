// The grid convergence index step by step, each call made inside its test:
// Celik, Ghia, Roache, Freitas, Coleman & Raad (2008), "Procedure for
// estimation and reporting of uncertainty due to discretization in CFD
// applications", J. Fluids Eng. 130(7), 078001 (procedure and Table 1,
// column 1 from memory, high; reference-values.md §4). Values the paper prints
// are compared to half a unit of their last printed digit; relations derived
// here from the paper's equations are named as derived.
import { describe, expect, it } from 'vitest';
import { list, num, shown, si, str, TradeError } from '../../server/core/index.js';
import { ASYMPTOTIC_TOLERANCE, cellSizes, gci, MIN_RATIO, observedOrder, SAFETY_FACTOR } from '../../server/core/convergence/gci.js';
import { boolField, call, siField } from './convergence-helpers.js';

const nums = (xs: number[]) => list(xs.map(num));
const TABLE1_PHI = [6.063, 5.972, 5.863] as const;
const TABLE1_CELLS = [18000, 8000, 4500];

/** |actual − printed| within half a unit of the printed last digit. */
function printed(actual: number, value: number, lastDigit: number): void {
  expect(Math.abs(actual - value), `${actual} against the printed ${value}`).toBeLessThanOrEqual(lastDigit / 2 + 1e-12);
}

describe('Celik et al. (2008), Table 1, column 1, computed inside the test', () => {
  it('gives every printed output from gci() and cellSizes()', () => {
    const g = gci({ phi: TABLE1_PHI, h: cellSizes(TABLE1_CELLS, 2) });
    printed(g.r21, 1.5, 0.1);
    printed(g.r32, 1.333, 0.001);
    printed(g.p, 1.53, 0.01);
    printed(g.phi_ext, 6.1685, 0.0001);
    printed(g.e_a * 100, 1.5, 0.1);
    printed(g.e_ext * 100, 1.7, 0.1);
    printed(g.gci_fine * 100, 2.2, 0.1);
    expect(g.oscillatory).toBe(false);
    expect(g.asymptotic).toBe(true);
    expect(g.iterations).toBeGreaterThanOrEqual(1);
    expect(g.iterations).toBeLessThanOrEqual(500);
  });

  it('has GCI32 = 1.25 e_a32/(r32^p − 1) and, for monotone grids, a check ratio of exactly φ1/φ2 (derived here from Eq. 3)', () => {
    // With s = 1, Eq. 3 gives |ε32/ε21| = r21^p (r32^p − 1)/(r21^p − 1), and
    // GCI32/(r21^p GCI21) then reduces to φ1/φ2.
    const g = gci({ phi: TABLE1_PHI, h: cellSizes(TABLE1_CELLS, 2) });
    const e_a32 = Math.abs((5.972 - 5.863) / 5.972);
    expect(g.gci_medium).toBeCloseTo((1.25 * e_a32) / (Math.pow(g.r32, g.p) - 1), 12);
    expect(g.ratio).toBeCloseTo(6.063 / 5.972, 12);
  });

  it('shows the errors, the remarks of each step and the report line through the worksheet entry', () => {
    const r = call('gci', { phi: nums([...TABLE1_PHI]), cells: nums(TABLE1_CELLS), dim: num(2) });
    const g = gci({ phi: TABLE1_PHI, h: cellSizes(TABLE1_CELLS, 2) });
    for (const [name, x] of [['e_a', g.e_a], ['e_ext', g.e_ext], ['gci_fine', g.gci_fine], ['gci_medium', g.gci_medium]] as const) {
      expect(siField(r, name), name).toBeCloseTo(x, 12);
    }
    expect(siField(r, 'ratio')).toBeCloseTo(g.ratio, 12);
    expect(r.warnings).toEqual([]);
    const remarks = r.remarks.join('\n');
    expect(remarks).toContain('h = (1/N)^(1/2) for grids over the same domain');
    expect(remarks).toContain(`by fixed-point iteration (${g.iterations} step${g.iterations === 1 ? '' : 's'})`);
    expect(remarks).toContain(`GCI_fine = ${SAFETY_FACTOR} e_a/(r21^p − 1), safety factor ${SAFETY_FACTOR} for three grids`);
    expect(remarks).toContain(`within ${ASYMPTOTIC_TOLERANCE * 100} %`);
    expect(remarks).toContain('Report: φ1 = 6.063 with a numerical uncertainty of ± 2.2 % (GCI_fine).');
    expect(r.tag).toBe('grid convergence');
  });

  it('says the cell sizes were taken as given when h is given', () => {
    const r = call('gci', { phi: nums([...TABLE1_PHI]), h: list(cellSizes(TABLE1_CELLS, 2).map((x) => si(x, 'm'))) });
    expect(r.remarks[0]).toBe('Cell sizes as given.');
  });
});

describe('the asymptotic check and its warning', () => {
  it('is failed when φ1/φ2 is far from 1 (own case: φ = 1.0, 0.8, 0.5 on h = 1, 2, 4)', () => {
    // ε21 = −0.2, ε32 = −0.3: p = ln 1.5/ln 2, r21^p = 1.5, and the ratio is φ1/φ2 = 1.25.
    const r = call('gci', { phi: nums([1.0, 0.8, 0.5]), h: nums([1, 2, 4]) });
    expect(siField(r, 'ratio')).toBeCloseTo(1.25, 12);
    expect(boolField(r, 'asymptotic')).toBe(false);
    expect(boolField(r, 'oscillatory')).toBe(false);
    expect(r.warnings).toEqual([
      `GCI32 / (r21^p GCI21) = 1.25 is not within ${ASYMPTOTIC_TOLERANCE * 100} % of 1: the grids are not yet in the asymptotic range, so treat the GCI as rough; refine further.`,
    ]);
  });

  it('says that with one refinement ratio the check is φ1/φ2 itself, and not with two', () => {
    // Derived here from Celik et al. (2008), eqs. 3–4 and the GCI definition: with r21 = r32 = r,
    // ε32 = r^p ε21, so GCI32/(r^p GCI21) = (e32/e21)/r^p = φ1/φ2.
    const same = call('gci', { phi: nums([1.0, 0.98, 0.95]), h: nums([1, 2, 4]) });
    expect(siField(same, 'ratio')).toBeCloseTo(1.0 / 0.98, 12);
    expect(same.remarks.join('\n')).toContain('With one refinement ratio for both pairs the ratio is φ1/φ2 exactly');
    const two = call('gci', { phi: nums([...TABLE1_PHI]), cells: nums(TABLE1_CELLS), dim: num(2) });
    expect(two.remarks.find((m) => m.startsWith('Asymptotic check'))).toBe(
      `Asymptotic check: GCI32 ≈ r21^p GCI21, judged near 1 when the ratio is within ${ASYMPTOTIC_TOLERANCE * 100} % (our threshold; the paper asks only that it be close to 1).`,
    );
    // Ratios that agree to a part in 10⁹ of r21 count as one (r21 = 2, r32 = 2 + 1e-9: within 1e-9 × r21 = 2e-9).
    const nearly = call('gci', { phi: nums([1.0, 0.98, 0.95]), h: nums([1, 2, 4 * (1 + 5e-10)]) });
    expect(nearly.remarks.join('\n')).toContain('With one refinement ratio for both pairs');
  });

  it('flags oscillatory convergence from gci() itself (own case of convergence-gci.test.ts)', () => {
    const g = gci({ phi: [1.0, 0.98, 1.01], h: [1, 2, 4] });
    expect(g.oscillatory).toBe(true);
    expect(g.asymptotic).toBe(true);
    expect(g.ratio).toBeCloseTo(1.0204, 4);
  });
});

describe('refinement ratios against the 1.3 Celik et al. (2008) ask for', () => {
  it('warns for r32 below it, naming r32', () => {
    const r = call('gci', { phi: nums([1.0, 1.02, 1.05]), h: nums([1, 2, 2.2]) });
    expect(r.warnings.join(' ')).toContain(`r32 = 1.1 is below ${MIN_RATIO}`);
    expect(r.warnings.join(' ')).not.toContain('r21');
  });

  it('does not warn for a ratio of exactly 1.3', () => {
    // r32 = 2: the order exists for |ε32/ε21| = 3 (it must exceed ln 2/ln 1.3 = 2.64, derived here).
    const r = call('gci', { phi: nums([1.0, 1.02, 1.08]), h: nums([1, 1.3, 2.6]) });
    expect(r.warnings.join(' ')).not.toMatch(/below 1.3/);
  });
});

describe('inputs that cannot make a study, each with its own words', () => {
  it('cell counts: three of them, each above zero and finite', () => {
    expect(() => cellSizes([18000, 8000], 2)).toThrow('cells must list three cell counts, fine to coarse');
    for (const bad of [[18000, 0, 4500], [18000, -8000, 4500], [Infinity, 8000, 4500], [18000, 8000, NaN]]) {
      expect(() => cellSizes(bad, 2), String(bad)).toThrow('every cell count must be above zero');
    }
  });

  it('cell sizes: each above zero', () => {
    for (const h of [[0, 2, 4], [-1, 2, 4], [1, 0, 4], [1, 2, 0], [1, 2, -4]] as const) {
      expect(() => gci({ phi: [1, 1.1, 1.3], h }), String(h)).toThrow('cell sizes must be above zero');
    }
  });

  it('cell sizes: strictly from fine to coarse', () => {
    for (const h of [[1, 1, 2], [1, 2, 2], [1, 2, 1.5], [2, 1, 4]] as const) {
      expect(() => gci({ phi: [1, 1.1, 1.3], h }), String(h)).toThrow('the grids must go from fine to coarse: h1 < h2 < h3, or cells N1 > N2 > N3');
    }
  });

  it('equal values on two grids, named', () => {
    expect(() => gci({ phi: [1, 1.1, 1.1], h: [1, 2, 4] })).toThrow('φ2 and φ3 are equal, so no order of convergence can be observed');
    expect(() => gci({ phi: [1, 1, 1.1], h: [1, 2, 4] })).toThrow('φ1 and φ2 are equal, so no order of convergence can be observed');
  });

  it('a fine-grid value of zero', () => {
    expect(() => gci({ phi: [0, 0.1, 0.3], h: [1, 2, 4] })).toThrow('φ1 is zero, so relative errors against it have no meaning');
  });

  it('an observed order of (nearly) zero', () => {
    // Equal ratios and differences alike to 1e-7: p = ln(1 + 1e-7)/ln 2 ≈ 1.4e-7.
    expect(() => gci({ phi: [1, 1.1, 1.2 + 1e-8], h: [1, 2, 4] })).toThrow('the observed order is zero');
    // Exactly equal differences: the iteration meets 0/0 at p = 0.
    expect(() => gci({ phi: [1, 1.5, 2], h: [1, 2, 4] })).toThrow('the observed order cannot be found: (r21^p − s)/(r32^p − s) is not positive at p = 0');
  });

  it('an order that runs away or does not settle (Eq. 3 has no root for these ratios)', () => {
    // With s = 1 the right side of |ε32/ε21| = r21^p (r32^p − 1)/(r21^p − 1) is at least
    // ln r32/ln r21 = 4.25 for r21 = 1.1, r32 = 1.5 (derived here): a ratio of 2 has no order.
    expect(() => observedOrder(1.1, 1.5, 2, 1)).toThrow('the observed order does not settle in the fixed-point iteration');
    expect(() => observedOrder(1.1, 1.3, -2, -1)).toThrow('the observed order does not settle in the fixed-point iteration');
    expect(() => observedOrder(1.1, 1.3, 5, 1)).toThrow(TradeError);
  });

  it('values through the worksheet entry: a single value, a text, a °C temperature, mixed units', () => {
    expect(() => call('gci', { phi: num(1), h: nums([1, 2, 4]) })).toThrow('phi must list three values, fine to coarse, not 1');
    expect(() => call('gci', { phi: list([num(1), str('a'), num(2)]), h: nums([1, 2, 4]) })).toThrow(/^phi\[2\] must be a number or quantity, not /);
    expect(() => call('gci', { phi: list([num(300), shown(21, 'degC'), num(301)]), h: nums([1, 2, 4]) })).toThrow('phi[2] is a temperature in °C or °F; give it in K');
    expect(() => call('gci', { phi: list([si(1, 'm'), si(1.1, 'm'), si(1.2, 's')]), h: nums([1, 2, 4]) })).toThrow('phi[3] is in s but phi[1] is in m: the three values must share one unit');
    expect(() => call('gci', { phi: nums([1, 1.1, 1.3]), h: nums([1, 2]) })).toThrow('h must list three cell sizes, fine to coarse, not 2');
  });
});

describe('the oscillatory case through the worksheet entry', () => {
  it('warns in full and counts one step: with r21 = r32, q(p) = 0 and the first iterate is the order', () => {
    const r = call('gci', { phi: nums([1.0, 0.98, 1.01]), h: nums([1, 2, 4]) });
    expect(r.warnings).toEqual([
      'the differences between the grids change sign (ε32/ε21 < 0): oscillatory convergence, for which Celik et al. (2008) warn that the observed order and the GCI are less reliable; add a grid or report the spread of the three values.',
    ]);
    expect(r.remarks.join('\n')).toContain('by fixed-point iteration (1 step).');
  });
});
