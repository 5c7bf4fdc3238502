// Prose renders as marked renders it (CommonMark/GFM), then goes through
// sanitize-html: marked passes raw HTML through, so scripts, event handlers
// and javascript: links are removed here. Our own KaTeX and values are put
// in after sanitising, never through it.
import { Parser, type Token, type TokensList } from 'marked';
import sanitizeHtml from 'sanitize-html';

const OPTIONS: sanitizeHtml.IOptions = {
  allowedTags: [...sanitizeHtml.defaults.allowedTags, 'img', 'del', 'ins', 'details', 'summary', 'sup', 'sub', 'input', 'kbd', 'h1', 'h2'],
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
};

export function sanitize(html: string): string {
  return sanitizeHtml(html, OPTIONS);
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
  return s
    .replace(/&#x([0-9a-f]+);/gi, (_, hex: string) => String.fromCodePoint(parseInt(hex, 16)))
    .replace(/&(lt|gt|amp|quot|#39);/g, (_, e: string) => ({ lt: '<', gt: '>', amp: '&', quot: '"', '#39': "'" })[e]!);
}
