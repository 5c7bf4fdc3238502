// Evaluates expression trees. Worksheet text never reaches JavaScript eval:
// names resolve through the sheet's own Map, fields through record Maps, and
// calls only through the trade-function registry.
import { SheetError } from '../diagnostics.js';
import type { Expr, Span } from '../parse/ast.js';
import { describeValue, type RecordValue, type Value } from '../core/index.js';
import { convert, quantity, UnitError, withUnit } from '../units/quantity.js';
import { isDimensionless } from '../units/dims.js';
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
  return { kind: 'list', items: v.items.map((x) => mapItems(x, budget, span, f)) };
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
