// The pipeline for one sheet: read → parse → evaluate → render, then the
// report. It holds each stage's caches from the last run, so a save
// re-parses, re-evaluates and re-renders only what changed.
import { basename, dirname, resolve } from 'node:path';
import { createRegistry, type Registry, type Value } from '../core/index.js';
import { diagnostic, SheetError } from '../diagnostics.js';
import { DEFAULT_LIMITS, EvalCache, evaluateSheet, type InlineExpr, type Limits, type StatementResult } from '../evaluate/index.js';
import { isStatement, parseExpression, parseLine, type BrokenLine, type ParsedLine, type Statement } from '../parse/index.js';
import { dataReader, projectPath } from '../read/data-files.js';
import { splitFrontMatter } from '../read/front-matter.js';
import { normaliseNewlines, resplitParts, splitParts, type SourcePart, type SplitSheet } from '../read/parts.js';
import { inlineKey, PartRenderer } from '../render/parts.js';
import { buildReport } from './report.js';
import type { RunOptions, SheetReport } from './types.js';

export interface PipelineOptions {
  registry?: Registry;
  limits?: Limits;
}

export class SheetPipeline {
  private readonly cache = new EvalCache();
  private readonly renderer = new PartRenderer();
  /** Each name's last good value, shown (marked stale) while its statement fails. */
  private lastGood: Map<string, Value> = new Map();
  /** Parsed lines by place and text: an unchanged line is not parsed again. */
  private parsedLines = new Map<string, ParsedLine | null>();
  /** Inline expressions by line and text, parsed once. */
  private parsedInline = new Map<string, InlineExpr>();
  /** The last body text and its parts, for cheap re-splitting after an edit inside a block. */
  private last: { body: string; sheet: SplitSheet } | undefined;
  private readonly registry: Registry;
  private readonly limits: Limits;

  constructor(opts: PipelineOptions = {}) {
    this.registry = opts.registry ?? sharedRegistry();
    this.limits = opts.limits ?? DEFAULT_LIMITS;
  }

  run(text: string, opts: RunOptions = {}): SheetReport {
    const t0 = performance.now();
    const path = opts.path ? resolve(opts.path) : undefined;
    const sheetDir = path ? dirname(path) : resolve(opts.root ?? '.');
    const root = resolve(opts.root ?? sheetDir);

    // read
    const { meta, body, problem } = splitFrontMatter(normaliseNewlines(text));
    const sheet = this.last ? resplitParts(this.last.body, this.last.sheet, body) : splitParts(body);
    this.last = { body, sheet };

    // parse
    const blocks = this.parseBlocks(sheet.parts);
    const statements: Statement[] = [];
    const broken: BrokenLine[] = [];
    for (const items of blocks) for (const item of items) (isStatement(item) ? statements : broken).push(item as never);
    const failedNames = new Map<string, number>();
    for (const d of broken) if (d.name) failedNames.set(d.name, d.line);
    const inline = this.parseInline(sheet.parts);

    // evaluate
    let reader: ((p: string) => string) | undefined;
    const readData = (p: string) => (reader ??= dataReader(root, sheetDir))(p);
    const fallback = this.lastGood;
    const evaluation = evaluateSheet(statements, { registry: this.registry, limits: this.limits, readData, cache: this.cache, failedNames, inline, fallback });
    this.lastGood = lastGoodValues(evaluation.results, failedNames.keys(), this.lastGood);

    // render
    const sig = sigfigs(meta.sigfigs);
    const results = new Map(evaluation.results.map((r) => [r.stmt.line, r]));
    // A run for values only (eval, check) renders no parts, and so never loads KaTeX.
    const parts = opts.render === false ? [] : this.renderer.render({ sheet, blocks, results, inline: evaluation.inline, view: { sig, values: evaluation.values, lastGood: this.lastGood } });

    return buildReport({
      title: meta.title ?? firstHeading(body) ?? (path ? basename(path, '.md') : 'Worksheet'),
      meta,
      frontMatterProblem: problem,
      broken,
      evaluation,
      inline,
      parts,
      sig,
      reads: evaluation.reads.map((p) => projectPath(root, sheetDir, p)),
      elapsedMs: performance.now() - t0,
    });
  }

  private parseBlocks(parts: readonly SourcePart[]): ParsedLine[][] {
    const blocks: ParsedLine[][] = [];
    const seen = new Map<string, ParsedLine | null>();
    for (const part of parts) {
      if (part.kind !== 'block') continue;
      const items: ParsedLine[] = [];
      for (const l of part.lines) {
        const key = `${l.line}\u0000${l.col}\u0000${l.text}`;
        let item = this.parsedLines.get(key);
        if (item === undefined) item = parseLine(l.text, l.line, l.col);
        seen.set(key, item);
        if (item) items.push(item);
      }
      blocks.push(items);
    }
    this.parsedLines = seen;
    return blocks;
  }

  private parseInline(parts: readonly SourcePart[]): InlineExpr[] {
    const out: InlineExpr[] = [];
    const seen = new Map<string, InlineExpr>();
    for (const part of parts) {
      if (part.kind !== 'prose') continue;
      for (const s of part.inline) {
        const key = inlineKey(s.line, s.text);
        let item = this.parsedInline.get(key) ?? seen.get(key);
        if (!item) {
          try {
            item = { key, line: s.line, text: s.text, expr: parseExpression(s.text, s.line) };
          } catch (e) {
            if (!(e instanceof SheetError)) throw e;
            item = { key, line: s.line, text: s.text, error: diagnostic(e, s.line) };
          }
        }
        seen.set(key, item);
        out.push(item);
      }
    }
    this.parsedInline = seen;
    return out;
  }
}

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

function sigfigs(s: string | undefined): number {
  const n = Number(s);
  return Number.isInteger(n) && n >= 1 && n <= 15 ? n : 4;
}

function firstHeading(body: string): string | undefined {
  return /^#\s+(.+)$/m.exec(body)?.[1]?.trim();
}

let registry: Registry | undefined;
function sharedRegistry(): Registry {
  registry ??= createRegistry();
  return registry;
}
