// Fairness benchmark: while one sheet takes its whole time budget (formulas
// that take long to typeset), how long does a save of another, small sheet
// take to reach its page? With one evaluator the small sheet waits its turn;
// with the server's two it does not. Measured over a WebSocket on loopback.
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { WebSocket } from 'ws';
import { SandboxPool } from '../dist/server/sandbox/pool.js';
import { Sandbox } from '../dist/server/sandbox/sandbox.js';
import { startServer, type SheetRunner } from '../dist/server/serve/index.js';
import { summarise, type Summary } from './stats.js';

const ROUNDS = Number(process.env.WAKESHEET_BENCH_ROUNDS ?? 5);

/** Twenty sums of 1,500 terms: each takes a few hundred ms to typeset. */
function slowSheet(round: number): string {
  const lines = Array.from({ length: 20 }, (_, k) => `s_${k} = ${Array(1500).fill('y').join('+')} + ${round}`);
  return '# Slow\n\n```basis\ny = 2\n' + lines.join('\n') + '\n```\n';
}

const quickSheet = (u: number) => `# Quick\n\n\`\`\`basis\nU = ${u} m/s\nRe = U * 2 m / 1.5e-5 m^2/s\n\`\`\`\n`;

export interface FairnessFigures {
  lanes: number;
  /** Save of the small sheet → its new value over the WebSocket, while the slow sheet evaluates. */
  quickSave: Summary;
}

async function measure(runner: SheetRunner, lanes: number): Promise<FairnessFigures> {
  const dir = await mkdtemp(path.join(tmpdir(), 'wakesheet-fair-'));
  await writeFile(path.join(dir, 'slow.md'), slowSheet(0));
  await writeFile(path.join(dir, 'quick.md'), quickSheet(10));
  const server = await startServer({ dir, port: 0, runner });
  const socket = new WebSocket(server.url.replace(/^http/, 'ws') + 'live');
  let seen: ((html: string) => void) | null = null;
  socket.on('message', (data) => seen?.(data.toString()));
  await new Promise((r) => socket.once('open', r));
  socket.send(JSON.stringify({ type: 'follow', target: 'sheet', sheet: 'quick.md' }));
  const samples: number[] = [];
  try {
    await new Promise((r) => setTimeout(r, 4000)); // both sheets evaluated once (the slow one to its limit)
    for (let round = 1; round <= ROUNDS; round++) {
      await writeFile(path.join(dir, 'slow.md'), slowSheet(round));
      await new Promise((r) => setTimeout(r, 150)); // the slow sheet is now being evaluated
      const u = 10 + round;
      const arrived = new Promise<number>((resolve) => {
        seen = (frame) => {
          // As html, or as an edit of the attribute (JSON-escaped inside the frame).
          if (frame.includes(`data-si=\\"${u}\\"`) || frame.includes(`"data-si","${u}"`)) resolve(performance.now());
        };
      });
      const t0 = performance.now();
      await writeFile(path.join(dir, 'quick.md'), quickSheet(u));
      samples.push((await arrived) - t0);
      await new Promise((r) => setTimeout(r, 3000)); // let the slow sheet finish its run
    }
  } finally {
    socket.terminate();
    await server.close();
    await runner.close();
    await rm(dir, { recursive: true, force: true });
  }
  return { lanes, quickSave: summarise(samples) };
}

export async function benchFairness(): Promise<FairnessFigures[]> {
  return [await measure(new Sandbox({ timeoutMs: 2000 }), 1), await measure(new SandboxPool(2, { timeoutMs: 2000 }), 2)];
}

export function printFairness(figures: FairnessFigures[]): void {
  console.log('\nA small sheet saved while another takes its whole time budget (ms)   median      p95      min      max');
  for (const f of figures) {
    const s = f.quickSave;
    console.log(`  ${f.lanes === 1 ? 'one evaluator' : `${f.lanes} evaluators (the server's default)`}`.padEnd(66) + [s.median, s.p95, s.min, s.max].map((x) => x.toFixed(1).padStart(8)).join(' '));
  }
}
