// Arguments the convergence entries refuse, each named with the value given.
// The limits are facts of the quantities: an order-of-magnitude target, a
// window of iterations, a count of values, a tolerance and a scale are all
// above zero; an under-relaxation factor lies in 0 < α ≤ 1 (Patankar,
// Numerical Heat Transfer and Fluid Flow, 1980, §4.4-4: α takes a share of the
// new value). The messages are project wording; the tests assert the name and
// the value refused.
import { describe, expect, it } from 'vitest';
import { list, num, shown, str } from '../../server/core/index.js';
import { call, historyCsv, numArgs, range } from './convergence-helpers.js';

const PATH = 'data/run.csv';
const falling = historyCsv(range(1, 300), { p: (n) => Math.pow(0.99, n) });
const settled = historyCsv(range(1, 1000), { Cd: (n) => 0.32 + 0.001 * Math.sin(n) });

describe('residuals(…) options', () => {
  it('refuses a target drop, a window or an initial count of zero or below, by name', () => {
    const residuals = (extra: Record<string, number>) => () =>
      call('residuals', { path: str(PATH), ...numArgs(extra) }, { [PATH]: falling });
    expect(residuals({ target_drop: 0 })).toThrow('target_drop must be above zero, not 0');
    expect(residuals({ target_drop: -2 })).toThrow('target_drop must be above zero, not −2');
    expect(residuals({ window: -50 })).toThrow('window must be above zero, not −50');
    expect(residuals({ initial: 0 })).toThrow('initial must be above zero, not 0');
    expect(residuals({ initial: Infinity })).toThrow('initial must be above zero, not infinity');
  });
});

describe('monitor(…) options', () => {
  const monitor = (extra: Record<string, number>) => () =>
    call('monitor', { path: str(PATH), ...numArgs(extra) }, { [PATH]: settled });

  it('refuses a window, a tolerance or a scale of zero or below, by name', () => {
    expect(monitor({ window: 0 })).toThrow('window must be above zero, not 0');
    expect(monitor({ tol: 0 })).toThrow('tol must be above zero, not 0');
    expect(monitor({ tol: -0.01 })).toThrow('tol must be above zero, not −0.01');
    expect(monitor({ scale: 0 })).toThrow('scale must be above zero, not 0');
    expect(monitor({ scale: -0.3 })).toThrow('scale must be above zero, not −0.3');
  });

  it('takes the defaults and a positive scale without complaint', () => {
    expect(monitor({})).not.toThrow();
    expect(monitor({ scale: 0.3 })).not.toThrow();
  });
});

describe('relaxation(…) factors', () => {
  it('names alpha_p and to_alpha_u when they are outside 0 < α ≤ 1', () => {
    expect(() => call('relaxation', { alpha_u: num(0.7), alpha_p: num(1.5) })).toThrow('alpha_p 1.5 is outside 0 < α ≤ 1');
    expect(() => call('relaxation', { alpha_u: num(0.7), alpha_p: num(0) })).toThrow('alpha_p 0 is outside 0 < α ≤ 1');
    expect(() => call('relaxation', { alpha_u: num(1.2) })).toThrow('alpha_u 1.2 is outside 0 < α ≤ 1');
    const h = call('residuals', { path: str(PATH) }, { [PATH]: falling });
    expect(() => call('relaxation', { alpha_u: num(0.7), history: h, to_alpha_u: num(1.1) })).toThrow('to_alpha_u 1.1 is outside 0 < α ≤ 1');
    expect(() => call('relaxation', { alpha_u: num(0.7), history: h, to_alpha_u: num(0.9) })).not.toThrow();
  });
});

describe('gci(…) lists', () => {
  it('names a missing phi, and counts a single value as one', () => {
    expect(() => call('gci', { cells: list([num(8e6), num(4e6), num(2e6)]) })).toThrow('missing argument phi');
    expect(() => call('gci', { phi: num(1), cells: list([num(8e6), num(4e6), num(2e6)]) })).toThrow('phi must list three values, fine to coarse, not 1');
  });

  it('names the entry that is a Celsius temperature, counting from 1', () => {
    // Relative errors |(φ1 − φ2)/φ1| need a zero that means nothing (Celik et al. 2008, J. Fluids Eng. 130, 078001, Eq. 5 divides by φ1): K, not °C.
    const phi = list([num(300), shown(25, 'degC'), num(301)]);
    expect(() => call('gci', { phi, h: list([num(1), num(2), num(4)]) })).toThrow('phi[2] is a temperature in °C or °F; give it in K');
    const first = list([shown(25, 'degC'), num(300), num(301)]);
    expect(() => call('gci', { phi: first, h: list([num(1), num(2), num(4)]) })).toThrow('phi[1] is a temperature in °C or °F');
  });

  it('names the entry that is not a quantity, counting from 1', () => {
    const phi = list([num(1), num(1.1), str('x')]);
    expect(() => call('gci', { phi, h: list([num(1), num(2), num(4)]) })).toThrow('phi[3] must be a number or quantity, not text');
  });
});
