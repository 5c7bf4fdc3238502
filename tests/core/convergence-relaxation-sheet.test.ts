// The relaxation(…) entry's warnings and remarks for each scheme and factor,
// each call made inside its test. α_p = 1 − α_u for SIMPLE is Ferziger & Perić
// (Computational Methods for Fluid Dynamics, 3rd ed. 2002, ch. 7, from memory,
// high); the limits the warnings name (α_u at most about 0.9 with SIMPLE, at
// least about 0.3, α_p within 0.05 of the pairing, PISO unrelaxed) are common
// practice.
import { describe, expect, it } from 'vitest';
import { num, str, type RecordValue } from '../../server/core/index.js';
import { call, historyCsv, range, siField, textField } from './convergence-helpers.js';

const PATANKAR = 'Under-relaxed update: φ_new = φ_old + α (φ_computed − φ_old); α = 1 takes the computed value whole, a smaller α a share of the change (Patankar 1980).';

function relax(args: Record<string, ReturnType<typeof num> | RecordValue | ReturnType<typeof str>>): RecordValue {
  return call('relaxation', args);
}

function history(residualsList: number[]): RecordValue {
  const text = historyCsv(range(1, residualsList.length), { p: (_n, k) => residualsList[k]! });
  return call('residuals', { path: str('run.csv') }, { 'run.csv': text });
}

describe('relaxation without a history', () => {
  it('SIMPLE at 0.7: the pairing, no warning, two remarks', () => {
    const r = relax({ scheme: str('SIMPLE'), alpha_u: num(0.7) });
    expect(siField(r, 'alpha_p')).toBeCloseTo(0.3, 12);
    expect(textField(r, 'note')).toBe('α_p = 1 − α_u');
    expect(r.warnings).toEqual([]);
    expect(r.remarks).toHaveLength(2);
    expect(r.remarks[0]).toBe(PATANKAR);
    expect(r.remarks[1]).toMatch(/^SIMPLE: α_p = 1 − α_u/);
    expect(r.tag).toBe('relaxation');
  });

  it('SIMPLE above 0.9 warns of a slow pressure field; at 0.9 it does not', () => {
    expect(relax({ scheme: str('SIMPLE'), alpha_u: num(0.95) }).warnings).toEqual([
      'with α_u 0.95, α_p = 1 − α_u is only 0.05: the pressure field will move very slowly (common practice keeps α_u at or below about 0.8–0.9).',
    ]);
    expect(relax({ scheme: str('SIMPLE'), alpha_u: num(0.9) }).warnings).toEqual([]);
    expect(relax({ scheme: str('SIMPLEC'), alpha_u: num(0.95) }).warnings).toEqual([]);
  });

  it('a given α_p away from the pairing is named; one near it is not', () => {
    expect(relax({ scheme: str('SIMPLE'), alpha_u: num(0.7), alpha_p: num(0.5) }).warnings).toEqual([
      'SIMPLE usually pairs α_u 0.7 with α_p 0.3 (α_p = 1 − α_u); α_p 0.5 was given.',
    ]);
    expect(relax({ scheme: str('SIMPLE'), alpha_u: num(0.7), alpha_p: num(0.34) }).warnings).toEqual([]);
    expect(relax({ scheme: str('SIMPLE'), alpha_u: num(0.7), alpha_p: num(0.26) }).warnings).toEqual([]);
    // With α_p given, the slow-pressure warning for α_u above 0.9 does not apply.
    expect(relax({ scheme: str('SIMPLE'), alpha_u: num(0.95), alpha_p: num(0.08) }).warnings).toEqual([]);
    // SIMPLE with α_u = 1 and α_p given: no pairing to compare with (1 − α_u = 0).
    expect(relax({ scheme: str('SIMPLE'), alpha_u: num(1), alpha_p: num(0.3) }).warnings).toEqual([]);
  });

  it('a very low α_u is warned of below 0.3, not at 0.3', () => {
    expect(relax({ scheme: str('SIMPLEC'), alpha_u: num(0.25) }).warnings).toEqual([
      'α_u 0.25 is very low: each iteration takes under a third of the change, so the run will crawl (common practice stays at or above about 0.3).',
    ]);
    expect(relax({ scheme: str('SIMPLEC'), alpha_u: num(0.3) }).warnings).toEqual([]);
  });

  it('PISO below 1 gets the time-accurate remark; PISO at 1 and SIMPLEC below 1 do not', () => {
    const piso = relax({ scheme: str('PISO'), alpha_u: num(0.9) }).remarks;
    expect(piso).toHaveLength(3);
    expect(piso[2]).toMatch(/^PISO in a time-accurate run is usually left unrelaxed/);
    expect(relax({ scheme: str('PISO'), alpha_u: num(1) }).remarks).toHaveLength(2);
    expect(relax({ scheme: str('SIMPLEC'), alpha_u: num(0.9) }).remarks).toHaveLength(2);
  });
});

describe('relaxation with a history', () => {
  const slow = () => history(range(1, 600).map((n) => Math.pow(0.997, n)));

  it('notes the measured factor and, for SIMPLE with the pairing, how α_p moves', () => {
    const r = relax({ scheme: str('SIMPLE'), alpha_u: num(0.7), history: slow() });
    expect(textField(r, 'advice')).toBe('raise');
    expect(r.remarks.join('\n')).toContain('For SIMPLE α_p follows α_u as 1 − α_u (Ferziger and Perić), so α_p moves the other way: 0.3 → 0.2.');
    expect(r.fields.get('factor')!.note).toMatch(/^measured for p: 0.997 per iteration$/);
    expect(r.fields.get('next_factor')!.note).toBe('estimated factor at α_u 0.8 (damped fixed-point model)');
  });

  it('scales a given α_p with α_u, and says nothing of the SIMPLE pairing then', () => {
    const r = relax({ scheme: str('SIMPLE'), alpha_u: num(0.7), alpha_p: num(0.35), history: slow() });
    expect(siField(r, 'next_alpha_p')).toBeCloseTo(0.35 * (0.8 / 0.7), 12);
    expect(r.remarks.join('\n')).not.toContain('For SIMPLE α_p follows α_u');
    const capped = relax({ scheme: str('SIMPLEC'), alpha_u: num(0.7), alpha_p: num(1), history: slow() });
    expect(siField(capped, 'next_alpha_p')).toBe(1);
  });

  it('keeps the factors of a converged run without the SIMPLE pairing remark', () => {
    const done = history(range(1, 400).map((n) => Math.pow(0.95, n)));
    const r = relax({ scheme: str('SIMPLE'), alpha_u: num(0.7), history: done });
    expect(textField(r, 'advice')).toBe('keep');
    expect(r.remarks.join('\n')).not.toContain('For SIMPLE α_p follows α_u');
  });
});
