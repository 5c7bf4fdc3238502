// Under-relaxation of a segregated pressure–velocity iteration. The relaxed
// update φ_new = φ_old + α (φ_computed − φ_old) (Patankar, Numerical Heat
// Transfer and Fluid Flow, 1980, §4.4-4, from memory); for SIMPLE the pressure
// factor α_p = 1 − α_u (Ferziger & Perić, Computational Methods for Fluid
// Dynamics, 3rd ed. 2002, ch. 7, from memory); SIMPLEC and PISO values are
// common practice. The change of the convergence factor with α is estimated
// with a damped scalar fixed-point model (below), labelled as an estimate.
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';
import type { Verdict } from './residual-history.js';
import { factorText } from './residual-history.js';

export const SCHEMES = ['SIMPLE', 'SIMPLEC', 'PISO'] as const;
export type Scheme = (typeof SCHEMES)[number];

/** How the error of the undamped iteration behaves: keeps its sign, or flips it every iteration. */
export const MODES = ['monotone', 'alternating'] as const;
export type Mode = (typeof MODES)[number];

/** Change the factor by about this much at a time (common practice). */
export const ALPHA_STEP = 0.1;
/** Below this a segregated run crawls (common practice). */
export const ALPHA_FLOOR = 0.3;
/** Converging more slowly than this many iterations per order of magnitude counts as slow (our threshold). */
export const SLOW_ITERATIONS_PER_DECADE = 500;

export function relaxedUpdate(old: number, computed: number, alpha: number): number {
  return old + alpha * (computed - old);
}

/** The pressure factor that goes with α_u: SIMPLE 1 − α_u (Ferziger & Perić); SIMPLEC and PISO 1 (common practice). */
export function pairedPressure(scheme: Scheme, alphaU: number): number {
  return scheme === 'SIMPLE' ? 1 - alphaU : 1;
}

/** The pairing in a few words, for the record's note field. */
export function pairingNote(scheme: Scheme): string {
  return scheme === 'SIMPLE' ? 'α_p = 1 − α_u' : scheme === 'SIMPLEC' ? 'α_p = 1' : 'α_p = α_u = 1';
}

/** Where the pairing comes from, for the note beside it. */
export function pairingSource(scheme: Scheme): string {
  return scheme === 'SIMPLE' ? 'the SIMPLE pairing (Ferziger and Perić)' : `the usual ${scheme} values (common practice)`;
}

/** What the pairing rests on, for the remarks. */
export function pairingRemark(scheme: Scheme): string {
  switch (scheme) {
    case 'SIMPLE':
      return 'SIMPLE: α_p = 1 − α_u (Ferziger and Perić), typically α_u 0.7–0.8 with α_p 0.3–0.2.';
    case 'SIMPLEC':
      return 'SIMPLEC: α_p = 1 with α_u about 0.7–0.9 (common practice): its consistent velocity correction needs no pressure under-relaxation.';
    case 'PISO':
      return 'PISO: α_p = 1 and, in a time-accurate run, α_u = 1 too (common practice): the time step is the control.';
  }
}

/** The largest α_u a recommendation raises to. */
export function alphaCeiling(scheme: Scheme): number {
  return scheme === 'PISO' ? 1 : 0.9;
}

export function checkAlpha(name: string, alpha: number): void {
  if (!(alpha > 0 && alpha <= 1)) throw new TradeError(`${name} ${numberText(alpha)} is outside 0 < α ≤ 1: an under-relaxation factor takes a share of the new value`);
}

/**
 * The damped fixed-point model: an iteration φ ← φ + α (G(φ) − φ) whose
 * undamped map G amplifies the error by λ per iteration amplifies it by
 * 1 − α (1 − λ). From a measured factor ρ = |1 − α (1 − λ)| at α, λ follows
 * once the sign is known: monotone decay or growth means 1 − α (1 − λ) = +ρ,
 * an error that flips sign every iteration means −ρ.
 */
export function undampedFactor(measured: number, alpha: number, mode: Mode): number {
  if (!(measured >= 0) || !Number.isFinite(measured)) throw new TradeError(`the measured factor ${numberText(measured)} must be a finite number of zero or more`);
  checkAlpha('alpha_u', alpha);
  return mode === 'monotone' ? 1 - (1 - measured) / alpha : 1 - (1 + measured) / alpha;
}

/** The model's factor at α for an undamped amplification λ. */
export function dampedFactor(lambda: number, alpha: number): number {
  return Math.abs(1 - alpha * (1 - lambda));
}

/** α at which the model's factor is below 1: (0, 2/(1 − λ)) for λ < 1; none for λ ≥ 1. */
export function stableAlphaLimit(lambda: number): number | null {
  return lambda < 1 ? 2 / (1 - lambda) : null;
}

export type Advice = 'lower' | 'raise' | 'keep';

export interface Recommendation {
  advice: Advice;
  alphaU: number;
  reason: string;
}

/**
 * Lower the factors when the run diverges or oscillates, raise them when it
 * converges slowly and steadily, otherwise keep them (common practice), in
 * steps of ALPHA_STEP within ALPHA_FLOOR and the scheme's ceiling.
 */
export function recommend(scheme: Scheme, verdict: Verdict, factor: number, alphaU: number): Recommendation {
  const ceiling = alphaCeiling(scheme);
  const perDecade = factor < 1 ? -1 / Math.log10(factor) : Infinity;
  const round = (a: number) => Math.round(a * 100) / 100;
  if (verdict === 'diverging' || verdict === 'oscillating') {
    const next = round(Math.max(ALPHA_FLOOR, alphaU - ALPHA_STEP));
    if (next >= alphaU) {
      return { advice: 'keep', alphaU, reason: `the run is ${verdict}, but α_u ${numberText(alphaU)} is already at the floor of about ${ALPHA_FLOOR} (common practice): look at the mesh quality, the boundary conditions or the time step instead` };
    }
    return { advice: 'lower', alphaU: next, reason: `the run is ${verdict}: lowering α_u by ${ALPHA_STEP} damps each update (common practice)` };
  }
  if (verdict === 'converging' && perDecade > SLOW_ITERATIONS_PER_DECADE) {
    const next = round(Math.min(ceiling, alphaU + ALPHA_STEP));
    if (next <= alphaU) {
      return { advice: 'keep', alphaU, reason: `the run converges slowly (about ${numberText(perDecade, { digits: 2 })} iterations per order of magnitude), but α_u is already at ${numberText(ceiling)}` };
    }
    return {
      advice: 'raise',
      alphaU: next,
      reason: `the run converges steadily but slowly, at factor ${factorText(factor)} (about ${numberText(perDecade, { digits: 2 })} iterations per order of magnitude, more than ${SLOW_ITERATIONS_PER_DECADE}): raising α_u by ${ALPHA_STEP} takes bigger steps (common practice)`,
    };
  }
  if (verdict === 'stalled') {
    return { advice: 'keep', alphaU, reason: 'the run has stalled: a plateau is seldom cured by the factors; it often means unsteady flow (run it time-accurate) or a residual floor set by the mesh or round-off' };
  }
  if (verdict === 'converged') return { advice: 'keep', alphaU, reason: 'the run has converged: keep the factors' };
  return { advice: 'keep', alphaU, reason: `the run converges at a fair rate (factor ${factorText(factor)}, about ${numberText(perDecade, { digits: 2 })} iterations per order of magnitude): keep the factors` };
}
