// The residuals(…) entry's warnings, remarks, caption and notes, each call
// made inside its test. The linear iteration error ∝ ρ^n behind the fitted
// factor is Ferziger & Perić (Computational Methods for Fluid Dynamics, 2002,
// ch. 5, from memory); the verdict thresholds are the project's, stated on the
// sheet; what to do about a field in trouble is common practice. The
// histories are synthetic, their factors known by construction.
import { describe, expect, it } from 'vitest';
import { num, str } from '../../server/core/index.js';
import { call, historyCsv, range, textField } from './convergence-helpers.js';

const PATH = 'run.csv';
const residuals = (text: string, args: Record<string, number> = {}) =>
  call('residuals', { path: str(PATH), ...Object.fromEntries(Object.entries(args).map(([k, v]) => [k, num(v)])) }, { [PATH]: text });

describe('a field in trouble is a warning with what to do', () => {
  it('diverging: stop the run', () => {
    const r = residuals(historyCsv(range(1, 400), { p: (n) => 1e-3 * Math.pow(1.01, n) }));
    expect(textField(r, 'verdict')).toBe('diverging');
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]).toMatch(/^p is diverging: its trailing fit rises .* decades over the last 200 iterations \(factor 1\.01 per iteration\), more than the scatter about it\. Stop the run and look at the mesh, the boundary conditions and the under-relaxation factors \(relaxation\(history: …\) suggests new ones\)\.$/);
    expect(r.remarks.some((x) => x.startsWith('p: '))).toBe(false);
  });

  it('stalled: a plateau', () => {
    const r = residuals(historyCsv(range(1, 600), { p: (n) => (n < 200 ? Math.pow(0.99, n) : Math.pow(0.99, 200)) }));
    expect(textField(r, 'verdict')).toBe('stalled');
    expect(r.warnings[0]).toMatch(/^p is stalled: .*\. The residual has reached a plateau: check whether the flow is unsteady or the mesh sets a floor; more iterations will not help\.$/);
  });
});

describe('a field doing well is a remark', () => {
  it('converging: its verdict and reason among the remarks, no warning, the caption and the factor note', () => {
    const r = residuals(historyCsv(range(1, 300), { p: (n) => Math.pow(0.99, n) }));
    expect(textField(r, 'verdict')).toBe('converging');
    expect(r.warnings).toEqual([]);
    expect(r.remarks[0]).toMatch(/^p: converging — its trailing fit falls .* decades over the last 200 iterations; at factor 0\.99 per iteration it needs about \d+ more iterations for 4 orders\.$/);
    expect(r.figure?.caption).toBe('Residuals from run.csv, iterations 1 to 300; the dashed line starts the fit window');
    expect(r.fields.get('factor')!.note).toBe('factor of p: 0.99 per iteration');
    expect(r.tag).toBe('residuals');
  });
});

describe('zeros and thin windows', () => {
  it('one zero is "it", two are "they"', () => {
    const one = residuals(historyCsv(range(1, 300), { p: (n) => (n === 10 ? 0 : Math.pow(0.99, n)) }));
    expect(one.remarks).toContain('p has 1 value of exactly zero: zero has no logarithm, so it is left out of the drop, the fit and the plot.');
    const two = residuals(historyCsv(range(1, 300), { p: (n) => (n === 10 || n === 20 ? 0 : Math.pow(0.99, n)) }));
    expect(two.remarks).toContain('p has 2 values of exactly zero: zero has no logarithm, so they are left out of the drop, the fit and the plot.');
    const none = residuals(historyCsv(range(1, 300), { p: (n) => Math.pow(0.99, n) }));
    expect(none.remarks.join(' ')).not.toContain('exactly zero');
  });

  it('a window holding fewer than three values is widened, with a warning', () => {
    // Written every 100th iteration: a window of 150 holds two values.
    const r = residuals(historyCsv(range(100, 3000, 100), { p: (n) => Math.pow(0.999, n) }), { window: 150 });
    expect(r.warnings).toContain('the last 150 iterations hold fewer than 3 values of p, so its last 3 were fitted: widen window.');
  });
});
