// `npm run bench`: runs every benchmark and prints its figures. The raw
// figures also go to bench/out/ (not committed) for comparison between runs.
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { benchConvergence, printConvergence } from './convergence.js';
import { benchLive, printLive } from './live.js';

const out = path.join(path.dirname(fileURLToPath(import.meta.url)), 'out');
// WAKESHEET_BENCH_ONLY=demo, =large or =convergence runs one of them.
const only = process.env.WAKESHEET_BENCH_ONLY;
await mkdir(out, { recursive: true });
if (only !== 'convergence') {
  const live = await benchLive();
  printLive(live);
  await writeFile(path.join(out, 'live.json'), JSON.stringify({ at: new Date().toISOString(), live }, null, 2));
}
if (!only || only === 'convergence') {
  const convergence = await benchConvergence();
  printConvergence(convergence);
  await writeFile(path.join(out, 'convergence.json'), JSON.stringify({ at: new Date().toISOString(), convergence }, null, 2));
}
