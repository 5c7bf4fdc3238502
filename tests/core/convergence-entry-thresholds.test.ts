// The convergence entries' warnings exactly at their thresholds, on values
// chosen so the arithmetic is exact in floating point. The thresholds are the
// project's own or common practice: a monitored mean counts as small against
// its swings when it is below one standard deviation; a monitored value swings
// too much when its standard deviation exceeds the tolerance; a given α_p is
// named when more than 0.05 from the scheme's pairing (α_p = 1 − α_u for
// SIMPLE, Ferziger & Perić, Computational Methods for Fluid Dynamics, 3rd ed.
// 2002, ch. 7, from memory). The warning texts are project wording.
import { describe, expect, it } from 'vitest';
import { list, num, str } from '../../server/core/index.js';
import { call, historyCsv, range } from './convergence-helpers.js';

const PATH = 'data/probe.csv';
/** Four rows written at iterations 1 to 4, judged over a window of 4. */
const four = (values: number[]) => historyCsv(range(1, 4), { v: (_n, k) => values[k]! });
const monitor = (values: number[], tol: number) => call('monitor', { path: str(PATH), window: num(4), tol: num(tol) }, { [PATH]: four(values) });

describe('the monitor warnings at their thresholds', () => {
  it('a mean equal to the standard deviation is not "small against its swings"', () => {
    // −1, 3, 3, 3: mean 2; squares about it 9 + 1 + 1 + 1 = 12, sample variance 12/3 = 4, standard deviation 2.
    const equal = monitor([-1, 3, 3, 3], 0.005);
    expect(equal.warnings.join(' ')).not.toMatch(/small against its swings/);
    expect(equal.warnings.join(' ')).toContain('v swings with a standard deviation of 100 % of the mean, more than 0.5 %: report the window mean, not the last value.');
    // −1, 3, 3, 2: mean 1.75 below its standard deviation (sample variance 10.75/3, 1.893): small, give a scale.
    const below = monitor([-1, 3, 3, 2], 0.005);
    expect(below.warnings.join(' ')).toContain('the mean of v (1.75) is small against its swings (standard deviation 1.89)');
  });

  it('a standard deviation equal to the tolerance is not "more than" it', () => {
    // 37, 41, 41, 41: mean 40, sample variance 12/3 = 4, standard deviation 2 = 5 % of the mean.
    expect(monitor([37, 41, 41, 41], 0.05).warnings).toEqual([]);
    expect(monitor([37, 41, 41, 41], 0.049).warnings.join(' ')).toContain('v swings with a standard deviation of 5 % of the mean, more than 4.9 %');
  });
});

describe('a given α_p against the pairing', () => {
  it('exactly 0.05 from 1 − α_u is not named; farther is', () => {
    // α_u 0.87 pairs with α_p 0.13 for SIMPLE; 0.08 is 0.05 below it.
    expect(call('relaxation', { alpha_u: num(0.87), alpha_p: num(0.08) }).warnings).toEqual([]);
    expect(call('relaxation', { alpha_u: num(0.87), alpha_p: num(0.07) }).warnings).toEqual([
      'SIMPLE usually pairs α_u 0.87 with α_p 0.13 (α_p = 1 − α_u); α_p 0.07 was given.',
    ]);
  });
});

describe('the SIMPLE pairing remark and the estimate options', () => {
  const slow = () => call('residuals', { path: str(PATH) }, { [PATH]: historyCsv(range(1, 600), { p: (n) => Math.pow(0.997, n) }) });

  it('SIMPLEC raised from a history gets no "α_p follows α_u" remark (its α_p stays 1)', () => {
    const r = call('relaxation', { scheme: str('SIMPLEC'), alpha_u: num(0.7), history: slow() });
    expect(r.fields.get('advice')!.value).toEqual(str('raise'));
    expect(r.remarks.join('\n')).not.toContain('α_p follows α_u');
  });

  it('mode and to_alpha_u each need a history, and say so', () => {
    // Project wording: which option needs what.
    const message = 'to_alpha_u and mode need history: (a residuals(…) record of a run made with alpha_u)';
    expect(() => call('relaxation', { alpha_u: num(0.7), mode: str('monotone') })).toThrow(message);
    expect(() => call('relaxation', { alpha_u: num(0.7), to_alpha_u: num(0.8) })).toThrow(message);
  });
});

describe('gci(…) with an empty list', () => {
  it('counts no values as none, in words', () => {
    expect(() => call('gci', { phi: list([]), h: list([num(1), num(2), num(4)]) })).toThrow('phi must list three values, fine to coarse, not 0');
    expect(() => call('gci', { phi: list([num(1), num(1.1), num(1.2)]), h: list([]) })).toThrow('h must list three cell sizes, fine to coarse, not 0');
  });
});
