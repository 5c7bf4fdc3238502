// The damped fixed-point model's remarks and warning in relaxation(…), read
// from a residuals record whose factor is set here, so λ and the stable range
// follow by hand. The model: the relaxed update φ ← φ + α (G(φ) − φ) (Patankar,
// Numerical Heat Transfer and Fluid Flow, 1980, §4.4-4) of a map G that
// multiplies the error by λ multiplies it by 1 − α (1 − λ); it is below 1 in
// size for 0 < α < 2/(1 − λ) and smallest at α = 1/(1 − λ) (algebra of that
// factor). The sentences around the numbers are project wording.
import { describe, expect, it } from 'vitest';
import { num, record, str, type RecordValue, type Value } from '../../server/core/index.js';
import { call, historyCsv, range, siField, textField } from './convergence-helpers.js';

/** A residuals record as relaxation(…) reads it: the run's verdict, its worst field and that field's factor. */
function historyRecord(verdict: string, factor: number, worst = 'p'): RecordValue {
  return record([
    ['verdict', str(verdict)],
    ['worst', str(worst)],
    ['factor', num(factor)],
  ]);
}

function relax(alphaU: number, history: RecordValue, extra: Record<string, Value> = {}): RecordValue {
  return call('relaxation', { alpha_u: num(alphaU), history, ...extra });
}

/** The remark that states the stable range of α_u ("In this model …"). */
function rangeRemark(r: RecordValue): string {
  const found = r.remarks.find((s) => s.startsWith('In this model'));
  if (!found) throw new Error(`no range remark in ${JSON.stringify(r.remarks)}`);
  return found;
}

describe('the estimate remark, number by number', () => {
  it('a slow monotone run at α_u 0.7, raised to 0.8', () => {
    // ρ = 0.997 at α 0.7, monotone: λ = 1 − (1 − 0.997)/0.7 = 0.995714…; at α 0.8: 1 − 0.8 × 0.0042857 = 0.996571…
    const r = relax(0.7, historyRecord('converging', 0.997));
    expect(siField(r, 'lambda')).toBeCloseTo(1 - 0.003 / 0.7, 12);
    expect(siField(r, 'next_factor')).toBeCloseTo(1 - (0.8 * 0.003) / 0.7, 12);
    // Project wording: the model, the measured factor with its field and α_u, the sign taken, λ to 4 digits, the factor at the new α_u.
    expect(r.remarks).toContain(
      'Estimate, damped fixed-point model: an iteration φ ← φ + α (G(φ) − φ) whose undamped map G amplifies the error by λ per iteration amplifies it by 1 − α (1 − λ). ' +
        'The measured factor ρ = 0.997 of p at α_u 0.7, taken as 1 − α (1 − λ) = +ρ (monotone), gives λ = 0.9957, and at α_u 0.8 the factor |1 − α (1 − λ)| = 0.9966.',
    );
    // Project wording: the caveat that the scalar model is a direction, not a prediction.
    expect(r.remarks).toContain(
      'The model treats the coupled velocity–pressure iteration as one scalar mode with one factor α = α_u; a real run couples many modes, so read it as the direction and rough size of the change, not a prediction.',
    );
  });

  it('an alternating error is taken as −ρ and named so', () => {
    // ρ = 0.5 at α 0.5, alternating: 1 − 0.5 (1 − λ) = −0.5 gives λ = −2.
    const r = relax(0.5, historyRecord('converging', 0.5, 'Ux'), { mode: str('alternating') });
    expect(siField(r, 'lambda')).toBeCloseTo(-2, 12);
    expect(r.remarks.join('\n')).toContain('The measured factor ρ = 0.5 of Ux at α_u 0.5, taken as 1 − α (1 − λ) = −ρ (alternating), gives λ = −2,');
    // Alternating errors have λ = 1 − (1 + ρ)/α ≤ 0: never the growth the warning is about.
    expect(r.warnings).toEqual([]);
  });
});

describe('the stable range of α_u in the model', () => {
  it('λ above 1: no α brings the factor below 1, and the warning says so', () => {
    // ρ = 1.01 at α 0.7, monotone: λ = 1 + 0.01/0.7 = 1.0142857…
    const r = relax(0.7, historyRecord('diverging', 1.01));
    expect(siField(r, 'lambda')).toBeCloseTo(1 + 0.01 / 0.7, 12);
    expect(rangeRemark(r)).toBe('In this model no α makes the factor fall below 1.');
    // Project wording: λ to 4 digits, and what to look at instead.
    expect(r.warnings).toContain(
      "in the model this run's error grows by itself (λ = 1.014 > 1): under-relaxation only slows the growth, no factor stops it; look at the mesh, the boundary conditions or the time step.",
    );
  });

  it('λ exactly 1: the factor is 1 at every α, and the warning says the error keeps its size', () => {
    // ρ = 1 monotone: λ = 1 − 0/α = 1, and 1 − α (1 − 1) = 1 for every α.
    const r = relax(0.7, historyRecord('stalled', 1));
    expect(siField(r, 'lambda')).toBe(1);
    expect(rangeRemark(r)).toBe('In this model no α makes the factor fall below 1.');
    expect(r.warnings).toContain(
      "in the model this run's error keeps its size (λ = 1): under-relaxation leaves the factor at 1 whatever its value; look at the mesh, the boundary conditions or the time step.",
    );
  });

  it('λ between 0 and 1: every α_u up to 1 converges, the larger the faster', () => {
    const r = relax(0.7, historyRecord('converging', 0.997));
    expect(rangeRemark(r)).toBe('In this model every α_u up to 1 converges, and the larger α_u the faster.');
    expect(r.warnings).toEqual([]);
  });

  it('λ exactly 0: fastest at α_u = 1 itself, still "the larger the faster"', () => {
    // ρ = 0.5 at α 0.5, monotone: λ = 1 − 0.5/0.5 = 0, so the factor is 1 − α, zero at α = 1.
    const r = relax(0.5, historyRecord('converging', 0.5));
    expect(siField(r, 'lambda')).toBe(0);
    expect(rangeRemark(r)).toBe('In this model every α_u up to 1 converges, and the larger α_u the faster.');
  });

  it('λ between −1 and 0: every α_u up to 1 converges, fastest below 1', () => {
    // ρ = 0.05 at α 0.7, alternating: λ = 1 − 1.05/0.7 = −0.5; 2/(1 − λ) = 4/3 > 1, fastest at 1/1.5 = 0.667, shown to 2 digits.
    const r = relax(0.7, historyRecord('converged', 0.05), { mode: str('alternating') });
    expect(siField(r, 'lambda')).toBeCloseTo(-0.5, 12);
    expect(rangeRemark(r)).toBe('In this model every α_u up to 1 converges, fastest near 0.67.');
  });

  it('λ exactly −1: the limit is α_u = 1 itself, which does not converge', () => {
    // ρ = 0.5 at α 0.75, alternating: λ = 1 − 1.5/0.75 = −1; at α = 1 the factor is |1 − 2| = 1.
    const r = relax(0.75, historyRecord('converging', 0.5), { mode: str('alternating') });
    expect(siField(r, 'lambda')).toBe(-1);
    expect(rangeRemark(r)).toBe('In this model the iteration converges for α_u below 1, fastest near 0.5.');
  });

  it('λ below −1: converges only below 2/(1 − λ), fastest at 1/(1 − λ)', () => {
    // λ = −2: limit 2/3 (3 digits: 0.667), fastest at 1/3 (2 digits: 0.33).
    const r = relax(0.5, historyRecord('converging', 0.5), { mode: str('alternating') });
    expect(rangeRemark(r)).toBe('In this model the iteration converges for α_u below 0.667, fastest near 0.33.');
  });
});

describe('a diverging run whose trailing factor is not below 1', () => {
  it('a factor of exactly 1 still gets the estimate (λ = 1), not the "no estimate" remark', () => {
    // Above its start and flat: the fitted slope is 0, so the factor is 10^0 = 1 exactly (residuals verdict rules, project's own).
    const h = call('residuals', { path: str('run.csv') }, { 'run.csv': historyCsv(range(1, 400), { p: (n) => (n < 50 ? 1 : 3) }) });
    expect(textField(h, 'verdict')).toBe('diverging');
    expect(siField(h, 'factor')).toBe(1);
    const r = relax(0.7, h);
    expect(r.remarks.join('\n')).not.toMatch(/No estimate/);
    expect(siField(r, 'lambda')).toBe(1);
    expect(r.warnings.join(' ')).toMatch(/error keeps its size \(λ = 1\): under-relaxation leaves the factor at 1/);
  });
});

describe('reading the history record', () => {
  it('refuses a record without a known verdict or without a factor, naming the verdicts', () => {
    // Project wording: what the record must hold, with the five verdicts spelled out.
    const message = 'history must be a residuals(…) record, with a verdict (one of "converged", "converging", "stalled", "oscillating", "diverging") and a factor';
    const bad = [
      record([['verdict', num(1)], ['factor', num(0.99)]]),
      record([['verdict', str('finished')], ['factor', num(0.99)]]),
      record([['verdict', str('converging')], ['factor', str('0.99')]]),
      record([['verdict', str('converging')]]),
      record([['factor', num(0.99)]]),
    ];
    for (const history of bad) expect(() => relax(0.7, history)).toThrow(message);
  });

  it('takes each known verdict, and says "the worst field" when the record names none', () => {
    for (const verdict of ['converged', 'converging', 'stalled', 'oscillating', 'diverging']) {
      expect(() => relax(0.7, historyRecord(verdict, 0.99))).not.toThrow();
    }
    const r = relax(0.7, record([['verdict', str('converging')], ['factor', num(0.99)]]));
    // Project wording: the note names whose factor was measured.
    expect(r.fields.get('factor')!.note).toBe('measured for the worst field: 0.99 per iteration');
    const named = relax(0.7, record([['verdict', str('converging')], ['factor', num(0.99)], ['worst', num(3)]]));
    expect(named.fields.get('factor')!.note).toBe('measured for the worst field: 0.99 per iteration');
  });
});
