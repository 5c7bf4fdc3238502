// KaTeX with a cache: a re-render after one changed input redraws only the
// formulas whose text changed. Trust stays off (no \href to javascript:).
import katex from 'katex';

const cache = new Map<string, string>();
const MAX = 20_000;

export function mathHtml(latex: string, display = false): string {
  const key = (display ? 'D' : 'I') + latex;
  const hit = cache.get(key);
  if (hit !== undefined) return hit;
  const html = katex.renderToString(latex, { throwOnError: false, displayMode: display, output: 'htmlAndMathml', strict: 'ignore', trust: false, maxExpand: 200 });
  if (cache.size >= MAX) cache.delete(cache.keys().next().value!);
  cache.set(key, html);
  return html;
}
