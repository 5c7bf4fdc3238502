// A report as one self-contained HTML document. Kept apart from the pipeline
// itself so that the sandbox's parent process can build pages without loading
// the engine (the command line starts faster).
import { standaloneCss } from '../render/assets.js';
import { pageHtml, RECORD_POLICY } from '../render/page.js';
import type { SheetReport, SheetResult } from './types.js';

/** A report as one self-contained HTML document. */
export function standalonePage(report: SheetReport): string {
  return pageHtml({
    title: report.title,
    headerHtml: report.headerHtml,
    summaryHtml: report.summaryHtml,
    parts: report.parts,
    head: `<meta http-equiv="Content-Security-Policy" content="${RECORD_POLICY}"><style>${standaloneCss()}</style>`,
  });
}

/** The result with `html` built on first read: the live server never reads it. */
export function withPage(report: SheetReport): SheetResult {
  let html: string | undefined;
  const result = { ...report } as SheetResult;
  Object.defineProperty(result, 'html', { enumerable: true, get: () => (html ??= standalonePage(report)) });
  return result;
}
