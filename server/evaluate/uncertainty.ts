// First-order propagation of the inputs' uncertainties through the sheet:
// the law of propagation of uncertainty for uncorrelated inputs, u(y)² =
// Σ (c_i u(x_i))² (JCGM 100:2008, GUM, §5.1.2, eq. 10), with each
// sensitivity coefficient c_i found by running the sheet again downstream of
// x_i at x_i ± u(x_i) (the central difference of GUM §5.1.3, note 2). A step
// of one standard uncertainty, not an infinitesimal one, keeps the rounding
// of iterated trade functions out of c_i and gives a layer count, which moves
// in whole steps, a slope that says how far it moves over the range.
import { SheetError } from '../diagnostics.js';
import type { Quantity, Value } from '../core/index.js';
import type { Expr, Statement, UncertaintyNode } from '../parse/ast.js';
import { dimsEqual } from '../units/dims.js';
import { unitLabel } from '../units/labels.js';
import type { Rerun, RerunRow } from './rerun.js';

type Define = Extract<Statement, { type: 'define' }>;

/** An input with its uncertainty, in SI. */
export interface UncertainInput {
  readonly name: string;
  readonly line: number;
  readonly value: Quantity;
  /** Standard uncertainty u(x), SI. */
  readonly u: number;
  readonly distribution: 'normal' | 'uniform';
  /** Set for a name brought in by `use`: the sheet it comes from, as the use line names it. */
  readonly from?: string;
}

/**
 * An uncertainty that comes with a name from another sheet. In the using
 * sheet the name is an input with this u. That is exact for an input of the
 * other sheet; for one of its results it holds only while no other name
 * brought in rests on the same inputs (they would be correlated), which
 * `sources` lets the use line check.
 */
export interface CarriedSpread {
  readonly u: number;
  readonly distribution: 'normal' | 'uniform';
  /** The inputs it rests on, each as the sheet that defines it (absolute path) and its name. */
  readonly sources: readonly CarriedSource[];
  /** A result of the other sheet (first order), not one of its inputs. */
  readonly derived: boolean;
}

export interface CarriedSource {
  readonly sheet: string;
  readonly name: string;
}

/** What one input gives a result: u(x_i), c_i; the contribution is |c_i u(x_i)|. */
export interface Contribution {
  readonly input: string;
  readonly u: number;
  readonly c: number;
}

/** A result's standard uncertainty with its budget; a record's quantity fields each have their own. */
export interface Propagated {
  readonly u: number;
  readonly budget: readonly Contribution[];
  readonly fields?: ReadonlyMap<string, Propagated>;
  /** Why it could not be propagated (the sheet failed at an end of an input's range). */
  readonly problem?: string;
}

/** ÷√3: a rectangular distribution of half-width a has u = a/√3 (GUM §4.3.7, eq. 7). */
export const UNIFORM_FACTOR = Math.sqrt(3);

/** The standard uncertainty an input's `±` gives, checked against the value it belongs to. */
export function readUncertainty(stmt: Define, node: UncertaintyNode, value: Value): UncertainInput {
  if (value.kind !== 'quantity') throw new SheetError('type', `only a number can carry an uncertainty, and ${stmt.name} is not one`, node.span);
  let half: number;
  if (node.relative) half = Math.abs(value.si) * node.value * 0.01;
  else {
    const unit = node.unit?.unit;
    const dims = unit?.dims ?? value.dims;
    if (!dimsEqual(dims, value.dims)) {
      throw new SheetError('unit-mismatch', `the uncertainty of ${stmt.name} is in ${unit?.text ?? 'a plain number'}, but ${stmt.name} is in ${unitLabel(value.dims) || 'a plain number'}; give it in the same dimension, or as a share (± 5 %)`, node.span);
    }
    // An uncertainty is a difference: ± 0.5 degC is half a degree, never an absolute temperature.
    half = node.value * (unit?.factor ?? (value.unit && !value.unit.offset ? value.unit.factor : 1));
  }
  const u = node.distribution === 'uniform' ? half / UNIFORM_FACTOR : half;
  return { name: stmt.name, line: stmt.line, value, u, distribution: node.distribution };
}

/** The input with another SI value, its unit and temperature sense kept. */
export function moved(q: Quantity, si: number): Quantity {
  return { ...q, si };
}

/** Quantity values a result has for propagation: itself, or a record's quantity fields. */
function numbersOf(v: Value | undefined): Map<string, number> | number | undefined {
  if (!v) return undefined;
  if (v.kind === 'quantity') return v.si;
  if (v.kind !== 'record') return undefined;
  const out = new Map<string, number>();
  for (const [k, f] of v.fields) if (f.value.kind === 'quantity') out.set(k, f.value.si);
  return out;
}

/**
 * u(y) for every result downstream of an uncertain input. `rowsOf` gives the
 * sheet run again at x ± u(x) for one input; `values` are the sheet's own.
 */
export function firstOrder(inputs: readonly UncertainInput[], rowsOf: (input: UncertainInput) => InputRows, values: ReadonlyMap<string, Value>): Map<string, Propagated> {
  /** Sensitivities by result (and field): input → c, or the words of a failure. */
  const slopes = new Map<string, Map<string, number>>();
  const fieldSlopes = new Map<string, Map<string, Map<string, number>>>();
  const problems = new Map<string, string>();
  const uOf = new Map(inputs.map((i) => [i.name, i.u]));
  for (const input of inputs) {
    slopes.set(input.name, new Map([...(slopes.get(input.name) ?? []), [input.name, 1]]));
    if (input.u === 0) continue;
    const { rerun, up, down } = rowsOf(input);
    for (const s of rerun.downstream) {
      const failed = up.errors.get(s.name) ?? down.errors.get(s.name);
      if (failed) {
        if (!problems.has(s.name)) problems.set(s.name, `at ${input.name} ${up.errors.has(s.name) ? '+' : '−'} u the sheet fails here (line ${failed.line}: ${failed.message})`);
        continue;
      }
      const a = numbersOf(up.values.get(s.name));
      const b = numbersOf(down.values.get(s.name));
      if (typeof a === 'number' && typeof b === 'number') {
        const m = slopes.get(s.name) ?? new Map<string, number>();
        m.set(input.name, (a - b) / (2 * input.u));
        slopes.set(s.name, m);
      } else if (a instanceof Map && b instanceof Map) {
        const byField = fieldSlopes.get(s.name) ?? new Map<string, Map<string, number>>();
        for (const [k, ya] of a) {
          const yb = b.get(k);
          if (yb === undefined) continue;
          const m = byField.get(k) ?? new Map<string, number>();
          m.set(input.name, (ya - yb) / (2 * input.u));
          byField.set(k, m);
        }
        fieldSlopes.set(s.name, byField);
      }
    }
  }
  const combine = (m: ReadonlyMap<string, number>): Propagated => {
    const budget = [...m].map(([input, c]) => ({ input, u: uOf.get(input)!, c }));
    return { u: Math.sqrt(budget.reduce((s, b) => s + (b.c * b.u) ** 2, 0)), budget };
  };
  const out = new Map<string, Propagated>();
  for (const [name, m] of slopes) if (numbersOf(values.get(name)) !== undefined) out.set(name, withProblem(combine(m), problems.get(name)));
  for (const [name, byField] of fieldSlopes) {
    const fields = new Map([...byField].map(([k, m]) => [k, combine(m)]));
    out.set(name, withProblem({ u: NaN, budget: [], fields }, problems.get(name)));
  }
  for (const [name, problem] of problems) if (!out.has(name)) out.set(name, { u: NaN, budget: [], problem });
  return out;
}

function withProblem(p: Propagated, problem: string | undefined): Propagated {
  return problem ? { ...p, problem } : p;
}

/** The propagated uncertainty of a name or a record's field (wr.height). */
export function propagatedAt(map: ReadonlyMap<string, Propagated>, name: string, field?: string): Propagated | undefined {
  const p = map.get(name);
  if (!p || field === undefined) return p;
  const f = p.fields?.get(field);
  return f && p.problem ? { ...f, problem: p.problem } : f;
}

/** Values of the sheet at x_i + u and x_i − u for one input, kept for whatever else asks (inline values). */
export interface InputRows {
  readonly rerun: Rerun;
  readonly up: RerunRow;
  readonly down: RerunRow;
}

export function inputRows(input: UncertainInput, rerun: Rerun): InputRows {
  const x = input.value.si;
  return {
    rerun,
    up: rerun.run(new Map([[input.name, moved(input.value, x + input.u)]])),
    down: rerun.run(new Map([[input.name, moved(input.value, x - input.u)]])),
  };
}

/**
 * u of an expression that reads `names` (an inline value of the prose), by
 * the same law as the statements': undefined when no uncertain input moves it,
 * NaN when it cannot be evaluated at an end of an input's range.
 */
export function expressionSpread(e: Expr, names: readonly string[], inputs: readonly UncertainInput[], movesOf: (input: UncertainInput) => ReadonlySet<string>, rowsOf: (input: UncertainInput) => InputRows): number | undefined {
  let sum = 0;
  let moves = false;
  for (const input of inputs) {
    if (input.u === 0 || !names.some((n) => movesOf(input).has(n))) continue;
    moves = true;
    const r = rowsOf(input);
    let a: Value;
    let b: Value;
    try {
      a = r.rerun.read(e, r.up);
      b = r.rerun.read(e, r.down);
    } catch (err) {
      if (err instanceof SheetError && err.code !== 'limit') return NaN;
      throw err;
    }
    if (a.kind !== 'quantity' || b.kind !== 'quantity') return NaN;
    sum += ((a.si - b.si) / 2) ** 2;
  }
  return moves ? Math.sqrt(sum) : undefined;
}
