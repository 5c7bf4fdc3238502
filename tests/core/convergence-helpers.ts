// Shared pieces for the convergence tests: calling the family's entries with a
// context whose data files come from a map, reading record fields and table
// rows, and writing synthetic histories as CSV text.
import { createRegistry, num, type Args, type Quantity, type RecordValue, type TradeFunction, type Value } from '../../server/core/index.js';
import { convergenceEntries } from '../../server/core/convergence/entries.js';
import { evaluate } from '../../server/evaluate/interpreter.js';
import { Budget, DEFAULT_LIMITS } from '../../server/evaluate/limits.js';
import { makeScope } from '../../server/evaluate/make-scope.js';
import { parseExpression } from '../../server/parse/index.js';
import { stubContext } from './wall-helpers.js';

export function entry(name: string): TradeFunction {
  const f = convergenceEntries.find((e) => e.name === name);
  if (!f) throw new Error(`no convergence function ${name}`);
  return f;
}

/** A call context whose data files come from a map (the near-wall tests' stub). */
export const context = stubContext;

/** Calls an entry with its defaults filled in, the way the engine would. */
export function call(name: string, args: Record<string, Value>, files: Record<string, string> = {}): RecordValue {
  const fn = entry(name);
  const full: Record<string, Value> = { ...defaults(fn), ...args };
  const v = fn.compute(full as Args, context(files));
  if (v.kind !== 'record') throw new Error(`expected a record, got ${v.kind}`);
  return v;
}

const registry = createRegistry();

/** Parameter defaults evaluated from their worksheet text, as the engine does. */
function defaults(fn: TradeFunction): Record<string, Value> {
  const out: Record<string, Value> = {};
  for (const p of fn.params) {
    if (p.default === undefined) continue;
    const scope = makeScope({
      registry,
      budget: new Budget(DEFAULT_LIMITS),
      context: context(),
      lookup: () => {
        throw new Error('a default uses a name');
      },
      defaults: new Map(),
    });
    out[p.name] = evaluate(parseExpression(p.default), scope);
  }
  return out;
}

export function field(r: RecordValue, name: string): Value {
  const f = r.fields.get(name);
  if (!f) throw new Error(`record has no field ${name} (it has ${[...r.fields.keys()].join(', ')})`);
  return f.value;
}

export function siField(r: RecordValue, name: string): number {
  const v = field(r, name);
  if (v.kind !== 'quantity') throw new Error(`field ${name} is ${v.kind}, not a quantity`);
  return v.si;
}

export function textField(r: RecordValue, name: string): string {
  const v = field(r, name);
  if (v.kind !== 'string') throw new Error(`field ${name} is ${v.kind}, not text`);
  return v.value;
}

export function boolField(r: RecordValue, name: string): boolean {
  const v = field(r, name);
  if (v.kind !== 'bool') throw new Error(`field ${name} is ${v.kind}, not true/false`);
  return v.value;
}

/** The residuals table as objects keyed by column, cells as SI numbers or text. */
export function tableRows(r: RecordValue): Array<Record<string, number | string>> {
  const t = field(r, 'table');
  if (t.kind !== 'table') throw new Error('no table');
  return t.rows.map((row) => Object.fromEntries(row.map((cell, i) => [t.columns[i]!, cell.kind === 'quantity' ? (cell as Quantity).si : cell.kind === 'string' ? cell.value : '?'])));
}

/**
 * CSV text of a history: iterations and one function of the iteration per
 * column. Values are written with 17 significant digits, so they read back exactly.
 */
export function historyCsv(iterations: number[], columns: Record<string, (n: number, k: number) => number | string>, delimiter = ','): string {
  const names = Object.keys(columns);
  const lines = [['iteration', ...names].join(delimiter)];
  iterations.forEach((n, k) => {
    lines.push([String(n), ...names.map((c) => {
      const v = columns[c]!(n, k);
      return typeof v === 'string' ? v : v.toPrecision(17);
    })].join(delimiter));
  });
  return lines.join('\n') + '\n';
}

export function range(from: number, to: number, step = 1): number[] {
  const out: number[] = [];
  for (let n = from; n <= to; n += step) out.push(n);
  return out;
}

export function relErr(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}

/** Plain-number arguments of a call (window, tol, …) as values. */
export function numArgs(extra: Record<string, number>): Record<string, Value> {
  return Object.fromEntries(Object.entries(extra).map(([k, v]) => [k, num(v)]));
}

/** Number of points in the first series' line of a figure (plot.ts draws it in the first palette colour). */
export function firstSeriesPoints(svg: string): number {
  return /<path d="(M[^"]+)" stroke="#1f5fa8" stroke-width="1.4"/.exec(svg)![1]!.split('L').length;
}
