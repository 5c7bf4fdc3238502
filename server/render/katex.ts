// KaTeX with a cache: a re-render after one changed input redraws only the
// formulas whose text changed. Trust stays off (no \href to javascript:).
// The cache is bounded by the characters it holds, not by a count of
// formulas: a sheet of long formulas must not take the memory of the sheet.
// It is small: the renderer keeps each statement's html itself (packed), so
// the cache matters only for the statements an edit changes, whose symbolic
// heads it spares typesetting again; a large sheet's first run fills it in
// passing, and it then holds the formulas seen last.
// KaTeX is loaded at the first formula: a run that renders nothing (the
// command line's eval and check) never pays for it.
import { createRequire } from 'node:module';
import type katexModule from 'katex';
import { compactHtml } from './html.js';

let katex: typeof katexModule | undefined;

function typesetter(): typeof katexModule {
  return (katex ??= createRequire(import.meta.url)('katex') as typeof katexModule);
}

const cache = new Map<string, string>();
/** Bytes the cache may hold: LaTeX and html at one byte a character once compact, and each entry's own cost. */
const MAX_BYTES = 600_000;
/** The heap an entry takes besides its characters: its slot in the map and two string headers. */
const ENTRY_BYTES = 64;
let held = 0;

export function mathHtml(latex: string, display = false): string {
  const key = (display ? 'D' : 'I') + latex;
  const hit = cache.get(key);
  if (hit !== undefined) return hit;
  const html = compactHtml(typesetter().renderToString(latex, { throwOnError: false, displayMode: display, output: 'htmlAndMathml', strict: 'ignore', trust: false, maxExpand: 200 }));
  const size = ENTRY_BYTES + key.length + html.length;
  if (size > MAX_BYTES / 8) return html; // a formula this long is not worth keeping
  while (held + size > MAX_BYTES) {
    const [oldKey, oldHtml] = cache.entries().next().value!;
    cache.delete(oldKey);
    held -= ENTRY_BYTES + oldKey.length + oldHtml.length;
  }
  cache.set(key, html);
  held += size;
  return html;
}

/** Empties the cache (for measuring what one sheet's formulas take). */
export function forgetFormulas(): void {
  cache.clear();
  held = 0;
}

/**
 * A chain of relations, `first = second = third …`, typeset piece by piece:
 * after an input changes, the symbolic head of a result is unchanged and comes
 * from the cache, and only the pieces with numbers in them are typeset again.
 * Each later piece starts with `{}` so its relation keeps the spacing it has
 * in one formula.
 */
export function chainHtml(first: string, rest: readonly string[], relation = '='): string {
  let html = mathHtml(first);
  for (const piece of rest) html += mathHtml(`{} ${relation} ${piece}`);
  return html;
}
