// A stand-in for the sandbox with behaviour the tests can steer: one part per
// paragraph, `reads: FILE` lines become data-file dependencies, and a line
// `crash!` makes evaluation fail the way a timeout or a dead child would.
import path from 'node:path';
import { emptyReport, type RunOptions, type RunProgress, type SheetResult } from '../../server/pipeline/index.js';
import type { SheetRunner } from '../../server/serve/store.js';

/** A result with nothing in it but what `fields` says: the shape a real run returns. */
export function fakeResult(fields: Partial<SheetResult>): SheetResult {
  return { html: '', ...emptyReport(fields) };
}

export class ParagraphRunner implements SheetRunner {
  calls: { text: string; opts: RunOptions }[] = [];
  delayMs = 0;

  async run(text: string, opts: RunOptions, _lane?: number, _onProgress?: (p: RunProgress) => void): Promise<SheetResult> {
    this.calls.push({ text, opts });
    if (this.delayMs) await new Promise((r) => setTimeout(r, this.delayMs));
    if (/^crash!$/m.test(text)) throw new Error('evaluation timed out after 2000 ms');
    const paragraphs = text.split(/\n\s*\n/).filter((p) => p.trim() !== '');
    const parts = paragraphs.map((p, i) => ({ key: `p${i}`, html: `<p>${p.trim().replace(/</g, '&lt;')}</p>` }));
    const reads = [...text.matchAll(/^reads: (\S+)$/gm)].map((m) => m[1]!);
    const failed = (text.match(/^fail$/gm) ?? []).length;
    return fakeResult({
      title: /^# (.*)$/m.exec(text)?.[1] ?? path.basename(opts.path ?? 'sheet.md', '.md'),
      parts,
      summaryHtml: `<section class="ws-summary">${paragraphs.length} paragraphs</section>`,
      summary: { inputs: 0, results: 0, checksPassed: 1, checksFailed: failed, checksNotRun: 0, errors: 0 },
      reads,
      elapsedMs: 1,
    });
  }

  async close(): Promise<void> {}
}
