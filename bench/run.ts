// `npm run bench`: runs every benchmark and prints its figures. The raw
// figures also go to bench/out/ (not committed) for comparison between runs.
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { benchConvergence, printConvergence } from './convergence.js';
import { benchDomain, printDomain } from './domain.js';
import { benchLive, printLive } from './live.js';

const out = path.join(path.dirname(fileURLToPath(import.meta.url)), 'out');
// WAKESHEET_BENCH_ONLY=live, =domain or =convergence runs one of them (live also takes =demo and =large).
const only = process.env.WAKESHEET_BENCH_ONLY;
const runs = (name: string, ...aliases: string[]) => !only || only === name || aliases.includes(only);
await mkdir(out, { recursive: true });
const save = (name: string, figures: unknown) => writeFile(path.join(out, `${name}.json`), JSON.stringify({ at: new Date().toISOString(), [name]: figures }, null, 2));
if (runs('live', 'demo', 'large')) {
  const live = await benchLive();
  printLive(live);
  await save('live', live);
}
if (runs('domain')) {
  const domain = await benchDomain();
  printDomain(domain);
  await save('domain', domain);
}
if (runs('convergence')) {
  const convergence = await benchConvergence();
  printConvergence(convergence);
  await save('convergence', convergence);
}
