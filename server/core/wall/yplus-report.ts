// Statistics of the wall y+ a solver run produced, and the first-layer height
// that would bring its mean to the target on the next mesh.
import { TradeError } from '../shared/trade-error.js';

export interface YplusStats {
  count: number;
  min: number;
  max: number;
  mean: number;
  weighted_mean: number;
  p05: number;
  p50: number;
  p95: number;
  in_band: number;
}

/**
 * Sample quantile by linear interpolation between order statistics,
 * Hyndman & Fan (1996), "Sample quantiles in statistical packages", definition 7.
 */
export function quantile(sorted: readonly number[], p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

/** Percentiles count faces; the weighted mean and the in-band share weigh each face (by area). */
export function yplusStats(values: readonly number[], weights: readonly number[], band: readonly [number, number]): YplusStats {
  if (values.length === 0) throw new TradeError('no samples');
  const sorted = [...values].sort((a, b) => a - b);
  const wsum = weights.reduce((a, b) => a + b, 0);
  let wv = 0;
  let wIn = 0;
  values.forEach((v, i) => {
    const w = weights[i]!;
    wv += w * v;
    if (v >= band[0] && v <= band[1]) wIn += w;
  });
  return {
    count: values.length,
    min: sorted[0]!,
    max: sorted[sorted.length - 1]!,
    mean: values.reduce((a, b) => a + b, 0) / values.length,
    weighted_mean: wv / wsum,
    p05: quantile(sorted, 0.05),
    p50: quantile(sorted, 0.5),
    p95: quantile(sorted, 0.95),
    in_band: wIn / wsum,
  };
}

/**
 * Next first-layer height: in the viscous sublayer y+ grows in proportion to the
 * wall distance at a nearly unchanged u_τ, so one scaling step moves the mean to the
 * target; a few such steps are usual because u_τ shifts with the mesh.
 */
export function correctedFirst(first: number, target: number, observedMean: number): number {
  if (!(observedMean > 0)) throw new TradeError('the observed mean y+ is zero, so no correction can be scaled from it');
  return (first * target) / observedMean;
}
