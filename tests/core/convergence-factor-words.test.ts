// How a residual history's factor and verdicts are put in words: a factor
// shown with two significant figures of its distance from 1 (so 0.99954 is
// not rounded to 1), what a solver writes for a value that blew up, and the
// worst field of a run. The rules are the project's own; the expected texts
// follow from them by hand.
import { describe, expect, it } from 'vitest';
import { factorText, nonFiniteWord, worstField, type FieldAssessment } from '../../server/core/convergence/residual-history.js';

describe('a convergence factor in words', () => {
  it('keeps two significant figures of its distance from 1, and at least three in all', () => {
    expect(factorText(0.99954)).toBe('0.99954'); // 1 − 4.6e-4
    expect(factorText(0.999123456)).toBe('0.99912'); // 1 − 8.8e-4
    expect(factorText(1.00004567)).toBe('1.000046'); // 1 + 4.6e-5
    expect(factorText(1.012)).toBe('1.012');
    expect(factorText(0.9999)).toBe('0.9999');
    expect(factorText(0.95)).toBe('0.95');
  });

  it('writes a factor 0.1 or more away from 1, or exactly 1, as a plain number', () => {
    expect(factorText(0.123456)).toBe('0.123');
    expect(factorText(0.85)).toBe('0.85');
    expect(factorText(1.2)).toBe('1.2');
    expect(factorText(1)).toBe('1');
  });
});

describe('a value that blew up, as a solver writes it', () => {
  it('nan, inf and −inf', () => {
    expect(nonFiniteWord(NaN)).toBe('nan (not a number)');
    expect(nonFiniteWord(Infinity)).toBe('inf');
    expect(nonFiniteWord(-Infinity)).toBe('−inf');
  });
});

describe('the worst field of a run', () => {
  const field = (name: string, verdict: FieldAssessment['verdict'], factor: number) => ({ field: name, verdict, factor }) as unknown as FieldAssessment;

  it('takes the worst verdict in the order converged, converging, stalled, oscillating, diverging', () => {
    expect(worstField([field('p', 'converged', 0.9), field('Ux', 'stalled', 0.999), field('k', 'converging', 0.99)]).field).toBe('Ux');
    expect(worstField([field('p', 'diverging', 0.5), field('Ux', 'oscillating', 0.999)]).field).toBe('p');
  });

  it('among fields with that verdict, the slowest; the first of equals', () => {
    expect(worstField([field('p', 'converging', 0.99), field('Ux', 'converging', 0.999), field('k', 'converging', 0.995)]).field).toBe('Ux');
    expect(worstField([field('p', 'converging', 0.99), field('Ux', 'converging', 0.99)]).field).toBe('p');
  });
});
