// The sheet's words for uncertainty, evaluated late (after every other
// definition, as sweeps are): uncertainty(y, k: 2) is the expanded
// uncertainty k·u(y) (k = 1 by default: the standard uncertainty),
// budget(y) the table of each input's share of u(y) (GUM §5.1.3 and its
// tables of uncertainty components), and propagate(y, samples: 20000, seed: 1)
// the Monte Carlo method of JCGM 101:2008 on the same graph.
import { SheetError } from '../diagnostics.js';
import { countText, describeValue, figure, linePlot, numberText, record, shown, str, table, type Quantity, type Value } from '../core/index.js';
import type { Expr } from '../parse/ast.js';
import { dimsMul } from '../units/dims.js';
import { unitLabel } from '../units/labels.js';
import { quantity } from '../units/quantity.js';
import { evaluate } from './interpreter.js';
import { BudgetError } from './limits.js';
import { normalCoverageFactor, summarise, validate, Xoshiro128 } from './monte-carlo.js';
import type { Rerun } from './rerun.js';
import type { Scope } from './scope.js';
import { moved, propagatedAt, UNIFORM_FACTOR, type Propagated, type UncertainInput } from './uncertainty.js';

export const UNCERTAINTY_FORMS: ReadonlySet<string> = new Set(['uncertainty', 'budget', 'propagate']);

export function isUncertaintyForm(e: Expr): boolean {
  return e.type === 'call' && UNCERTAINTY_FORMS.has(e.callee);
}

export interface UncertaintyEnv {
  scope: Scope;
  propagated: ReadonlyMap<string, Propagated>;
  inputs: readonly UncertainInput[];
  /** A rerun downstream of `changed` that computes only what `wanted` needs (no checks). */
  plan(changed: ReadonlySet<string>, wanted: ReadonlySet<string>): Rerun;
  /** Told every so often how far a Monte Carlo run has come. */
  progress?: ((done: number, total: number) => void) | undefined;
}

/** Monte Carlo trials at most: with the sheet's own step and time budget, this is where a sheet stalls. */
export const MAX_SAMPLES = 1_000_000;
/** Default trials: JCGM 101 §7.2.2 takes 10^6 for a 95 % interval good to one or two digits; 20,000 is a planning figure. */
export const DEFAULT_SAMPLES = 20_000;
/** Progress is told after each this many trials. */
export const PROGRESS_EVERY = 2_000;

type CallExpr = Extract<Expr, { type: 'call' }>;

/** The result a form is about: a name or a record's field, as written. */
interface Target {
  name: string;
  field?: string;
  label: string;
  value: Quantity;
  propagated: Propagated;
}

export function evaluateUncertaintyForm(expr: Expr, env: UncertaintyEnv): Value {
  const e = expr as CallExpr;
  const positional = e.args.filter((a) => !a.name);
  const named = new Map(e.args.filter((a) => a.name).map((a) => [a.name!, a]));
  const allowed = e.callee === 'uncertainty' ? ['k'] : e.callee === 'propagate' ? ['samples', 'seed', 'interval'] : [];
  for (const [n, a] of named) {
    if (!allowed.includes(n)) throw new SheetError('bad-argument', `${e.callee}() has no option "${n}"${allowed.length ? `; it takes ${allowed.join(', ')}` : ''}`, a.span);
  }
  if (positional.length !== 1) throw new SheetError('bad-argument', `${e.callee}() takes one result, a name or a record's field: ${e.callee}(wr.height)`, e.span);
  const target = readTarget(e, positional[0]!.value, env);
  const number = (name: string, fallback: number) => {
    const a = named.get(name);
    if (!a) return fallback;
    const v = evaluate(a.value, env.scope);
    if (v.kind !== 'quantity' || unitLabel(v.dims) !== '') throw new SheetError('type', `${name}: must be a plain number, not ${describeValue(v)}`, a.span);
    return v.si;
  };
  if (e.callee === 'uncertainty') {
    const k = number('k', 1);
    if (!(k > 0)) throw new SheetError('bad-argument', `k: the coverage factor must be positive, not ${numberText(k)}`, named.get('k')!.span);
    return likeTarget(target.value, k * target.propagated.u);
  }
  if (e.callee === 'budget') return budgetTable(target, env);
  const samples = number('samples', DEFAULT_SAMPLES);
  if (!Number.isInteger(samples) || samples < 100 || samples > MAX_SAMPLES) {
    throw new SheetError('bad-argument', `samples: a whole number from 100 to ${MAX_SAMPLES.toLocaleString('en')}, not ${numberText(samples)}`, named.get('samples')?.span ?? e.span);
  }
  const seed = number('seed', 1);
  if (!Number.isInteger(seed)) throw new SheetError('bad-argument', `seed: a whole number, not ${numberText(seed)}`, named.get('seed')!.span);
  let shortest = false;
  const iv = named.get('interval');
  if (iv) {
    const v = evaluate(iv.value, env.scope);
    if (v.kind !== 'string' || (v.value !== 'symmetric' && v.value !== 'shortest')) throw new SheetError('bad-argument', 'interval: "symmetric" (the default) or "shortest"', iv.span);
    shortest = v.value === 'shortest';
  }
  return monteCarlo(e, target, env, samples, seed, shortest);
}

function readTarget(e: CallExpr, arg: Expr, env: UncertaintyEnv): Target {
  const path = arg.type === 'name' ? { name: arg.name } : arg.type === 'field' && arg.object.type === 'name' ? { name: arg.object.name, field: arg.field } : undefined;
  if (!path) throw new SheetError('bad-argument', `${e.callee}() takes a name or a record's field (wr.height), not an expression; name the expression first`, arg.span);
  const label = path.field === undefined ? path.name : `${path.name}.${path.field}`;
  const value = evaluate(arg, env.scope);
  if (value.kind !== 'quantity') throw new SheetError('type', `${label} is ${describeValue(value)}; an uncertainty belongs to a number`, arg.span);
  const propagated = propagatedAt(env.propagated, path.name, path.field);
  if (!propagated) {
    const none = env.inputs.length === 0 ? 'the sheet has no input with an uncertainty (U = 12 m/s ± 1 m/s)' : `${label} depends on none of the inputs with an uncertainty (${env.inputs.map((i) => i.name).join(', ')})`;
    throw new SheetError('bad-argument', none, arg.span);
  }
  if (propagated.problem) throw new SheetError('bad-argument', `the uncertainty of ${label} cannot be propagated: ${propagated.problem}`, arg.span);
  return { ...path, label, value, propagated };
}

/** A value in the target's dimension and display unit (a temperature's uncertainty is a difference). */
function likeTarget(v: Quantity, si: number): Quantity {
  if (v.unit && v.unit.offset) return quantity(si, v.dims, undefined, false, true);
  return quantity(si, v.dims, v.unit);
}

function budgetTable(t: Target, env: UncertaintyEnv): Value {
  const byName = new Map(env.inputs.map((i) => [i.name, i]));
  const total = t.propagated.u;
  const rows = [...t.propagated.budget]
    .sort((a, b) => Math.abs(b.c * b.u) - Math.abs(a.c * a.u))
    .map((b) => {
      const x = byName.get(b.input)!;
      const share = total > 0 ? (b.c * b.u) ** 2 / total ** 2 : 0;
      return [
        str(x.from ? `${b.input} (from ${x.from})` : b.input),
        likeTarget(x.value, b.u),
        str(x.distribution),
        quantity(b.c, dimsMul(t.value.dims, x.value.dims, -1)),
        likeTarget(t.value, Math.abs(b.c * b.u)),
        shown(share * 100, '%'),
      ];
    });
  return table(['input', 'u(x)', 'distribution', 'sensitivity c', '|c·u(x)|', 'share of u²'], rows, {
    remarks: [
      `u(${t.label}) = ${numberText(total, { digits: 4 })} ${unitLabel(t.value.dims)} (SI): the contributions added in quadrature, inputs taken as uncorrelated (JCGM 100:2008, eq. 10); each c from the sheet run again at x ± u(x).`,
    ],
  });
}

function monteCarlo(e: CallExpr, t: Target, env: UncertaintyEnv, samples: number, seed: number, shortest: boolean): Value {
  const inputs = env.inputs.filter((i) => t.propagated.budget.some((b) => b.input === i.name));
  const rerun = env.plan(new Set(inputs.map((i) => i.name)), new Set([t.name]));
  const rng = new Xoshiro128(seed);
  const ys = new Float64Array(samples);
  let kept = 0;
  let firstFailure: string | undefined;
  const changes = new Map<string, Value>();
  for (let r = 0; r < samples; r++) {
    for (const x of inputs) {
      const d = x.distribution === 'uniform' ? (2 * rng.uniform() - 1) * x.u * UNIFORM_FACTOR : rng.normal() * x.u;
      changes.set(x.name, moved(x.value, x.value.si + d));
    }
    let row;
    try {
      row = rerun.run(changes);
    } catch (err) {
      // The sheet's budget ran out among the samples: said at the call, wherever in a sample it happened.
      if (err instanceof BudgetError) throw new BudgetError('limit', `${err.message}, in the Monte Carlo samples of propagate(); take fewer samples`, e.span);
      throw err;
    }
    const failed = row.errors.get(t.name) ?? [...row.errors.values()][0];
    if (failed) {
      firstFailure ??= `line ${failed.line}: ${failed.message}`;
    } else {
      const v = row.values.get(t.name);
      const y = t.field === undefined ? v : v?.kind === 'record' ? v.fields.get(t.field)?.value : undefined;
      if (y?.kind === 'quantity') ys[kept++] = y.si;
    }
    // The last sample is not progress: the result itself follows at once.
    if (env.progress && (r + 1) % PROGRESS_EVERY === 0 && r + 1 < samples) env.progress(r + 1, samples);
  }
  if (kept < 2) throw new SheetError('bad-argument', `propagate() could not evaluate ${t.label} for its samples${firstFailure ? ` (${firstFailure})` : ''}`, e.span);
  const p = 0.95;
  const mc = summarise(ys.subarray(0, kept), p, shortest);
  const k = normalCoverageFactor(p);
  const check = validate(t.value.si, t.propagated.u, k, mc, samples);
  const unit = unitLabel(t.value.dims);
  const words = (x: number) => `${numberText(x, { digits: 4 })}${unit ? ` ${unit}` : ''}`;
  const warnings: string[] = [];
  if (kept < samples) warnings.push(`${(samples - kept).toLocaleString('en')} of ${samples.toLocaleString('en')} samples failed and were left out (first: ${firstFailure}); the sheet is not defined over the whole range of its inputs`);
  const comparison = `first order gives [${words(t.value.si - k * t.propagated.u)}, ${words(t.value.si + k * t.propagated.u)}] (y ± ${numberText(k, { digits: 4 })}u); the endpoints differ by ${words(check.dLow)} and ${words(check.dHigh)} against δ = ${words(check.delta)}`;
  if (check.agrees) {
    // Remarks are in the record below.
  } else warnings.push(`first order and Monte Carlo disagree beyond the tolerance of JCGM 101:2008 §8: ${comparison}; take the Monte Carlo interval`);
  const remarks = [
    `Monte Carlo method of JCGM 101:2008: ${samples.toLocaleString('en')} samples (seed ${seed}) of ${inputs.map((i) => `${i.name} (${i.distribution})`).join(', ')}, each run through the ${countText(rerun.downstream.length, 'statement')} between ${inputs.length === 1 ? inputs[0]!.name : 'them'} and ${t.name}.`,
    `${shortest ? 'Shortest' : 'Probabilistically symmetric'} 95 % coverage interval (JCGM 101 §7.7).`,
  ];
  if (check.agrees) remarks.push(`The first-order result is validated (JCGM 101 §8): ${comparison}.`);
  const like = (x: number) => likeTarget(t.value, x);
  const at = (x: number) => (t.value.unit && t.value.unit.offset ? quantity(x, t.value.dims, t.value.unit, true) : quantity(x, t.value.dims, t.value.unit));
  return record(
    [
      ['mean', at(mc.mean), 'estimate: the mean of the samples'],
      ['u', like(mc.u), 'standard uncertainty: the standard deviation of the samples'],
      ['low', at(mc.low), 'lower end of the 95 % coverage interval'],
      ['high', at(mc.high), 'upper end of the 95 % coverage interval'],
      ['u_first', like(t.propagated.u), 'first-order standard uncertainty, for comparison'],
      ['agrees', { kind: 'bool', value: check.agrees }, 'first order validated within δ (JCGM 101 §8)'],
    ],
    { warnings, remarks, figure: figure(histogram(ys.subarray(0, kept), mc, t, unit), `${t.label}: ${samples.toLocaleString('en')} Monte Carlo samples`) },
  );
}

/** The samples' histogram as a step line, with the coverage interval and the first-order one marked. */
function histogram(ys: Float64Array, mc: { low: number; high: number; mean: number }, t: Target, unit: string): string {
  let lo = Infinity;
  let hi = -Infinity;
  for (const y of ys) {
    if (y < lo) lo = y;
    if (y > hi) hi = y;
  }
  const bins = 40;
  const width = hi > lo ? (hi - lo) / bins : 1;
  const counts = new Array<number>(bins).fill(0);
  for (const y of ys) counts[Math.min(bins - 1, Math.floor((y - lo) / width))]!++;
  const points: Array<[number, number]> = [[lo, 0]];
  counts.forEach((c, i) => {
    const density = c / (ys.length * width);
    points.push([lo + i * width, density], [lo + (i + 1) * width, density]);
  });
  points.push([lo + bins * width, 0]);
  const k = normalCoverageFactor(0.95);
  return linePlot({
    title: `Distribution of ${t.label}`,
    x: { label: `${t.label}${unit ? ` (${unit}, SI)` : ''}` },
    y: { label: 'probability density' },
    series: [{ name: 'Monte Carlo samples', points }],
    references: [
      { axis: 'x', at: mc.low, label: '95 % low' },
      { axis: 'x', at: mc.high, label: '95 % high' },
      { axis: 'x', at: t.value.si - k * t.propagated.u, label: 'first order', colour: '#8e44ad' },
      { axis: 'x', at: t.value.si + k * t.propagated.u, label: '', colour: '#8e44ad' },
    ],
  });
}
