// The pipeline for one sheet: read → parse → evaluate → render, then the
// report. It holds each stage's caches from the last run, so a save
// re-parses, re-evaluates and re-renders only what changed.
import { basename, dirname, relative, resolve, sep } from 'node:path';
import { createRegistry, nearestWord, type Registry, type Value } from '../core/index.js';
import { diagnostic, type Diagnostic } from '../diagnostics.js';
import { DEFAULT_LIMITS, EvalCache, evaluateSheet, type InlineExpr, type Limits, type StatementResult } from '../evaluate/index.js';
import { asSheetError, isStatement, isUse, parseExpression, parseLine, type BrokenLine, type ParsedLine, type Statement, type UseLine } from '../parse/index.js';
import { dataReader, projectPath } from '../read/data-files.js';
import { loadImages, type ImageCache } from '../read/images.js';
import { splitFrontMatter } from '../read/front-matter.js';
import { normaliseNewlines, resplitParts, splitParts, type FenceSlip, type SourcePart, type SplitSheet } from '../read/parts.js';
import { readDisplayUnits } from '../render/display-units.js';
import { setPreferredUnits } from '../render/numbers.js';
import { inlineKey, PartRenderer } from '../render/parts.js';
import { applyOverrides, type OverrideMemo } from './overrides.js';
import { buildReport } from './report.js';
import { resolveUses, type UsedRun } from './uses.js';
import { carriedOf, NOTHING_CARRIED } from './carried.js';
import type { Override, RunHooks, RunOptions, SheetReport } from './types.js';

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
  /** Images embedded in the prose, read again only when their file changes. */
  private readonly images: ImageCache = new Map();
  /** Inline expressions by line and text, parsed once. */
  private parsedInline = new Map<string, InlineExpr>();
  /** The last body text and its parts, for cheap re-splitting after an edit inside a block. */
  private last: { body: string; sheet: SplitSheet } | undefined;
  private readonly registry: Registry;
  private readonly limits: Limits;
  /** A pipeline for each sheet this one uses, by absolute path, so theirs stay warm too. */
  private readonly usedPipelines = new Map<string, SheetPipeline>();
  private readonly overrideMemo: OverrideMemo = new WeakMap();
  /** What the last run defined, for a sheet that uses this one. */
  private lastRun: Omit<UsedRun, 'report'> = { values: new Map(), failed: new Set(), defined: new Set(), origins: new Map(), carried: NOTHING_CARRIED };

  constructor(opts: PipelineOptions = {}) {
    this.registry = opts.registry ?? sharedRegistry();
    this.limits = opts.limits ?? DEFAULT_LIMITS;
  }

  run(text: string, opts: RunOptions = {}, hooks: RunHooks = {}): SheetReport {
    const t0 = performance.now();
    // One time budget for the whole run: evaluation stops itself at it, and
    // typesetting shows what it has not reached by then as source text.
    const deadline = Date.now() + this.limits.timeoutMs;
    const path = opts.path ? resolve(opts.path) : undefined;
    const sheetDir = path ? dirname(path) : resolve(opts.root ?? '.');
    const root = resolve(opts.root ?? sheetDir);

    // read
    const { meta, body, problem } = splitFrontMatter(normaliseNewlines(text));
    const sheet = this.last ? resplitParts(this.last.body, this.last.sheet, body) : splitParts(body);
    this.last = { body, sheet };

    // parse
    const blocks = this.parseBlocks(sheet.parts);
    const parsed: Statement[] = [];
    const broken: BrokenLine[] = [];
    const useLines: UseLine[] = [];
    for (const items of blocks) for (const item of items) (isStatement(item) ? parsed : isUse(item) ? useLines : broken).push(item as never);
    const inline = this.parseInline(sheet.parts);
    const sheetName = path ? relative(root, path).split(sep).join('/') : '';
    const set = applyOverrides(parsed, opts.overrides, sheetName, this.overrideMemo, this.registry);
    const statements = set.statements;

    // the sheets it uses, each run by a pipeline of its own
    const uses = resolveUses(useLines, { root, sheetDir, chain: opts.chain ?? (path ? [path] : []), opts, run: (abs, usedText, usedOpts) => this.runUsed(abs, usedText, usedOpts) });
    const failedNames = new Map(uses.failedNames);
    for (const d of broken) if (d.name) failedNames.set(d.name, d.line);

    // evaluate
    let reader: ((p: string) => string) | undefined;
    const readData = (p: string) => (reader ??= dataReader(root, sheetDir))(p);
    const fallback = this.lastGood;
    const progress = hooks.progress ? (line: number, done: number, total: number) => hooks.progress!({ line, done, total }) : undefined;
    const evaluation = evaluateSheet(statements, { registry: this.registry, limits: this.limits, readData, cache: this.cache, failedNames, imported: uses.imported, inline, fallback, ...(progress ? { progress } : {}) });
    this.lastGood = lastGoodValues(evaluation.results, failedNames.keys(), this.lastGood);
    markOverridden(evaluation.results, set.applied);
    const own = parsed.flatMap((x) => (x.type === 'define' ? [x.name] : []));
    const origins = new Map(uses.origins);
    for (const name of own) origins.set(name, path ?? '');
    // What the names carry is asked only by a sheet that uses this one, whose run of it always passes the chain.
    this.lastRun = { values: evaluation.values, failed: new Set([...failedNames.keys(), ...failedDefinitions(evaluation.results)]), defined: new Set([...uses.defined, ...own]), origins, carried: opts.chain ? carriedOf(evaluation, path ?? '', uses.imported, uses.uncarried) : NOTHING_CARRIED };
    // Only the sheet run first knows every sheet below it: it says which names to set are nowhere.
    const overrideErrors = [...set.errors, ...(opts.chain || opts.overridesElsewhere ? [] : unknownOverrides(opts.overrides, this.lastRun.defined))];

    const imageSources = sheet.parts.flatMap((p) => (p.kind === 'prose' ? p.images : []));
    const images = loadImages(root, sheetDir, imageSources, this.images);

    // render
    const sig = sigfigs(meta.sigfigs);
    const display = readDisplayUnits(meta.units);
    setPreferredUnits(display.units);
    const settingLine = lineOfSetting(text, 'units');
    const frontMatterProblems = [...(problem ? [problem] : []), ...display.problems.map((message) => ({ line: settingLine, message }))];
    const results = new Map(evaluation.results.map((r) => [r.stmt.line, r]));
    // A run for values only (eval, check) renders no parts, and so never loads KaTeX.
    const { parts, untypeset } =
      opts.render === false
        ? { parts: [], untypeset: 0 }
        : this.renderer.render({
            sheet,
            blocks,
            results,
            inline: evaluation.inline,
            images,
            uses: uses.views,
            view: { sig, values: evaluation.values, lastGood: this.lastGood },
            deadline,
            budgetMs: this.limits.timeoutMs,
          });
    const imageProblems = imageSources.flatMap((i) => {
      const loaded = images.get(i.src);
      return loaded && 'error' in loaded ? [{ line: i.line, message: loaded.error }] : [];
    });

    return buildReport({
      title: meta.title ?? firstHeading(body) ?? (path ? basename(path, '.md') : 'Worksheet'),
      meta,
      frontMatterProblems,
      imageProblems,
      broken,
      lineErrors: [...uses.errors, ...overrideErrors, ...sheet.fenceSlips.map(fenceSlipError)],
      evaluation,
      lastGood: this.lastGood,
      inline,
      parts,
      untypeset,
      sig,
      reads: [...new Set([...[...evaluation.reads, ...imageSources.filter((i) => !/^[a-z][a-z0-9+.-]*:|^\/\//i.test(i.src)).map((i) => i.src)].map((p) => projectPath(root, sheetDir, p)), ...uses.reads])],
      usedSheets: uses.sources,
      imported: uses.imported,
      overrides: [...set.applied, ...uses.overrides],
      overridesMatched: Object.keys(opts.overrides ?? {}).filter((n) => this.lastRun.defined.has(n)),
      elapsedMs: performance.now() - t0,
    });
  }

  private runUsed(abs: string, text: string, opts: RunOptions): UsedRun {
    let pipeline = this.usedPipelines.get(abs);
    if (!pipeline) {
      pipeline = new SheetPipeline({ registry: this.registry, limits: this.limits });
      this.usedPipelines.set(abs, pipeline);
    }
    const report = pipeline.run(text, opts);
    return { report, ...pipeline.lastRun };
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
            item = { key, line: s.line, text: s.text, error: diagnostic(asSheetError(e, { line: s.line, col: 1, end: 1 }), s.line) };
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

function failedDefinitions(results: readonly StatementResult[]): string[] {
  return results.flatMap((r) => (r.stmt.type === 'define' && (r.error || r.blockedBy || r.skipped) ? [r.stmt.name] : []));
}

/** A replaced input says so beside its value. */
function markOverridden(results: StatementResult[], applied: readonly Override[]): void {
  if (applied.length === 0) return;
  const byName = new Map(applied.map((o) => [o.name, o]));
  for (const r of results) {
    const o = r.stmt.type === 'define' ? byName.get(r.stmt.name) : undefined;
    if (o) r.warnings = [...r.warnings, `set for this run to ${o.now}; the sheet says ${o.was}`];
  }
}

/** Names given to set that no sheet of the run defines. */
function unknownOverrides(overrides: Readonly<Record<string, string>> | undefined, defined: ReadonlySet<string>): Diagnostic[] {
  return Object.keys(overrides ?? {})
    .filter((name) => !defined.has(name))
    .map((name) => {
      const near = nearestWord(name, [...defined]);
      return { code: 'unknown-name' as const, line: 1, column: 1, message: `--set ${name}: no input \`${name}\` in this sheet or the sheets it uses${near ? `; did you mean ${near}?` : ''}` };
    });
}

function sigfigs(s: string | undefined): number {
  const n = Number(s);
  return Number.isInteger(n) && n >= 1 && n <= 15 ? n : 4;
}

/** The file line of a front-matter key (1 when it cannot be found). */
function lineOfSetting(text: string, key: string): number {
  const lines = text.split('\n');
  const at = lines.findIndex((l) => new RegExp(`^${key}\\s*:`).test(l));
  return at < 0 ? 1 : at + 1;
}

function firstHeading(body: string): string | undefined {
  return /^#\s+(.+)$/m.exec(body)?.[1]?.trim();
}

let registry: Registry | undefined;
function sharedRegistry(): Registry {
  registry ??= createRegistry();
  return registry;
}

/** A code block meant as a basis block: an error, since nothing in it is evaluated. */
function fenceSlipError(slip: FenceSlip): Diagnostic {
  return {
    code: 'syntax',
    line: slip.line,
    column: slip.column,
    message: `this block's fence says \`${slip.word}\`, so it is shown as code and nothing in it is evaluated: write \`basis\` to evaluate it, or another word (such as \`text\`) to keep it as code`,
  };
}
