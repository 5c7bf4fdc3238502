// `npm run bench`: runs every benchmark and prints its figures. The raw
// figures also go to bench/out/ (not committed) for comparison between runs.
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { benchLive, printLive } from './live.js';
import { benchMemory, printMemory } from './memory.js';
import { benchFairness, printFairness } from './fairness.js';

const out = path.join(path.dirname(fileURLToPath(import.meta.url)), 'out');
// WAKESHEET_BENCH_PARTS=memory (or live, or a comma list) runs some of them.
const parts = (process.env.WAKESHEET_BENCH_PARTS ?? 'live,memory,fairness').split(',');
await mkdir(out, { recursive: true });
if (parts.includes('memory')) {
  const memory = benchMemory();
  printMemory(memory);
  await writeFile(path.join(out, 'memory.json'), JSON.stringify({ at: new Date().toISOString(), memory }, null, 2));
}
if (parts.includes('fairness')) {
  const fairness = await benchFairness();
  printFairness(fairness);
  await writeFile(path.join(out, 'fairness.json'), JSON.stringify({ at: new Date().toISOString(), fairness }, null, 2));
}
if (parts.includes('live')) {
  const live = await benchLive();
  printLive(live);
  await writeFile(path.join(out, 'live.json'), JSON.stringify({ at: new Date().toISOString(), live }, null, 2));
}
