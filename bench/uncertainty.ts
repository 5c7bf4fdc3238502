// Uncertainty benchmark: propagate() with 20,000 Monte Carlo samples through
// the near-wall plan's graph (speed and length, each uncertain, through the
// first cell, the boundary layer and the layer stack), evaluated by the
// engine, beside 20,000 direct calls of the same trade functions with the same
// sampled inputs (target: under 2 s; aim: within 3× of the direct calls).
import { performance } from 'node:perf_hooks';
import { SheetPipeline } from '../dist/server/index.js';
import { DEFAULT_LIMITS } from '../dist/server/evaluate/limits.js';
import { Xoshiro128 } from '../dist/server/evaluate/monte-carlo.js';
import { nearWallCalls, nearWallSheet, vanAir } from './near-wall.js';
import { fmt, summarise, type Summary } from './stats.js';

const SAMPLES = 20_000;
const RUNS = Number(process.env.WAKESHEET_BENCH_RUNS ?? 10);
export const PROPAGATE_LIMIT_MS = 2000;

export interface UncertaintyFigures {
  samples: number;
  /** The run of the sheet whose Monte Carlo statement changed (its seed), everything else cached. */
  propagate: Summary;
  /** The same trade functions called directly, once per sample. */
  direct: Summary;
}

const U0 = 110 / 3.6;
const uU = 5 / 3.6;
const L0 = 5.9;
const uL = 0.059;

/** The plan with the speed and the length uncertain; a new seed each run, so that none is served from the cache. */
function nearWall(seed: number): string {
  return nearWallSheet('110 km/h ± 5 km/h', '5.9 m ± 1 %', `mc = propagate(stack.total, samples: ${SAMPLES}, seed: ${seed})`);
}

function propagateCost(): Summary {
  // A time budget past the target, so that a slow run is measured rather than stopped.
  const pipeline = new SheetPipeline({ limits: { ...DEFAULT_LIMITS, timeoutMs: 30_000 } });
  pipeline.run(nearWall(1)); // warm: from here on only the Monte Carlo statement (and the first-order pass) runs again
  const samples: number[] = [];
  for (let i = 2; i <= RUNS + 1; i++) {
    const r = pipeline.run(nearWall(i));
    if (r.errors.length) throw new Error(`the benchmark sheet has errors: ${r.errors[0]!.message}`);
    samples.push(r.elapsedMs);
  }
  return summarise(samples);
}

function directCost(): Summary {
  const air = vanAir();
  const samples: number[] = [];
  for (let run = 0; run <= RUNS; run++) {
    const rng = new Xoshiro128(run + 2);
    const t0 = performance.now();
    for (let k = 0; k < SAMPLES; k++) nearWallCalls(U0 + uU * rng.normal(), L0 + uL * rng.normal(), air);
    if (run > 0) samples.push(performance.now() - t0); // the first is the warm-up
  }
  return summarise(samples);
}

export function benchUncertainty(): UncertaintyFigures {
  // Side by side in one run, in turns, so that load on the machine falls on both alike.
  const direct = directCost();
  const propagate = propagateCost();
  return { samples: SAMPLES, propagate, direct };
}

export function printUncertainty(f: UncertaintyFigures): void {
  const row = (label: string, s: Summary) => console.log(`  ${label.padEnd(60)}${fmt(s.median)} ${fmt(s.p95)} ${fmt(s.min)} ${fmt(s.max)}`);
  console.log('\nUncertainty (ms)                                                median      p95      min      max');
  row(`propagate(), ${f.samples.toLocaleString('en')} samples through first cell, layers`, f.propagate);
  row(`  the same trade functions called directly ${f.samples.toLocaleString('en')} times`, f.direct);
  console.log(`  propagate median ${f.propagate.median.toFixed(0)} ms (target < ${PROPAGATE_LIMIT_MS}); propagate / direct calls: ${(f.propagate.median / f.direct.median).toFixed(2)} (aim ≤ 3)`);
}
