// Convergence benchmarks. (1) The residuals entry on a generated
// 100,000-iteration, 7-field history, reading the text included (target: a
// median under 100 ms). (2) Through the live server in Chromium: from
// appending 100 lines to the residual file to the page showing the new
// iteration count, against changing an input of the same sheet (the target
// drop the residuals call reads, so both re-run it) to the page showing the
// new value (target: a ratio of medians under 1.5). An input that does not
// feed the residuals call is timed too, as the floor of a save.
import { existsSync } from 'node:fs';
import { appendFile, mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { convergenceEntries } from '../dist/server/core/convergence/entries.js';
import { num, str } from '../dist/server/core/index.js';
import { startServer } from '../dist/server/serve/index.js';
import { PROBE_SOURCE, TimedSandbox } from './live.js';
import { fmt, summarise, type Summary } from './stats.js';

const CHROMIUM = process.env.WAKESHEET_CHROMIUM ?? '/usr/bin/chromium';
const SAVES = Number(process.env.WAKESHEET_BENCH_SAVES ?? 30);
const ITERATIONS = 100_000;
const FIELDS = ['continuity', 'Ux', 'Uy', 'Uz', 'k', 'omega', 'T'];
const APPEND = 100;
const COMPUTE_RUNS = 30;

/** One kind of save: write start → new value in the DOM, and where the time goes. */
export interface SaveFigures {
  toDom: Summary;
  /** write → evaluation starts (watch, debounce, read). */
  toEvalStart: Summary;
  /** Evaluation in the sandbox, round trip included. */
  evalRoundTrip: Summary;
  /** The engine's own time inside the sandbox. */
  engine: Summary;
  /** Evaluation done → value in the DOM. */
  evalToDom: Summary;
}

export interface ConvergenceFigures {
  fileMb: number;
  /** residuals() compute, text to record: wall clock. */
  compute: Summary;
  /** The same runs in processor time of this process (user + system): what the runs cost on a machine shared with other work. */
  computeCpu: Summary;
  /** Null without Chromium. */
  append: SaveFigures | null;
  inputChange: SaveFigures | null;
  unrelatedInput: SaveFigures | null;
}

class SaveSamples {
  readonly toDom: number[] = [];
  readonly toEvalStart: number[] = [];
  readonly evalRoundTrip: number[] = [];
  readonly engine: number[] = [];
  readonly evalToDom: number[] = [];
  add(t0: number, dom: number, evaluation: TimedSandbox['last']): void {
    this.toDom.push(dom - t0);
    this.toEvalStart.push(evaluation.start - t0);
    this.evalRoundTrip.push(evaluation.end - evaluation.start);
    this.engine.push(evaluation.engine);
    this.evalToDom.push(dom - evaluation.end);
  }
  summary(): SaveFigures {
    return { toDom: summarise(this.toDom), toEvalStart: summarise(this.toEvalStart), evalRoundTrip: summarise(this.evalRoundTrip), engine: summarise(this.engine), evalToDom: summarise(this.evalToDom) };
  }
}

/** Deterministic residual lines: each field falls about four and a half decades over the run, with scatter. */
function historyLines(from: number, to: number): string {
  let seed = from;
  const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
  const out: string[] = [];
  for (let n = from; n <= to; n++) {
    const cells = FIELDS.map((_, k) => (Math.pow(10, -4.5 * (n / ITERATIONS) * (1 + 0.05 * k)) * (1 + 0.3 * rnd())).toExponential(5));
    out.push(`${n},${cells.join(',')}\n`);
  }
  return out.join('');
}

const HEADER = `iteration,${FIELDS.join(',')}\n`;

function sheet(target: number, speed: number): string {
  return [
    '# Residual benchmark',
    '',
    '```basis',
    `U_tow = ${speed} m/s   # an input the residuals call does not read`,
    '```',
    '',
    '```basis',
    `target = ${target}   # orders of magnitude to fall`,
    'res = residuals("data/run.csv", target_drop: target, window: 200)',
    '```',
    '',
  ].join('\n');
}

export async function benchConvergence(): Promise<ConvergenceFigures> {
  const text = HEADER + historyLines(1, ITERATIONS);
  const { wall: compute, cpu: computeCpu } = computeCost(text);
  const browser = existsSync(CHROMIUM) ? await liveCost(text) : null;
  if (!browser) console.warn(`skipping the live part: no Chromium at ${CHROMIUM}`);
  return { fileMb: Buffer.byteLength(text) / 1e6, compute, computeCpu, append: browser?.append ?? null, inputChange: browser?.input ?? null, unrelatedInput: browser?.unrelated ?? null };
}

/**
 * Each run reads a text of its own (the header names the run), so that the
 * reader's memo of a growing file never answers: every run parses all of it.
 */
function computeCost(text: string): { wall: Summary; cpu: Summary } {
  const residuals = convergenceEntries.find((e) => e.name === 'residuals')!;
  const args = { path: str('data/run.csv'), target_drop: num(4), window: num(200), initial: num(5) };
  const body = text.slice(text.indexOf('\n'));
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let run = 0; run < COMPUTE_RUNS + 3; run++) {
    const own = `iteration${run}${HEADER.slice('iteration'.length, -1)}${body}`;
    own.charCodeAt(own.length - 1); // joins the two pieces into one flat string, as a file read gives, before the clock starts
    const ctx = { readData: () => own, warn: () => {} };
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    residuals.compute(args, ctx);
    const t1 = performance.now();
    const c1 = process.cpuUsage(c0);
    if (run < 3) continue; // the first runs warm up the JIT
    wall.push(t1 - t0);
    cpu.push((c1.user + c1.system) / 1000);
  }
  return { wall: summarise(wall), cpu: summarise(cpu) };
}

async function liveCost(text: string) {
  const dir = await mkdtemp(path.join(tmpdir(), 'wakesheet-bench-convergence-'));
  await mkdir(path.join(dir, 'data'));
  const csv = path.join(dir, 'data/run.csv');
  const md = path.join(dir, 'run.md');
  await writeFile(csv, text);
  let target = 4;
  let speed = 2;
  await writeFile(md, sheet(target, speed));
  const renderer = new TimedSandbox(20_000);
  const server = await startServer({ dir, port: 0, runner: renderer });
  const profile = await mkdtemp(path.join(tmpdir(), 'wakesheet-bench-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const append = new SaveSamples();
  const input = new SaveSamples();
  const unrelated = new SaveSamples();
  let last = ITERATIONS;
  try {
    const page = await context.newPage();
    await page.goto(server.url + 'sheet/run.md');
    await page.waitForSelector('[data-name="res.iterations"]', { timeout: 60_000 });
    await page.waitForSelector('.live-status[data-state="live"]', { timeout: 60_000 });
    await page.evaluate('new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(() => setTimeout(r, 200))))');
    await page.evaluate(PROBE_SOURCE);
    const time = async (samples: SaveSamples, name: string, si: number, write: () => Promise<void>): Promise<void> => {
      await page.evaluate(`window.benchExpect(${JSON.stringify(name)}, ${si})`);
      const t0 = performance.timeOrigin + performance.now();
      await write();
      const { dom } = (await page.evaluate('window.benchSeen')) as { dom: number };
      samples.add(t0, dom, renderer.last);
      await new Promise((r) => setTimeout(r, 150)); // let the watcher's second look pass
    };
    // The three kinds of save take turns, so that load on the machine falls on each alike.
    for (let i = 0; i < SAVES; i++) {
      const from = last + 1;
      last += APPEND;
      await time(append, 'res.iterations', last, () => appendFile(csv, historyLines(from, last)));
      target = 4 + (i + 1) / 1000;
      await time(input, 'target', target, () => writeFile(md, sheet(target, speed)));
      speed = 2 + (i + 1) / 1000;
      await time(unrelated, 'U_tow', speed, () => writeFile(md, sheet(target, speed)));
    }
  } finally {
    await context.close();
    await server.close();
    await renderer.close();
    await rm(profile, { recursive: true, force: true });
    await rm(dir, { recursive: true, force: true });
  }
  return { append: append.summary(), input: input.summary(), unrelated: unrelated.summary() };
}

export function printConvergence(f: ConvergenceFigures): void {
  const row = (label: string, s: Summary | null | undefined) => console.log(`  ${label.padEnd(60)}${fmt(s?.median ?? NaN)} ${fmt(s?.p95 ?? NaN)} ${fmt(s?.min ?? NaN)} ${fmt(s?.max ?? NaN)}`);
  console.log('\nConvergence (ms)                                                median      p95      min      max');
  row(`residuals(), ${ITERATIONS.toLocaleString('en')} iterations × ${FIELDS.length} fields (${f.fileMb.toFixed(1)} MB)`, f.compute);
  row('  the same runs in processor time of this process', f.computeCpu);
  const save = (label: string, s: SaveFigures | null) => {
    row(label, s?.toDom);
    row('  of which: write → evaluation starts', s?.toEvalStart);
    row('  of which: evaluation (sandbox round trip)', s?.evalRoundTrip);
    row('    of which: the engine in the sandbox', s?.engine);
    row('  of which: evaluated → in the DOM', s?.evalToDom);
  };
  save(`live: append ${APPEND} lines → new iteration count in the DOM`, f.append);
  save('live: change the target drop it reads → new value in the DOM', f.inputChange);
  save('live: change an input it does not read → new value in the DOM', f.unrelatedInput);
  const ratio = f.append && f.inputChange ? f.append.toDom.median / f.inputChange.toDom.median : NaN;
  const floor = f.append && f.unrelatedInput ? f.append.toDom.median / f.unrelatedInput.toDom.median : NaN;
  console.log(`  compute median ${f.compute.median.toFixed(1)} ms (target < 100);  append / input change: ${ratio.toFixed(2)} (target < 1.5);  append / unrelated input: ${floor.toFixed(2)}`);
}
