// The report of one run, assembled from what the stages produced: checks,
// errors, the summary and the values as JSON. A pure function of its input.
import type { Value } from '../core/index.js';
import type { InlineExpr, SheetEvaluation } from '../evaluate/index.js';
import type { BrokenLine } from '../parse/index.js';
import { isLiteral } from '../render/statement.js';
import { sheetHeaderHtml, summaryHtml, type SummaryItem } from '../render/page.js';
import type { SheetPart } from '../render/parts.js';
import { valueJson, type ValueJson } from '../render/values.js';
import type { CheckJson, ErrorJson, SheetReport } from './types.js';

export interface ReportInput {
  title: string;
  meta: Record<string, string>;
  /** A problem reading the front matter, if any. */
  frontMatterProblem?: { line: number; message: string } | undefined;
  broken: readonly BrokenLine[];
  evaluation: SheetEvaluation;
  inline: readonly InlineExpr[];
  parts: SheetPart[];
  /** Statements and prose parts the time budget left untypeset. */
  untypeset: number;
  sig: number;
  /** Data files read, relative to the project root. */
  reads: string[];
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
  if (input.frontMatterProblem) error(input.frontMatterProblem.line, 1, input.frontMatterProblem.message, 'syntax');
  for (const d of input.broken) error(d.line, d.column, d.message, d.code);
  let inputs = 0;
  let results = 0;
  for (const r of evaluation.results) {
    if (r.error) error(r.error.line, r.error.column, r.error.message, r.error.code, r.stmt.line);
    if (r.stmt.type === 'check' && r.passed !== undefined) {
      checks.push({ line: r.stmt.line, passed: r.passed, text: r.stmt.label ?? r.stmt.source.replace(/^check\s+/, '') });
      if (!r.passed) problems.push({ line: r.stmt.line, text: `check failed: ${r.stmt.label ?? r.stmt.source}`, kind: 'fail' });
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
  for (const [name, v] of evaluation.values) values[name] = valueJson(v, input.sig);
  const summary = {
    inputs,
    results,
    checksPassed: checks.filter((c) => c.passed).length,
    checksFailed: checks.filter((c) => !c.passed).length,
    errors: errors.length,
  };
  const caution = [...evaluation.values.values()].some(needsCaution) || input.meta.caution === 'true';
  return {
    title: input.title,
    meta: input.meta,
    headerHtml: sheetHeaderHtml(input.title, input.meta, caution),
    parts: input.parts,
    summaryHtml: summaryHtml(summary, problems, input.untypeset ? [untypesetNote(input.untypeset)] : []),
    summary,
    values,
    checks,
    errors,
    reads: input.reads,
    elapsedMs: input.elapsedMs,
    caution,
    freshStatements: evaluation.freshCount,
    untypeset: input.untypeset,
  };
}

/**
 * A run that left `after` of `before` statements untypeset did enough to be
 * worth another run of the same text (which goes on where it stopped). A
 * sheet too large to typeset in any run stops after one.
 */
export function typesetProgress(before: number, after: number): boolean {
  return after <= 0.9 * before;
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
