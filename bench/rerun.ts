// Re-run benchmarks. (1) A 1,000-row sweep of the near-wall plan's speed
// through the first-cell height, the layer count and the checks downstream,
// evaluated by the engine, beside 1,000 direct calls of the same trade
// functions (target: under 1 s; aim: no more than 2× the direct calls).
// (2) Through the live server in Chromium: a save to a sheet that another
// uses, to the new value on the page of the sheet that uses it, beside a save
// to that sheet itself (target: the same p95).
import { existsSync } from 'node:fs';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { chromium } from 'playwright-core';
import { SheetPipeline } from '../dist/server/index.js';
import { startServer } from '../dist/server/serve/index.js';
import { PROBE_SOURCE, TimedSandbox } from './live.js';
import { nearWallCalls, nearWallSheet, vanAir } from './near-wall.js';
import { fmt, summarise, type Summary } from './stats.js';

const CHROMIUM = process.env.WAKESHEET_CHROMIUM ?? '/usr/bin/chromium';
const ROWS = 1000;
const RUNS = Number(process.env.WAKESHEET_BENCH_RUNS ?? 15);
const SAVES = Number(process.env.WAKESHEET_BENCH_SAVES ?? 30);
export const SWEEP_LIMIT_MS = 1000;

export interface RerunFigures {
  rows: number;
  /** The statement holding the sweep, evaluated by the engine (the rest of the sheet cached). */
  sweep: Summary;
  /** The same trade functions called directly, once per row. */
  direct: Summary;
  /** Null without Chromium. */
  usedSave: Summary | null;
  directSave: Summary | null;
}

/** The near-wall plan with its sweep; `top` moves the last speed a hair so that no run is served from the cache. */
function nearWall(top: number): string {
  return nearWallSheet('110 km/h', '5.9 m', `plan = sweep(U, linspace(60 km/h, ${top} km/h, ${ROWS}), wr.height, stack.count)`);
}

function sweepCost(): Summary {
  const pipeline = new SheetPipeline();
  pipeline.run(nearWall(180)); // warm: everything but the sweep stays cached from here on
  const samples: number[] = [];
  for (let i = 1; i <= RUNS; i++) {
    const r = pipeline.run(nearWall(180 + i * 1e-6));
    if (r.errors.length) throw new Error(`the benchmark sheet has errors: ${r.errors[0]!.message}`);
    // The pipeline's own time, less the run without a sweep change, is what the sweep costs; here the sweep is nearly all of it.
    samples.push(r.elapsedMs);
  }
  return summarise(samples);
}

function directCost(): Summary {
  const air = vanAir();
  const samples: number[] = [];
  for (let run = 0; run <= RUNS; run++) {
    const t0 = performance.now();
    for (let k = 0; k < ROWS; k++) nearWallCalls((60 + ((180 - 60) * k) / (ROWS - 1)) / 3.6, 5.9, air);
    if (run > 0) samples.push(performance.now() - t0); // the first is the warm-up
  }
  return summarise(samples);
}

const inputsSheet = (u: number) => `# Shared inputs\n\n\`\`\`basis\nU_inf = ${u} m/s\nL_ref = 4.2 m\n\`\`\`\n`;
const carSheet = (d: number) => `# Car\n\n\`\`\`basis\nuse "inputs.md"\nd_ref = ${d} m\nRe = U_inf * L_ref / (1.5e-5 m^2/s)\nk = d_ref * 2\n\`\`\`\n`;

async function liveCost(): Promise<{ used: Summary; direct: Summary }> {
  const dir = await mkdtemp(path.join(tmpdir(), 'wakesheet-bench-use-'));
  await writeFile(path.join(dir, 'inputs.md'), inputsSheet(30));
  await writeFile(path.join(dir, 'car.md'), carSheet(1));
  const runner = new TimedSandbox();
  const server = await startServer({ dir, port: 0, runner });
  const profile = await mkdtemp(path.join(tmpdir(), 'wakesheet-bench-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const used: number[] = [];
  const direct: number[] = [];
  try {
    const page = await context.newPage();
    await page.goto(server.url + 'sheet/car.md');
    await page.waitForSelector('[data-name="Re"]', { timeout: 60_000 });
    await page.waitForSelector('.live-status[data-state="live"]', { timeout: 60_000 });
    await page.evaluate('new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(() => setTimeout(r, 200))))');
    await page.evaluate(PROBE_SOURCE);
    const time = async (samples: number[], name: string, expected: number, write: () => Promise<void>) => {
      await page.evaluate(`window.benchExpect(${JSON.stringify(name)}, ${expected})`);
      const t0 = performance.timeOrigin + performance.now();
      await write();
      const { dom } = (await page.evaluate('window.benchSeen')) as { dom: number };
      samples.push(dom - t0);
      await new Promise((r) => setTimeout(r, 150)); // let the watcher's second look pass
    };
    // The two kinds of save take turns, so that load on the machine falls on each alike.
    for (let i = 1; i <= SAVES; i++) {
      const u = 30 + i / 100;
      await time(used, 'Re', (u * 4.2) / 1.5e-5, () => writeFile(path.join(dir, 'inputs.md'), inputsSheet(u)));
      const d = 1 + i / 100;
      await time(direct, 'k', d * 2, () => writeFile(path.join(dir, 'car.md'), carSheet(d)));
    }
  } finally {
    await context.close();
    await server.close();
    await runner.close();
    await rm(profile, { recursive: true, force: true });
    await rm(dir, { recursive: true, force: true });
  }
  return { used: summarise(used), direct: summarise(direct) };
}

export async function benchRerun(): Promise<RerunFigures> {
  const sweep = sweepCost();
  const direct = directCost();
  const live = existsSync(CHROMIUM) ? await liveCost() : null;
  if (!live) console.warn(`skipping the browser part: no Chromium at ${CHROMIUM}`);
  return { rows: ROWS, sweep, direct, usedSave: live?.used ?? null, directSave: live?.direct ?? null };
}

export function printRerun(f: RerunFigures): void {
  const row = (label: string, s: Summary | null) => console.log(`  ${label.padEnd(60)}${fmt(s?.median ?? NaN)} ${fmt(s?.p95 ?? NaN)} ${fmt(s?.min ?? NaN)} ${fmt(s?.max ?? NaN)}`);
  console.log('\nRe-runs (ms)                                                    median      p95      min      max');
  row(`sweep of ${f.rows.toLocaleString('en')} speeds through first cell, layers, checks`, f.sweep);
  row(`  the same trade functions called directly ${f.rows.toLocaleString('en')} times`, f.direct);
  row('live: save the used sheet → new value on the page that uses it', f.usedSave);
  row('live: save the sheet itself → new value on its page', f.directSave);
  const ratio = f.sweep.median / f.direct.median;
  console.log(`  sweep median ${f.sweep.median.toFixed(0)} ms (target < ${SWEEP_LIMIT_MS}); sweep / direct calls: ${ratio.toFixed(2)} (aim ≤ 2);  used / direct save p95: ${f.usedSave && f.directSave ? (f.usedSave.p95 / f.directSave.p95).toFixed(2) : 'n/a'}`);
}
