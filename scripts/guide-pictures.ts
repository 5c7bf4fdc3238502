// The language guide's pictures of a failing check, an error and a stale
// value, made from the live page itself so that they show what a user sees:
// a small sheet is served from a temporary folder, opened in Debian's
// Chromium, broken on purpose while the page is open, and each state is
// cut out of the page as a PNG into worksheets/guide/pictures/.
//
//   node --import tsx scripts/guide-pictures.ts      (npm run guide:pictures)
import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { openChromium } from './chromium.js';
import { startServer } from '../server/serve/index.js';

const OUT = path.resolve('worksheets/guide/pictures');

const sheet = (speed: string, check: string) => `# Cabin at its wind limit

\`\`\`basis
U_wind = ${speed}          # operating wind limit across the line
L_cabin = 7.5 m            # cabin length along the wind
Re_cabin = U_wind * L_cabin / 1.5e-5 m^2/s
${check}
\`\`\`
`;
const GOOD = sheet('22 m/s', 'check U_wind <= 25 m/s "within the range the wind-tunnel campaign covered"');
const FAILING = sheet('28 m/s', 'check U_wind <= 25 m/s "within the range the wind-tunnel campaign covered"');
const BROKEN = sheet('22 m/s + 3 Pa', 'check U_wind <= 25 m/s "within the range the wind-tunnel campaign covered"');

const folder = await mkdtemp(path.join(tmpdir(), 'wakesheet-guide-'));
const file = path.join(folder, 'cabin.md');
await writeFile(file, GOOD);
const server = await startServer({ dir: folder, port: 0, host: '127.0.0.1', warn: () => {} });
const browser = await openChromium({ width: 760, height: 700 });
const context = browser.context;

/** Saves the sheet and waits until the page shows `expect` in its main part. */
async function save(page: Page, text: string, expect: string): Promise<void> {
  await writeFile(file, text);
  await page.waitForFunction((t) => document.querySelector('main')?.textContent?.includes(t) ?? false, expect, { timeout: 15_000 });
  await page.evaluate(() => document.fonts.ready);
}

/** The block part of the page (summary included when asked), as a PNG. */
async function shoot(page: Page, name: string, withSummary = false): Promise<void> {
  const block = page.locator('main [data-part]').filter({ has: page.locator('.katex') }).first();
  const target = withSummary ? page.locator('body') : block;
  await target.screenshot({ path: path.join(OUT, name) });
  console.log(`wrote worksheets/guide/pictures/${name}`);
}

try {
  await mkdir(OUT, { recursive: true });
  const page = context.pages()[0] ?? (await context.newPage());
  await page.goto(new URL('sheet/cabin.md', server.url).href, { waitUntil: 'networkidle' });
  await save(page, FAILING, 'fail');
  await shoot(page, 'failing-check.png');
  await save(page, GOOD, 'pass');
  await save(page, BROKEN, 'cannot add');
  await shoot(page, 'error-and-stale.png');
} finally {
  await browser.close();
  await server.close();
  await rm(folder, { recursive: true, force: true });
}
