// Run by bench/memory.ts in a process of its own with --expose-gc: the heap
// a pipeline keeps after running a generated sheet, per statement, and the
// heap a list keeps per item. Prints one line of JSON.
import { SheetPipeline } from '../dist/server/pipeline/index.js';
import { generatedSheet } from './sheets.js';

const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error('run with --expose-gc');

function heap(): number {
  gc!();
  gc!();
  return process.memoryUsage().heapUsed;
}

const NO_TIME_LIMIT = { maxSteps: 5e7, maxListLength: 1e5, timeoutMs: 1e7 };

/** Retained bytes per statement after a full run and after a one-input run, for `blocks` blocks of five statements. */
function perStatement(blocks: number) {
  const sheet = generatedSheet(blocks);
  const statements = blocks * 5;
  // Warm the modules (registry, unit catalogue, KaTeX) on a small sheet first.
  new SheetPipeline({ limits: NO_TIME_LIMIT }).run(generatedSheet(2).text(1));
  const pipeline = new SheetPipeline({ limits: NO_TIME_LIMIT });
  const before = heap();
  let report: ReturnType<SheetPipeline['run']> | null = pipeline.run(sheet.text(sheet.base));
  const htmlChars = report.parts.reduce((n, p) => n + p.html.length, 0);
  report = null;
  const afterFull = heap();
  pipeline.run(sheet.text(sheet.base + 0.5));
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

const out = { small: perStatement(400), large: perStatement(1200), listItem: perListItem() };
process.stdout.write(JSON.stringify(out) + '\n');
