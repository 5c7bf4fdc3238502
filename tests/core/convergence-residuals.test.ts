// Residual verdicts on synthetic histories built here with known factors. A
// geometric history r_n = r0 ρ^n has convergence factor ρ by definition (the
// asymptotic factor of a linear iteration, Ferziger & Perić, Computational
// Methods for Fluid Dynamics, 2002, ch. 5, from memory), so the fitted factor,
// the drop and the remaining iterations are known exactly. The verdict
// thresholds are the project's own; each history sits clearly on one side.
import { describe, expect, it } from 'vitest';
import { str, TradeError } from '../../server/core/index.js';
import { call, firstSeriesPoints, historyCsv, numArgs, range, relErr, siField, tableRows, textField } from './convergence-helpers.js';

const PATH = 'data/run.csv';
const residuals = (text: string, extra: Record<string, number> = {}) =>
  call('residuals', { path: str(PATH), ...numArgs(extra) }, { [PATH]: text });
const row = (r: ReturnType<typeof residuals>, field: string) => tableRows(r).find((x) => x['field'] === field)!;

/** log10 of the fall from iteration a to b at factor rho. */
const decades = (rho: number, steps: number) => -steps * Math.log10(rho);

describe('a steady fall at a known factor', () => {
  const rho = 0.99;
  const text = historyCsv(range(1, 501), { p: (n) => 2e-1 * Math.pow(rho, n - 1) });

  it('fits the factor, measures the drop and counts the iterations remaining', () => {
    const r = residuals(text);
    const p = row(r, 'p');
    expect(relErr(siField(r, 'factor'), rho)).toBeLessThan(1e-12);
    expect(p['factor']).toBe('0.99');
    // Falling from the first value: drop = 500 steps at −log10 ρ each.
    expect(p['drop'] as number).toBeCloseTo(decades(rho, 500), 10);
    expect(p['remaining']).toBe(Math.ceil((4 - decades(rho, 500)) / decades(rho, 1)));
    expect(p['verdict']).toBe('converging');
    expect(textField(r, 'verdict')).toBe('converging');
    expect(siField(r, 'iterations')).toBe(501);
  });

  it('is converged once the drop reaches the target', () => {
    const long = historyCsv(range(1, 1001), { p: (n) => Math.pow(rho, n - 1) });
    const r = residuals(long);
    expect(row(r, 'p')['verdict']).toBe('converged');
    expect(row(r, 'p')['remaining']).toBe(0);
    // A higher target is not reached: converging again, with iterations remaining.
    const far = residuals(long, { target_drop: 6 });
    expect(row(far, 'p')['verdict']).toBe('converging');
    expect(row(far, 'p')['remaining']).toBe(Math.ceil((6 - decades(rho, 1000)) / decades(rho, 1)));
  });

  it('counts the factor per iteration when the solver writes every tenth iteration', () => {
    const sparse = historyCsv(range(10, 2000, 10), { p: (n) => Math.pow(rho, n) });
    const r = residuals(sparse, { window: 300 });
    expect(relErr(siField(r, 'factor'), rho)).toBeLessThan(1e-12);
  });

  it('takes the initial value as the largest of the first five values written', () => {
    // Start-up: the residual climbs for three iterations before it falls.
    const text2 = historyCsv(range(1, 400), { p: (n) => (n <= 3 ? 0.1 * n : 0.3 * Math.pow(rho, n - 3)) });
    const p = row(residuals(text2), 'p');
    expect(p['initial']).toBeCloseTo(0.3, 12);
    expect(p['drop'] as number).toBeCloseTo(decades(rho, 397), 10);
    const first = row(residuals(text2, { initial: 1 }), 'p');
    expect(first['initial']).toBeCloseTo(0.1, 12);
  });
});

describe('the other verdicts', () => {
  it('a plateau is stalled, its factor 1 within the band', () => {
    const level = Math.pow(0.98, 300);
    const text = historyCsv(range(1, 700), { p: (n) => (n <= 300 ? Math.pow(0.98, n - 1) : level * (1 + 0.01 * Math.sin(n))) });
    const r = residuals(text);
    expect(row(r, 'p')['verdict']).toBe('stalled');
    expect(Math.abs(siField(r, 'factor') - 1)).toBeLessThan(1e-4);
    expect(row(r, 'p')['remaining']).toBe('not at this rate');
    expect(r.warnings.join(' ')).toMatch(/p is stalled: .*plateau/);
  });

  it('an oscillation without net fall is oscillating', () => {
    // log10 r swings ±0.5 decade: scatter 0.5/√2 ≈ 0.35 decades about a flat fit.
    const text = historyCsv(range(1, 600), { p: (n) => 1e-3 * Math.pow(10, 0.5 * Math.sin((2 * Math.PI * n) / 25)) });
    const r = residuals(text);
    expect(row(r, 'p')['verdict']).toBe('oscillating');
    expect(r.warnings.join(' ')).toMatch(/p is oscillating: it scatters 0.35\d* decades/);
  });

  it('a noisy but steep fall is still converging, at its mean factor', () => {
    const text = historyCsv(range(1, 600), { p: (n) => Math.pow(0.99, n) * Math.pow(10, 0.05 * Math.sin(n)) });
    const r = residuals(text);
    expect(row(r, 'p')['verdict']).toBe('converging');
    expect(Math.abs(siField(r, 'factor') - 0.99)).toBeLessThan(2e-4);
  });

  it('a blow-up is diverging, at its factor', () => {
    // Falls for 300 iterations, then grows by 1 % per iteration; the window of 200 lies in the growth.
    const text = historyCsv(range(1, 600), { p: (n) => (n <= 300 ? Math.pow(0.99, n) : Math.pow(0.99, 300) * Math.pow(1.01, n - 300)) });
    const r = residuals(text);
    expect(row(r, 'p')['verdict']).toBe('diverging');
    expect(relErr(siField(r, 'factor'), 1.01)).toBeLessThan(1e-12);
    expect(row(r, 'p')['factor']).toBe('1.01');
    expect(r.warnings.join(' ')).toMatch(/p is diverging: its trailing fit rises 0.86\d* decades over the last 200 iterations/);
  });

  it('a residual above its start that is not falling is diverging', () => {
    const text = historyCsv(range(1, 400), { p: (n) => (n < 50 ? 1 : 3) });
    expect(row(residuals(text), 'p')['verdict']).toBe('diverging');
  });

  it('nan written by the solver is diverging, and the row is named', () => {
    const text = historyCsv(range(1, 300), { p: (n) => (n < 250 ? Math.pow(0.99, n) : 'nan'), U: (n) => Math.pow(0.98, n) });
    const r = residuals(text);
    expect(row(r, 'p')['verdict']).toBe('diverging');
    expect(r.warnings.join(' ')).toMatch(/the solver wrote nan \(not a number\) at iteration 250 \(row 251\): the run blew up there/);
    expect(textField(r, 'verdict')).toBe('diverging');
  });

  it('the run takes the worst field, and names it', () => {
    const text = historyCsv(range(1, 700), {
      Ux: (n) => Math.pow(0.98, n),
      p: (n) => Math.pow(0.995, n),
      k: (n) => Math.pow(0.99, n),
    });
    const r = residuals(text);
    expect(tableRows(r).map((x) => x['verdict'])).toEqual(['converged', 'converging', 'converging']);
    expect(textField(r, 'verdict')).toBe('converging');
    expect(textField(r, 'worst')).toBe('p'); // the slower of the two converging fields
    const worse = historyCsv(range(1, 700), { Ux: (n) => Math.pow(0.98, n), k: (n) => 1e-3 * Math.pow(10, 0.5 * Math.sin(n / 4)) });
    expect(textField(residuals(worse), 'verdict')).toBe('oscillating');
  });

  it('states every rule on the sheet', () => {
    const r = residuals(historyCsv(range(1, 300), { p: (n) => Math.pow(0.99, n) }));
    const remarks = r.remarks.join('\n');
    for (const v of ['diverging —', 'converged —', 'oscillating —', 'stalled —', 'converging —']) expect(remarks).toContain(v);
    expect(remarks).toMatch(/largest of the first 5 values/);
    expect(remarks).toMatch(/least-squares slope of log10 residual against iteration over the last 200 iterations/);
  });
});

describe('the table and the figure', () => {
  it('has the columns the issue fixes, and a log-scale plot of every field', () => {
    const text = historyCsv(range(1, 300), { continuity: (n) => Math.pow(0.99, n), Ux: (n) => Math.pow(0.98, n) });
    const r = residuals(text);
    const t = r.fields.get('table')!.value;
    expect(t.kind === 'table' && t.columns).toEqual(['field', 'initial', 'final', 'drop', 'factor', 'remaining', 'verdict']);
    expect([...r.fields.keys()]).toEqual(['table', 'verdict', 'worst', 'factor', 'iterations']);
    for (const f of r.fields.values()) expect(f.symbol).toBeTruthy();
    expect(r.figure?.svg).toMatch(/residual \(log scale\)/);
    expect(r.figure?.svg).toContain('>continuity<');
    expect(r.figure?.svg).toContain('>Ux<');
  });

  it('draws a 100,000-iteration history thinned to what the chart can show', () => {
    const text = historyCsv(range(1, 100_000), { p: (n) => Math.pow(0.9999, n) });
    const svg = residuals(text).figure!.svg;
    expect(firstSeriesPoints(svg)).toBeLessThanOrEqual(1200);
  });
});

describe('reading a file the solver is still writing', () => {
  const whole = historyCsv(range(1, 300), { p: (n) => Math.pow(0.99, n), U: (n) => Math.pow(0.98, n) });

  it('leaves out a half-written last line with a remark, not an error', () => {
    for (const tail of ['301,4.9e-2,2.3e-', '301,4.9e-2', '301,4.9e-2,2.3e-03']) {
      const r = residuals(whole + tail);
      expect(siField(r, 'iterations')).toBe(300);
      expect(r.remarks.join(' ')).toMatch(/The last line \(row 302\) has no line end yet, so it is left out/);
      expect(tableRows(r)).toEqual(tableRows(residuals(whole)));
    }
    expect(residuals(whole).remarks.join(' ')).not.toMatch(/no line end/);
  });

  it('a bad line in the middle is an error naming its row', () => {
    const lines = whole.split('\n');
    lines[120] = '120,4.9e-2,oops';
    expect(() => residuals(lines.join('\n'))).toThrow('row 121: "oops" in column U is not a number');
    lines[120] = '120,4.9e-2';
    expect(() => residuals(lines.join('\n'))).toThrow('row 121: 2 cells where the header has 3');
  });
});

describe('values a residual history should not hold', () => {
  it('a negative residual is an error naming row and column', () => {
    const text = historyCsv(range(1, 50), { p: (n) => (n === 20 ? -0.5 : Math.pow(0.99, n)) });
    expect(() => residuals(text)).toThrow(TradeError);
    expect(() => residuals(text)).toThrow(/row 21: the residual −0.5 in column p is negative/);
  });

  it('zeros are left out of the drop, the fit and the plot, and the sheet says so', () => {
    const text = historyCsv(range(1, 300), { p: (n) => (n % 50 === 0 ? 0 : Math.pow(0.99, n)) });
    const r = residuals(text);
    expect(relErr(siField(r, 'factor'), 0.99)).toBeLessThan(1e-12);
    expect(r.remarks.join(' ')).toMatch(/p has 6 values of exactly zero: zero has no logarithm/);
  });

  it('too few values, an iteration count that does not increase, a header alone', () => {
    expect(() => residuals('it,p\n1,0\n2,0\n3,1e-3\n')).toThrow('column p has 1 residual value above zero; judging a history needs at least 3');
    expect(() => residuals('it,p\n1,1\n2,0.5\n2,0.25\n')).toThrow(/row 4: iteration 2 does not come after iteration 2 \(row 3\)/);
    expect(() => residuals('it,p\n')).toThrow('the file has a header but no rows of values yet');
    expect(() => residuals('it\n1\n')).toThrow(/at least one more/);
  });

  it('reads semicolons with decimal commas, and tabs', () => {
    const text = historyCsv(range(1, 300), { p: (n) => Math.pow(0.99, n) }, ';').replace(/\./g, ',');
    expect(relErr(siField(residuals(text), 'factor'), 0.99)).toBeLessThan(1e-12);
    const tabs = historyCsv(range(1, 300), { p: (n) => Math.pow(0.99, n) }, '\t');
    expect(relErr(siField(residuals(tabs), 'factor'), 0.99)).toBeLessThan(1e-12);
  });

  it('bad options say what to give', () => {
    const text = historyCsv(range(1, 30), { p: (n) => Math.pow(0.99, n) });
    expect(() => residuals(text, { window: 0 })).toThrow('window must be above zero, not 0');
    expect(() => residuals(text, { initial: 2.5 })).toThrow(/initial must be a whole number/);
  });
});
