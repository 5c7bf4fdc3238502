// The residual verdict rules one at a time, on histories built to fall on one
// side of a rule: assessField is called directly so each rule's reason, the
// fit's scatter and the initial and final values can be read. A geometric
// history r_n = r0 ρ^n has factor ρ and a straight log10 r, so its least-squares
// fit has zero scatter (Ferziger & Perić, Computational Methods for Fluid
// Dynamics, 2002, ch. 5, from memory). The thresholds are the project's own
// (project wording, stated on the sheet by verdictRules).
import { describe, expect, it } from 'vitest';
import { assessField, verdictRules, type ResidualOptions } from '../../server/core/convergence/residual-history.js';
import { historyPoints, monitorPlot, residualPlot } from '../../server/core/convergence/history-plots.js';
import { MAX_POINTS } from '../../server/core/shared/plot.js';
import { firstSeriesPoints } from './convergence-helpers.js';

const OPTS: ResidualOptions = { targetDrop: 4, window: 200, initialCount: 5 };

function assess(n: number, f: (i: number) => number, opts: Partial<ResidualOptions> = {}) {
  const iterations = Float64Array.from({ length: n }, (_, k) => k + 1);
  const values = iterations.map(f);
  const lines = Int32Array.from({ length: n }, (_, k) => k + 2);
  return assessField('p', iterations, values, lines, { ...OPTS, ...opts });
}

/** log10 r falls `fall` decades per iteration from 1, with a sine of amplitude `amp` decades (period 10). */
const wavy = (fall: number, amp: number) => (i: number) => Math.pow(10, -fall * i + amp * Math.sin((2 * Math.PI * i) / 10));

describe('the values a verdict starts from', () => {
  it('three values above zero are enough; two are refused, naming a blow-up after them', () => {
    expect(assess(3, (i) => Math.pow(0.5, i)).fitRows).toBe(3);
    const iterations = Float64Array.from([1, 2, 3]);
    expect(() => assessField('p', iterations, Float64Array.from([1, 0.5, NaN]), Int32Array.from([2, 3, 4]), OPTS)).toThrow(
      'column p has 2 residual values above zero before the solver wrote nan (not a number) in row 4; judging a history needs at least 3',
    );
  });

  it('zeros at the start: the initial value is the first value above zero', () => {
    const a = assess(400, (i) => (i <= 6 ? 0 : Math.pow(0.99, i - 7)));
    expect(a.initial).toBe(1);
    expect(a.drop).toBeCloseTo(-393 * Math.log10(0.99), 10);
  });

  it('zeros at the end: the final value is the last value above zero, and zeros do not enter the scatter', () => {
    const a = assess(300, (i) => (i % 50 === 0 ? 0 : Math.pow(0.99, i)));
    expect(a.final).toBeCloseTo(Math.pow(0.99, 299), 15);
    expect(a.lastIteration).toBe(299);
    expect(a.scatter).toBeLessThan(1e-12);
    expect(a.zeros).toBe(6);
  });

  it('a blow-up is kept with its row and iteration', () => {
    const a = assess(300, (i) => (i < 250 ? Math.pow(0.99, i) : NaN));
    expect(a.blowUp).toEqual({ row: 251, iteration: 250, value: NaN });
  });
});

describe('the trailing fit', () => {
  it('a window holding one row is widened to the last three, across a zero', () => {
    // Rows 1…20 geometric, row 19 zero: the fit takes rows 17, 18 and 20.
    const a = assess(20, (i) => (i === 19 ? 0 : Math.pow(0.9, i)), { window: 1 });
    expect(a.widened).toBe(true);
    expect(a.fitRows).toBe(3);
    expect(Math.abs(a.factor - 0.9)).toBeLessThan(1e-12);
    expect(a.scatter).toBeLessThan(1e-12);
  });

  it('the last value off the line shows in the scatter (the last row is fitted)', () => {
    // 200 rows on a line and the last one a decade above it: least squares by hand.
    const a = assess(400, (i) => Math.pow(0.99, i) * (i === 400 ? 10 : 1));
    const xs = Array.from({ length: 200 }, (_, k) => 201 + k);
    const ys = xs.map((i) => i * Math.log10(0.99) + (i === 400 ? 1 : 0));
    const mx = xs.reduce((s, x) => s + x, 0) / 200;
    const my = ys.reduce((s, y) => s + y, 0) / 200;
    const b = xs.reduce((s, x, k) => s + (x - mx) * (ys[k]! - my), 0) / xs.reduce((s, x) => s + (x - mx) ** 2, 0);
    const rms = Math.sqrt(xs.reduce((s, x, k) => s + (ys[k]! - my - b * (x - mx)) ** 2, 0) / 200);
    expect(a.scatter).toBeCloseTo(rms, 10);
    expect(Math.log10(a.factor)).toBeCloseTo(b, 12);
  });
});

describe('each verdict rule, on its side of the line', () => {
  it('a residual that never moves is stalled, its fit flat, not diverging', () => {
    const a = assess(300, () => 1);
    expect(a.verdict).toBe('stalled');
    expect(a.reason).toBe('its trailing fit rises 0 decades over the last 200 iterations, less than 0.1 decades: at 0 orders fallen it is no longer falling');
  });

  it('a slow rise below the trend band is stalled however clean it is', () => {
    // Falls 2 decades, then rises 0.05 decades over the window without scatter.
    const a = assess(600, (i) => (i <= 400 ? Math.pow(10, -i / 200) : Math.pow(10, -2 + (0.05 * (i - 400)) / 200)));
    expect(a.verdict).toBe('stalled');
  });

  it('a rise inside its own scatter is oscillating, not diverging', () => {
    // 2 decades down, then a rise of 0.2 decades over the window under a ±0.4 decade swing (scatter ≈ 0.28).
    const a = assess(600, (i) => (i <= 400 ? Math.pow(10, -i / 200) : Math.pow(10, -2 + (0.2 * (i - 400)) / 200 + 0.4 * Math.sin((2 * Math.PI * i) / 10))));
    expect(a.trend).toBeGreaterThan(0.1);
    expect(a.verdict).toBe('oscillating');
  });

  it('above its initial value but falling fast is converging, not diverging', () => {
    // The first five values are 1e-3; then it jumps to 1 and falls at 0.99.
    const a = assess(400, (i) => (i <= 5 ? 1e-3 : Math.pow(0.99, i - 6)));
    expect(a.final).toBeGreaterThan(a.initial);
    expect(a.verdict).toBe('converging');
  });

  it('above its initial value and not falling: the reason says how far above', () => {
    const a = assess(400, (i) => (i < 50 ? 1 : 3));
    expect(a.verdict).toBe('diverging');
    expect(a.reason).toBe('it stands 0.477 decades above its initial value and is not falling'); // log10 3
  });

  it('a fall of exactly the target is converged, and says so', () => {
    const a = assess(300, (i) => (i === 300 ? 1e-4 : Math.pow(10, (-4 * (i - 1)) / 299)));
    expect(a.drop).toBe(4);
    expect(a.verdict).toBe('converged');
    expect(a.reason).toBe('it has fallen 4 orders of magnitude, at least the 4 asked for');
  });

  it('a steep fall through a wide scatter is converging, not oscillating', () => {
    // 0.005 decades per iteration (1 decade over the window) under a ±0.28 decade swing: scatter ≈ 0.2, 3 × 0.2 < 1.
    const a = assess(600, wavy(0.005, 0.28));
    expect(a.scatter).toBeGreaterThan(0.15);
    expect(a.verdict).toBe('converging');
  });

  it('an oscillation with a slight fall says how far its fit falls', () => {
    // 0.3 decades over the window under a ±0.5 decade swing (scatter ≈ 0.35).
    const a = assess(600, wavy(0.0015, 0.5));
    expect(a.verdict).toBe('oscillating');
    expect(a.reason).toMatch(/and the fit falls only 0\.3\d* decades over the last 200 iterations$/);
  });

  it('a plateau says it is stalled at its orders fallen', () => {
    const a = assess(700, (i) => Math.pow(0.98, Math.min(i, 300) - 1));
    expect(a.verdict).toBe('stalled');
    expect(a.reason).toMatch(/less than 0\.1 decades: at 2\.6\d* orders fallen it is no longer falling$/); // 299 × −log10 0.98 = 2.62
  });

  it('the rules state the factor range of a stalled fit and the converging rule', () => {
    const rules = verdictRules(OPTS).join('\n');
    // 10^(∓0.1 / 200) = 0.99885 and 1.00115.
    expect(rules).toContain('a factor within 0.9988–1.0012 per iteration');
    expect(rules).toContain('converging — the fit falls 0.1 decades or more across the window and the target is not reached yet.');
  });
});

describe('the points a history figure draws', () => {
  const n = 10 * MAX_POINTS;
  const iterations = Float64Array.from({ length: n }, (_, k) => k + 1);

  it('a log axis gets no zero, and each stretch keeps its lowest value above zero', () => {
    // Every even row is zero; the odd rows fall steadily, so the last odd row is the lowest.
    const values = iterations.map((i) => (i % 2 === 0 ? 0 : Math.pow(0.9999, i)));
    const pts = historyPoints(iterations, values, n, true);
    expect(pts.length).toBeLessThanOrEqual(MAX_POINTS);
    expect(pts.every(([, y]) => y > 0)).toBe(true);
    expect(pts.at(-1)).toEqual([n - 1, values[n - 2]]);
    expect(historyPoints(iterations.subarray(0, 4), values.subarray(0, 4), 4, true)).toEqual([[1, values[0]], [3, values[2]]]);
    // The residual figure thins the positive values only, so its line keeps the full point budget.
    const svg = residualPlot(iterations, [{ name: 'p', values, upTo: n }], n - 200);
    expect(firstSeriesPoints(svg)).toBe(MAX_POINTS);
  });

  it('a monitor keeps its spike when thinned, and the drawn line has the full point budget', () => {
    const values = iterations.map((i) => (i === 5000 ? 2 : 0.3));
    expect(historyPoints(iterations, values, n, false)).toContainEqual([5000, 2]);
    // Three windows of n/6 back from the end: the last half of the run, still longer than the budget.
    expect(firstSeriesPoints(monitorPlot(iterations, 'Cd', values, n / 6, n - n / 6, 0.3, 0.003, 0.01))).toBe(MAX_POINTS);
  });
});
