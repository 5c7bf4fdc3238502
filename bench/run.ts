// `npm run bench`: runs every benchmark and prints its figures. The raw
// figures also go to bench/out/ (not committed) for comparison between runs.
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { benchColdStart, printColdStart } from './cold-start.js';
import { benchConvergence, printConvergence } from './convergence.js';
import { benchDomain, printDomain } from './domain.js';
import { benchRerun, printRerun } from './rerun.js';
import { benchLive, printLive } from './live.js';
import { benchMemory, printMemory } from './memory.js';
import { benchFairness, printFairness } from './fairness.js';
import { benchUncertainty, printUncertainty } from './uncertainty.js';

const out = path.join(path.dirname(fileURLToPath(import.meta.url)), 'out');
// WAKESHEET_BENCH_ONLY picks some of them, as a comma list: live (or demo, or
// large, its two sheets), start, domain, convergence, rerun, uncertainty, memory, fairness.
const only = process.env.WAKESHEET_BENCH_ONLY?.split(',');
const runs = (name: string, ...aliases: string[]) => !only || only.includes(name) || aliases.some((a) => only.includes(a));
await mkdir(out, { recursive: true });
const save = (name: string, figures: unknown) => writeFile(path.join(out, `${name}.json`), JSON.stringify({ at: new Date().toISOString(), [name]: figures }, null, 2));
if (runs('start')) {
  const coldStart = benchColdStart();
  printColdStart(coldStart);
  await save('coldStart', coldStart);
}
if (runs('memory')) {
  const memory = benchMemory();
  printMemory(memory);
  await save('memory', memory);
}
if (runs('fairness')) {
  const fairness = await benchFairness();
  printFairness(fairness);
  await save('fairness', fairness);
}
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
if (runs('rerun')) {
  const rerun = await benchRerun();
  printRerun(rerun);
  await save('rerun', rerun);
}
if (runs('uncertainty')) {
  const uncertainty = benchUncertainty();
  printUncertainty(uncertainty);
  await save('uncertainty', uncertainty);
}
