// A `use` line as the page shows it: the other sheet, a link to it, and each
// name it brings in with its value, each a link to where that sheet defines it.
import type { Diagnostic } from '../diagnostics.js';
import type { Value } from '../core/index.js';
import { attrs, escapeHtml } from './html.js';
import { errorHtml } from './statement.js';
import { displayText } from './value-text.js';

export interface UseView {
  /** The other sheet as this one names it (a link relative to this sheet). */
  path: string;
  names: ReadonlyArray<{ name: string; value?: Value }>;
  error?: Diagnostic;
  source: string;
}

export function useHtml(line: number, u: UseView, sig: number): string {
  const href = (anchor?: string) => escapeHtml(encodeURI(u.path) + (anchor ? `#v-${encodeURIComponent(anchor)}` : ''));
  const names = u.names
    .map((n) => `<a class="ws-used-name" href="${href(n.name)}"${n.value ? attrs({ title: displayText(n.value, sig) }) : ''}><code>${escapeHtml(n.name)}</code></a>${n.value ? ` <span class="ws-used-value">${escapeHtml(displayText(n.value, sig))}</span>` : ''}`)
    .join(', ');
  const body = u.names.length ? `: ${names}` : '';
  const error = u.error ? errorHtml(u.error.message, u.error.line, u.error.column, u.source) : '';
  return `<div class="ws-stmt ws-use" id="L${line}"${attrs({ 'data-line': line })}><span class="ws-use-head">from <a href="${href()}"><code>${escapeHtml(u.path)}</code></a></span>${body}${error}</div>`;
}
