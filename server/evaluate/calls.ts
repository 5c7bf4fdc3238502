// Binds a call's arguments to a trade function's declared parameters, checks
// kinds and dimensions, fills defaults, and maps over lists given for
// quantity parameters (a speed sweep gives a list of results).
import { SheetError } from '../diagnostics.js';
import type { Expr, Span } from '../parse/ast.js';
import { ANY_DIMENSION, describeValue, nearestWord, TradeError, withDeclaredSymbols, type ListValue, type ParamSpec, type TradeFunction, type Value } from '../core/index.js';
import { parseUnit, UnitError } from '../units/quantity.js';
import { dimsEqual, isDimensionless } from '../units/dims.js';
import { unitLabel } from '../units/labels.js';
import type { Scope } from './scope.js';

type CallExpr = Extract<Expr, { type: 'call' }>;

export function callTrade(e: CallExpr, scope: Scope, evalArg: (x: Expr) => Value): Value {
  const entry = scope.registry.get(e.callee);
  if (!entry) {
    const hint = nearestWord(e.callee, scope.registry.list().map((f) => f.name));
    throw new SheetError('unknown-function', `there is no function "${e.callee}"${hint ? `; did you mean ${hint}?` : ''}`, e.calleeSpan);
  }
  const bound = bindArgs(entry, e, scope, evalArg);
  const listParam = entry.params.find((p) => p.type === 'quantity' && bound.values[p.name]?.kind === 'list');
  if (listParam) return sweep(entry, bound, e.span, scope);
  return invoke(entry, bound, e.span, scope);
}

interface Bound {
  values: Record<string, Value | undefined>;
  spans: Record<string, Span>;
}

function bindArgs(entry: TradeFunction, e: CallExpr, scope: Scope, evalArg: (x: Expr) => Value): Bound {
  const values: Record<string, Value | undefined> = Object.create(null);
  const spans: Record<string, Span> = Object.create(null);
  const names = entry.params.map((p) => p.name);
  const positional = e.args.filter((a) => !a.name);
  // A lone catch-all parameter (min, max) gathers any number of positional values.
  if (entry.params.length === 1 && entry.params[0]!.type === 'any' && positional.length > 1) {
    const p = entry.params[0]!;
    values[p.name] = { kind: 'list', items: positional.map((a) => evalArg(a.value)) };
    spans[p.name] = e.span;
    return { values, spans };
  }
  e.args.forEach((a, i) => {
    let name: string;
    if (a.name) {
      if (!names.includes(a.name)) {
        const hint = nearestWord(a.name, names);
        throw new SheetError('bad-argument', `${entry.name}() has no parameter "${a.name}"${hint ? ` (did you mean ${hint}?)` : ''}; it takes ${names.join(', ')}`, a.span);
      }
      name = a.name;
    } else {
      if (i >= names.length) throw new SheetError('bad-argument', `${entry.name}() takes at most ${names.length} arguments (${names.join(', ')})`, a.span);
      name = names[i]!;
    }
    if (name in values) throw new SheetError('bad-argument', `${name} is given twice in the call to ${entry.name}()`, a.span);
    values[name] = evalArg(a.value);
    spans[name] = a.span;
  });
  for (const p of entry.params) {
    if (values[p.name] !== undefined) {
      checkParam(entry, p, values[p.name]!, spans[p.name]!);
      continue;
    }
    if (p.default !== undefined) values[p.name] = scope.defaultOf(entry, p.name);
    else if (!p.optional) {
      throw new SheetError('bad-argument', `${entry.name}() needs ${p.name}: ${p.doc}${p.unit && p.unit !== '1' && p.unit !== ANY_DIMENSION ? ` (in ${p.unit})` : ''}`, e.span);
    }
  }
  return { values, spans };
}

function describeDims(unit: string): string {
  const u = parseUnit(unit);
  return isDimensionless(u.dims) ? 'a plain number' : `in ${unitLabel(u.dims)}`;
}

function checkQuantity(entry: TradeFunction, p: ParamSpec, v: Value, span: Span): void {
  if (v.kind === 'list') {
    v.items.forEach((item) => checkQuantity(entry, p, item, span));
    return;
  }
  if (v.kind !== 'quantity') throw new SheetError('type', `${p.name} of ${entry.name}() must be a number, not ${describeValue(v)}`, span);
  if (p.unit === ANY_DIMENSION) return;
  if (p.unit === undefined) throw new SheetError('internal', `${entry.name}() declares no dimension for ${p.name}`, span);
  const want = parseUnit(p.unit);
  if (!dimsEqual(want.dims, v.dims)) {
    throw new SheetError('unit-mismatch', `${p.name} of ${entry.name}() must be ${describeDims(p.unit)} (${p.doc}), not ${describeValue(v)}`, span);
  }
}

function checkParam(entry: TradeFunction, p: ParamSpec, v: Value, span: Span): void {
  switch (p.type) {
    case 'quantity':
      return checkQuantity(entry, p, v, span);
    case 'string':
      if (v.kind !== 'string') throw new SheetError('type', `${p.name} of ${entry.name}() must be text in double quotes, not ${describeValue(v)}`, span);
      if (p.choices && !p.choices.includes(v.value)) {
        throw new SheetError('bad-argument', `${p.name} of ${entry.name}() must be one of ${p.choices.map((c) => `"${c}"`).join(', ')}, not "${v.value}"`, span);
      }
      return;
    case 'bool':
      if (v.kind !== 'bool') throw new SheetError('type', `${p.name} of ${entry.name}() must be true or false, not ${describeValue(v)}`, span);
      return;
    case 'record':
      if (v.kind !== 'record') throw new SheetError('type', `${p.name} of ${entry.name}() must be a record, not ${describeValue(v)}`, span);
      return;
    case 'fluid':
      if (v.kind !== 'record' || !v.fields.has('rho') || !(v.fields.has('mu') || v.fields.has('nu'))) {
        throw new SheetError('type', `${p.name} of ${entry.name}() must be a fluid: a record with rho and mu, such as air(T: 15 degC) or fluid(rho, mu)`, span);
      }
      return;
    case 'list':
      if (v.kind !== 'list' && v.kind !== 'quantity') throw new SheetError('type', `${p.name} of ${entry.name}() must be a list, not ${describeValue(v)}`, span);
      if (p.unit) checkQuantity(entry, p, v, span);
      return;
    case 'any':
      return;
  }
}

function invoke(entry: TradeFunction, bound: Bound, span: Span, scope: Scope): Value {
  scope.budget.spend(10, span);
  try {
    const v = entry.compute(bound.values, scope.context);
    return entry.fields && v.kind === 'record' ? withDeclaredSymbols(v, entry.fields, entry.name) : v;
  } catch (err) {
    if (err instanceof SheetError) throw err.span ? err : new (err.constructor as typeof SheetError)(err.code, err.message, span);
    if (err instanceof TradeError) {
      const named = err.message.startsWith(`${entry.name}(`) ? err.message : `${entry.name}(): ${err.message}`;
      throw new SheetError('bad-argument', named, span);
    }
    if (err instanceof UnitError) throw new SheetError('unit-mismatch', `${entry.name}(): ${err.message}`, span);
    const msg = err instanceof Error ? err.message : String(err);
    throw new SheetError('internal', `internal fault in ${entry.name}(): ${msg}`, span);
  }
}

function sweep(entry: TradeFunction, bound: Bound, span: Span, scope: Scope): Value {
  const listed = entry.params.filter((p) => p.type === 'quantity' && bound.values[p.name]?.kind === 'list');
  const lengths = new Set(listed.map((p) => (bound.values[p.name] as ListValue).items.length));
  if (lengths.size > 1) throw new SheetError('type', `lists given to ${entry.name}() have different lengths`, span);
  const n = [...lengths][0]!;
  scope.budget.checkLength(n, span);
  const items: Value[] = [];
  for (let i = 0; i < n; i++) {
    const values = { ...bound.values };
    for (const p of listed) values[p.name] = (bound.values[p.name] as ListValue).items[i];
    items.push(invoke(entry, { values, spans: bound.spans }, span, scope));
  }
  return { kind: 'list', items, sweep: listed.map((p) => ({ name: p.name, values: (bound.values[p.name] as ListValue).items })) };
}
