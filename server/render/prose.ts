// Prose renders as marked renders it (CommonMark/GFM), then goes through
// sanitize-html: marked passes raw HTML through, so scripts, event handlers
// and javascript: links are removed here. Our own KaTeX and values are put
// in after sanitising, never through it.
import { createRequire } from 'node:module';
import { Parser, type Token, type TokensList } from 'marked';
import type sanitizeModule from 'sanitize-html';

// sanitize-html is loaded at the first prose part: a run that renders nothing never pays for it.
let sanitizer: typeof sanitizeModule | undefined;

function sanitizeHtml(): typeof sanitizeModule {
  return (sanitizer ??= createRequire(import.meta.url)('sanitize-html') as typeof sanitizeModule);
}

const options = (defaults: sanitizeModule.IDefaults): sanitizeModule.IOptions => ({
  allowedTags: [...defaults.allowedTags, 'img', 'del', 'ins', 'details', 'summary', 'sup', 'sub', 'input', 'kbd', 'h1', 'h2'],
  allowedAttributes: {
    a: ['href', 'name', 'title'],
    img: ['src', 'alt', 'title', 'width', 'height'],
    input: ['type', 'checked', 'disabled'],
    th: ['align', 'colspan', 'rowspan'],
    td: ['align', 'colspan', 'rowspan'],
    code: ['class'],
    ol: ['start'],
    details: ['open'],
  },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesAppliedToAttributes: ['href', 'src'],
  allowProtocolRelative: false,
  allowedClasses: { code: [/^language-[\w-]+$/] },
});
let OPTIONS: sanitizeModule.IOptions | undefined;

export function sanitize(html: string): string {
  const clean = sanitizeHtml();
  return clean(html, (OPTIONS ??= options(clean.defaults)));
}

export function proseHtml(tokens: Token[], links: TokensList['links']): string {
  const list = Object.assign([...tokens], { links }) as TokensList;
  return sanitize(new Parser({ gfm: true }).parse(list));
}

/** Inline `=expr` code spans in rendered prose, as [whole match, decoded expression]. */
export function inlineValueSpans(html: string): Array<{ match: string; expr: string }> {
  const out: Array<{ match: string; expr: string }> = [];
  for (const m of html.matchAll(/<code>=(?!=)([^<]+)<\/code>/g)) out.push({ match: m[0], expr: decode(m[1]!) });
  return out;
}

function decode(s: string): string {
  return s.replace(/&(lt|gt|amp|quot|#39|#x27);/g, (_, e: string) => ({ lt: '<', gt: '>', amp: '&', quot: '"', '#39': "'", '#x27': "'" })[e]!);
}
