// Cold start of the command line: `wakesheet eval` of the demo sheet against
// `node -e 0`, measured side by side in one run (alternating, after warm-up
// runs, median of many), as a script or a pre-commit hook calls it. The goal
// is eval within 3× node's own start. Runs the compiled CLI (bin/ → dist/).
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { fmt, summarise, type Summary } from './stats.js';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const RUNS = Number(process.env.WAKESHEET_BENCH_STARTS ?? 30);
const WARMUP = 3;
const GOAL = 3;

export interface ColdStartFigures {
  node: Summary;
  evalDemo: Summary;
  /** Median of eval over median of node -e 0. */
  ratio: number;
  goal: number;
}

function wallMs(args: string[]): number {
  const t0 = performance.now();
  const r = spawnSync(process.execPath, args, { cwd: ROOT, stdio: ['ignore', 'ignore', 'pipe'] });
  const ms = performance.now() - t0;
  if (r.status !== 0) throw new Error(`node ${args.join(' ')} exited ${r.status}: ${r.stderr.toString()}`);
  return ms;
}

export function benchColdStart(): ColdStartFigures {
  const node = ['-e', '0'];
  const evalDemo = [path.join('bin', 'wakesheet.js'), 'eval', path.join('worksheets', 'van-and-towed-body.md')];
  for (let i = 0; i < WARMUP; i++) wallMs(node), wallMs(evalDemo);
  const a: number[] = [];
  const b: number[] = [];
  // Alternating, so a busy moment of the machine falls on both alike.
  for (let i = 0; i < RUNS; i++) {
    a.push(wallMs(node));
    b.push(wallMs(evalDemo));
  }
  const n = summarise(a);
  const e = summarise(b);
  return { node: n, evalDemo: e, ratio: e.median / n.median, goal: GOAL };
}

export function printColdStart(f: ColdStartFigures): void {
  console.log(`\nCold start, wall clock (ms, ${f.node.n} runs each)      median      p95      min      max`);
  const row = (label: string, s: Summary) => console.log(`  ${label.padEnd(44)}${fmt(s.median)} ${fmt(s.p95)} ${fmt(s.min)} ${fmt(s.max)}`);
  row('node -e 0', f.node);
  row('wakesheet eval worksheets/van-and-towed-body.md', f.evalDemo);
  console.log(`  eval / node: ${f.ratio.toFixed(2)}× (goal: within ${f.goal}×)`);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) printColdStart(benchColdStart());
