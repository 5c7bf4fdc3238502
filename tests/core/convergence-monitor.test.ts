// A monitored quantity over the trailing window: mean, sample standard
// deviation, drift between the halves. Settling by the drift between the
// halves of a window against a tolerance is common practice; the statistics
// are the textbook definitions, recomputed here by hand on synthetic histories.
import { describe, expect, it } from 'vitest';
import { num, str } from '../../server/core/index.js';
import { call, historyCsv, range, relErr, siField, textField } from './convergence-helpers.js';

const PATH = 'data/forces.csv';
const monitor = (text: string, args: Record<string, number | string> = {}) =>
  call('monitor', { path: str(PATH), ...Object.fromEntries(Object.entries(args).map(([k, v]) => [k, typeof v === 'string' ? str(v) : num(v)])) }, { [PATH]: text });

/** Mean and sample standard deviation (n − 1), by definition. */
function stats(xs: number[]) {
  const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
  const std = Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (xs.length - 1));
  return { mean, std };
}

describe('a force coefficient that has settled', () => {
  // Cd = 0.32 + 0.004 sin(2πn/50): whole periods in each half of a 500-iteration window.
  const cd = (n: number) => 0.32 + 0.004 * Math.sin((2 * Math.PI * n) / 50);
  const text = historyCsv(range(1, 2000), { Cd: cd, Cl: (n) => 0.05 + 1e-6 * n });

  it('gives the mean, standard deviation and drift over the last 500 iterations', () => {
    const r = monitor(text, { column: 'Cd' });
    const w = stats(range(1501, 2000).map(cd));
    expect(relErr(siField(r, 'mean'), w.mean)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'std'), w.std)).toBeLessThan(1e-9);
    expect(Math.abs(siField(r, 'drift'))).toBeLessThan(1e-12);
    expect(textField(r, 'verdict')).toBe('settled');
    expect([...r.fields.keys()]).toEqual(['mean', 'std', 'drift', 'verdict']);
    expect(r.figure?.svg).toMatch(/^<svg/);
  });

  it('takes the first column after the iteration by default, and a column by name in any case', () => {
    expect(siField(monitor(text), 'mean')).toBe(siField(monitor(text, { column: 'cd' }), 'mean'));
    expect(() => monitor(text, { column: 'Cs' })).toThrow('no column "Cs" to monitor; the columns after the iteration are Cd, Cl');
    expect(() => monitor(text, { column: 'iteration' })).toThrow(/iteration is the iteration column/);
  });
});

describe('drift and its verdict', () => {
  // v = 1 + a n: the halves of the last 500 iterations differ by a × 250 (their centres are 250 apart).
  const drifting = (a: number) => historyCsv(range(1, 1000), { Cd: (n) => 1 + a * n });

  it('measures the drift between the halves relative to the mean', () => {
    const r = monitor(drifting(1e-5));
    const mean = 1 + 1e-5 * 750.5;
    expect(relErr(siField(r, 'drift'), (1e-5 * 250) / mean)).toBeLessThan(1e-9);
    expect(textField(r, 'verdict')).toBe('settled'); // 0.25 % < 0.5 %
    const far = monitor(drifting(4e-5));
    expect(textField(far, 'verdict')).toBe('drifting'); // about 1 %
    expect(far.warnings.join(' ')).toMatch(/drifts by 0.97\d* % of the mean .* beyond 0.5 %: it has not settled, so run on/);
    expect(textField(monitor(drifting(4e-5), { tol: 0.02 }), 'verdict')).toBe('settled');
  });

  it('is too short while the run has written fewer iterations than the window', () => {
    const r = monitor(historyCsv(range(1, 300), { Cd: () => 0.3 }));
    expect(textField(r, 'verdict')).toBe('too short');
    expect(r.warnings.join(' ')).toMatch(/fewer than the window of 500/);
  });

  it('uses a given scale for a value that averages near zero', () => {
    const cs = historyCsv(range(1, 1000), { Cs: (n) => 0.01 * Math.sin(n / 7) });
    expect(monitor(cs).warnings.join(' ')).toMatch(/small against its swings .* give scale:/);
    const scaled = monitor(cs, { scale: 0.32 });
    expect(Math.abs(siField(scaled, 'drift'))).toBeLessThan(0.005);
    expect(() => monitor(historyCsv(range(1, 10), { Cs: () => 0 }), { window: 10 })).toThrow(/mean of Cs over the window is zero/);
  });

  it('a value that blew up is an error naming its row; a half-written last line is left out', () => {
    expect(() => monitor(historyCsv(range(1, 600), { Cd: (n) => (n === 550 ? 'nan' : 0.3) }))).toThrow(/row 551: the solver wrote nan \(not a number\) for Cd at iteration 550/);
    const r = monitor(historyCsv(range(1, 600), { Cd: () => 0.3 }) + '601,0.2');
    expect(siField(r, 'mean')).toBeCloseTo(0.3, 15);
    expect(r.remarks.join(' ')).toMatch(/row 602\) has no line end yet/);
  });
});
