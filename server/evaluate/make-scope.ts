// The one way to build a Scope, for statements and inline values alike:
// names resolve through a lookup, parameter defaults are evaluated once and kept.
import { SheetError } from '../diagnostics.js';
import type { CallContext, Registry, TradeFunction, Value } from '../core/index.js';
import { parseExpression } from '../parse/index.js';
import { evaluate } from './interpreter.js';
import type { Budget } from './limits.js';
import { CONSTANTS, type Scope } from './scope.js';
import { unknownName } from './unknown-name.js';

export interface ScopeParts {
  registry: Registry;
  budget: Budget;
  context: CallContext;
  lookup: Scope['lookup'];
  /** Parameter defaults evaluated so far: they never change, so they are kept across runs. */
  defaults: Map<string, Value>;
}

export function makeScope(parts: ScopeParts): Scope {
  const scope: Scope = {
    registry: parts.registry,
    budget: parts.budget,
    context: parts.context,
    lookup: parts.lookup,
    defaultOf(fn: TradeFunction, param: string): Value {
      const key = `${fn.name}.${param}`;
      const hit = parts.defaults.get(key);
      if (hit) return hit;
      const spec = fn.params.find((p) => p.name === param)!;
      const v = evaluate(parseExpression(spec.default!), { ...scope, lookup: () => { throw new Error(`default of ${key} uses a name`); } });
      parts.defaults.set(key, v);
      return v;
    },
  };
  return scope;
}

/** Looks a name up among the sheet's values, then the constants. */
export function sheetLookup(values: ReadonlyMap<string, Value>): Scope['lookup'] {
  return (name, span) => {
    const v = values.get(name) ?? CONSTANTS.get(name);
    if (!v) throw unknownName(name, span, [...values.keys(), ...CONSTANTS.keys()]);
    return v;
  };
}
