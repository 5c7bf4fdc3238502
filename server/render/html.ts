// Attributes written from values: every value escaped by the one escaper.
import { escapeHtml } from '../core/shared/escape.js';

export { escapeHtml };

export function attrs(a: Record<string, string | number | undefined>): string {
  return Object.entries(a)
    .filter(([, v]) => v !== undefined)
    .map(([k, v]) => ` ${k}="${escapeHtml(String(v))}"`)
    .join('');
}

const PAST_LATIN1 = /[^\x00-\xff]/u;
const PAST_LATIN1_ALL = /[^\x00-\xff]/gu;

/**
 * Html that is kept across runs, made compact. Characters past Latin-1 are
 * written as character references (the page's DOM is the same), so V8 keeps
 * the string at one byte a character instead of two; and the result is one
 * flat string, not the tree of pieces that concatenation builds (KaTeX's
 * output held that way took three times its length in memory).
 */
export function compactHtml(html: string): string {
  const referenced = PAST_LATIN1.test(html) ? html.replace(PAST_LATIN1_ALL, (c) => `&#x${c.codePointAt(0)!.toString(16)};`) : html;
  // A string of Latin-1 characters may still be stored at two bytes each (it
  // was built from pieces that were); the round trip gives one flat one-byte string.
  return Buffer.from(referenced, 'latin1').toString('latin1');
}

/** A list of notes as the page shows them under a value: warnings (ws-warnings) or remarks (ws-remarks). */
export function noteList(cls: 'ws-warnings' | 'ws-remarks', items: readonly string[] | undefined): string {
  return items?.length ? `<ul class="${cls}">${items.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul>` : '';
}
