// Under-relaxation arithmetic. The update φ_new = φ_old + α(φ_computed − φ_old)
// is Patankar's (Numerical Heat Transfer and Fluid Flow, 1980, §4.4-4; the form
// verified in a secondary source, reference-values.md §11); α_p = 1 − α_u for
// SIMPLE is Ferziger & Perić (Computational Methods for Fluid Dynamics, 3rd ed.
// 2002, ch. 7, from memory, high); SIMPLEC and PISO pairings are common
// practice. The damped fixed-point model is checked against a damped linear
// iteration run here, where its factor is exact.
import { describe, expect, it } from 'vitest';
import { num, str, type RecordValue } from '../../server/core/index.js';
import { dampedFactor, relaxedUpdate, undampedFactor } from '../../server/core/convergence/relaxation.js';
import { call, historyCsv, range, relErr, siField, textField } from './convergence-helpers.js';

/** Residual magnitudes of φ ← φ + α(λφ + c − φ) from φ0 = 0: the error is multiplied by 1 − α(1 − λ) each step. */
function dampedRun(alpha: number, lambda: number, steps: number): number[] {
  const c = 1;
  const fixed = c / (1 - lambda);
  let phi = 0;
  const out: number[] = [];
  for (let k = 0; k < steps; k++) {
    const next = relaxedUpdate(phi, lambda * phi + c, alpha);
    out.push(Math.abs(next - phi) / Math.abs(fixed)); // the update size, as a solver's residual
    phi = next;
  }
  return out;
}

function history(residualsList: number[]): RecordValue {
  const text = historyCsv(range(1, residualsList.length), { p: (_n, k) => residualsList[k]! });
  return call('residuals', { path: str('run.csv') }, { 'run.csv': text });
}

describe('the relaxed update and the pairings', () => {
  it('φ_new = φ_old + α (φ_computed − φ_old) (Patankar 1980)', () => {
    expect(relaxedUpdate(1, 2, 0.7)).toBeCloseTo(1.7, 15);
    expect(relaxedUpdate(10, 4, 0.3)).toBeCloseTo(8.2, 15);
    expect(relaxedUpdate(3, 5, 1)).toBe(5);
  });

  it('SIMPLE: α_p = 1 − α_u (Ferziger and Perić)', () => {
    const r = call('relaxation', { scheme: str('SIMPLE'), alpha_u: num(0.7) });
    expect(siField(r, 'alpha_u')).toBe(0.7);
    expect(siField(r, 'alpha_p')).toBeCloseTo(0.3, 15);
    expect(textField(r, 'note')).toBe('α_p = 1 − α_u');
    expect(r.fields.get('note')!.note).toBe('the SIMPLE pairing (Ferziger and Perić)');
    expect(siField(call('relaxation', { alpha_u: num(0.8) }), 'alpha_p')).toBeCloseTo(0.2, 15);
    expect(r.remarks.join(' ')).toContain('φ_new = φ_old + α (φ_computed − φ_old)');
  });

  it('SIMPLEC and PISO: α_p = 1, stated as common practice', () => {
    for (const scheme of ['SIMPLEC', 'PISO']) {
      const r = call('relaxation', { scheme: str(scheme), alpha_u: num(0.8) });
      expect(siField(r, 'alpha_p')).toBe(1);
      expect(r.fields.get('note')!.note).toMatch(/common practice/);
      expect(r.remarks.join(' ')).toMatch(new RegExp(`${scheme}: α_p = 1 .*\\(common practice\\)`));
    }
  });

  it('refuses factors outside 0 < α ≤ 1, and SIMPLE with α_u = 1', () => {
    expect(() => call('relaxation', { alpha_u: num(1.2) })).toThrow(/outside 0 < α ≤ 1/);
    expect(() => call('relaxation', { alpha_u: num(0) })).toThrow(/outside 0 < α ≤ 1/);
    expect(() => call('relaxation', { alpha_u: num(1) })).toThrow(/α_p = 1 − α_u = 0/);
    expect(call('relaxation', { alpha_u: num(0.7), alpha_p: num(0.6) }).warnings.join(' ')).toMatch(/usually pairs α_u 0.7 with α_p 0.3/);
  });
});

describe('the damped fixed-point model', () => {
  it('is exact for a damped linear iteration', () => {
    for (const [alpha, lambda] of [[0.5, 0.99], [0.7, 0.9], [0.8, -0.5], [0.3, -2]] as const) {
      const r = dampedRun(alpha, lambda, 8); // a few steps: round-off must not reach the update sizes
      const measured = r[6]! / r[5]!;
      expect(relErr(dampedFactor(lambda, alpha), measured)).toBeLessThan(1e-9);
      const mode = 1 - alpha * (1 - lambda) >= 0 ? 'monotone' : 'alternating';
      expect(undampedFactor(measured, alpha, mode)).toBeCloseTo(lambda, 9);
    }
  });

  it('estimates the factor at another α from one measured at the present α', () => {
    // λ = 0.99 run at α = 0.5: factor 1 − 0.5 × 0.01 = 0.995. At α = 0.6 the model gives 1 − 0.6 × 0.01 = 0.994.
    const h = history(dampedRun(0.5, 0.99, 900));
    expect(relErr(siField(h, 'factor'), 0.995)).toBeLessThan(1e-9);
    const r = call('relaxation', { alpha_u: num(0.5), history: h, to_alpha_u: num(0.6) });
    expect(siField(r, 'lambda')).toBeCloseTo(0.99, 9);
    expect(siField(r, 'next_factor')).toBeCloseTo(0.994, 9);
    // And that is what running at α = 0.6 measures.
    expect(relErr(siField(history(dampedRun(0.6, 0.99, 900)), 'factor'), siField(r, 'next_factor'))).toBeLessThan(1e-9);
    expect(r.remarks.join(' ')).toMatch(/^.*Estimate, damped fixed-point model/m);
  });

  it('takes the alternating branch when told the error flips sign every iteration', () => {
    // λ = −1.5 at α = 0.7: 1 − 0.7 × 2.5 = −0.75, so the update sizes fall by 0.75 (smoothly: magnitudes).
    // The model converges for α below 2/(1 − λ) = 0.8, fastest at 1/(1 − λ) = 0.4.
    const h = history(dampedRun(0.7, -1.5, 60));
    expect(relErr(siField(h, 'factor'), 0.75)).toBeLessThan(1e-9);
    const r = call('relaxation', { alpha_u: num(0.7), history: h, mode: str('alternating'), to_alpha_u: num(0.5) });
    expect(siField(r, 'lambda')).toBeCloseTo(-1.5, 9);
    expect(siField(r, 'next_factor')).toBeCloseTo(Math.abs(1 - 0.5 * 2.5), 9);
    expect(r.remarks.join(' ')).toMatch(/converges for α_u below 0.8, fastest near 0.4\./);
  });

  it('says when no factor can stop a monotone growth', () => {
    const growing = history(range(1, 400).map((n) => Math.pow(1.01, n)));
    const r = call('relaxation', { alpha_u: num(0.7), history: growing });
    expect(textField(r, 'advice')).toBe('lower');
    expect(siField(r, 'lambda')).toBeGreaterThan(1);
    expect(r.warnings.join(' ')).toMatch(/no factor stops it/);
  });
});

describe('advice from a residual history (common practice)', () => {
  it('raises α_u by 0.1 when the run converges steadily but slowly', () => {
    // 0.997 per iteration: about 770 iterations per order of magnitude, beyond the 500 that count as slow.
    const slow = history(range(1, 600).map((n) => Math.pow(0.997, n)));
    const r = call('relaxation', { alpha_u: num(0.7), history: slow });
    expect(textField(r, 'advice')).toBe('raise');
    expect(siField(r, 'next_alpha_u')).toBeCloseTo(0.8, 12);
    expect(siField(r, 'next_alpha_p')).toBeCloseTo(0.2, 12);
    expect(r.remarks.join(' ')).toMatch(/steadily but slowly/);
  });

  it('keeps the factors when the run converges at a fair rate or has converged', () => {
    const fair = history(range(1, 300).map((n) => Math.pow(0.98, n)));
    expect(textField(call('relaxation', { alpha_u: num(0.7), history: fair }), 'advice')).toBe('keep');
  });

  it('lowers α_u by 0.1 when the run oscillates or diverges, down to about 0.3', () => {
    const osc = history(range(1, 600).map((n) => 1e-3 * Math.pow(10, 0.5 * Math.sin(n / 3))));
    const r = call('relaxation', { alpha_u: num(0.7), history: osc });
    expect(textField(r, 'advice')).toBe('lower');
    expect(siField(r, 'next_alpha_u')).toBeCloseTo(0.6, 12);
    expect(r.remarks.join(' ')).toMatch(/alternating/);
    const floor = call('relaxation', { alpha_u: num(0.3), history: osc });
    expect(textField(floor, 'advice')).toBe('keep');
    expect(floor.remarks.join(' ')).toMatch(/already at the floor/);
  });

  it('gives no estimate for a run that blew up after falling', () => {
    const blown = historyCsv(range(1, 300), { p: (n) => (n < 280 ? Math.pow(0.99, n) : 'nan') });
    const h = call('residuals', { path: str('run.csv') }, { 'run.csv': blown });
    const r = call('relaxation', { alpha_u: num(0.7), history: h });
    expect(textField(r, 'advice')).toBe('lower');
    expect(r.fields.has('next_factor')).toBe(false);
    expect(r.remarks.join(' ')).toMatch(/No estimate: p is diverging although its trailing factor \(0.99\) is below 1/);
  });

  it('refuses a record that is not a residual history', () => {
    const notHistory = call('relaxation', { alpha_u: num(0.7) });
    expect(() => call('relaxation', { alpha_u: num(0.7), history: notHistory })).toThrow(/history must be a residuals/);
    expect(() => call('relaxation', { alpha_u: num(0.7), to_alpha_u: num(0.8) })).toThrow(/need history/);
  });
});
