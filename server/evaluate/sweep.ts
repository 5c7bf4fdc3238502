// sweep(U, [10, 20, 30] m/s, Re, wall.height, plot: true) and
// sweep2(a, [...], b, [...], outputs…): the sheet run again for each value
// (each pair of values) of its inputs, only downstream of them, as a table of
// the chosen outputs labelled by the inputs. A row that fails shows its error
// in that row; each check downstream says for which rows it holds.
import { SheetError, type Diagnostic } from '../diagnostics.js';
import { bool, describeValue, figure, linePlot, numberText, str, table, type FigureValue, type Quantity, type TableValue, type Value } from '../core/index.js';
import type { Expr, Statement } from '../parse/ast.js';
import { engineeringPrefix, unitLabel } from '../units/labels.js';
import { evaluate } from './interpreter.js';
import type { Rerun, RerunRow } from './rerun.js';
import type { Scope } from './scope.js';

export const SWEEP_FORMS: ReadonlySet<string> = new Set(['sweep', 'sweep2']);

type CallExpr = Extract<Expr, { type: 'call' }>;

/** The call is a sweep, not a trade function. (Not a type guard: every other call stays a call.) */
export function isSweep(e: Expr): boolean {
  return e.type === 'call' && SWEEP_FORMS.has(e.callee);
}

export interface SweepEnv {
  /** Evaluates the lists of values and the options, against the sheet. */
  scope: Scope;
  /** Plans a rerun downstream of `changed`, computing what `wanted` needs. */
  plan(changed: ReadonlySet<string>, wanted: ReadonlySet<string>): Rerun;
  /** The defined names of the sheet. */
  defines(name: string): boolean;
  /** The sheet a name comes from through `use`, if it does. */
  usedFrom(name: string): string | undefined;
  /** The label of a check, for what the sweep says of it. */
  checkLabel(line: number): string;
}

/** Longest sweep (all rows of a sweep2): beyond it the sheet would stall. */
export const MAX_SWEEP_ROWS = 100_000;

interface Input {
  name: string;
  values: readonly Value[];
}

export function evaluateSweep(expr: Expr, env: SweepEnv): TableValue {
  const e = expr as CallExpr;
  const two = e.callee === 'sweep2';
  const positional = e.args.filter((a) => !a.name);
  const named = new Map(e.args.filter((a) => a.name).map((a) => [a.name!, a]));
  for (const a of named.keys()) if (a !== 'plot') throw new SheetError('bad-argument', `${e.callee}() has no option "${a}"; it takes plot: true or false`, named.get(a)!.span);
  const lead = two ? 4 : 2;
  if (positional.length <= lead) {
    throw new SheetError('bad-argument', two ? 'sweep2() needs two inputs with their values and at least one output: sweep2(a, [..], b, [..], output, …)' : 'sweep() needs an input, its values and at least one output: sweep(U, [10, 20] m/s, output, …)', e.span);
  }
  const inputs: Input[] = [];
  for (let k = 0; k < (two ? 2 : 1); k++) inputs.push(readInput(e, positional[2 * k]!.value, positional[2 * k + 1]!.value, env));
  if (two && inputs[0]!.name === inputs[1]!.name) throw new SheetError('bad-argument', `sweep2() sweeps ${inputs[0]!.name} twice; give two different inputs`, e.span);
  const outputs = positional.slice(lead).map((a) => a.value);
  const plot = named.has('plot') ? evaluate(named.get('plot')!.value, env.scope) : bool(false);
  if (plot.kind !== 'bool') throw new SheetError('type', `plot: must be true or false, not ${describeValue(plot)}`, named.get('plot')!.span);

  const combos = two ? inputs[0]!.values.flatMap((a) => inputs[1]!.values.map((b) => [a, b])) : inputs[0]!.values.map((a) => [a]);
  if (combos.length > MAX_SWEEP_ROWS) throw new SheetError('limit', `a sweep of ${combos.length} rows is more than the ${MAX_SWEEP_ROWS} a sheet may run`, e.span);
  const wanted = new Set(outputs.flatMap(namesOf));
  const rerun = env.plan(new Set(inputs.map((i) => i.name)), wanted);
  const rows: Value[][] = [];
  const checkRows = new Map<number, Array<boolean | Diagnostic>>();
  for (const combo of combos) {
    const changes = new Map(inputs.map((inp, k) => [inp.name, combo[k]!]));
    const row = rerun.run(changes);
    rows.push([...combo, ...outputs.map((o) => outputOf(o, row, rerun))]);
    for (const [line, outcome] of row.checks) {
      const list = checkRows.get(line) ?? [];
      list.push(outcome);
      checkRows.set(line, list);
    }
  }
  const labels = combos.map((combo) => combo.map((v, k) => `${inputs[k]!.name} = ${valueWords(v)}`).join(', '));
  const warnings: string[] = [];
  const remarks = [`Each row runs again only what lies downstream of ${inputs.map((i) => i.name).join(' and ')} (${rerun.downstream.length} of the sheet's statements); everything else keeps the sheet's own value.`];
  for (const [line, outcomes] of checkRows) {
    const words = checkWords(outcomes, labels);
    const text = `the check "${env.checkLabel(line)}" (line ${line}) ${words.text}`;
    (words.allHold ? remarks : warnings).push(text);
  }
  const columns = [...inputs.map((i) => i.name), ...outputs.map(outputLabel)];
  const figures = plot.value ? plots(columns, rows, inputs.length) : [];
  return table(columns, rows, { warnings, remarks, figures });
}

function readInput(e: CallExpr, nameExpr: Expr, valuesExpr: Expr, env: SweepEnv): Input {
  if (nameExpr.type !== 'name') throw new SheetError('bad-argument', `${e.callee}() sweeps a name defined on the sheet, such as U_inf, not an expression`, nameExpr.span);
  const from = env.usedFrom(nameExpr.name);
  if (from) {
    throw new SheetError('bad-argument', `\`${nameExpr.name}\` comes from ${from}, and a sweep runs only this sheet again; define a name here from it (${nameExpr.name}_here = ${nameExpr.name}), use that downstream, and sweep it`, nameExpr.span);
  }
  if (!env.defines(nameExpr.name)) throw new SheetError('unknown-name', `${e.callee}() can only sweep a name this sheet defines; \`${nameExpr.name}\` is not one`, nameExpr.span);
  const v = evaluate(valuesExpr, env.scope);
  const values = v.kind === 'list' ? v.items : [v];
  if (values.length === 0) throw new SheetError('bad-argument', `the values of ${nameExpr.name} are an empty list`, valuesExpr.span);
  return { name: nameExpr.name, values };
}

function outputOf(o: Expr, row: RerunRow, rerun: Rerun): Value {
  try {
    return rerun.read(o, row);
  } catch (err) {
    if (!(err instanceof SheetError)) throw err;
    if (err.code === 'limit') throw err;
    // The error of the statement this output reads, rather than any of the row's.
    const cause = namesOf(o).map((n) => row.errors.get(n)).find((d) => d !== undefined);
    return str(`⚠ ${cause ? `line ${cause.line}: ${cause.message}` : err.message}`);
  }
}

/** A name or field path as the sheet writes it: wall.height, c[2].Re. */
function outputLabel(e: Expr): string {
  switch (e.type) {
    case 'name':
      return e.name;
    case 'field':
      return `${outputLabel(e.object)}.${e.field}`;
    case 'index':
      return `${outputLabel(e.object)}[…]`;
    case 'paren':
      return outputLabel(e.expr);
    default:
      return 'output';
  }
}

function namesOf(e: Expr): string[] {
  switch (e.type) {
    case 'name':
      return [e.name];
    case 'field':
      return namesOf(e.object);
    case 'index':
      return [...namesOf(e.object), ...namesOf(e.index)];
    case 'paren':
    case 'convert':
      return namesOf(e.expr);
    case 'unary':
      return namesOf(e.arg);
    case 'binary':
      return [...namesOf(e.left), ...namesOf(e.right)];
    case 'call':
      return e.args.flatMap((a) => namesOf(a.value));
    case 'list':
      return e.items.flatMap(namesOf);
    case 'compare':
      return e.operands.flatMap(namesOf);
    default:
      return [];
  }
}

/** A value in the words of a label: `U = 110 km/h`. */
export function valueWords(v: Value): string {
  if (v.kind !== 'quantity') return describeValue(v);
  const label = unitLabel(v.dims);
  const shown = v.unit && !v.unit.offset ? v.si / v.unit.factor : v.si;
  return `${numberText(shown, { digits: 4 })}${v.unit && !v.unit.offset ? ` ${v.unit.text}` : label ? ` ${label}` : ''}`;
}

/** "holds for U = 10 m/s to U = 30 m/s, fails for U = 40 m/s": runs of rows, in order. */
function checkWords(outcomes: readonly (boolean | Diagnostic)[], labels: readonly string[]): { text: string; allHold: boolean } {
  const state = (o: boolean | Diagnostic) => (o === true ? 'holds' : o === false ? 'fails' : 'cannot run');
  if (outcomes.every((o) => o === true)) return { text: `holds in every row (${labels.length})`, allHold: true };
  const runs: Array<{ state: string; from: number; to: number }> = [];
  outcomes.forEach((o, i) => {
    const s = state(o);
    const last = runs[runs.length - 1];
    if (last && last.state === s) last.to = i;
    else runs.push({ state: s, from: i, to: i });
  });
  const at = (r: { from: number; to: number }) => (r.from === r.to ? `at ${labels[r.from]}` : `from ${labels[r.from]} to ${labels[r.to]}`);
  return { text: runs.map((r) => `${r.state} ${at(r)}`).join('; '), allHold: false };
}

/** One plot per numeric output against the first input (a line per value of the second, in sweep2). */
function plots(columns: readonly string[], rows: readonly (readonly Value[])[], inputCount: number): FigureValue[] {
  const out: FigureValue[] = [];
  const x = (row: readonly Value[]) => row[0]!;
  if (!rows.every((r) => x(r).kind === 'quantity')) return out;
  for (let c = inputCount; c < columns.length; c++) {
    if (!rows.every((r) => r[c]!.kind === 'quantity')) continue;
    const xAxis = axisUnit(rows.map((r) => x(r) as Quantity));
    const yAxis = axisUnit(rows.map((r) => r[c] as Quantity));
    const groups = new Map<string, Array<readonly [number, number]>>();
    for (const r of rows) {
      const key = inputCount === 2 ? `${columns[1]} = ${valueWords(r[1]!)}` : columns[c]!;
      const list = groups.get(key) ?? [];
      list.push([(x(r) as Quantity).si / xAxis.factor, (r[c] as Quantity).si / yAxis.factor]);
      groups.set(key, list);
    }
    const svg = linePlot({
      title: `${columns[c]} against ${columns[0]}`,
      x: { label: `${columns[0]}${xAxis.text ? ` (${xAxis.text})` : ''}` },
      y: { label: `${columns[c]}${yAxis.text ? ` (${yAxis.text})` : ''}` },
      series: [...groups].map(([name, points]) => ({ name, points, dots: true })),
    });
    out.push(figure(svg, `${columns[c]} over the sweep`));
  }
  return out;
}

/**
 * The unit an axis reads in: the one the sheet gave the values (km/h), else
 * an engineering prefix that fits the largest (µm), else SI. Temperatures
 * and other units with an offset stay in SI (kelvin).
 */
function axisUnit(values: readonly Quantity[]): { factor: number; text: string } {
  const first = values[0]!;
  if (first.unit && !first.unit.offset && values.every((v) => v.unit?.text === first.unit!.text)) return { factor: first.unit.factor, text: first.unit.text };
  const label = unitLabel(first.dims);
  const prefix = engineeringPrefix(label, Math.max(...values.map((v) => Math.abs(v.si))));
  return prefix ? { factor: prefix.factor, text: prefix.prefix + label } : { factor: 1, text: label };
}

export type { Statement };
