// Inline `=expr` values of the prose, evaluated against the sheet's values
// after its statements. While the statement behind a name fails, an inline
// value falls back to that name's last good value and is marked stale.
// Inline values read no data files and raise no warnings (prose has nowhere
// to show them); each gets a small step budget of its own.
import { diagnostic, SheetError, type Diagnostic } from '../diagnostics.js';
import type { Registry, Value } from '../core/index.js';
import type { Expr } from '../parse/ast.js';
import { isStackOverflow } from '../parse/index.js';
import { namesUsed } from './graph.js';
import { evaluate } from './interpreter.js';
import { Budget, type Limits } from './limits.js';
import { makeScope } from './make-scope.js';
import { sameItems } from './memo.js';
import { CONSTANTS } from './scope.js';
import { unitNameClash, type DefinedName } from './unit-clash.js';

/** An inline value as parsed: the expression, or why it does not parse. */
export interface InlineExpr {
  /** Line and text: the key of its result. */
  readonly key: string;
  readonly line: number;
  readonly text: string;
  readonly expr?: Expr;
  readonly error?: Diagnostic;
}

export interface InlineResult {
  value?: Value;
  error?: Diagnostic;
  /** The value leans on a last good value of a failing statement. */
  stale: boolean;
  /** Its standard uncertainty (SI, first order) when it depends on inputs with one; NaN when it could not be propagated. */
  u?: number;
}

export interface InlineCacheEntry {
  inputs: unknown[];
  result: InlineResult;
}

export interface InlineOptions {
  registry: Registry;
  limits: Limits;
  values: ReadonlyMap<string, Value>;
  /** The last good value of a name whose statement fails now, if it had one. */
  fallback: (name: string) => Value | undefined;
  /** Where the sheet defines a name: a unit after a number must not be one. */
  defined?: DefinedName;
  /** Results of the last run, reused while the values they read are the same objects. */
  cache: Map<string, InlineCacheEntry>;
  defaults: Map<string, Value>;
}

/** Steps one inline value may take: a sum or a field, never a sweep. */
const INLINE_STEPS = 100_000;
/** Marks an input that came from the fallback, so a stale result is never reused as a current one. */
const STALE = Symbol('stale');

const namesMemo = new WeakMap<Expr, string[]>();

function namesOf(e: Expr): string[] {
  let names = namesMemo.get(e);
  if (!names) namesMemo.set(e, (names = [...new Set(namesUsed(e).map((u) => u.name))]));
  return names;
}

export function evaluateInline(items: readonly InlineExpr[], opts: InlineOptions): Map<string, InlineResult> {
  const out = new Map<string, InlineResult>();
  const seen = new Set<string>();
  for (const item of items) {
    seen.add(item.key);
    if (!item.expr) {
      out.set(item.key, { error: item.error!, stale: false });
      continue;
    }
    // Checked before the cache: defining a name can make an unchanged value read two ways.
    const clash = opts.defined && unitNameClash(item.expr, opts.defined);
    if (clash) {
      out.set(item.key, { error: diagnostic(clash, item.line), stale: false });
      continue;
    }
    const inputs: unknown[] = [];
    for (const n of namesOf(item.expr)) {
      const current = opts.values.get(n) ?? CONSTANTS.get(n);
      inputs.push(current ?? STALE, current ?? opts.fallback(n));
    }
    const hit = opts.cache.get(item.key);
    if (hit && sameItems(hit.inputs, inputs)) {
      out.set(item.key, hit.result);
      continue;
    }
    const result = evaluateOne(item.expr, item.line, opts);
    // Only values that worked are kept: an error must be reported on every run.
    if (result.value) opts.cache.set(item.key, { inputs, result });
    out.set(item.key, result);
  }
  for (const key of opts.cache.keys()) if (!seen.has(key)) opts.cache.delete(key);
  return out;
}

function evaluateOne(expr: Expr, line: number, opts: InlineOptions): InlineResult {
  let stale = false;
  const scope = makeScope({
    registry: opts.registry,
    budget: new Budget({ ...opts.limits, maxSteps: INLINE_STEPS }),
    context: {
      readData: () => {
        throw new SheetError('data-file', 'inline values cannot read data files');
      },
      warn: () => {},
    },
    defaults: opts.defaults,
    lookup: (name, span) => {
      const v = opts.values.get(name) ?? CONSTANTS.get(name);
      if (v) return v;
      const old = opts.fallback(name);
      if (!old) throw new SheetError('unknown-name', `\`${name}\` has no value (line ${span.line})`, span);
      stale = true;
      return old;
    },
  });
  try {
    const value = evaluate(expr, scope);
    return { value, stale };
  } catch (err) {
    const e = err instanceof SheetError ? err : new SheetError(isStackOverflow(err) ? 'limit' : 'internal', isStackOverflow(err) ? 'this value is nested too deeply to evaluate' : `internal fault while evaluating this value: ${String(err)}`);
    return { error: diagnostic(e, line), stale: false };
  }
}
