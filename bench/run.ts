// `npm run bench`: runs every benchmark and prints its figures. The raw
// figures also go to bench/out/ (not committed) for comparison between runs.
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { benchColdStart, printColdStart } from './cold-start.js';
import { benchLive, printLive } from './live.js';

const out = path.join(path.dirname(fileURLToPath(import.meta.url)), 'out');
const coldStart = benchColdStart();
printColdStart(coldStart);
const live = await benchLive();
printLive(live);
await mkdir(out, { recursive: true });
await writeFile(path.join(out, 'live.json'), JSON.stringify({ at: new Date().toISOString(), live, coldStart }, null, 2));
