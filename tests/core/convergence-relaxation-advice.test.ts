// The under-relaxation pairings and advice called directly, each inside its
// test. SIMPLE's α_p = 1 − α_u is Ferziger & Perić (Computational Methods for
// Fluid Dynamics, 3rd ed. 2002, ch. 7, from memory, high); the SIMPLEC and
// PISO values, the 0.1 step, the 0.3 floor and the 500-iterations-per-decade
// threshold are common practice. The damped model's inverse is checked
// against its forward form, 1 − α (1 − λ).
import { describe, expect, it } from 'vitest';
import { TradeError } from '../../server/core/index.js';
import {
  ALPHA_FLOOR,
  ALPHA_STEP,
  alphaCeiling,
  dampedFactor,
  pairedPressure,
  pairingNote,
  pairingRemark,
  pairingSource,
  recommend,
  SLOW_ITERATIONS_PER_DECADE,
  stableAlphaLimit,
  undampedFactor,
} from '../../server/core/convergence/relaxation.js';

describe('the pairing of each scheme, in words', () => {
  it('SIMPLE is Ferziger and Perić; SIMPLEC and PISO are common practice', () => {
    expect(pairedPressure('SIMPLE', 0.7)).toBeCloseTo(0.3, 12);
    expect(pairedPressure('SIMPLEC', 0.7)).toBe(1);
    expect(pairedPressure('PISO', 0.7)).toBe(1);
    expect(pairingNote('SIMPLE')).toBe('α_p = 1 − α_u');
    expect(pairingNote('SIMPLEC')).toBe('α_p = 1');
    expect(pairingNote('PISO')).toBe('α_p = α_u = 1');
    expect(pairingSource('SIMPLE')).toBe('the SIMPLE pairing (Ferziger and Perić)');
    expect(pairingSource('SIMPLEC')).toBe('the usual SIMPLEC values (common practice)');
    expect(pairingSource('PISO')).toBe('the usual PISO values (common practice)');
    expect(pairingRemark('SIMPLE')).toMatch(/^SIMPLE: α_p = 1 − α_u \(Ferziger and Perić\)/);
    expect(pairingRemark('SIMPLEC')).toMatch(/^SIMPLEC: α_p = 1 with α_u about 0.7–0.9 \(common practice\)/);
    expect(pairingRemark('PISO')).toMatch(/^PISO: α_p = 1 and, in a time-accurate run, α_u = 1 too \(common practice\)/);
    expect(alphaCeiling('PISO')).toBe(1);
    expect(alphaCeiling('SIMPLE')).toBe(0.9);
    expect(alphaCeiling('SIMPLEC')).toBe(0.9);
  });
});

describe('the damped fixed-point model, inverted', () => {
  it('recovers λ from the factor it gives, on both branches', () => {
    expect(undampedFactor(dampedFactor(0.95, 0.7), 0.7, 'monotone')).toBeCloseTo(0.95, 12);
    expect(undampedFactor(dampedFactor(-3, 0.7), 0.7, 'alternating')).toBeCloseTo(-3, 12);
    expect(undampedFactor(0, 0.5, 'monotone')).toBeCloseTo(-1, 12);
  });

  it('refuses a measured factor below zero or not finite, in words', () => {
    for (const bad of [-0.1, Infinity, NaN]) {
      expect(() => undampedFactor(bad, 0.7, 'monotone'), String(bad)).toThrow(/^the measured factor .* must be a finite number of zero or more$/);
    }
    expect(() => undampedFactor(0.9, 0, 'monotone')).toThrow(TradeError);
  });

  it('is stable below 2/(1 − λ) for λ < 1 and for no α at λ = 1 or above', () => {
    expect(stableAlphaLimit(0.5)).toBeCloseTo(4, 12);
    expect(stableAlphaLimit(1)).toBeNull();
    expect(stableAlphaLimit(1.2)).toBeNull();
  });
});

describe('advice on α_u (common practice)', () => {
  it('lowers by the step when diverging or oscillating, and keeps at the floor', () => {
    const lower = recommend('SIMPLE', 'diverging', 1.1, 0.7);
    expect(lower.advice).toBe('lower');
    expect(lower.alphaU).toBeCloseTo(0.7 - ALPHA_STEP, 12);
    expect(lower.reason).toBe(`the run is diverging: lowering α_u by ${ALPHA_STEP} damps each update (common practice)`);
    const floor = recommend('SIMPLE', 'oscillating', 0.99, ALPHA_FLOOR);
    expect(floor.advice).toBe('keep');
    expect(floor.alphaU).toBe(ALPHA_FLOOR);
    expect(floor.reason).toMatch(/^the run is oscillating, but α_u 0.3 is already at the floor of about 0.3 \(common practice\)/);
  });

  it('raises when slower than the threshold and keeps at the ceiling', () => {
    // factor 0.999: −1/log10(0.999) = 2302 iterations per decade, above 500.
    const raise = recommend('SIMPLE', 'converging', 0.999, 0.7);
    expect(raise.advice).toBe('raise');
    expect(raise.alphaU).toBeCloseTo(0.8, 12);
    expect(raise.reason).toContain(`more than ${SLOW_ITERATIONS_PER_DECADE}): raising α_u by ${ALPHA_STEP}`);
    const atCeiling = recommend('PISO', 'converging', 0.999, 1);
    expect(atCeiling.advice).toBe('keep');
    expect(atCeiling.reason).toMatch(/^the run converges slowly .* but α_u is already at 1$/);
  });

  it('keeps at a fair rate, when stalled and when converged, each with its reason', () => {
    // factor 0.99: 229 iterations per decade, below the 500 threshold.
    const fair = recommend('SIMPLE', 'converging', 0.99, 0.7);
    expect(fair.advice).toBe('keep');
    expect(fair.reason).toMatch(/^the run converges at a fair rate/);
    const stalled = recommend('SIMPLE', 'stalled', 1, 0.7);
    expect(stalled).toEqual({ advice: 'keep', alphaU: 0.7, reason: expect.stringMatching(/^the run has stalled: a plateau is seldom cured by the factors/) });
    expect(recommend('SIMPLE', 'converged', 0.9, 0.7)).toEqual({ advice: 'keep', alphaU: 0.7, reason: 'the run has converged: keep the factors' });
  });
});

describe('iterations per order of magnitude in the advice', () => {
  it('are stated to two significant figures, in each reason that gives them', () => {
    // A factor ρ per iteration falls one decade in −1/log10 ρ iterations (definition of the factor):
    // ρ = 0.997 gives 766.4, shown as 770; ρ = 0.99 gives 229.1, shown as 230. Project wording around them.
    expect(recommend('SIMPLE', 'converging', 0.997, 0.7).reason).toContain('at factor 0.997 (about 770 iterations per order of magnitude, more than 500)');
    expect(recommend('PISO', 'converging', 0.997, 1).reason).toBe('the run converges slowly (about 770 iterations per order of magnitude), but α_u is already at 1');
    expect(recommend('SIMPLE', 'converging', 0.99, 0.7).reason).toBe('the run converges at a fair rate (factor 0.99, about 230 iterations per order of magnitude): keep the factors');
  });
});

describe('the factor refused by name', () => {
  it('names alpha_u when the present factor is outside 0 < α ≤ 1', () => {
    expect(() => undampedFactor(0.9, 1.5, 'monotone')).toThrow('alpha_u 1.5 is outside 0 < α ≤ 1');
  });
});
