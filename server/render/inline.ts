// An inline `=expr` value as it sits in prose: the value, a record or figure
// as a block, the last good value marked stale, or the error in words.
import type { InlineResult } from '../evaluate/index.js';
import { uncertaintyHtml } from './uncertainty.js';
import { escapeHtml } from './html.js';
import { displayKey } from './numbers.js';
import { dataAttrs, displayText, valueHtml } from './values.js';

const shown = new WeakMap<InlineResult, { key: string; html: string }>();

/** The html of one inline value; results reused across runs keep their html. */
export function inlineHtml(text: string, result: InlineResult, sig: number): string {
  const key = displayKey(sig);
  const hit = shown.get(result);
  if (hit && hit.key === key) return hit.html;
  const html = build(text, result, sig);
  shown.set(result, { key, html });
  return html;
}

function build(text: string, r: InlineResult, sig: number): string {
  if (r.error) {
    // A very long expression is cut, so the message after it stays in view.
    const shownText = text.length > 60 ? `${text.slice(0, 60)}…` : text;
    return `<span class="ws-inline ws-inline-error" title="${escapeHtml(r.error.message)}">=${escapeHtml(shownText)} ⚠ ${escapeHtml(r.error.message)}</span>`;
  }
  const v = r.value!;
  if (r.stale) {
    return `<span class="ws-inline ws-stale-value" title="the last good value: not current while a statement it depends on fails">${escapeHtml(displayText(v, sig))} <span class="ws-stale-tag">stale</span></span>`;
  }
  if (v.kind === 'record' || v.kind === 'figure' || v.kind === 'table') return valueHtml(text, v, sig);
  const spread = r.u !== undefined && v.kind === 'quantity' ? ` ${uncertaintyHtml(v, { u: r.u, ...(Number.isNaN(r.u) ? { problem: 'cannot be propagated: the value fails at an end of an input’s range' } : {}) }, sig)}` : '';
  return `<span class="ws-inline"${dataAttrs(text, v)}>${escapeHtml(displayText(v, sig))}${spread}</span>`;
}
