// A stand-in for the sandbox with behaviour the tests can steer: one part per
// paragraph, `reads: FILE` lines become data-file dependencies, and a line
// `crash!` makes evaluation fail the way a timeout or a dead child would.
import type { RenderOptions, SheetResult } from '../../server/sheet-types.js';
import type { SheetRenderer } from '../../server/serve/store.js';

export class ParagraphRenderer implements SheetRenderer {
  calls: { text: string; opts: RenderOptions }[] = [];
  delayMs = 0;

  async render(text: string, opts: RenderOptions): Promise<SheetResult> {
    this.calls.push({ text, opts });
    if (this.delayMs) await new Promise((r) => setTimeout(r, this.delayMs));
    if (/^crash!$/m.test(text)) throw new Error('evaluation timed out after 2000 ms');
    const paragraphs = text.split(/\n\s*\n/).filter((p) => p.trim() !== '');
    const parts = paragraphs.map((p, i) => ({ key: `p${i}`, html: `<p>${p.trim().replace(/</g, '&lt;')}</p>` }));
    const reads = [...text.matchAll(/^reads: (\S+)$/gm)].map((m) => m[1]!);
    const failed = (text.match(/^fail$/gm) ?? []).length;
    return {
      title: /^# (.*)$/m.exec(text)?.[1] ?? '',
      meta: {},
      html: '',
      parts,
      summaryHtml: `<section class="ws-summary">${paragraphs.length} paragraphs</section>`,
      summary: { inputs: 0, results: 0, checksPassed: 1, checksFailed: failed, errors: 0 },
      values: {},
      checks: [],
      errors: [],
      reads,
      elapsedMs: 1,
    };
  }

  async close(): Promise<void> {}
}
