// KaTeX with a cache: a re-render after one changed input redraws only the
// formulas whose text changed. Trust stays off (no \href to javascript:).
// KaTeX is loaded at the first formula: a run that renders nothing (the
// command line's eval and check) never pays for it.
import { createRequire } from 'node:module';
import type katexModule from 'katex';

let katex: typeof katexModule | undefined;

function typesetter(): typeof katexModule {
  return (katex ??= createRequire(import.meta.url)('katex') as typeof katexModule);
}

const cache = new Map<string, string>();
const MAX = 20_000;

export function mathHtml(latex: string, display = false): string {
  const key = (display ? 'D' : 'I') + latex;
  const hit = cache.get(key);
  if (hit !== undefined) return hit;
  const html = typesetter().renderToString(latex, { throwOnError: false, displayMode: display, output: 'htmlAndMathml', strict: 'ignore', trust: false, maxExpand: 200 });
  if (cache.size >= MAX) cache.delete(cache.keys().next().value!);
  cache.set(key, html);
  return html;
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
