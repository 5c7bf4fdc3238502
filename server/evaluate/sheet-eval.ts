// Evaluates a sheet's statements in dependency order, reusing the previous
// run's result for every statement whose text and inputs are unchanged.
import { SheetError, type Diagnostic, diagnostic } from '../diagnostics.js';
import type { Statement } from '../parse/ast.js';
import { isStackOverflow } from '../parse/index.js';
import type { CallContext, Registry, Value } from '../core/index.js';
import { evaluate } from './interpreter.js';
import { namesUsed, orderDefinitions, type NameUse } from './graph.js';
import { evaluateInline, type InlineCacheEntry, type InlineExpr, type InlineResult } from './inline.js';
import { Budget, BudgetError, DEFAULT_LIMITS, type Limits } from './limits.js';
import { unknownName } from './unknown-name.js';
import { makeScope, sheetLookup } from './make-scope.js';
import { sameItems } from './memo.js';
import { CONSTANTS, type Scope } from './scope.js';
import { planRerun } from './rerun.js';
import { evaluateSweep, isSweep, type SweepEnv } from './sweep.js';
import { unitNameClash, type DefinedName } from './unit-clash.js';
import { checkOverRange, type RangeVerdict } from './corners.js';
import { expressionSpread, firstOrder, inputRows, readUncertainty, type InputRows, type CarriedSpread, type Propagated, type UncertainInput } from './uncertainty.js';
import { evaluateUncertaintyForm, isUncertaintyForm, type UncertaintyEnv } from './uncertainty-forms.js';

export interface StatementResult {
  readonly stmt: Statement;
  value?: Value;
  /** For checks: whether it held. */
  passed?: boolean;
  error?: Diagnostic;
  /** Set when not evaluated because an input failed: the failed name. */
  blockedBy?: string;
  /** The line of the statement behind blockedBy. */
  blockedLine?: number;
  /** Set when not evaluated because the sheet hit a limit earlier: why. */
  skipped?: string;
  warnings: string[];
  /** Names the statement reads, in order of appearance. */
  readonly uses: readonly string[];
  /** Whether this run computed it afresh (false: reused from the last run). */
  fresh: boolean;
  /** A result's standard uncertainty from the inputs' (first order), with its budget. */
  propagated?: Propagated;
  /** An input's own uncertainty. */
  uncertain?: UncertainInput;
  /** A check that depends on uncertain inputs: whether it also holds over their ±2u range. */
  range?: RangeVerdict;
}

/** A name brought in from another sheet, read-only here; with a spread it is one of this sheet's uncertain inputs. */
export interface ImportedValue {
  value: Value;
  /** The line of the use. */
  line: number;
  /** The sheet it comes from, as the use line names it. */
  from: string;
  spread?: CarriedSpread;
}

export interface EvalOptions {
  registry: Registry;
  limits?: Limits;
  /** Reads a data file relative to the project; throws SheetError('data-file') when it may not. */
  readData?: (relativePath: string) => string;
  cache?: EvalCache;
  /** Names whose definition line could not be parsed, with that line: their users are blocked. */
  failedNames?: ReadonlyMap<string, number>;
  /** Names brought in from other sheets (`use`), read-only, with the line of the use and the sheet they come from. */
  imported?: ReadonlyMap<string, ImportedValue>;
  /** Inline `=expr` values of the prose, evaluated after the statements. */
  inline?: readonly InlineExpr[];
  /** Last good values of names that fail now: inline values fall back to them, marked stale. */
  fallback?: ReadonlyMap<string, Value>;
  /** Told how far a long statement (a Monte Carlo run) has come. */
  progress?: (line: number, done: number, total: number) => void;
}

interface CacheEntry {
  inputs: unknown[];
  value?: Value;
  error?: SheetError;
  warnings: string[];
  reads: Array<{ path: string; text: string }>;
}

/** Results of earlier runs, keyed by statement text; one per sheet. */
export class EvalCache {
  entries = new Map<string, CacheEntry>();
  /** Parameter defaults: evaluated once, they never change. */
  readonly defaults = new Map<string, Value>();
  /** Dependency order of the last run's statements. */
  order?: { statements: readonly Statement[]; order: string[]; cycles: Map<string, string[]> };
  /** Inline values of the last run, by line and text. */
  inline = new Map<string, InlineCacheEntry>();
  /** Inline values given their uncertainty in the last run, so an unchanged one stays the same object. */
  inlineSpreads = new Map<string, { base: InlineResult; out: InlineResult }>();
  /** The last first-order propagation and check ranges, with what they were computed from. */
  uncertainty?: {
    inputs: unknown[];
    propagated: Map<string, Propagated>;
    ranges: Map<number, { nominal: boolean; source: string; verdict: RangeVerdict }>;
    /** The sheet run again at x ± u(x), by input: first order computes them, inline values read them again. */
    rows: Map<string, InputRows>;
  };
}

export interface SheetEvaluation {
  results: StatementResult[];
  values: Map<string, Value>;
  /** Data files read (relative paths). */
  reads: string[];
  /** Statements computed afresh in this run. */
  freshCount: number;
  /** Inline values by key (line and text). */
  inline: Map<string, InlineResult>;
  /** Standard uncertainties of the results, by name (first order). */
  propagated: Map<string, Propagated>;
  /** The inputs that carry an uncertainty. */
  uncertain: UncertainInput[];
}

export function evaluateSheet(statements: readonly Statement[], opts: EvalOptions): SheetEvaluation {
  const cache = opts.cache ?? new EvalCache();
  const budget = new Budget(opts.limits ?? DEFAULT_LIMITS);
  const results = statements.map<StatementResult>((stmt) => ({ stmt, warnings: [], uses: usesOf(stmt), fresh: false }));
  const defs = new Map<string, StatementResult>();
  const imported = opts.imported ?? new Map<string, ImportedValue>();
  for (const r of results) {
    if (r.stmt.type !== 'define') continue;
    const from = imported.get(r.stmt.name);
    if (from) {
      r.error = {
        ...diagnostic(new SheetError('redefined', `"${r.stmt.name}" comes from ${from.from} (used on line ${from.line}) and is read-only here; give this one another name`, r.stmt.nameSpan), r.stmt.line),
        related: [from.line],
      };
      continue;
    }
    const first = defs.get(r.stmt.name);
    if (first) {
      r.error = {
        ...diagnostic(new SheetError('redefined', `"${r.stmt.name}" is already defined on line ${first.stmt.line}; a name is defined once`, r.stmt.nameSpan), r.stmt.line),
        related: [first.stmt.line],
      };
      continue;
    }
    defs.set(r.stmt.name, r);
  }

  // The order depends only on the statements: when the parse cache hands back
  // the very same statements, the last run's order still holds.
  let ordered = cache.order;
  if (!ordered || !sameStructure(ordered.statements, statements)) {
    const deps = new Map([...defs].map(([n, r]) => [n, r.uses]));
    ordered = { statements, ...orderDefinitions(new Map([...defs].map(([n, r]) => [n, r.stmt])), deps) };
    cache.order = ordered;
  }
  const { order, cycles } = ordered;
  for (const [name, cycle] of cycles) {
    const r = defs.get(name)!;
    const stmt = r.stmt as Extract<Statement, { type: 'define' }>;
    r.error = diagnostic(new SheetError('cycle', `these definitions depend on each other in a circle: ${cycle.join(' → ')}`, stmt.nameSpan), stmt.line);
  }

  const values = new Map<string, Value>();
  const failed = new Map<string, string>(); // name → root cause name
  const broken = opts.failedNames ?? new Map<string, number>();
  for (const name of broken.keys()) if (!defs.has(name)) failed.set(name, name);
  for (const [name, { value }] of imported) values.set(name, value);
  const reads = new Set<string>();
  let freshCount = 0;

  const defined: DefinedName = (name) => {
    const d = defs.get(name);
    if (d) return { line: d.stmt.line, source: d.stmt.source };
    const line = broken.get(name);
    return line === undefined ? undefined : { line };
  };
  const used = new Set<string>();
  let stopped: string | undefined;
  const run = (r: StatementResult) => {
    if (r.error) return;
    if (stopped) {
      r.skipped = stopped;
      return;
    }
    for (const u of nameUsesOf(r.stmt)) {
      if (defs.has(u.name) || CONSTANTS.has(u.name) || broken.has(u.name) || imported.has(u.name)) continue;
      r.error = diagnostic(unknownName(u.name, u.span, [...defs.keys(), ...imported.keys(), ...CONSTANTS.keys()]), r.stmt.line);
      return;
    }
    const clash = unitNameClash(r.stmt.expr, defined);
    if (clash) {
      r.error = diagnostic(clash, r.stmt.line);
      return;
    }
    const blocked = r.uses.find((n) => failed.has(n));
    if (blocked) {
      const root = failed.get(blocked)!;
      r.blockedBy = root;
      const line = defs.get(root)?.stmt.line ?? broken.get(root) ?? imported.get(root)?.line;
      if (line !== undefined) r.blockedLine = line;
      return;
    }
    const inputs: unknown[] = r.uses.map((n) => values.get(n) ?? CONSTANTS.get(n)!);
    // A sweep (or another late form) also depends on every statement it runs again: the sheet's
    // text stands for them, with their lines, since what it says of a check names the check's line.
    if (isLateForm(r.stmt.expr)) inputs.push((sheetText ??= statements.map((x) => `${x.line}:${x.source}`).join('\n')));
    const key = memoOf(r.stmt).key;
    used.add(key);
    const hit = cache.entries.get(key);
    if (hit && sameItems(hit.inputs, inputs) && readsUnchanged(hit.reads, opts.readData)) {
      if (hit.value) {
        try {
          budget.hold(heldItems(hit.value), r.stmt.expr.span);
        } catch (e) {
          r.error = diagnostic(e as SheetError, r.stmt.line);
          stopped = `the sheet stopped at the limit on line ${r.stmt.line}`;
          return;
        }
      }
      r.value = hit.value;
      // The statement may have moved since its error was found: a statement is one line, so the error is on its line now.
      if (hit.error) r.error = { ...diagnostic(hit.error, r.stmt.line), line: r.stmt.line };
      r.warnings = hit.warnings;
      hit.reads.forEach((x) => reads.add(x.path));
      return;
    }
    const entry: CacheEntry = { inputs, warnings: [], reads: [] };
    const scope = statementScope(opts, budget, values, cache, entry);
    try {
      entry.value = isSweep(r.stmt.expr)
        ? evaluateSweep(r.stmt.expr, sweepEnv(scope))
        : isUncertaintyForm(r.stmt.expr)
          ? evaluateUncertaintyForm(r.stmt.expr, uncertaintyEnv(scope, r.stmt.line))
          : evaluate(r.stmt.expr, scope);
      budget.hold(heldItems(entry.value), r.stmt.expr.span);
    } catch (e) {
      entry.value = undefined;
      entry.error = statementError(e, r.stmt);
      r.error = diagnostic(entry.error, r.stmt.line);
    }
    r.value = entry.value;
    r.warnings = entry.warnings;
    r.fresh = true;
    freshCount++;
    entry.reads.forEach((x) => reads.add(x.path));
    // The sheet's own budget depends on the whole run, not on this statement: never cache it.
    if (!(entry.error instanceof BudgetError)) cache.entries.set(key, entry);
    else stopped = `the sheet stopped at the limit on line ${r.stmt.line}`;
  };

  // Sweeps run the sheet again downstream of their inputs, so they come after
  // every other definition (and what depends on a sweep after them).
  const late = new Set<string>();
  for (const name of order) {
    const r = defs.get(name)!;
    if (isLateForm(r.stmt.expr) || r.uses.some((n) => late.has(n))) late.add(name);
  }
  const sweepOrder = order.filter((n) => !late.has(n)).map((n) => defs.get(n)!.stmt as Extract<Statement, { type: 'define' }>);
  const checkStatements = statements.filter((x): x is Extract<Statement, { type: 'check' }> => x.type === 'check');
  let sheetText: string | undefined;
  const sweepEnv = (scope: Scope): SweepEnv => ({
    scope,
    plan: (changed, wanted) => planRerun(sweepOrder, checkStatements, usesOf, changed, values, { registry: opts.registry, budget, defaults: cache.defaults, readData: opts.readData }, wanted),
    defines: (name) => defs.has(name) && !late.has(name),
    usedFrom: (name) => imported.get(name)?.from,
    checkLabel: (line) => {
      const c = checkStatements.find((x) => x.line === line);
      return c?.label ?? c?.source.replace(/^check\s+/, '') ?? '';
    },
  });

  // A name brought in with its uncertainty is an input of this sheet too.
  const uncertain: UncertainInput[] = [];
  for (const [name, { value, line, from, spread }] of imported) {
    if (spread && value.kind === 'quantity') uncertain.push({ name, line, value, u: spread.u, distribution: spread.distribution, from });
  }
  const define = (name: string) => {
    const r = defs.get(name)!;
    run(r);
    const stmt = r.stmt as Extract<Statement, { type: 'define' }>;
    if (stmt.uncertainty && r.value && !r.error) {
      try {
        r.uncertain = readUncertainty(stmt, stmt.uncertainty, r.value);
        uncertain.push(r.uncertain);
      } catch (e) {
        r.error = diagnostic(statementError(e, stmt), stmt.line);
      }
    }
    if (r.error || r.blockedBy || r.skipped) failed.set(name, r.blockedBy ?? name);
    else values.set(stmt.name, r.value!);
  };
  for (const name of order) if (!late.has(name)) define(name);
  // First order, once every input and what it feeds has its value; the late forms read it.
  let uncertaintyBasis: unknown[] | undefined;
  const plans = new Map<string, ReturnType<typeof planRerun>>();
  const movesMemo = new Map<string, ReadonlySet<string>>();
  const propagated = propagateSheet();
  const uncertaintyEnv = (scope: Scope, line: number): UncertaintyEnv => ({
    scope,
    propagated,
    inputs: uncertain,
    plan: (changed, wanted) => planRerun(sweepOrder, checkStatements, usesOf, changed, values, rerunEnv(), wanted, false),
    progress: opts.progress ? (done, total) => opts.progress!(line, done, total) : undefined,
  });
  for (const name of order) if (late.has(name)) define(name);
  for (const r of results) {
    if (r.stmt.type === 'define') continue;
    run(r);
    if (r.stmt.type === 'check' && r.value) {
      if (r.value.kind === 'bool') r.passed = r.value.value;
      else if (r.value.kind === 'list' && r.value.items.every((v) => v.kind === 'bool')) {
        r.passed = r.value.items.every((v) => v.kind === 'bool' && v.value);
      } else {
        r.error = diagnostic(new SheetError('type', 'a check needs a comparison or another true/false value', r.stmt.expr.span), r.stmt.line);
      }
    }
  }
  const ranges = checkRanges();
  for (const r of results) {
    if (r.stmt.type === 'define') {
      const p = propagated.get(r.stmt.name);
      if (p && r.value && !r.uncertain) r.propagated = p;
      if (r.value?.kind === 'list' && !stopped) {
        const name = r.stmt.name;
        const by = uncertain.filter((i) => i.name !== name && movesOf(i).has(name)).map((i) => i.name);
        if (by.length) r.warnings = [...r.warnings, listWithoutSpread(name, by)];
      }
      if (r.uncertain) r.propagated = { u: r.uncertain.u, budget: [{ input: r.uncertain.name, u: r.uncertain.u, c: 1 }] };
    } else if (r.stmt.type === 'check' && r.passed !== undefined) {
      const range = ranges.get(r.stmt.line);
      if (range) r.range = range;
    }
  }
  // Forget statements that left the sheet, so the cache follows the file.
  for (const key of cache.entries.keys()) if (!used.has(key)) cache.entries.delete(key);
  // Only names the sheet still defines have a last good value to fall back to.
  const fallback = (name: string) => (defs.has(name) || broken.has(name) ? opts.fallback?.get(name) : undefined);
  const inline = evaluateInline(opts.inline ?? [], { registry: opts.registry, limits: opts.limits ?? DEFAULT_LIMITS, values, fallback, defined, cache: cache.inline, defaults: cache.defaults });
  inlineSpreads(inline);
  return { results, values, reads: [...reads], freshCount, inline, propagated, uncertain };

  /** First-order uncertainties of the results, reused while nothing they rest on changed. */
  function propagateSheet(): Map<string, Propagated> {
    if (uncertain.length === 0 || stopped) return new Map();
    uncertaintyBasis = [statements, ...sweepOrder.map((s) => values.get(s.name)), ...uncertain.flatMap((i) => [i.name, i.value, i.u])];
    if (cache.uncertainty && sameItems(cache.uncertainty.inputs, uncertaintyBasis)) return cache.uncertainty.propagated;
    const memo = { inputs: uncertaintyBasis, propagated: new Map<string, Propagated>(), ranges: new Map(), rows: new Map<string, InputRows>() };
    cache.uncertainty = memo;
    memo.propagated = guarded(() => firstOrder(uncertain, rowsFor, values), memo.propagated);
    return memo.propagated;
  }

  /** Each check that depends on uncertain inputs, at the corners of their ±2u box. */
  function checkRanges(): Map<number, RangeVerdict> {
    const ranges = new Map<number, RangeVerdict>();
    const memo = cache.uncertainty;
    if (uncertain.length === 0 || stopped || !memo || memo.inputs !== uncertaintyBasis && !sameItems(memo.inputs, uncertaintyBasis!)) return ranges;
    for (const r of results) {
      if (r.stmt.type !== 'check' || r.passed === undefined) continue;
      const c = r.stmt;
      const key = c.line;
      const known = memo.ranges.get(key);
      if (known && known.nominal === r.passed && known.source === c.source) {
        ranges.set(key, known.verdict);
        continue;
      }
      const mine = uncertain.filter((i) => planOne(i.name).checks.includes(c));
      if (mine.length === 0) continue;
      const verdict = guarded(() => {
        const rerun = planRerun(sweepOrder, [c], usesOf, new Set(mine.map((i) => i.name)), values, rerunEnv(), new Set(usesOf(c)));
        return checkOverRange(c.line, r.passed!, mine, rerun);
      }, undefined);
      if (!verdict) break;
      memo.ranges.set(key, { nominal: r.passed, source: c.source, verdict });
      ranges.set(key, verdict);
    }
    return ranges;
  }

  /** Inline values that depend on uncertain inputs get their u, as the statements do. */
  function inlineSpreads(inline: Map<string, InlineResult>) {
    const kept = cache.inlineSpreads;
    cache.inlineSpreads = new Map();
    if (uncertain.length === 0 || stopped) return;
    for (const item of opts.inline ?? []) {
      const base = inline.get(item.key);
      if (!item.expr || !base?.value || base.stale || base.value.kind !== 'quantity') continue;
      const names = namesUsed(item.expr).map((n) => n.name);
      const u = guarded(() => expressionSpread(item.expr!, names, uncertain, movesOf, rowsFor), undefined);
      if (u === undefined) continue;
      const before = kept?.get(item.key);
      const out = before && before.base === base && Object.is(before.out.u, u) ? before.out : { ...base, u };
      cache.inlineSpreads.set(item.key, { base, out });
      inline.set(item.key, out);
    }
  }

  /** An input's rows at x ± u(x), computed once for as long as the propagation they belong to stands. */
  function rowsFor(input: UncertainInput): InputRows {
    const rows = cache.uncertainty!.rows;
    let r = rows.get(input.name);
    if (!r) rows.set(input.name, (r = inputRows(input, planOne(input.name))));
    return r;
  }

  /** The input and every name downstream of it. */
  function movesOf(input: UncertainInput): ReadonlySet<string> {
    let m = movesMemo.get(input.name);
    if (!m) movesMemo.set(input.name, (m = new Set([input.name, ...planOne(input.name).downstream.map((s) => s.name)])));
    return m;
  }

  function rerunEnv() {
    return { registry: opts.registry, budget, defaults: cache.defaults, readData: opts.readData };
  }

  function planOne(name: string) {
    let p = plans.get(name);
    if (!p) plans.set(name, (p = planRerun(sweepOrder, checkStatements, usesOf, new Set([name]), values, rerunEnv())));
    return p;
  }

  /** Past the sheet's own budget the rest of it is listed, not evaluated; the values stand without their uncertainties. */
  function guarded<T>(f: () => T, otherwise: T): T {
    try {
      return f();
    } catch (e) {
      if (!(e instanceof SheetError) || e.code !== 'limit') throw e;
      stopped = `the sheet stopped at its limit while propagating uncertainties: ${e.message}`;
      return otherwise;
    }
  }
}

/** A list carries no uncertainty: said beside it, so its items are not read as exact. */
function listWithoutSpread(name: string, inputs: readonly string[]): string {
  return `this list depends on ${inputs.length === 1 ? 'an input' : 'inputs'} with an uncertainty (${inputs.join(', ')}), but a list carries none: its items are nominal values; name an item (x = ${name}[1]) to see its uncertainty`;
}

function isLateForm(e: Statement['expr']): boolean {
  return isSweep(e) || isUncertaintyForm(e);
}

/** List items a value holds, nested lists and record fields included. */
function heldItems(v: Value): number {
  if (v.kind === 'record') {
    let n = 0;
    for (const f of v.fields.values()) n += heldItems(f.value);
    return n;
  }
  if (v.kind !== 'list') return 0;
  let n = v.items.length;
  for (const item of v.items) if (item.kind === 'list' || item.kind === 'record') n += heldItems(item);
  return n;
}

/**
 * Whatever a statement throws is that statement's error, never the sheet's:
 * running out of stack is a limit, anything else a fault of ours.
 */
export function statementError(e: unknown, stmt: Statement): SheetError {
  if (e instanceof SheetError) return e;
  const span = { line: stmt.line, col: 1, end: 1 + stmt.source.length };
  if (isStackOverflow(e)) return new SheetError('limit', 'this statement is nested too deeply to evaluate; split it into named steps', span);
  return new SheetError('internal', `internal fault while evaluating this statement: ${e instanceof Error ? e.message : String(e)}`, span);
}

// Statements are immutable and reused across runs by the pipeline's parse cache.
const usesMemo = new WeakMap<Statement, { all: NameUse[]; names: string[]; key: string }>();

function memoOf(s: Statement) {
  let m = usesMemo.get(s);
  if (!m) {
    const all = namesUsed(s.expr);
    m = { all, names: [...new Set(all.map((u) => u.name))], key: `${s.type}\u0000${s.source}` };
    usesMemo.set(s, m);
  }
  return m;
}

export function usesOf(s: Statement): string[] {
  return memoOf(s).names;
}

function nameUsesOf(s: Statement): NameUse[] {
  return memoOf(s).all;
}

/** Same definitions using the same names, in the same places: the order still holds. */
function sameStructure(a: readonly Statement[], b: readonly Statement[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) {
    const x = a[i]!;
    const y = b[i]!;
    if (x === y) continue;
    if (x.type !== y.type || (x.type === 'define' && y.type === 'define' && x.name !== y.name)) return false;
    const ux = usesOf(x);
    const uy = usesOf(y);
    if (ux.length !== uy.length || ux.some((n, k) => n !== uy[k])) return false;
  }
  return true;
}


function readsUnchanged(readsBefore: CacheEntry['reads'], readData?: (p: string) => string): boolean {
  if (readsBefore.length === 0) return true;
  if (!readData) return false;
  try {
    return readsBefore.every((r) => readData(r.path) === r.text);
  } catch {
    return false;
  }
}

function statementScope(opts: EvalOptions, budget: Budget, values: Map<string, Value>, cache: EvalCache, entry: CacheEntry) {
  const context: CallContext = {
    readData(path) {
      if (!opts.readData) throw new SheetError('data-file', 'this sheet cannot read data files here');
      const text = opts.readData(path);
      entry.reads.push({ path, text });
      return text;
    },
    warn(message) {
      entry.warnings.push(message);
    },
  };
  return makeScope({ registry: opts.registry, budget, context, lookup: sheetLookup(values), defaults: cache.defaults });
}
