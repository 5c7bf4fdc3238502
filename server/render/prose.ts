// Prose renders as marked renders it (CommonMark/GFM), then goes through
// sanitize-html: marked passes raw HTML through, so scripts, event handlers
// and javascript: links are removed here. Our own KaTeX and values are put
// in after sanitising, never through it.
import { createRequire } from 'node:module';
import { Parser, type Token, type TokensList } from 'marked';
import type sanitizeModule from 'sanitize-html';
import { escapeHtml } from './html.js';

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
  // A wide table scrolls inside the column instead of widening the page.
  return sanitize(new Parser({ gfm: true }).parse(list)).replace(/<table>/g, '<div class="ws-table-wrap"><table>').replace(/<\/table>/g, '</table></div>');
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

/**
 * Every <img> of rendered prose with its embedded data: URI, or in its place a
 * plain notice of why it is not shown. Runs after sanitising, so raw-HTML
 * images written into the prose are caught as well.
 */
export function embedImages(html: string, images: ReadonlyMap<string, { uri: string } | { error: string }>): string {
  if (!html.includes('<img')) return html;
  return html.replace(/<img\b[^>]*>/g, (tag) => {
    const src = decode(/\ssrc="([^"]*)"/.exec(tag)?.[1] ?? '');
    const alt = /\salt="([^"]*)"/.exec(tag)?.[1] ?? '';
    const loaded = images.get(src);
    if (loaded && 'uri' in loaded) return tag.replace(/\ssrc="[^"]*"/, ` src="${loaded.uri}"`);
    const why = loaded && 'error' in loaded ? loaded.error : `the image ${src} is not shown: images come from files inside the project folder`;
    return `<span class="ws-image-refused" role="note">${alt ? `[${alt}] ` : ''}${escapeHtml(why)}</span>`;
  });
}
