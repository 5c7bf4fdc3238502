// A `use` line as the page shows it: the other sheet, a link to it, and each
// name it brings in with its value, each a link to where that sheet defines it.
import type { Diagnostic } from '../diagnostics.js';
import type { Value } from '../core/index.js';
import { attrs, escapeHtml, noteList } from './html.js';
import { errorHtml } from './statement.js';
import { uncertaintyText } from './uncertainty.js';
import { displayText } from './value-text.js';

export interface UseView {
  /** The other sheet as this one names it (a link relative to this sheet). */
  path: string;
  /** Each name with its value, and its standard uncertainty (SI) when one comes with it. */
  names: ReadonlyArray<{ name: string; value?: Value; u?: number }>;
  error?: Diagnostic;
  /** What the page must say of names brought in (an uncertainty that could not come along). */
  notes?: readonly string[];
  source: string;
}

export function useHtml(line: number, u: UseView, sig: number): string {
  const href = (anchor?: string) => escapeHtml(encodeURI(u.path) + (anchor ? `#v-${encodeURIComponent(anchor)}` : ''));
  const shown = (v: Value, spread?: number) => displayText(v, sig) + (spread !== undefined && v.kind === 'quantity' ? ` ${uncertaintyText(v, spread, sig)}` : '');
  const names = u.names
    .map((n) => {
      const text = n.value ? shown(n.value, n.u) : '';
      const uAttr = n.u !== undefined && Number.isFinite(n.u) ? attrs({ 'data-u': n.u }) : '';
      return `<a class="ws-used-name" href="${href(n.name)}"${text ? attrs({ title: text }) : ''}><code>${escapeHtml(n.name)}</code></a>${text ? ` <span class="ws-used-value"${uAttr}>${escapeHtml(text)}</span>` : ''}`;
    })
    .join(', ');
  const notes = noteList('ws-warnings', u.notes);
  const body = u.names.length ? `: ${names}` : '';
  const error = u.error ? errorHtml(u.error.message, u.error.line, u.error.column, u.source) : '';
  return `<div class="ws-stmt ws-use" id="L${line}"${attrs({ 'data-line': line })}><span class="ws-use-head">from <a href="${href()}"><code>${escapeHtml(u.path)}</code></a></span>${body}${error}${notes}</div>`;
}
