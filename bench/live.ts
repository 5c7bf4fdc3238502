// Live-update benchmark: from the start of writing a sheet to the new value in
// the page in Chromium, over 50 saves, for the demo sheet and a generated
// 2,000-statement sheet. Next to it, the floor (marked and KaTeX alone
// rendering the same output) and the cost of re-evaluating after a one-input
// change against a full evaluation.
import { existsSync } from 'node:fs';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import katex from 'katex';
import { marked } from 'marked';
import { chromium } from 'playwright-core';
// The compiled server, as `npm start` runs it: from the TypeScript sources the
// sandbox child would run under a loader that slows hot code down.
import { Sandbox } from '../dist/server/sandbox/sandbox.js';
import { startServer, type SheetRunner } from '../dist/server/serve/index.js';
import type { RunOptions, SheetResult } from '../dist/server/pipeline/index.js';
import { demoSheet, generatedSheet, type BenchSheet } from './sheets.js';
import { fmt, summarise, type Summary } from './stats.js';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const CHROMIUM = process.env.WAKESHEET_CHROMIUM ?? '/usr/bin/chromium';
const SAVES = Number(process.env.WAKESHEET_BENCH_SAVES ?? 50);
/** Generous, so the benchmark measures speed rather than the default time limit. */
const BENCH_TIMEOUT_MS = 20_000;

export interface LiveFigures {
  sheet: string;
  /** writeFile start → new value in the DOM. */
  toDom: Summary | null;
  /** writeFile start → the frame showing it has been laid out and painted (what the eye can see). */
  toPaint: Summary | null;
  /** Where the time goes: writeFile → evaluation starts (watch, debounce, read). */
  toEvalStart: Summary | null;
  /** Evaluation in the sandbox, round trip included. */
  evalRoundTrip: Summary | null;
  /** The engine's own time inside the sandbox (its elapsedMs). */
  engine: Summary | null;
  /** Evaluation done → value in the DOM (hash, send, parse, patch). */
  evalToDom: Summary | null;
  /** marked + KaTeX alone on the same text and formulas. */
  floor: Summary;
  fullEval: Summary;
  oneInputEval: Summary;
}

export async function benchLive(): Promise<LiveFigures[]> {
  // WAKESHEET_BENCH_ONLY=demo or =large runs one of the two.
  const only = process.env.WAKESHEET_BENCH_ONLY?.split(',') ?? [];
  const picked = only.filter((o) => o === 'demo' || o === 'large');
  const sheets = [demoSheet(ROOT), generatedSheet()].filter((_, i) => picked.length === 0 || picked.includes(i === 0 ? 'demo' : 'large'));
  const results: LiveFigures[] = [];
  for (const sheet of sheets) {
    const { full, oneInput, formulas } = await evaluationCost(sheet);
    const floor = floorCost(sheet, formulas);
    const browser = existsSync(CHROMIUM) ? await saveToPage(sheet) : null;
    if (!browser) console.warn(`skipping the browser part: no Chromium at ${CHROMIUM}`);
    results.push({
      sheet: sheet.name,
      toDom: browser?.toDom ?? null,
      toPaint: browser?.toPaint ?? null,
      toEvalStart: browser?.toEvalStart ?? null,
      evalRoundTrip: browser?.evalRoundTrip ?? null,
      engine: browser?.engine ?? null,
      evalToDom: browser?.evalToDom ?? null,
      floor,
      fullEval: full,
      oneInputEval: oneInput,
    });
  }
  return results;
}

/** Full evaluation (a fresh per-sheet cache) against re-evaluation after one input changed. */
async function evaluationCost(sheet: BenchSheet) {
  const sandbox = new Sandbox({ timeoutMs: BENCH_TIMEOUT_MS });
  const full: number[] = [];
  const oneInput: number[] = [];
  let formulas: string[] = [];
  try {
    await sandbox.run(sheet.text(sheet.base), { path: path.join(ROOT, 'bench', 'warm-up.md'), root: ROOT });
    for (let run = 0; run < 5; run++) {
      const opts = { path: path.join(ROOT, 'bench', `full-${run}.md`), root: ROOT };
      const first = await sandbox.run(sheet.text(sheet.base), opts);
      full.push(first.elapsedMs);
      if (run === 0) formulas = texOf(first.parts.map((p) => p.html).join(''));
      for (let i = 1; i <= 4; i++) oneInput.push((await sandbox.run(sheet.text(sheet.base + run + i / 10), opts)).elapsedMs);
    }
  } finally {
    await sandbox.close();
  }
  return { full: summarise(full), oneInput: summarise(oneInput), formulas };
}

/** The TeX sources KaTeX rendered, read back from its annotations. */
function texOf(html: string): string[] {
  const decode = (s: string) => s.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&');
  return [...html.matchAll(/<annotation encoding="application\/x-tex">([\s\S]*?)<\/annotation>/g)].map((m) => decode(m[1]!));
}

function floorCost(sheet: BenchSheet, formulas: string[]): Summary {
  const text = sheet.text(sheet.base);
  const samples: number[] = [];
  for (let run = 0; run < 12; run++) {
    const t0 = performance.now();
    marked.parse(text, { async: false });
    for (const tex of formulas) katex.renderToString(tex, { throwOnError: false });
    if (run >= 2) samples.push(performance.now() - t0); // the first runs warm up the JIT
  }
  return summarise(samples);
}

/** The sandbox, noting when each evaluation starts and ends (epoch ms, like the page's clock). */
export class TimedSandbox implements SheetRunner {
  private readonly inner: Sandbox;
  constructor(timeoutMs = BENCH_TIMEOUT_MS) {
    this.inner = new Sandbox({ timeoutMs });
  }
  last = { start: 0, end: 0, engine: 0 };
  async run(text: string, opts: RunOptions): Promise<SheetResult> {
    const start = performance.timeOrigin + performance.now();
    const result = await this.inner.run(text, opts);
    this.last = { start, end: performance.timeOrigin + performance.now(), engine: result.elapsedMs };
    return result;
  }
  close(): Promise<void> {
    return this.inner.close();
  }
}

async function saveToPage(sheet: BenchSheet) {
  const dir = await mkdtemp(path.join(tmpdir(), 'wakesheet-bench-'));
  const file = path.join(dir, 'sheet.md');
  await writeFile(file, sheet.text(sheet.base));
  const runner = new TimedSandbox();
  const server = await startServer({ dir, port: 0, runner });
  const profile = await mkdtemp(path.join(tmpdir(), 'wakesheet-bench-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const toDom: number[] = [];
  const toPaint: number[] = [];
  const toEvalStart: number[] = [];
  const evalRoundTrip: number[] = [];
  const engine: number[] = [];
  const evalToDom: number[] = [];
  try {
    const page = await context.newPage();
    await page.goto(server.url + 'sheet/sheet.md');
    await page.waitForSelector(`[data-name="${sheet.input}"]`, { timeout: 60_000 });
    // Let the page finish opening (its complete frame applied, first frames drawn):
    // the saves measure updates, not the load of a 2,000-statement page.
    await page.waitForSelector('.live-status[data-state="live"]', { timeout: 60_000 });
    await page.evaluate('new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(() => setTimeout(r, 200))))');
    await page.evaluate(PROBE_SOURCE);
    for (let i = 1; i <= SAVES; i++) {
      const value = sheet.base + i / 100;
      await page.evaluate(`window.benchExpect(${JSON.stringify(sheet.input)}, ${sheet.si(value)})`);
      const t0 = performance.timeOrigin + performance.now();
      await writeFile(file, sheet.text(value));
      // One awaited promise in the page instead of polling: polling over CDP
      // would load the event loop that the server shares with this driver.
      const { dom, painted } = (await page.evaluate('window.benchSeen')) as { dom: number; painted: number };
      toDom.push(dom - t0);
      toPaint.push(painted - t0);
      toEvalStart.push(runner.last.start - t0);
      evalRoundTrip.push(runner.last.end - runner.last.start);
      engine.push(runner.last.engine);
      evalToDom.push(dom - runner.last.end);
      await new Promise((r) => setTimeout(r, 150)); // let the watcher's second look pass
    }
  } finally {
    await context.close();
    await server.close();
    await runner.close(); // the server closes only a runner it made itself
    await rm(profile, { recursive: true, force: true });
    await rm(dir, { recursive: true, force: true });
  }
  return {
    toDom: summarise(toDom),
    toPaint: summarise(toPaint),
    toEvalStart: summarise(toEvalStart),
    evalRoundTrip: summarise(evalRoundTrip),
    engine: summarise(engine),
    evalToDom: summarise(evalToDom),
  };
}

/**
 * Runs in the page: notes when the expected value appears, and when the
 * frame that shows it is done. A message posted from requestAnimationFrame
 * arrives after that frame's style, layout and paint, so it counts them.
 * Kept as source text: the TypeScript loader would add helpers to a function
 * that do not exist in the page.
 */
export const PROBE_SOURCE = `(() => {
  const now = () => performance.timeOrigin + performance.now();
  window.benchTarget = null;
  window.benchSeen = null;
  let settle = null;
  window.benchExpect = (name, si) => {
    window.benchTarget = { name, si };
    window.benchSeen = new Promise((resolve) => { settle = resolve; });
  };
  // The element is looked up again only when it left the page: a query over a
  // 2,000-statement page on every mutation would be the slowest thing measured.
  let element = null;
  new MutationObserver(() => {
    const target = window.benchTarget;
    if (!target) return;
    if (!element || !element.isConnected || element.getAttribute('data-name') !== target.name) {
      element = document.querySelector('main [data-name="' + target.name + '"]');
    }
    const si = Number(element && element.getAttribute('data-si'));
    if (!(Math.abs(si - target.si) <= 1e-9 * Math.abs(target.si))) return;
    const dom = now();
    window.benchTarget = null;
    requestAnimationFrame(() => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => settle({ dom, painted: now() });
      channel.port2.postMessage(null);
    });
  }).observe(document.querySelector('main'), { childList: true, subtree: true, attributes: true, characterData: true });
})()`;

export function printLive(figures: LiveFigures[]): void {
  console.log('\nLive update, writeFile → page (ms)            median      p95      min      max');
  for (const f of figures) {
    const row = (label: string, s: Summary | null) =>
      console.log(`  ${label.padEnd(44)}${fmt(s?.median ?? NaN)} ${fmt(s?.p95 ?? NaN)} ${fmt(s?.min ?? NaN)} ${fmt(s?.max ?? NaN)}`);
    console.log(`${f.sheet}`);
    row(`new value in the DOM (${f.toDom?.n ?? 0} saves)`, f.toDom);
    row('laid out and painted', f.toPaint);
    row('  of which: write → evaluation starts', f.toEvalStart);
    row('  of which: evaluation (sandbox round trip)', f.evalRoundTrip);
    row('    of which: the engine in the sandbox', f.engine);
    row('  of which: evaluated → in the DOM', f.evalToDom);
    row('floor: marked + KaTeX alone, same output', f.floor);
    row('evaluation, full (engine elapsedMs)', f.fullEval);
    row('evaluation, one input changed', f.oneInputEval);
    const share = f.oneInputEval.median / f.fullEval.median;
    const vsFloor = f.toPaint ? f.toPaint.p95 / f.floor.median : NaN;
    console.log(`  one-input / full: ${(share * 100).toFixed(1)} %;  p95 / floor: ${vsFloor.toFixed(2)}`);
  }
}
