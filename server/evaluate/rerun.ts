// Running part of a sheet again with some inputs changed: only the
// statements downstream of the changed names are evaluated, against the
// sheet's own values for everything else. Sweeps use it (a row per value),
// and so can anything that asks how the sheet moves with an input.
import { diagnostic, SheetError, type Diagnostic } from '../diagnostics.js';
import { unknownName } from './unknown-name.js';
import type { CallContext, Registry, Value } from '../core/index.js';
import type { Expr, Statement } from '../parse/ast.js';
import { evaluate } from './interpreter.js';
import type { Budget } from './limits.js';
import { makeScope } from './make-scope.js';
import { CONSTANTS } from './scope.js';

export interface RerunEnv {
  registry: Registry;
  budget: Budget;
  defaults: Map<string, Value>;
  readData?: ((relativePath: string) => string) | undefined;
}

/** One run with changed inputs: the values it computed, and what failed. */
export interface RerunRow {
  values: Map<string, Value>;
  errors: Map<string, Diagnostic>;
  /** Each downstream check by line: held, failed, or why it could not run. */
  checks: Map<number, boolean | Diagnostic>;
  /** The names that failed in this row. */
  failed: ReadonlySet<string>;
}

export interface Rerun {
  /** The definitions downstream of the changed names, in dependency order. */
  readonly downstream: readonly Extract<Statement, { type: 'define' }>[];
  /** The checks that read any of them (or a changed name). */
  readonly checks: readonly Extract<Statement, { type: 'check' }>[];
  run(changes: ReadonlyMap<string, Value>): RerunRow;
  /** Evaluates an expression against a row's values (the sheet's for the rest). */
  read(e: Expr, row: RerunRow): Value;
}

/**
 * Plans a rerun: `order` is the sheet's definitions in dependency order,
 * `uses` the names each statement reads. Only what lies downstream of
 * `changed` (and, when `wanted` is given, upstream of something wanted) runs.
 */
export function planRerun(
  order: readonly Extract<Statement, { type: 'define' }>[],
  checks: readonly Extract<Statement, { type: 'check' }>[],
  uses: (s: Statement) => readonly string[],
  changed: ReadonlySet<string>,
  base: ReadonlyMap<string, Value>,
  env: RerunEnv,
  wanted?: ReadonlySet<string>,
  /** false: run no checks, and keep only what `wanted` needs (a Monte Carlo sample). */
  checksToo = true,
): Rerun {
  const affected = new Set(changed);
  const downstream = order.filter((s) => {
    if (changed.has(s.name)) return false;
    if (!uses(s).some((n) => affected.has(n))) return false;
    affected.add(s.name);
    return true;
  });
  let needed = downstream;
  if (wanted) {
    // Keep only what a wanted name (or a check) leans on.
    const keep = new Set(wanted);
    const relevantChecks = checksToo ? checks.filter((c) => uses(c).some((n) => affected.has(n))) : [];
    for (const c of relevantChecks) for (const n of uses(c)) keep.add(n);
    for (let i = downstream.length - 1; i >= 0; i--) {
      const s = downstream[i]!;
      if (keep.has(s.name)) for (const n of uses(s)) keep.add(n);
    }
    needed = downstream.filter((s) => keep.has(s.name));
  }
  const downChecks = checksToo ? checks.filter((c) => uses(c).some((n) => affected.has(n))) : [];
  const context: CallContext = {
    readData(path) {
      if (!env.readData) throw new SheetError('data-file', 'this sheet cannot read data files here');
      return env.readData(path);
    },
    warn() {},
  };
  /** A scope over one row's values, falling back to the sheet's; a name that failed in the row fails its readers. */
  const rowScope = (values: ReadonlyMap<string, Value>, failed: ReadonlySet<string>) =>
    makeScope({
      registry: env.registry,
      budget: env.budget,
      context,
      defaults: env.defaults,
      lookup: (name, span) => {
        if (failed.has(name)) throw new SheetError('not-evaluated', `waits on ${name}, which failed in this run`, span);
        const v = values.get(name) ?? base.get(name) ?? CONSTANTS.get(name);
        if (!v) throw unknownName(name, span, [...values.keys(), ...base.keys(), ...CONSTANTS.keys()]);
        return v;
      },
    });

  return {
    downstream: needed,
    checks: downChecks,
    run(changes) {
      const values = new Map<string, Value>(changes);
      const errors = new Map<string, Diagnostic>();
      const failed = new Set<string>();
      const scope = rowScope(values, failed);
      for (const s of needed) {
        try {
          values.set(s.name, evaluate(s.expr, scope));
        } catch (e) {
          if (!(e instanceof SheetError)) throw e;
          if (e.code === 'limit') throw e;
          failed.add(s.name);
          errors.set(s.name, diagnostic(e, s.line));
        }
      }
      const outcomes = new Map<number, boolean | Diagnostic>();
      for (const c of downChecks) {
        try {
          const v = evaluate(c.expr, scope);
          if (v.kind === 'bool') outcomes.set(c.line, v.value);
          else if (v.kind === 'list' && v.items.every((i) => i.kind === 'bool')) outcomes.set(c.line, v.items.every((i) => i.kind === 'bool' && i.value));
          else outcomes.set(c.line, diagnostic(new SheetError('type', 'a check needs a comparison or another true/false value', c.expr.span), c.line));
        } catch (e) {
          if (!(e instanceof SheetError)) throw e;
          if (e.code === 'limit') throw e;
          outcomes.set(c.line, diagnostic(e, c.line));
        }
      }
      return { values, errors, checks: outcomes, failed };
    },
    read(e, row) {
      return evaluate(e, rowScope(row.values, row.failed));
    },
  };
}
