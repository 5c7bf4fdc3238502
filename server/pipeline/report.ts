// The report of one run, assembled from what the stages produced: checks,
// errors, the summary and the values as JSON. A pure function of its input.
import type { Value } from '../core/index.js';
import type { InlineExpr, SheetEvaluation } from '../evaluate/index.js';
import { isLiteral, literalArguments, literalText, type BrokenLine, type Statement } from '../parse/index.js';
import { sheetHeaderHtml, summaryHtml, type SummaryItem } from '../render/page.js';
import type { SheetPart } from '../render/parts.js';
import { comparedValuesText } from '../render/compared-values.js';
import { valueJson, withUncertainty, type ValueJson } from '../render/value-json.js';
import type { ArgumentJson, CheckJson, ErrorJson, InputJson, Override, SheetReport } from './types.js';
import type { Diagnostic } from '../diagnostics.js';
import { dimsEqual, type Dims } from '../units/dims.js';

export interface ReportInput {
  title: string;
  meta: Record<string, string>;
  /** Problems reading the front matter or the settings in it. */
  frontMatterProblems: readonly { line: number; message: string }[];
  /** Images that could not be embedded. */
  imageProblems: readonly { line: number; message: string }[];
  broken: readonly BrokenLine[];
  /** Errors found before evaluation on other lines: uses that failed, inputs that could not be set. */
  lineErrors: readonly Diagnostic[];
  evaluation: SheetEvaluation;
  /** The last good values of the live page, shown stale beside lines that fail now. */
  lastGood?: ReadonlyMap<string, Value>;
  inline: readonly InlineExpr[];
  parts: SheetPart[];
  /** Statements and prose parts the time budget left untypeset. */
  untypeset: number;
  sig: number;
  /** Data files read, relative to the project root. */
  reads: string[];
  /** The sheets it uses, with their texts. */
  usedSheets: Array<{ path: string; text: string }>;
  /** Values brought in from them, listed with the sheet's own values. */
  imported: ReadonlyMap<string, { value: Value; from: string; spread?: { u: number } }>;
  overrides: Override[];
  overridesMatched: string[];
  elapsedMs: number;
}

export function buildReport(input: ReportInput): SheetReport {
  const { evaluation } = input;
  const checks: CheckJson[] = [];
  const errors: ErrorJson[] = [];
  const problems: SummaryItem[] = [];
  const error = (line: number, column: number, message: string, code: string, problemLine = line) => {
    errors.push({ line, column, message, code });
    problems.push({ line: problemLine, text: message, kind: 'error' });
  };
  for (const p of input.frontMatterProblems) error(p.line, 1, p.message, 'syntax');
  for (const d of [...input.broken, ...input.lineErrors]) error(d.line, d.column, d.message, d.code);
  for (const p of input.imageProblems) error(p.line, 1, p.message, 'data-file');
  let inputs = 0;
  let results = 0;
  let checksNotRun = 0;
  for (const r of evaluation.results) {
    if (r.error) error(r.error.line, r.error.column, r.error.message, r.error.code, r.stmt.line);
    if (r.stmt.type === 'check' && r.passed === undefined) checksNotRun++;
    if (r.stmt.type === 'check' && r.passed !== undefined) {
      const compared = r.passed ? undefined : comparedValuesText(r.stmt.expr, evaluation.values, input.sig);
      const check: CheckJson = { line: r.stmt.line, passed: r.passed, text: r.stmt.label ?? r.stmt.source.replace(/^check\s+/, ''), ...(compared ? { compared } : {}) };
      checks.push(r.range ? { ...check, range: { holds: r.range.holds, text: r.range.text } } : check);
      if (!r.passed) problems.push({ line: r.stmt.line, text: `check failed: ${r.stmt.label ?? r.stmt.source}${compared ? ` (${compared})` : ''}`, kind: 'fail' });
      else if (r.range && !r.range.holds) problems.push({ line: r.stmt.line, text: `${r.stmt.label ?? r.stmt.source}: ${r.range.text}`, kind: 'range' });
    }
    if (r.stmt.type === 'define' && r.value) {
      if (isLiteral(r.stmt.expr)) inputs++;
      else results++;
    } else if (r.stmt.type === 'expr' && r.value) results++;
  }
  for (const item of input.inline) {
    const e = evaluation.inline.get(item.key)?.error;
    if (e) error(item.line, e.column, e.message, e.code);
  }
  errors.sort((a, b) => a.line - b.line || a.column - b.column);
  problems.sort((a, b) => a.line - b.line);
  const values: Record<string, ValueJson> = {};
  for (const [name, { value, from, spread }] of input.imported) values[name] = { ...withUncertainty(valueJson(value, input.sig), spread, value, input.sig), from };
  const inputsList: InputJson[] = [];
  const args: ArgumentJson[] = [];
  for (const r of evaluation.results) {
    const name = r.stmt.type === 'define' ? r.stmt.name : '';
    for (const a of literalArguments(r.stmt.expr)) args.push({ line: r.stmt.line, name, ...a });
    if (r.stmt.type !== 'define') continue;
    const v = evaluation.values.get(r.stmt.name);
    if (!v) continue;
    values[r.stmt.name] = withUncertainty(withNotes(valueJson(v, input.sig), r.warnings), r.propagated, v, input.sig);
    const text = isLiteral(r.stmt.expr) ? literalText(r.stmt.expr) : undefined;
    if (text !== undefined) inputsList.push({ name: r.stmt.name, line: r.stmt.line, text, value: values[r.stmt.name]! });
  }
  const summary = {
    inputs,
    used: input.imported.size,
    results,
    checksPassed: checks.filter((c) => c.passed).length,
    checksFailed: checks.filter((c) => !c.passed).length,
    checksNotRun,
    errors: errors.length,
  };
  // A bare expression's result counts as much as a named one: `abl(...)` alone on a line still gives wind loads.
  // While a line is broken, what it computed is still on the live page as a stale value: so is its caution.
  const onPage = evaluation.results.flatMap((r) => {
    const value = r.value ?? (r.stmt.type === 'define' ? input.lastGood?.get(r.stmt.name) : undefined);
    return value ? [{ stmt: r.stmt, value }] : [];
  });
  const shown = [...evaluation.values.values(), ...onPage.map((p) => p.value)];
  const caution = shown.some(needsCaution) || onPage.some(computesLoad) || input.meta.caution === 'true';
  return {
    title: input.title,
    meta: input.meta,
    headerHtml: sheetHeaderHtml(input.title, input.meta, caution, input.overrides),
    parts: input.parts,
    summaryHtml: summaryHtml(summary, problems, input.untypeset ? [untypesetNote(input.untypeset)] : []),
    summary,
    values,
    inputs: inputsList,
    arguments: args,
    checks,
    errors,
    reads: input.reads,
    elapsedMs: input.elapsedMs,
    caution,
    freshStatements: evaluation.freshCount,
    untypeset: input.untypeset,
    usedSheets: input.usedSheets,
    overrides: input.overrides,
    overridesMatched: input.overridesMatched,
  };
}

/** A value's JSON with the warnings its statement raised (a record's own are in its JSON already). */
function withNotes(json: ValueJson, warnings: readonly string[]): ValueJson {
  return warnings.length ? { ...json, warnings: [...(json.warnings ?? []), ...warnings] } : json;
}

function untypesetNote(n: number): string {
  const what = n === 1 ? 'One statement or paragraph was' : `${n.toLocaleString('en')} statements and paragraphs were`;
  return `${what} not typeset within the sheet's time limit and ${n === 1 ? 'is' : 'are'} shown as source text; the values are all current.`;
}

function needsCaution(v: Value): boolean {
  if (v.kind === 'record') return v.tag === 'caution' || [...v.fields.values()].some((f) => needsCaution(f.value));
  if (v.kind === 'list') return v.items.some(needsCaution);
  return false;
}

// Force, pressure or stress, force per length, moment: what a load is measured in.
const LOAD_DIMS: readonly Dims[] = [
  [1, 1, -2, 0, 0, 0, 0],
  [1, -1, -2, 0, 0, 0, 0],
  [1, 0, -2, 0, 0, 0, 0],
  [1, 2, -2, 0, 0, 0, 0],
];

/**
 * A result the sheet computes in the units of a load (`q = dynamic_pressure(U, a)`,
 * `F = q * A`) calls for the planning caution as a tagged record does. Inputs typed
 * as numbers (an ambient pressure) and fields inside records (a fluid's p) do not.
 */
function computesLoad({ stmt, value }: { stmt: Statement; value: Value }): boolean {
  if ((stmt.type === 'define' && isLiteral(stmt.expr)) || stmt.type === 'check') return false;
  const items = value.kind === 'list' ? value.items : [value];
  return items.some((v) => v.kind === 'quantity' && LOAD_DIMS.some((d) => dimsEqual(d, v.dims)));
}
