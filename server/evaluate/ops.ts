// Arithmetic and comparison on worksheet values. Lists work element-wise and
// broadcast a single value; unit errors are rethrown in the sheet's words.
import { SheetError } from '../diagnostics.js';
import type { BinaryOp, CompareOp, Span } from '../parse/ast.js';
import { describeValue, type BoolValue, type ListValue, type Value } from '../core/index.js';
import { add, compare, divide, multiply, negate, power, subtract, UnitError, type Quantity } from '../units/quantity.js';
import type { Budget } from './limits.js';

type QOp = (a: Quantity, b: Quantity) => Quantity;
const ARITH: Record<'+' | '-' | '*' | '/' | '^', QOp> = { '+': add, '-': subtract, '*': multiply, '/': divide, '^': power };

function wrap<T>(span: Span, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof UnitError) throw new SheetError(e.message.startsWith('cannot') ? 'unit-mismatch' : 'type', e.message, span);
    throw e;
  }
}

/** Apply f element-wise over lists, broadcasting single values. */
export function broadcast(a: Value, b: Value, span: Span, budget: Budget, f: (x: Value, y: Value) => Value): Value {
  if (a.kind === 'list' || b.kind === 'list') {
    const la = a.kind === 'list' ? a.items : null;
    const lb = b.kind === 'list' ? b.items : null;
    if (la && lb && la.length !== lb.length) {
      throw new SheetError('type', `lists of different lengths (${la.length} and ${lb.length})`, span);
    }
    const n = (la ?? lb)!.length;
    budget.spend(n, span);
    const items: Value[] = new Array(n);
    for (let i = 0; i < n; i++) items[i] = broadcast(la ? la[i]! : a, lb ? lb[i]! : b, span, budget, f);
    // Arithmetic on a sweep stays labelled by what was swept.
    const sweep = (a.kind === 'list' ? a.sweep : undefined) ?? (b.kind === 'list' ? b.sweep : undefined);
    return (sweep ? { kind: 'list', items, sweep } : { kind: 'list', items }) satisfies ListValue;
  }
  return f(a, b);
}

export function arithmetic(op: BinaryOp, a: Value, b: Value, span: Span, budget: Budget): Value {
  if (op === 'and' || op === 'or') {
    return broadcast(a, b, span, budget, (x, y) => {
      const p = truth(x, span);
      const q = truth(y, span);
      return bool(op === 'and' ? p && q : p || q);
    });
  }
  const f = ARITH[op];
  return broadcast(a, b, span, budget, (x, y) => {
    if (x.kind !== 'quantity' || y.kind !== 'quantity') {
      const bad = x.kind !== 'quantity' ? x : y;
      throw new SheetError('type', `cannot use ${describeValue(bad)} in arithmetic ("${op}")`, span);
    }
    const r = wrap(span, () => f(x, y));
    if (!Number.isFinite(r.si)) throw new SheetError('type', `the result of "${op}" is not a finite number`, span);
    return r;
  });
}

export function unaryMinus(a: Value, span: Span, budget: Budget): Value {
  return broadcast(a, a, span, budget, (x) => {
    if (x.kind !== 'quantity') throw new SheetError('type', `cannot negate ${describeValue(x)}`, span);
    return wrap(span, () => negate(x));
  });
}

export function bool(value: boolean): BoolValue {
  return { kind: 'bool', value };
}

export function truth(v: Value, span: Span): boolean {
  if (v.kind === 'bool') return v.value;
  throw new SheetError('type', `expected true or false, found ${describeValue(v)}`, span);
}

export function compareValues(op: CompareOp, a: Value, b: Value, span: Span, budget: Budget): Value {
  return broadcast(a, b, span, budget, (x, y) => {
    if (x.kind === 'string' && y.kind === 'string') {
      if (op === '==' || op === '!=') return bool((x.value === y.value) === (op === '=='));
      throw new SheetError('type', `text can only be compared with == or !=`, span);
    }
    if (x.kind === 'bool' && y.kind === 'bool' && (op === '==' || op === '!=')) return bool((x.value === y.value) === (op === '=='));
    if (x.kind !== 'quantity' || y.kind !== 'quantity') {
      throw new SheetError('type', `cannot compare ${describeValue(x)} with ${describeValue(y)}`, span);
    }
    const d = wrap(span, () => compare(x, y));
    // Equality within a relative 1e-12: 0.1 + 0.2 == 0.3 should hold.
    const scale = Math.max(Math.abs(x.si), Math.abs(y.si));
    const eq = Math.abs(d) <= 1e-12 * scale;
    switch (op) {
      case '<':
        return bool(d < 0 && !eq);
      case '<=':
        return bool(d <= 0 || eq);
      case '>':
        return bool(d > 0 && !eq);
      case '>=':
        return bool(d >= 0 || eq);
      case '==':
        return bool(eq);
      case '!=':
        return bool(!eq);
    }
  });
}
