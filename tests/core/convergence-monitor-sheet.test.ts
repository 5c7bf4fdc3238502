// The monitor(…) entry's warnings, remarks and caption, each call made inside
// its test. Judging a settled value by the drift between the halves of a
// trailing window, and reporting the window mean of a swinging value, are
// common practice; the figures below follow from the synthetic histories by
// hand (a sine over whole periods averages to its mean).
import { describe, expect, it } from 'vitest';
import { num, str } from '../../server/core/index.js';
import { call, historyCsv, range, siField, textField } from './convergence-helpers.js';

const PATH = 'data/forces.csv';
const monitor = (text: string, args: Record<string, number> = {}) =>
  call('monitor', { path: str(PATH), ...Object.fromEntries(Object.entries(args).map(([k, v]) => [k, num(v)])) }, { [PATH]: text });

describe('a settled value with small swings', () => {
  // Cd = 0.32 + 0.0004 sin(2πn/50): whole periods in each half of the last 500 iterations.
  const text = historyCsv(range(1, 2000), { Cd: (n) => 0.32 + 0.0004 * Math.sin((2 * Math.PI * n) / 50) });

  it('has no warning, two remarks naming the window and the halves, and a caption with the band', () => {
    const r = monitor(text, { window: 500, tol: 0.005 });
    expect(textField(r, 'verdict')).toBe('settled');
    expect(r.warnings).toEqual([]);
    expect(r.remarks).toHaveLength(2);
    expect(r.remarks[0]).toMatch(/^Over iterations 1501 to 2000 \(500 rows\): first-half mean 0\.32, second-half mean 0\.32\.$/);
    expect(r.remarks[1]).toBe('drift = (second-half mean − first-half mean) / |mean|; settled when |drift| ≤ 0.5 % (common practice: a monitored value that no longer moves, together with residuals that have fallen).');
    expect(r.figure?.caption).toBe('Cd from data/forces.csv, the last 1500 iterations; the dashed lines mark the window and the band of ± 0.5 % of the mean about the mean');
    expect(r.fields.get('drift')!.note).toBe('second-half mean − first-half mean, relative to the mean');
    expect(r.tag).toBe('monitor');
  });

  it('says the middle row of an odd window belongs to neither half', () => {
    const r = monitor(text, { window: 501, tol: 0.005 });
    expect(r.remarks[0]).toMatch(/\(501 rows\).*; the middle row belongs to neither half\.$/);
  });
});

describe('the warnings of a monitored value', () => {
  it('a drift beyond the tolerance, in percent of the mean', () => {
    // Cd = 0.3 (1 + 1e-4 n) over 1..1000: the halves of the last 500 differ by 250 × 3e-5 = 0.0075,
    // against the mean 0.3 × (1 + 0.07505): 2.33 %.
    const r = monitor(historyCsv(range(1, 1000), { Cd: (n) => 0.3 * (1 + 1e-4 * n) }), { window: 500, tol: 0.005 });
    expect(textField(r, 'verdict')).toBe('drifting');
    expect(siField(r, 'drift')).toBeCloseTo(0.0075 / (0.3 * 1.07505), 6);
    expect(r.warnings[0]).toBe('Cd drifts by 2.33 % of the mean between the halves of the last 500 iterations, beyond 0.5 %: it has not settled, so run on.');
    // The ramp also swings: its standard deviation 3e-5 × 500/√12 = 0.00433 is 1.34 % of the mean.
    expect(r.warnings[1]).toMatch(/^Cd swings with a standard deviation of 1\.34 % of the mean/);
    expect(r.warnings).toHaveLength(2);
  });

  it('swings larger than the tolerance: report the window mean', () => {
    // Cd = 0.32 + 0.032 sin(2πn/50): standard deviation 0.032/√2 = 7.07 % of the mean (sample form, 500 rows: 7.08 %).
    const r = monitor(historyCsv(range(1, 2000), { Cd: (n) => 0.32 + 0.032 * Math.sin((2 * Math.PI * n) / 50) }), { window: 500, tol: 0.005 });
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]).toMatch(/^Cd swings with a standard deviation of 7\.0\d % of the mean, more than 0\.5 %: report the window mean, not the last value\. Swings that stay/);
  });

  it('a mean small against the swings: give a scale; with one, the drift is relative to it', () => {
    const swing = historyCsv(range(1, 2000), { Cl: (n) => 0.001 + 0.05 * Math.sin((2 * Math.PI * n) / 50) });
    const r = monitor(swing, { window: 500, tol: 0.005 });
    expect(r.warnings.join(' ')).toMatch(/^the mean of Cl \(1e−3\) is small against its swings \(standard deviation 0\.035\d*\), so a drift relative to the mean says little: give scale: \(a typical size of Cl\)\.$/);
    const scaled = monitor(swing, { window: 500, tol: 0.005, scale: 0.05 });
    expect(scaled.warnings.join(' ')).toMatch(/^Cl swings with a standard deviation of 70\.\d % of the scale 0\.05/);
    expect(scaled.remarks[1]).toMatch(/^drift = \(second-half mean − first-half mean\) \/ scale;/);
    expect(scaled.figure?.caption).toMatch(/band of ± 0\.5 % of the scale 0\.05 about the mean$/);
    expect(scaled.fields.get('drift')!.note).toBe('second-half mean − first-half mean, relative to the scale');
  });
});
