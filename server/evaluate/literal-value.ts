// The value of a literal on its own (`30 m/s`, `[1, 2] m`, `"log"`), outside
// any sheet: for comparing what a run was given with what the sheet says.
import type { Registry, Value } from '../core/index.js';
import { SheetError } from '../diagnostics.js';
import type { Expr } from '../parse/ast.js';
import { evaluate } from './interpreter.js';
import { Budget, DEFAULT_LIMITS } from './limits.js';
import { makeScope } from './make-scope.js';

export function literalValue(e: Expr, registry: Registry): Value {
  const scope = makeScope({
    registry,
    budget: new Budget(DEFAULT_LIMITS),
    context: { readData: () => { throw new SheetError('data-file', 'a literal reads no data file'); }, warn() {} },
    lookup: (name, span) => { throw new SheetError('unknown-name', `a value names nothing, and \`${name}\` is a name`, span); },
    defaults: new Map(),
  });
  return evaluate(e, scope);
}
