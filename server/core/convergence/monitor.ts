// A monitored quantity (a force coefficient, a probe value) over the trailing
// window of a run: mean, sample standard deviation, and the drift between the
// window's two halves relative to the mean (or to a given scale). Settled when
// the drift is within the tolerance: a common-practice test that the value no
// longer moves with iterations, besides the residuals having fallen.
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';
import { trailingRows } from './history-file.js';
import { nonFiniteWord } from './residual-history.js';

export type MonitorVerdict = 'settled' | 'drifting' | 'too short';

/** Fewest rows in the window: two per half. */
export const MIN_WINDOW_ROWS = 4;

export interface MonitorStats {
  mean: number;
  /** Sample standard deviation (n − 1) over the window. */
  std: number;
  /** (mean of the second half − mean of the first half) / reference. */
  drift: number;
  verdict: MonitorVerdict;
  /** |mean|, or the scale given. */
  reference: number;
  firstHalfMean: number;
  secondHalfMean: number;
  windowRows: number;
  /** Iteration at the start of the window. */
  windowStart: number;
  lastIteration: number;
}

export function monitorStats(column: string, iterations: Float64Array, values: Float64Array, lines: Int32Array, window: number, tol: number, scale?: number): MonitorStats {
  const rows = values.length;
  for (let k = 0; k < rows; k++) {
    if (!Number.isFinite(values[k]!)) {
      throw new TradeError(`row ${lines[k]}: the solver wrote ${nonFiniteWord(values[k]!)} for ${column} at iteration ${numberText(iterations[k]!)}: the run blew up there, so there is nothing to settle`);
    }
  }
  const [first, n] = trailingRows(iterations, rows, window);
  if (n < MIN_WINDOW_ROWS) {
    throw new TradeError(`the last ${numberText(window)} iterations hold ${n} row${n === 1 ? '' : 's'} of ${column}; the drift between two halves needs at least ${MIN_WINDOW_ROWS}: widen window`);
  }
  const half = Math.floor(n / 2);
  let s1 = 0;
  let s2 = 0;
  for (let k = 0; k < half; k++) s1 += values[first + k]!;
  for (let k = n - half; k < n; k++) s2 += values[first + k]!;
  let sum = 0;
  for (let k = first; k < rows; k++) sum += values[k]!;
  const mean = sum / n;
  let ss = 0;
  for (let k = first; k < rows; k++) ss += (values[k]! - mean) ** 2;
  const std = Math.sqrt(ss / (n - 1));
  const reference = scale ?? Math.abs(mean);
  if (!(reference > 0)) throw new TradeError(`the mean of ${column} over the window is zero, so a drift relative to it has no meaning; give scale: (a typical size of ${column})`);
  const firstHalfMean = s1 / half;
  const secondHalfMean = s2 / half;
  const drift = (secondHalfMean - firstHalfMean) / reference;
  const lastIteration = iterations[rows - 1]!;
  const tooShort = iterations[0]! > lastIteration - window + 1;
  const verdict: MonitorVerdict = tooShort ? 'too short' : Math.abs(drift) <= tol ? 'settled' : 'drifting';
  return { mean, std, drift, verdict, reference, firstHalfMean, secondHalfMean, windowRows: n, windowStart: iterations[first]!, lastIteration };
}
