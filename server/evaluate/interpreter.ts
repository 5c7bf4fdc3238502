// Evaluates expression trees. Worksheet text never reaches JavaScript eval:
// names resolve through the sheet's own Map, fields through record Maps, and
// calls only through the trade-function registry.
import { SheetError } from '../diagnostics.js';
import type { Expr, Span } from '../parse/ast.js';
import { describeValue, numberText, type ListValue, type Quantity, type RecordValue, type Value } from '../core/index.js';
import { convert, quantity, UnitError, withUnit } from '../units/quantity.js';
import { dimsEqual, isDimensionless } from '../units/dims.js';
import { unitLabel } from '../units/labels.js';
import { arithmetic, bool, compareValues, truth, unaryMinus } from './ops.js';
import { callTrade } from './calls.js';
import type { Budget } from './limits.js';
import type { Scope } from './scope.js';

export function evaluate(e: Expr, scope: Scope): Value {
  scope.budget.spend(1, e.span);
  switch (e.type) {
    case 'number': {
      if (!e.unit) return quantity(e.value);
      const q = withUnit(e.value, e.unit.unit);
      if (!Number.isFinite(q.si)) throw new SheetError('limit', `this number in ${e.unit.unit.text} is beyond the largest number a sheet can hold, about 1.8e308 in SI units`, e.span);
      return q;
    }
    case 'string':
      return { kind: 'string', value: e.value };
    case 'bool':
      return bool(e.value);
    case 'name':
      return scope.lookup(e.name, e.span);
    case 'paren':
      return evaluate(e.expr, scope);
    case 'unary': {
      const v = evaluate(e.arg, scope);
      if (e.op === 'not') return bool(!truth(v, e.arg.span));
      if (e.op === '+') return v;
      return unaryMinus(v, e.span, scope.budget);
    }
    case 'binary': {
      const a = evaluate(e.left, scope);
      const b = evaluate(e.right, scope);
      return arithmetic(e.op, a, b, e.span, scope.budget);
    }
    case 'compare': {
      const vals = e.operands.map((o) => evaluate(o, scope));
      let result: Value | undefined;
      e.ops.forEach((op, i) => {
        const r = compareValues(op, vals[i]!, vals[i + 1]!, e.span, scope.budget);
        result = result ? arithmetic('and', result, r, e.span, scope.budget) : r;
      });
      return result!;
    }
    case 'field':
      return fieldOf(evaluate(e.object, scope), e.field, e.span, scope.budget);
    case 'index':
      return itemOf(evaluate(e.object, scope), evaluate(e.index, scope), e);
    case 'list': {
      scope.budget.checkLength(e.items.length, e.span);
      const items = e.items.map((item) => evaluate(item, scope));
      if (!e.unit) return { kind: 'list', items };
      const unit = e.unit.unit;
      return {
        kind: 'list',
        items: items.map((v, i) => {
          if (v.kind !== 'quantity' || !isDimensionless(v.dims)) {
            throw new SheetError('type', `the unit after a list applies to plain numbers; item ${i + 1} is ${v.kind === 'quantity' ? 'a quantity with units' : describeValue(v)}`, e.items[i]!.span);
          }
          return withUnit(v.si, unit);
        }),
      };
    }
    case 'convert': {
      const v = evaluate(e.expr, scope);
      return mapItems(v, scope.budget, e.span, (x) => {
        if (x.kind !== 'quantity') throw new SheetError('type', `cannot convert ${describeValue(x)} to ${e.unit.unit.text}`, e.span);
        try {
          return convert(x, e.unit.unit);
        } catch (err) {
          if (err instanceof UnitError) throw new SheetError('unit-mismatch', err.message, e.unit.span);
          throw err;
        }
      });
    }
    case 'call':
      return callTrade(e, scope, (arg) => evaluate(arg, scope));
  }
}

export function mapItems(v: Value, budget: Budget, span: Span, f: (x: Value) => Value): Value {
  if (v.kind !== 'list') return f(v);
  budget.spend(v.items.length, span);
  const items = v.items.map((x) => mapItems(x, budget, span, f));
  // A field or a conversion of a sweep is still labelled by what was swept.
  return v.sweep ? { kind: 'list', items, sweep: v.sweep } : { kind: 'list', items };
}

function fieldOf(v: Value, field: string, span: Span, budget: Budget): Value {
  if (v.kind === 'list') return mapItems(v, budget, span, (x) => fieldOf(x, field, span, budget));
  if (v.kind !== 'record') throw new SheetError('type', `"${field}" is a field, but this is ${describeValue(v)}, not a record`, span);
  const f = (v as RecordValue).fields.get(field);
  if (!f) {
    const names = [...v.fields.keys()].join(', ');
    throw new SheetError('unknown-name', `this record has no field "${field}"; its fields are ${names}`, span);
  }
  return f.value;
}

/** An item of a list, by its place (from 1) or by the value of a swept input. */
function itemOf(v: Value, index: Value, e: Extract<Expr, { type: 'index' }>): Value {
  if (v.kind !== 'list') throw new SheetError('type', `only a list has items to pick with [ ]; this is ${describeValue(v)}`, e.span);
  if (e.by !== undefined) return itemByInput(v, e.by, index, e);
  if (index.kind !== 'quantity' || !isDimensionless(index.dims) || !Number.isInteger(index.si)) {
    throw new SheetError('type', `a list is indexed by a whole number (its items count from 1), not ${describeValue(index)}`, e.index.span);
  }
  const n = index.si;
  if (n < 1 || n > v.items.length) {
    const counting = n === 0 ? ' (items count from 1)' : '';
    throw new SheetError('type', `item ${n} is not in this list of ${v.items.length}; pick 1 to ${v.items.length}${counting}`, e.index.span);
  }
  return v.items[n - 1]!;
}

function itemByInput(v: ListValue, name: string, key: Value, e: Extract<Expr, { type: 'index' }>): Value {
  const input = v.sweep?.find((s) => s.name === name);
  if (!input) {
    const swept = v.sweep?.map((s) => s.name) ?? [];
    throw new SheetError('unknown-name', swept.length ? `this list was swept over ${swept.join(', ')}, not ${name}` : `this list is not a sweep, so it has no input ${name} to pick by; pick an item by its place, e.g. [1]`, e.span);
  }
  for (let i = 0; i < input.values.length; i++) {
    const x = input.values[i]!;
    if (x.kind === 'quantity' && key.kind === 'quantity' && dimsEqual(x.dims, key.dims) && Math.abs(x.si - key.si) <= 1e-9 * Math.max(Math.abs(x.si), Math.abs(key.si))) return v.items[i]!;
  }
  throw new SheetError('type', `no item of this sweep has ${name} = ${key.kind === 'quantity' ? quantityWords(key) : describeValue(key)}; its values are ${input.values.map((x) => (x.kind === 'quantity' ? quantityWords(x) : describeValue(x))).join(', ')}`, e.index.span);
}

function quantityWords(q: Quantity): string {
  const label = unitLabel(q.dims);
  return label ? `${numberText(q.si, { digits: 6 })} ${label}` : numberText(q.si, { digits: 6 });
}
