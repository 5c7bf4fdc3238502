// The pipeline for one sheet: read → parse → evaluate → render. A session
// keeps the last run's results, so a save re-evaluates and re-renders only
// the statements and parts whose inputs changed.
import { basename, dirname, resolve } from 'node:path';
import { SheetError, diagnostic, type Diagnostic } from './diagnostics.js';
import { createRegistry, type Registry } from './core/index.js';
import type { Value } from './core/index.js';
import { parseExpression, parseStatement, type Expr, type Statement } from './parse/index.js';
import { CONSTANTS, EvalCache, evaluateSheet, type StatementResult } from './evaluate/sheet-eval.js';
import { evaluate } from './evaluate/interpreter.js';
import { namesUsed } from './evaluate/graph.js';
import { Budget, DEFAULT_LIMITS, type Limits } from './evaluate/limits.js';
import { splitFrontMatter } from './read/front-matter.js';
import { normaliseNewlines, resegment, segment, type Segment, type Segmented } from './read/segments.js';
import { dataReader, projectPath } from './read/data-files.js';
import { statementHtml, errorHtml, isLiteral, lastGoodHtml, type StatementView } from './render/statement.js';
import { inlineValueSpans, proseHtml } from './render/prose.js';
import { summaryHtml, type SummaryItem } from './render/page.js';
import { dataAttrs, displayText, valueHtml, valueJson } from './render/values.js';
import { escapeHtml } from './render/html.js';
import type { CheckJson, ErrorJson, RenderOptions, SheetPart, SheetResult, ValueJson } from './sheet-types.js';

export interface SessionOptions {
  registry?: Registry;
  limits?: Limits;
}

interface Parsed {
  /** Per block: its statements and its unparsable lines. */
  blocks: Array<{ items: Array<Statement | Diagnostic>; fenceLine: number }>;
}

interface PartMemo {
  html: string;
  inputs: unknown[];
}

/** Everything but the standalone page, which the caller frames. */
export type SheetCore = Omit<SheetResult, 'html'> & { freshStatements?: number };

const DEFINE_HEAD = /^\s*([A-Za-z_µμ\u0370-\u03ff][A-Za-z0-9_\u0370-\u03ff]*)\s*=(?!=)/;

/** What rendering reads besides each statement's own result. */
type SheetView = StatementView & { lastGood: ReadonlyMap<string, Value> };

export class SheetSession {
  private readonly cache = new EvalCache();
  /** Each name's last good value, shown (marked stale) while its statement fails. */
  private lastGood: Map<string, Value> = new Map();
  private readonly parts = new Map<string, PartMemo>();
  /** Parsed lines by place and text: an unchanged line is not parsed again. */
  private parsedLines = new Map<string, Statement | Diagnostic | null>();
  /** The last body text and its segments, for cheap re-segmenting after an edit inside a block. */
  private lastBody: string | undefined;
  private lastSegments: Segmented | undefined;
  /** Rendered statements of the last run, by line and text. */
  private statements = new Map<string, PartMemo>();
  private readonly registry: Registry;
  private readonly limits: Limits;

  constructor(opts: SessionOptions = {}) {
    this.registry = opts.registry ?? sharedRegistry();
    this.limits = opts.limits ?? DEFAULT_LIMITS;
  }

  render(text: string, opts: RenderOptions = {}): SheetCore {
    const t0 = performance.now();
    const path = opts.path ? resolve(opts.path) : undefined;
    const sheetDir = path ? dirname(path) : resolve(opts.root ?? '.');
    const root = resolve(opts.root ?? sheetDir);
    const { meta, body, problem } = splitFrontMatter(normaliseNewlines(text));
    const sig = sigfigs(meta.sigfigs);
    const segmented = this.lastBody !== undefined && this.lastSegments ? resegment(this.lastBody, this.lastSegments, body) : segment(body);
    this.lastBody = body;
    this.lastSegments = segmented;
    const { segments, links } = segmented;

    const parsed = this.parseBlocks(segments);
    const statements: Statement[] = [];
    const parseErrors: Diagnostic[] = [];
    const failedNames = new Map<string, number>();
    for (const b of parsed.blocks) {
      for (const item of b.items) {
        if ('type' in item) statements.push(item);
        else parseErrors.push(item);
      }
    }
    for (const d of parseErrors) {
      const name = brokenName(d);
      if (name) failedNames.set(name, d.line);
    }
    let reader: ((p: string) => string) | undefined;
    const readerFor = (p: string) => {
      reader ??= dataReader(root, sheetDir);
      return reader(p);
    };
    const evaluation = evaluateSheet(statements, { registry: this.registry, limits: this.limits, readData: readerFor, cache: this.cache, failedNames });
    const byLine = new Map(evaluation.results.map((r) => [r.stmt.line, r]));
    this.lastGood = lastGoodValues(evaluation.results, failedNames.keys(), this.lastGood);
    const view: SheetView = { sig, values: evaluation.values, lastGood: this.lastGood };

    const out: SheetPart[] = [];
    const checks: CheckJson[] = [];
    const errors: ErrorJson[] = [];
    const problems: SummaryItem[] = [];
    if (problem) {
      errors.push({ line: problem.line, column: 1, message: problem.message, code: 'syntax' });
      problems.push({ line: problem.line, text: problem.message, kind: 'error' });
    }
    let blockIndex = 0;
    let inputs = 0;
    let results = 0;
    segments.forEach((seg, i) => {
      if (seg.kind === 'prose') {
        out.push({ key: `t${i}`, html: this.prose(seg, links, view, `t${i}`, errors, problems) });
        return;
      }
      const block = parsed.blocks[blockIndex++]!;
      // A block whose statements all kept their inputs keeps its HTML string
      // (cheap to compare downstream); otherwise each statement is memoised on its own.
      const inputs: unknown[] = [];
      for (const item of block.items) {
        if ('type' in item) statementInputs(byLine.get(item.line)!, view, inputs);
        else inputs.push(item.message, item.line, item.column, view.lastGood.get(brokenName(item) ?? ''));
      }
      const key = `b${i}`;
      const memo = this.parts.get(key);
      let html: string;
      if (memo && sameList(memo.inputs, inputs)) html = memo.html;
      else {
        const pieces = block.items.map((item) =>
          'type' in item
            ? this.statement(byLine.get(item.line)!, view)
            : `<div class="ws-stmt ws-broken" id="L${item.line}" data-line="${item.line}">${errorHtml(item.message, item.line, item.column, (item as Diagnostic & { source?: string }).source)}${lastGoodHtml(brokenName(item), view)}</div>`,
        );
        html = `<div class="ws-block" data-fence-line="${block.fenceLine}">${pieces.join('')}</div>`;
        this.parts.set(key, { html, inputs });
      }
      out.push({ key, html });
    });

    // Forget statements that left the sheet, now and then rather than every run.
    if (this.statements.size > 2 * statements.length + 100) {
      const live = new Set(statements.map((st) => `${st.line}\u0000${st.source}`));
      for (const k of this.statements.keys()) if (!live.has(k)) this.statements.delete(k);
    }
    for (const d of parseErrors) {
      errors.push({ line: d.line, column: d.column, message: d.message, code: d.code });
      problems.push({ line: d.line, text: d.message, kind: 'error' });
    }
    for (const r of evaluation.results) {
      if (r.error) {
        errors.push({ line: r.error.line, column: r.error.column, message: r.error.message, code: r.error.code });
        problems.push({ line: r.stmt.line, text: r.error.message, kind: 'error' });
      }
      if (r.stmt.type === 'check' && r.passed !== undefined) {
        checks.push({ line: r.stmt.line, passed: r.passed, text: r.stmt.label ?? r.stmt.source.replace(/^check\s+/, '') });
        if (!r.passed) problems.push({ line: r.stmt.line, text: `check failed: ${r.stmt.label ?? r.stmt.source}`, kind: 'fail' });
      }
      if (r.stmt.type === 'define' && r.value) {
        if (isLiteral(r.stmt.expr)) inputs++;
        else results++;
      } else if (r.stmt.type === 'expr' && r.value) results++;
    }
    errors.sort((a, b) => a.line - b.line || a.column - b.column);
    problems.sort((a, b) => a.line - b.line);
    const values: Record<string, ValueJson> = {};
    for (const [name, v] of evaluation.values) values[name] = valueJson(v, sig);
    const summary = { inputs, results, checksPassed: checks.filter((c) => c.passed).length, checksFailed: checks.filter((c) => !c.passed).length, errors: errors.length };
    const title = meta.title ?? firstHeading(body) ?? (path ? basename(path, '.md') : 'Worksheet');
    return {
      title,
      meta,
      parts: out,
      summaryHtml: summaryHtml(summary, problems),
      summary,
      values,
      checks,
      errors,
      reads: evaluation.reads.map((p) => projectPath(root, sheetDir, p)),
      elapsedMs: performance.now() - t0,
      caution: [...evaluation.values.values()].some(needsCaution) || meta.caution === 'true',
      freshStatements: evaluation.freshCount,
    } as SheetCore;
  }

  /** One statement's HTML, reused while its result and inputs are the same objects. */
  private statement(r: StatementResult, view: SheetView): string {
    const key = `${r.stmt.line}\u0000${r.stmt.source}`;
    const inputs = statementInputs(r, view, []);
    const memo = this.statements.get(key);
    if (memo && sameList(memo.inputs, inputs)) return memo.html;
    const html = `<a id="L${r.stmt.line}" class="ws-anchor"></a>${statementHtml(r, view)}`;
    this.statements.set(key, { html, inputs });
    return html;
  }

  /** Inline expressions by line and text: parsed once, with the names they read. */
  private readonly inlineParsed = new Map<string, { expr: Expr; names: string[] }>();
  /** The html of each inline value, reused while the values it reads are the same objects. */
  private readonly inlineShown = new Map<string, PartMemo>();

  private inlineExpr(key: string, text: string, line: number): { expr: Expr; names: string[] } {
    let e = this.inlineParsed.get(key);
    if (!e) {
      if (this.inlineParsed.size > 2000) this.inlineParsed.clear();
      const expr = parseExpression(text, line);
      e = { expr, names: [...new Set(namesUsed(expr).map((u) => u.name))] };
      this.inlineParsed.set(key, e);
    }
    return e;
  }

  private parseBlocks(segments: Segment[]): Parsed {
    const blocks: Parsed['blocks'] = [];
    const seen = new Map<string, Statement | Diagnostic | null>();
    for (const seg of segments) {
      if (seg.kind !== 'block') continue;
      const items: Array<Statement | Diagnostic> = [];
      for (const l of seg.lines) {
        const key = `${l.line}\u0000${l.col}\u0000${l.text}`;
        let item = this.parsedLines.get(key);
        if (item === undefined) item = parseLine(l.text, l.line, l.col);
        seen.set(key, item);
        if (item) items.push(item);
      }
      blocks.push({ items, fenceLine: seg.fenceLine });
    }
    this.parsedLines = seen;
    return { blocks };
  }

  private prose(seg: Extract<Segment, { kind: 'prose' }>, links: Parameters<typeof proseHtml>[1], view: SheetView, key: string, errors: ErrorJson[], problems: SummaryItem[]): string {
    const memo = this.parts.get(key);
    let base: string;
    if (memo && memo.inputs[0] === seg.raw) base = memo.inputs[1] as string;
    else {
      base = proseHtml(seg.tokens, links);
      this.parts.set(key, { html: base, inputs: [seg.raw, base] });
    }
    const spans = inlineValueSpans(base);
    if (spans.length === 0) return base;
    let html = base;
    for (const s of spans) {
      const line = lineOf(seg, s.expr);
      html = html.replace(s.match, () => this.inlineValue(s.expr, line, view, errors, problems));
    }
    return html;
  }

  private inlineValue(exprText: string, line: number, view: SheetView, errors: ErrorJson[], problems: SummaryItem[]): string {
    const text = exprText.trim();
    const key = `${line}\u0000${text}`;
    try {
      const { expr: e, names } = this.inlineExpr(key, text, line);
      const inputs: unknown[] = [view.sig];
      for (const n of names) {
        const current = view.values.get(n) ?? CONSTANTS.get(n);
        inputs.push(current ?? STALE, current ?? view.lastGood.get(n));
      }
      const memo = this.inlineShown.get(key);
      if (memo && sameList(memo.inputs, inputs)) return memo.html;
      let stale = false;
      const v = evaluate(e, {
        registry: this.registry,
        budget: new Budget({ ...this.limits, maxSteps: 100_000 }),
        context: { readData: () => { throw new SheetError('data-file', 'inline values cannot read data files'); }, warn: () => {} },
        lookup: (name, span) => {
          const x = view.values.get(name) ?? CONSTANTS.get(name);
          if (x) return x;
          // While the statement behind a name fails, prose keeps its last good value, marked.
          const old = view.lastGood.get(name);
          if (!old) throw new SheetError('unknown-name', `\`${name}\` has no value (line ${span.line})`, span);
          stale = true;
          return old;
        },
        defaultOf: () => { throw new SheetError('syntax', 'inline values cannot call functions with defaults'); },
      });
      const html = stale
        ? staleInlineHtml(v, view.sig)
        : v.kind === 'record' || v.kind === 'figure' || v.kind === 'table'
          ? valueHtml(text, v, view.sig)
          : `<span class="ws-inline"${dataAttrs(text, v)}>${escapeHtml(displayText(v, view.sig))}</span>`;
      if (this.inlineShown.size > 2000) this.inlineShown.clear();
      this.inlineShown.set(key, { html, inputs }); // only values that worked: errors must be reported every run
      return html;
    } catch (err) {
      if (!(err instanceof SheetError)) throw err;
      const d = diagnostic(err, line);
      errors.push({ line, column: d.column, message: d.message, code: d.code });
      problems.push({ line, text: d.message, kind: 'error' });
      return `<span class="ws-inline ws-inline-error" title="${escapeHtml(d.message)}">=${escapeHtml(exprText)} ⚠ ${escapeHtml(d.message)}</span>`;
    }
  }
}

function needsCaution(v: Value): boolean {
  if (v.kind === 'record') return v.tag === 'caution' || [...v.fields.values()].some((f) => needsCaution(f.value));
  if (v.kind === 'list') return v.items.some(needsCaution);
  return false;
}

/** What a statement's HTML depends on, appended to `out`. */
function statementInputs(r: StatementResult, view: SheetView, out: unknown[]): unknown[] {
  out.push(r.stmt.line, r.stmt.source, r.value, r.error?.message, r.error?.column, r.blockedBy, r.skipped, r.warnings.length ? r.warnings.join('\n') : '');
  for (const n of r.uses) out.push(view.values.get(n));
  if ((r.error || r.blockedBy) && r.stmt.type === 'define') out.push(view.lastGood.get(r.stmt.name));
  return out;
}

/** The name a line that does not parse was meant to define, if it says. */
function brokenName(d: Diagnostic): string | undefined {
  return (d as Diagnostic & { name?: string }).name;
}

/** Marks the memo inputs of an inline value that fell back to a last good value. */
const STALE = Symbol('stale');

/**
 * Each defined name's last good value: this run's where it has one, else the
 * one kept from earlier runs while its statement fails, waits on a failure or
 * does not parse. Names no longer defined are dropped.
 */
function lastGoodValues(results: readonly StatementResult[], unparsed: Iterable<string>, before: ReadonlyMap<string, Value>): Map<string, Value> {
  const kept = new Map<string, Value>();
  for (const name of unparsed) {
    const value = before.get(name);
    if (value) kept.set(name, value);
  }
  for (const r of results) {
    if (r.stmt.type !== 'define') continue;
    const fresh = r.value && !r.error && !r.blockedBy && !r.skipped ? r.value : undefined;
    const value = fresh ?? before.get(r.stmt.name);
    if (value) kept.set(r.stmt.name, value);
  }
  return kept;
}

function staleInlineHtml(v: Value, sig: number): string {
  return `<span class="ws-inline ws-stale-value" title="the last good value: not current while a statement it depends on fails">${escapeHtml(displayText(v, sig))} <span class="ws-stale-tag">stale</span></span>`;
}

function sameList(a: unknown[], b: unknown[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

function parseLine(text: string, line: number, col: number): Statement | Diagnostic | null {
  try {
    return parseStatement(text, line, col);
  } catch (e) {
    if (!(e instanceof SheetError)) throw e;
    const d = diagnostic(e, line) as Diagnostic & { name?: string; source?: string };
    const head = DEFINE_HEAD.exec(text);
    if (head) d.name = head[1];
    d.source = text.trim();
    return d;
  }
}

function sigfigs(s: string | undefined): number {
  const n = Number(s);
  return Number.isInteger(n) && n >= 1 && n <= 15 ? n : 4;
}

function firstHeading(body: string): string | undefined {
  return /^#\s+(.+)$/m.exec(body)?.[1]?.trim();
}

function lineOf(seg: Extract<Segment, { kind: 'prose' }>, expr: string): number {
  const idx = seg.raw.indexOf('`=' + expr);
  if (idx < 0) return seg.firstLine;
  let n = seg.firstLine;
  for (let i = 0; i < idx; i++) if (seg.raw.charCodeAt(i) === 10) n++;
  return n;
}

let registry: Registry | undefined;
function sharedRegistry(): Registry {
  registry ??= createRegistry();
  return registry;
}
