// Small statistics for benchmark samples (milliseconds).

export function quantile(samples: number[], q: number): number {
  if (samples.length === 0) return NaN;
  const sorted = [...samples].sort((a, b) => a - b);
  const at = (sorted.length - 1) * q;
  const lo = Math.floor(at);
  const hi = Math.ceil(at);
  return sorted[lo]! + (sorted[hi]! - sorted[lo]!) * (at - lo);
}

export interface Summary {
  n: number;
  median: number;
  p95: number;
  min: number;
  max: number;
}

export function summarise(samples: number[]): Summary {
  return {
    n: samples.length,
    median: quantile(samples, 0.5),
    p95: quantile(samples, 0.95),
    min: Math.min(...samples),
    max: Math.max(...samples),
  };
}

export function fmt(ms: number): string {
  return Number.isFinite(ms) ? ms.toFixed(1).padStart(8) : '       –';
}
