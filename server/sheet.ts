// renderSheet: the library entry. One call evaluates and renders a sheet in
// this process (interpreter limits apply); the server and CLI run the same
// pipeline inside the sandbox child instead.
import { SheetSession, type SheetCore } from './session.js';
import { pageHtml } from './render/page.js';
import { standaloneCss } from './render/assets.js';
import type { RenderOptions, SheetResult } from './sheet-types.js';

/** Frame a rendered sheet as one self-contained HTML document. */
export function standalonePage(core: SheetCore): string {
  return pageHtml({
    title: core.title,
    meta: core.meta,
    summaryHtml: core.summaryHtml,
    parts: core.parts,
    caution: core.caution,
    head: `<style>${standaloneCss()}</style>`,
  });
}

/** The result with `html` built on first read: the live server never reads it. */
export function withPage(core: SheetCore): SheetResult {
  let html: string | undefined;
  const result = { ...core } as unknown as SheetResult;
  Object.defineProperty(result, 'html', { enumerable: true, get: () => (html ??= standalonePage(core)) });
  return result;
}

export async function renderSheet(text: string, opts: RenderOptions = {}): Promise<SheetResult> {
  return withPage(new SheetSession().render(text, opts));
}
