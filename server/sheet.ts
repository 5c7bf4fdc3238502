// TEMPORARY STUB: the real pipeline (read → parse → evaluate → render) replaces
// this file's body; the exported signature stays.
import { marked } from 'marked';
import type { RenderOptions, SheetResult } from './sheet-types.js';

export async function renderSheet(text: string, _opts: RenderOptions = {}): Promise<SheetResult> {
  const t0 = performance.now();
  const body = marked.parse(text, { async: false });
  const parts = [{ key: 't0', html: body }];
  const summaryHtml = '<section class="ws-summary">stub</section>';
  return {
    title: 'stub',
    meta: {},
    html: `<!doctype html><html><body>${summaryHtml}<main>${body}</main></body></html>`,
    parts,
    summaryHtml,
    summary: { inputs: 0, results: 0, checksPassed: 0, checksFailed: 0, errors: 0 },
    values: {},
    checks: [],
    errors: [],
    reads: [],
    elapsedMs: performance.now() - t0,
  };
}
