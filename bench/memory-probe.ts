// Run by bench/memory.ts with --expose-gc, in a process of its own for each
// figure: the heap a pipeline keeps after running a generated sheet, per
// statement, or the heap a list keeps per item. Prints one line of JSON.
import { SheetPipeline } from '../dist/server/pipeline/index.js';
import { forgetFormulas } from '../dist/server/render/katex.js';
import { generatedSheet } from './sheets.js';

const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error('run with --expose-gc');

function heap(): number {
  gc!();
  gc!();
  return process.memoryUsage().heapUsed;
}

const NO_TIME_LIMIT = { maxSteps: 5e7, maxListLength: 1e5, timeoutMs: 1e7 };

/**
 * One run, every part's html read as the live server's sender reads it; the
 * characters of html. In a function of its own: V8 scans every register of
 * an interpreted frame, so a report left in a dead register of the measuring
 * frame would be counted as kept by the pipeline.
 */
function runAndRead(pipeline: SheetPipeline, text: string): number {
  return pipeline.run(text).parts.reduce((n, p) => n + p.html.length, 0);
}

/**
 * What the process keeps whatever the sheet, paid before measuring: modules,
 * the unit catalogue, and the compiled code of the hot paths, which a sheet
 * of the same shape under other names brings about. Its formulas are then
 * forgotten, so the measured sheet's own fill KaTeX's cache.
 */
function warmUp(): void {
  const other = generatedSheet(100);
  runAndRead(new SheetPipeline({ limits: NO_TIME_LIMIT }), other.text(other.base).replaceAll('_', '_w'));
  forgetFormulas();
}

/** Retained bytes per statement after a full run and after a one-input run, for `blocks` blocks of five statements. */
function perStatement(blocks: number) {
  const sheet = generatedSheet(blocks);
  const statements = blocks * 5;
  warmUp();
  const pipeline = new SheetPipeline({ limits: NO_TIME_LIMIT });
  const before = heap();
  const htmlChars = runAndRead(pipeline, sheet.text(sheet.base));
  const afterFull = heap();
  runAndRead(pipeline, sheet.text(sheet.base + 0.5));
  const afterEdit = heap();
  return {
    statements,
    full: Math.round((afterFull - before) / statements),
    afterEdit: Math.round((afterEdit - before) / statements),
    htmlChars: Math.round(htmlChars / statements),
  };
}

/** Retained bytes per list item: one 100,000-point list and nine lists computed from it. */
function perListItem() {
  const lines = ['a = linspace(0, 1, 100000)', ...Array.from({ length: 9 }, (_, i) => `b${i} = a * ${i + 2} m + 1 m`)];
  const pipeline = new SheetPipeline({ limits: NO_TIME_LIMIT });
  const before = heap();
  const r = pipeline.run('```basis\n' + lines.join('\n') + '\n```\n');
  if (r.errors.length) throw new Error(JSON.stringify(r.errors));
  return Math.round((heap() - before) / 1e6);
}

// `statements N` or `list`.
const [what, count] = process.argv.slice(2);
const out = what === 'list' ? perListItem() : perStatement(Number(count) / 5);
process.stdout.write(JSON.stringify(out) + '\n');
