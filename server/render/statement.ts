// One statement as HTML: inputs as name = value, results as formula =
// substituted values = result, checks with a pass/fail mark, errors boxed.
import type { Expr, Statement } from '../parse/ast.js';
import { isLiteral } from '../parse/literals.js';
import { isSweep } from '../evaluate/sweep.js';
import type { Value } from '../core/index.js';
import type { StatementResult } from '../evaluate/sheet-eval.js';
import { attrs, escapeHtml, noteList } from './html.js';
import { chainHtml, mathHtml } from './katex.js';
import { valueAt } from './compared-values.js';
import { exprLatex, failedComparisonLatex, valueLatex, type LatexContext } from './latex.js';
import { symbolLatex } from './symbols.js';
import { allItemsHtml, dataAttrs, displayText, FOLD_AFTER, valueHtml } from './values.js';
import { uncertaintyHtml } from './uncertainty.js';

export interface StatementView {
  sig: number;
  /** Values by name, for substituting into formulas. */
  values: ReadonlyMap<string, Value>;
  /** Last good values of names whose statements now fail (after earlier runs of the pipeline). */
  lastGood?: ReadonlyMap<string, Value>;
}

function hasNames(e: Expr): boolean {
  switch (e.type) {
    case 'name':
    case 'field':
    case 'index':
      return true;
    case 'unary':
      return hasNames(e.arg);
    case 'binary':
      return hasNames(e.left) || hasNames(e.right);
    case 'compare':
      return e.operands.some(hasNames);
    case 'call':
      return e.args.some((a) => hasNames(a.value));
    case 'list':
      return e.items.some(hasNames);
    case 'convert':
    case 'paren':
      return hasNames(e.expr);
    default:
      return false;
  }
}

function valueOfFactory(view: StatementView) {
  return (e: Expr): Value | undefined => valueAt(e, view.values);
}

/** The declared symbol of a field, read from the record (or the first record of a sweep) it belongs to. */
function fieldSymbolFactory(view: StatementView) {
  const valueOf = valueOfFactory(view);
  return (e: Extract<Expr, { type: 'field' }>): string | undefined => {
    const owner = valueOf(e.object);
    const record = owner?.kind === 'list' ? owner.items[0] : owner;
    return record?.kind === 'record' ? record.fields.get(e.field)?.symbol : undefined;
  };
}

/** The LaTeX context of a statement's symbolic form. */
function symbolicContext(view: StatementView): LatexContext {
  return { sig: view.sig, fieldSymbol: fieldSymbolFactory(view) };
}

/** Does substituting values say more than the symbols (and stay readable)? */
function substituted(e: Expr, view: StatementView): string | null {
  if (!hasNames(e) || e.type === 'name' || e.type === 'field') return null;
  // A sweep names the input it varies: its value in place of its name would say the opposite.
  if (isSweep(e)) return null;
  if (e.type === 'call' && e.args.some((a) => a.value.type === 'name' && view.values.get(a.value.name)?.kind === 'record')) return null;
  return exprLatex(e, substitutedContext(view));
}

/** The LaTeX context of a statement's substituted form: names replaced by their values. */
function substitutedContext(view: StatementView): LatexContext {
  return { ...symbolicContext(view), valueFor: valueOfFactory(view) };
}

function warningsHtml(r: StatementResult): string {
  return noteList('ws-warnings', r.warnings);
}

function descHtml(d: string | undefined): string {
  return d ? `<span class="ws-desc">${escapeHtml(d)}</span>` : '';
}

export function errorHtml(message: string, line: number, column: number, source?: string): string {
  return `<div class="ws-error" role="alert"${attrs({ 'data-line': line, 'data-column': column })}><span class="ws-where">line ${line}, column ${column}</span> <span class="ws-message">${escapeHtml(message)}</span>${source ? `<code class="ws-source">${escapeHtml(source)}</code>` : ''}</div>`;
}

/** Why a statement did not run, in one quiet line: the sheet's limit, or the failing line it waits on. */
function blockedHtml(r: StatementResult, view?: StatementView): string {
  if (r.skipped) return `<div class="ws-blocked"${attrs({ 'data-line': r.stmt.line })}>not evaluated: ${escapeHtml(r.skipped)}</div>`;
  const where = r.blockedLine !== undefined ? `, <a href="#L${r.blockedLine}">line ${r.blockedLine}</a>` : '';
  const last = view && r.stmt.type === 'define' ? waitingValueHtml(r.stmt.name, view) : '';
  return `<div class="ws-blocked"${attrs({ 'data-line': r.stmt.line })}>waiting on <code>${escapeHtml(r.blockedBy!)}</code>${where}${last}</div>`;
}

/** A waiting statement's last good value, in its quiet line (records and tables folded away). */
function waitingValueHtml(name: string, view: StatementView): string {
  const v = view.lastGood?.get(name);
  if (!v) return '';
  if (v.kind === 'record' || v.kind === 'table' || v.kind === 'figure' || (v.kind === 'list' && v.items.some((i) => i.kind === 'record'))) {
    return ` · <details class="ws-last-good-fold"><summary>last good value</summary>${staleCopy(name, v, view)}</details>`;
  }
  return ` · last good value <span class="ws-last-good-value">${escapeHtml(displayText(v, view.sig))}</span> <span class="ws-stale-tag">stale</span>`;
}

/** A value as it was, with the machine-readable values taken out: data-si means "current". */
function staleCopy(name: string, v: Value, view: StatementView): string {
  return valueHtml(name, v, view.sig).replace(/ data-(?:name|si|unit)="[^"]*"/g, '');
}

/** The value a failing statement had before, kept in view and plainly marked as not current. */
export function lastGoodHtml(name: string | undefined, view: StatementView): string {
  if (name === undefined) return '';
  const v = view.lastGood?.get(name);
  if (!v) return '';
  // Tables keep their look but lose the machine-readable values: data-si means "current".
  const shown =
    v.kind === 'record' || v.kind === 'table' || v.kind === 'figure' ? staleCopy(name, v, view) : `<span class="ws-last-good-value">${escapeHtml(displayText(v, view.sig))}</span>`;
  return `<div class="ws-last-good"><span class="ws-last-good-label">last good value, stale</span> ${shown}</div>`;
}

function resultLatexOrBlock(name: string, v: Value, view: StatementView, r?: StatementResult): { inline?: string; block?: string } {
  const tex = v.kind === 'quantity' || v.kind === 'bool' || v.kind === 'string' || v.kind === 'list' ? valueLatex(v, view.sig) : null;
  if (!tex) return { block: valueHtml(name, v, view.sig, r?.propagated?.fields) };
  // A long list is folded in the formula; every item is a click away below it.
  if (v.kind === 'list' && v.items.length > FOLD_AFTER) return { inline: tex, block: allItemsHtml(v, view.sig) };
  return { inline: tex };
}

function defineHtml(r: StatementResult & { stmt: Extract<Statement, { type: 'define' }> }, view: StatementView): string {
  const s = r.stmt;
  const sym = symbolLatex(s.name);
  const literal = isLiteral(s.expr);
  const cls = literal ? 'ws-input' : 'ws-result';
  const data = r.value && !r.error && !r.blockedBy && !r.skipped ? dataAttrs(s.name, r.value) : attrs({ 'data-name': s.name, 'data-state': r.error ? 'error' : 'not-evaluated' });
  const head = `<div class="ws-stmt ws-def ${cls}"${attrs({ 'data-line': s.line, id: `v-${s.name}` })}${data}`;
  if (r.error) {
    const formula = mathHtml(`${sym} = ${exprLatex(s.expr, symbolicContext(view))}`);
    return `${head}><div class="ws-formula">${formula}</div>${errorHtml(r.error.message, r.error.line, r.error.column, s.source)}${lastGoodHtml(s.name, view)}</div>`;
  }
  if (r.blockedBy || r.skipped) {
    return `${head}><div class="ws-formula">${mathHtml(`${sym} = ${exprLatex(s.expr, symbolicContext(view))}`)}</div>${blockedHtml(r, view)}</div>`;
  }
  const v = r.value!;
  const { inline, block } = resultLatexOrBlock(s.name, v, view, r);
  const parts: string[] = [sym];
  if (!literal || !inline) parts.push(exprLatex(s.expr, symbolicContext(view)));
  const subst = literal ? null : substituted(s.expr, view);
  if (subst && subst !== parts[parts.length - 1]) parts.push(subst);
  if (inline && (!literal || parts.length === 1)) parts.push(inline);
  const dedup = parts.filter((p, i) => i === 0 || p !== parts[i - 1]);
  // The name and its formula are one piece; substituted values and the result follow.
  const formula = chainHtml(dedup.slice(0, 2).join(' = '), dedup.slice(2));
  return `${head}><div class="ws-formula">${formula}${uncertaintyOf(r, v, view)}${descHtml(s.description)}</div>${block ?? ''}${warningsHtml(r)}</div>`;
}

/** "± 0.61 m/s (5.1 %)" beside a number that carries an uncertainty; nothing otherwise. */
function uncertaintyOf(r: StatementResult, v: Value, view: StatementView): string {
  const p = r.propagated;
  if (!p || v.kind !== 'quantity') return '';
  const distribution = r.uncertain?.distribution;
  return ` ${uncertaintyHtml(v, { u: p.u, ...(distribution ? { distribution } : {}), ...(p.problem ? { problem: p.problem } : {}) }, view.sig)}`;
}

/**
 * A check's values after its formula. A failed check is joined by "but" and
 * says what does hold: a single comparison with the negated relation
 * (`Re > 2×10⁵ but 1.8×10⁵ ≯ 2×10⁵`), a chain or a compound condition as
 * "not (…)", in plain brackets so a long one can wrap on a phone. A check over a list keeps "⟹" and its values (some items may hold).
 */
function checkValues(r: StatementResult & { stmt: Extract<Statement, { type: 'check' }> }, view: StatementView): { latex: string; joint: string } | null {
  const subst = substituted(r.stmt.expr, view);
  if (subst === null) return null;
  const implies = { latex: subst, joint: '\\quad\\Longrightarrow\\quad' };
  if (r.passed !== false || r.error || r.blockedBy || r.skipped || r.value?.kind !== 'bool') return implies;
  const refuted = failedComparisonLatex(r.stmt.expr, substitutedContext(view)) ?? `\\text{not}\\ (${subst})`;
  return { latex: refuted, joint: '\\quad\\text{but}\\quad' };
}

function checkHtml(r: StatementResult & { stmt: Extract<Statement, { type: 'check' }> }, view: StatementView): string {
  const s = r.stmt;
  const symbolic = exprLatex(s.expr, symbolicContext(view));
  const values = checkValues(r, view);
  const formula = chainHtml(symbolic, values && values.latex !== symbolic ? [values.latex] : [], values?.joint);
  const label = s.label ? `<span class="ws-label">${escapeHtml(s.label)}</span>` : '';
  if (r.error) return `<div class="ws-stmt ws-check ws-check-error"${attrs({ 'data-line': s.line })}>${formula}${label}${errorHtml(r.error.message, r.error.line, r.error.column, s.source)}</div>`;
  if (r.blockedBy || r.skipped) return `<div class="ws-stmt ws-check ws-check-blocked"${attrs({ 'data-line': s.line })}>${formula}${label}${blockedHtml(r)}</div>`;
  const pass = r.passed === true;
  const mark = pass ? '<span class="ws-mark" aria-label="passed">✓ pass</span>' : '<span class="ws-mark" aria-label="failed">✗ fail</span>';
  const range = r.range ? `<div class="ws-range ${r.range.holds ? 'holds' : 'fails'}"${attrs({ 'data-holds': String(r.range.holds) })}>over the inputs' range: ${escapeHtml(r.range.text)}</div>` : '';
  return `<div class="ws-stmt ws-check ${pass ? 'pass' : 'fail'}"${attrs({ 'data-line': s.line, 'data-passed': String(pass), 'data-range-holds': r.range ? String(r.range.holds) : undefined })}>${mark}<span class="ws-formula">${formula}</span>${label}${range}${warningsHtml(r)}</div>`;
}

function exprHtml(r: StatementResult & { stmt: Extract<Statement, { type: 'expr' }> }, view: StatementView): string {
  const s = r.stmt;
  const symbolic = exprLatex(s.expr, symbolicContext(view));
  const name = s.source;
  if (r.error) return `<div class="ws-stmt ws-expr"${attrs({ 'data-line': s.line })}>${mathHtml(symbolic)}${errorHtml(r.error.message, r.error.line, r.error.column, s.source)}</div>`;
  if (r.blockedBy || r.skipped) return `<div class="ws-stmt ws-expr"${attrs({ 'data-line': s.line })}>${mathHtml(symbolic)}${blockedHtml(r)}</div>`;
  const v = r.value!;
  const { inline, block } = resultLatexOrBlock(name, v, view);
  const subst = substituted(s.expr, view);
  const rest = [...(subst && subst !== symbolic ? [subst] : []), ...(inline && inline !== symbolic ? [inline] : [])];
  return `<div class="ws-stmt ws-expr"${attrs({ 'data-line': s.line })}${inline ? dataAttrs(name, v) : ''}><div class="ws-formula">${chainHtml(symbolic, rest)}${descHtml(s.description)}</div>${block ?? ''}${warningsHtml(r)}</div>`;
}

/**
 * A statement that was not typeset, shown as its source text with its value
 * (or error) in plain words and the reason: the sheet's time ran out before
 * its turn, or its formula nests too deeply for the typesetter.
 */
export function untypesetHtml(r: StatementResult, view: StatementView, reason: string): string {
  const s = r.stmt;
  const ok = !r.error && !r.blockedBy && !r.skipped && r.value !== undefined;
  const data = ok && s.type === 'define' ? dataAttrs(s.name, r.value!) : ok && s.type === 'expr' ? dataAttrs(s.source, r.value!) : '';
  let outcome = '';
  if (r.error) outcome = errorHtml(r.error.message, r.error.line, r.error.column);
  else if (r.blockedBy || r.skipped) outcome = blockedHtml(r);
  else if (s.type === 'check') outcome = `<span class="ws-mark">${r.passed ? '✓ pass' : '✗ fail'}</span>`;
  else if (r.value) outcome = `<span class="ws-plain-value">= ${escapeHtml(displayText(r.value, view.sig))}</span>`;
  const passed = s.type === 'check' && ok ? attrs({ 'data-passed': String(r.passed === true) }) : '';
  return `<div class="ws-stmt ws-untypeset"${attrs({ 'data-line': s.line })}${data}${passed}><code class="ws-source">${escapeHtml(s.source)}</code>${outcome}<div class="ws-untypeset-note">not typeset: ${escapeHtml(reason)}</div></div>`;
}

export function statementHtml(r: StatementResult, view: StatementView): string {
  // After a limit the rest of the sheet is listed, not typeset: typesetting is what would take the time.
  if (r.skipped) return `<div class="ws-stmt ws-skipped"${attrs({ 'data-line': r.stmt.line })}><code class="ws-source">${escapeHtml(r.stmt.source)}</code>${blockedHtml(r)}</div>`;
  switch (r.stmt.type) {
    case 'define':
      return defineHtml(r as StatementResult & { stmt: Extract<Statement, { type: 'define' }> }, view);
    case 'check':
      return checkHtml(r as StatementResult & { stmt: Extract<Statement, { type: 'check' }> }, view);
    case 'expr':
      return exprHtml(r as StatementResult & { stmt: Extract<Statement, { type: 'expr' }> }, view);
  }
}
