// The trailing window of a monitored quantity at its edges: the fewest rows
// the two halves need, and a run exactly as long as the window. Judging
// settling by the drift between the halves of a trailing window is common
// practice; the counts here follow from the synthetic histories by hand.
import { describe, expect, it } from 'vitest';
import { num, str } from '../../server/core/index.js';
import { call, historyCsv, range, textField } from './convergence-helpers.js';

const PATH = 'data/forces.csv';
const monitor = (text: string, window: number) => call('monitor', { path: str(PATH), window: num(window) }, { [PATH]: text });
// A solver that writes every 100th iteration, 100 to 1000.
const sparse = historyCsv(range(100, 1000, 100), { Cd: (n) => 0.3 + 1e-5 * Math.sin(n) });

describe('the rows in the trailing window', () => {
  it('refuses fewer than four, saying how many there are', () => {
    // Window 250 after iteration 1000 takes 800, 900 and 1000: three rows.
    expect(() => monitor(sparse, 250)).toThrow('the last 250 iterations hold 3 rows of Cd; the drift between two halves needs at least 4: widen window');
    // Window 50 takes 1000 alone: one row, in the singular.
    expect(() => monitor(sparse, 50)).toThrow('the last 50 iterations hold 1 row of Cd;');
  });

  it('takes four rows (700 to 1000 in a window of 350)', () => {
    const r = monitor(sparse, 350);
    expect(textField(r, 'verdict')).not.toBe('too short');
  });
});

describe('a run exactly as long as the window', () => {
  it('is long enough with iterations 1 to 500 in a window of 500, and too short with 1 to 499', () => {
    const cd = (n: number) => 0.32 + 1e-6 * Math.sin(n);
    expect(textField(monitor(historyCsv(range(1, 500), { Cd: cd }), 500), 'verdict')).toBe('settled');
    expect(textField(monitor(historyCsv(range(1, 499), { Cd: cd }), 500), 'verdict')).toBe('too short');
  });
});
