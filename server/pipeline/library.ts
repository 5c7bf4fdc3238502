// The library entry: `renderSheet` evaluates and renders a sheet in this
// process (interpreter limits apply); the server and CLI run the same
// pipeline inside the sandbox child instead.
import { standaloneCss } from '../render/assets.js';
import { pageHtml, RECORD_POLICY } from '../render/page.js';
import { SheetPipeline } from './pipeline.js';
import { typesetProgress } from './report.js';
import type { RunOptions, SheetReport, SheetResult } from './types.js';

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

export async function renderSheet(text: string, opts: RunOptions = {}): Promise<SheetResult> {
  const pipeline = new SheetPipeline();
  let report = pipeline.run(text, opts);
  // A run that ran out of time while typesetting goes on where it stopped, while that gets somewhere.
  for (let before = Infinity; report.untypeset > 0 && typesetProgress(before, report.untypeset); ) {
    before = report.untypeset;
    report = pipeline.run(text, opts);
  }
  return withPage(report);
}
