// Residual histories judged by their trend: the orders of magnitude fallen
// since the start, and the asymptotic convergence factor ρ per iteration from
// a least-squares fit of log10 residual against iteration over a trailing
// window (a linear iteration's error falls as ρ^n, so log r is straight at the
// end of a run: Ferziger & Perić, Computational Methods for Fluid Dynamics,
// 3rd ed. 2002, ch. 5, from memory). The verdict
// thresholds are ours (common practice fixes none); each is stated on the sheet.
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';
import { trailingRows } from './history-file.js';

export type Verdict = 'converged' | 'converging' | 'stalled' | 'oscillating' | 'diverging';

/** Best to worst: a run takes its worst field's verdict. */
export const VERDICTS: readonly Verdict[] = ['converged', 'converging', 'stalled', 'oscillating', 'diverging'];

/** A fitted change smaller than this across the window (decades) is flat: about 26 % up or down. */
export const TREND_BAND = 0.1;
/** Root-mean-square scatter of log10 residual about the fit (decades) that counts as oscillation: a factor of about 1.4. */
export const SCATTER_LIMIT = 0.15;
/** An oscillation's fit falls less than this many times its scatter across the window. */
export const OSCILLATION_FALL = 3;
/** A rise counts as divergence when it is also more than this many times the scatter. */
export const RISE_OVER_SCATTER = 2;
/** Fewest rows a fit may use. */
export const MIN_FIT_ROWS = 3;

export interface ResidualOptions {
  /** Orders of magnitude the residual must fall. */
  targetDrop: number;
  /** Iterations in the trailing window. */
  window: number;
  /** The initial value is the largest of the first `initialCount` values written. */
  initialCount: number;
}

export interface FieldAssessment {
  field: string;
  initial: number;
  final: number;
  /** Orders of magnitude fallen: log10(initial / final). */
  drop: number;
  /** Asymptotic convergence factor per iteration, 10^slope of the trailing fit. */
  factor: number;
  /** Iterations still needed at that factor; 0 when converged; null when the target is not in reach. */
  remaining: number | null;
  verdict: Verdict;
  /** The rule that gave the verdict, with its numbers. */
  reason: string;
  /** Change of the fitted log10 residual across the window, in decades. */
  trend: number;
  /** Root-mean-square scatter of log10 residual about the fit, in decades. */
  scatter: number;
  fitRows: number;
  /** The window held fewer than MIN_FIT_ROWS rows, so the last MIN_FIT_ROWS were fitted. */
  widened: boolean;
  /** Iteration of the last value used. */
  lastIteration: number;
  zeros: number;
  /** The solver wrote nan or inf here; the values before it are used. */
  blowUp?: { row: number; iteration: number; value: number };
}

/**
 * Judges one field. `values` and `iterations` run over the file's rows;
 * `lines` gives each row's spreadsheet row number for messages.
 */
export function assessField(field: string, iterations: Float64Array, values: Float64Array, lines: Int32Array, opts: ResidualOptions): FieldAssessment {
  const rows = values.length;
  let usable = rows;
  let zeros = 0;
  let positives = 0;
  let blowUp: FieldAssessment['blowUp'];
  for (let k = 0; k < rows; k++) {
    const v = values[k]!;
    if (!Number.isFinite(v)) {
      blowUp = { row: lines[k]!, iteration: iterations[k]!, value: v };
      usable = k;
      break;
    }
    if (v < 0) throw new TradeError(`row ${lines[k]}: the residual ${numberText(v)} in column ${field} is negative; a residual history holds sizes of residuals, which are never below zero`);
    if (v === 0) zeros++;
    else positives++;
  }
  if (positives < MIN_FIT_ROWS) {
    const where = blowUp ? ` before the solver wrote ${nonFiniteWord(blowUp.value)} in row ${blowUp.row}` : '';
    throw new TradeError(`column ${field} has ${positives} residual value${positives === 1 ? '' : 's'} above zero${where}; judging a history needs at least ${MIN_FIT_ROWS}`);
  }

  let initial = 0;
  for (let k = 0; k < Math.min(opts.initialCount, usable); k++) initial = Math.max(initial, values[k]!);
  if (initial === 0) for (let k = 0; k < usable && initial === 0; k++) initial = values[k]!;
  let lastRow = usable - 1;
  while (values[lastRow] === 0) lastRow--;
  const final = values[lastRow]!;
  const drop = Math.log10(initial / final);

  const fit = trailingFit(iterations, values, lastRow + 1, opts.window);
  const factor = Math.pow(10, fit.slope);
  const base = { field, initial, final, drop, factor, trend: fit.trend, scatter: fit.scatter, fitRows: fit.rows, widened: fit.widened, lastIteration: iterations[lastRow]!, zeros };
  const judged = judge(base, opts, blowUp);
  const out: FieldAssessment = { ...base, ...judged };
  if (blowUp) out.blowUp = blowUp;
  return out;
}

interface Fit {
  /** d log10 r / d iteration. */
  slope: number;
  trend: number;
  scatter: number;
  rows: number;
  widened: boolean;
}

/** Least squares of log10 r on iteration over the window's positive values (two passes, for round-off). */
function trailingFit(iterations: Float64Array, values: Float64Array, upTo: number, window: number): Fit {
  let [first] = trailingRows(iterations, upTo, window);
  let widened = false;
  const count = () => {
    let n = 0;
    for (let k = first; k < upTo; k++) if (values[k]! > 0) n++;
    return n;
  };
  let n = count();
  while (n < MIN_FIT_ROWS && first > 0) {
    first--;
    if (values[first]! > 0) n++;
    widened = true;
  }
  const x0 = iterations[upTo - 1]!;
  let sx = 0;
  let sy = 0;
  for (let k = first; k < upTo; k++) {
    if (!(values[k]! > 0)) continue;
    sx += iterations[k]! - x0;
    sy += Math.log10(values[k]!);
  }
  const mx = sx / n;
  const my = sy / n;
  let sxx = 0;
  let sxy = 0;
  let xMin = Infinity;
  for (let k = first; k < upTo; k++) {
    if (!(values[k]! > 0)) continue;
    const dx = iterations[k]! - x0 - mx;
    sxx += dx * dx;
    sxy += dx * (Math.log10(values[k]!) - my);
    xMin = Math.min(xMin, iterations[k]!);
  }
  const slope = sxy / sxx;
  let sse = 0;
  for (let k = first; k < upTo; k++) {
    if (!(values[k]! > 0)) continue;
    const e = Math.log10(values[k]!) - my - slope * (iterations[k]! - x0 - mx);
    sse += e * e;
  }
  return { slope, trend: slope * (x0 - xMin), scatter: Math.sqrt(sse / n), rows: n, widened };
}

type Judged = Pick<FieldAssessment, 'verdict' | 'reason' | 'remaining'>;

function judge(f: Omit<FieldAssessment, 'verdict' | 'reason' | 'remaining'>, opts: ResidualOptions, blowUp: FieldAssessment['blowUp']): Judged {
  const over = `over the last ${numberText(opts.window)} iterations`;
  const fit = `its trailing fit ${f.trend >= 0 ? 'rises' : 'falls'} ${numberText(Math.abs(f.trend))} decades ${over}`;
  if (blowUp) {
    return { verdict: 'diverging', remaining: null, reason: `the solver wrote ${nonFiniteWord(blowUp.value)} at iteration ${numberText(blowUp.iteration)} (row ${blowUp.row}): the run blew up there` };
  }
  if (f.trend >= TREND_BAND && f.trend > RISE_OVER_SCATTER * f.scatter) {
    return { verdict: 'diverging', remaining: null, reason: `${fit} (factor ${factorText(f.factor)} per iteration), more than the scatter about it` };
  }
  if (f.final > f.initial && f.trend > -TREND_BAND) {
    return { verdict: 'diverging', remaining: null, reason: `it stands ${numberText(-f.drop)} decades above its initial value and is not falling` };
  }
  if (f.drop >= opts.targetDrop) {
    return { verdict: 'converged', remaining: 0, reason: `it has fallen ${numberText(f.drop)} orders of magnitude, at least the ${numberText(opts.targetDrop)} asked for` };
  }
  if (f.scatter >= SCATTER_LIMIT && f.trend > -OSCILLATION_FALL * f.scatter) {
    return { verdict: 'oscillating', remaining: null, reason: `it scatters ${numberText(f.scatter)} decades (root mean square) about its trailing fit, and the fit falls only ${numberText(Math.max(0, -f.trend))} decades ${over}` };
  }
  if (f.trend > -TREND_BAND) {
    return { verdict: 'stalled', remaining: null, reason: `${fit}, less than ${TREND_BAND} decades: at ${numberText(f.drop)} orders fallen it is no longer falling` };
  }
  const remaining = Math.ceil((opts.targetDrop - f.drop) / -Math.log10(f.factor));
  return { verdict: 'converging', remaining, reason: `${fit}; at factor ${factorText(f.factor)} per iteration it needs about ${numberText(remaining)} more iterations for ${numberText(opts.targetDrop)} orders` };
}

/** What a solver wrote for a value that blew up, as it would write it. */
export function nonFiniteWord(v: number): string {
  return Number.isNaN(v) ? 'nan (not a number)' : v > 0 ? 'inf' : '−inf';
}

/** The run takes its worst field's verdict; among fields with that verdict, the slowest (largest factor). */
export function worstField(fields: readonly FieldAssessment[]): FieldAssessment {
  let worst = fields[0]!;
  for (const f of fields) {
    const a = VERDICTS.indexOf(f.verdict);
    const b = VERDICTS.indexOf(worst.verdict);
    if (a > b || (a === b && f.factor > worst.factor)) worst = f;
  }
  return worst;
}

/**
 * A factor with enough digits to tell it from 1: two significant figures of
 * its distance from 1 (0.99954, 1.012), at least three in all.
 */
export function factorText(factor: number): string {
  const gap = Math.abs(1 - factor);
  if (!(gap > 0) || gap >= 0.1) return numberText(factor);
  const decimals = Math.max(2, 1 - Math.floor(Math.log10(gap)));
  return numberText(Number(factor.toFixed(Math.min(decimals, 12))), { digits: Math.min(15, decimals + 1) });
}

/** How each verdict is detected, in the order the rules are tried: the sheet shows these. */
export function verdictRules(opts: ResidualOptions): string[] {
  const w = numberText(opts.window);
  return [
    `drop = log10(initial / final): initial is the largest of the first ${numberText(opts.initialCount)} values written (a run's first residuals often rise before they fall), final the last value.`,
    `factor = 10^b per iteration, b the least-squares slope of log10 residual against iteration over the last ${w} iterations; remaining = (target drop − drop) / (−log10 factor) iterations.`,
    `Verdicts, tried in this order (thresholds are ours; no standard fixes them): diverging — the solver wrote nan or inf, or the fit rises ${TREND_BAND} decades or more across the window and by more than ${RISE_OVER_SCATTER} × the scatter about it, or the residual stands above its initial value and is not falling.`,
    `converged — drop at least ${numberText(opts.targetDrop)} orders (a fall of three to four orders is common practice for steady runs, with the monitored quantities settled as well).`,
    `oscillating — the root-mean-square scatter of log10 residual about the fit is ${SCATTER_LIMIT} decades (a factor ${numberText(Math.pow(10, SCATTER_LIMIT))}) or more and the fit falls less than ${OSCILLATION_FALL} × that scatter across the window.`,
    `stalled — the fit changes by less than ${TREND_BAND} decades across the window (a factor within ${factorText(Math.pow(10, -TREND_BAND / opts.window))}–${factorText(Math.pow(10, TREND_BAND / opts.window))} per iteration) and the scatter is small.`,
    `converging — the fit falls ${TREND_BAND} decades or more across the window and the target is not reached yet. The run takes its worst field's verdict, in the order converged, converging, stalled, oscillating, diverging.`,
  ];
}
