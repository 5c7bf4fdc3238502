// The page around a sheet: header with the front matter, the summary, the
// sheet's own content in one <main>, and the planning caution where due.
import { nounFor } from '../core/shared/words.js';
import { escapeHtml } from './html.js';
import type { SheetPart } from './parts.js';

export interface SheetSummary {
  inputs: number;
  /** Names brought in from other sheets by `use`: inputs too, defined elsewhere. */
  used?: number;
  results: number;
  checksPassed: number;
  checksFailed: number;
  /** Checks that could not run: their expression failed, or waits on a failure. */
  checksNotRun: number;
  errors: number;
}

export interface SummaryItem {
  line: number;
  text: string;
  /** range: a check that holds at nominal but not over its inputs' ±2u range. */
  kind: 'error' | 'fail' | 'range';
}

export function summaryHtml(s: SheetSummary, items: SummaryItem[], notes: readonly string[] = []): string {
  const state = s.errors > 0 ? 'has-errors' : s.checksFailed > 0 ? 'has-failures' : 'all-clear';
  const cell = (n: number, singular: string, plural: string, cls: string) => `<div class="ws-count ${cls}" data-count="${cls}"><span class="ws-n">${n}</span> ${escapeHtml(nounFor(n, singular, plural))}</div>`;
  const list = items.length
    ? `<ol class="ws-problems">${items.map((i) => `<li class="ws-${i.kind}"><a href="#L${i.line}">line ${i.line}</a> ${escapeHtml(i.text)}</li>`).join('')}</ol>`
    : '';
  const used = s.used ? cell(s.used, 'brought in', 'brought in', 'used') : '';
  const notRun = s.checksNotRun > 0 ? cell(s.checksNotRun, 'check not run', 'checks not run', 'not-run') : '';
  const notesHtml = notes.map((n) => `<p class="ws-summary-note">${escapeHtml(n)}</p>`).join('');
  return `<section class="ws-summary ${state}" aria-label="summary">${cell(s.inputs, 'input', 'inputs', 'inputs')}${used}${cell(s.results, 'result', 'results', 'results')}${cell(s.checksPassed, 'check passed', 'checks passed', 'passed')}${cell(s.checksFailed, 'check failed', 'checks failed', 'failed')}${notRun}${cell(s.errors, 'error', 'errors', 'errors')}${list}${notesHtml}</section>`;
}

export function headerHtml(title: string, meta: Record<string, string>): string {
  const keys = ['project', 'revision', 'author', 'date'];
  const facts = keys.filter((k) => meta[k]).map((k) => `<span class="ws-meta-item"><span class="ws-meta-key">${k}</span> ${escapeHtml(meta[k]!)}</span>`);
  return `<header class="ws-header"><h1 class="ws-title">${escapeHtml(title)}</h1>${facts.length ? `<div class="ws-meta">${facts.join('')}</div>` : ''}</header>`;
}

/** The header above a sheet, with the planning caution when the sheet needs it. */
/** An input replaced for one run, as the header lists it. */
export interface ReplacedInput {
  name: string;
  was: string;
  now: string;
  sheet: string;
}

export function sheetHeaderHtml(title: string, meta: Record<string, string>, caution: boolean, replaced: readonly ReplacedInput[] = []): string {
  return headerHtml(title, meta) + (caution ? cautionHtml() : '') + replacedHtml(replaced);
}

/** A run with inputs set from outside is not the sheet as written: the header says so first. */
function replacedHtml(replaced: readonly ReplacedInput[]): string {
  if (replaced.length === 0) return '';
  const items = replaced.map((o) => `<li><code>${escapeHtml(o.name)}</code> = ${escapeHtml(o.now)} <span class="ws-replaced-was">(${escapeHtml(o.sheet || 'the sheet')} says ${escapeHtml(o.was)})</span></li>`).join('');
  return `<aside class="ws-replaced" role="note"><p>This run does not use the sheet as written: ${replaced.length === 1 ? 'one input was' : `${replaced.length} inputs were`} set for it.</p><ul>${items}</ul></aside>`;
}

export const CAUTION =
  'Planning estimates only. Loads, pressures and anything structural must be designed to the local codes and checked by a licensed engineer.';

export function cautionHtml(): string {
  return `<aside class="ws-caution" role="note">${escapeHtml(CAUTION)}</aside>`;
}

export function partsHtml(parts: SheetPart[]): string {
  return parts.map((p) => `<div class="ws-part" data-part="${escapeHtml(p.key)}">${p.html}</div>`).join('');
}

/**
 * The policy of a standalone page or record, as its own first line of
 * defence when opened from disk: no request of any kind, no script; its own
 * styles, fonts and images are inline.
 */
export const RECORD_POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; font-src data:; base-uri 'none'; form-action 'none'";

export interface PageOptions {
  title: string;
  /** The sheet's header with its caution (sheetHeaderHtml). */
  headerHtml: string;
  summaryHtml: string;
  parts: SheetPart[];
  /** <head> content: styles, the policy, data. */
  head: string;
  /** Markup after the sheet (a record's provenance). */
  after?: string;
  /** The footer's words; by default when it was rendered. */
  footer?: string;
}

export function pageHtml(o: PageOptions): string {
  const footer = o.footer ?? `Rendered by Wakesheet ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC`;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(o.title)}</title>${o.head}</head>
<body class="ws-page">${o.headerHtml}${o.summaryHtml}<main class="ws-sheet">${partsHtml(o.parts)}</main>${o.after ?? ''}<footer class="ws-footer">${escapeHtml(footer)}</footer></body></html>`;
}
