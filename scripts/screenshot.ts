// Pictures of the live page, made again after any change: starts the server
// on the bundled worksheets (or DIR), opens one sheet in Debian's Chromium and
// writes a PNG (or, with --print, the A4 print-out as a PDF).
//
//   node --import tsx scripts/screenshot.ts [SHEET] [-o OUT] [--dir DIR] [--width N] [--height N] [--full] [--at TEXT] [--print]
//
// --at scrolls the first element of the sheet itself that shows TEXT to the top of the
// window (the summary above the sheet repeats failing checks' labels: it is passed over).
//
// The default is the README's picture: the near-wall plan at 1280 px, written
// to docs/live-page.png.
import path from 'node:path';
import { existsSync } from 'node:fs';
import { mkdir } from 'node:fs/promises';
import { openChromium } from './chromium.js';
import { sheetUrl, startServer } from '../server/serve/index.js';

const args = process.argv.slice(2);
const flag = (name: string) => args.includes(name);
const option = (name: string, fallback: string) => {
  const i = args.indexOf(name);
  return i >= 0 && args[i + 1] ? args[i + 1]! : fallback;
};
const valued = new Set(['-o', '--dir', '--width', '--height', '--at']);
const USAGE = 'usage: npm run screenshot -- [SHEET] [-o OUT] [--dir DIR] [--width N] [--height N] [--full] [--at TEXT] [--print]';
if (flag('--help') || flag('-h')) {
  process.stdout.write(USAGE + '\n');
  process.exit(0);
}
// An unknown flag must not fall back to overwriting the README's picture.
const unknown = args.filter((a, i) => a.startsWith('-') && !valued.has(a) && !['--full', '--print'].includes(a) && !valued.has(args[i - 1] ?? ''));
if (unknown.length) {
  process.stderr.write(`unknown option ${unknown.join(', ')}\n${USAGE}\n`);
  process.exit(2);
}
const given = args.find((a, i) => !a.startsWith('-') && !valued.has(args[i - 1] ?? '')) ?? 'van-near-wall.md';
// SHEET is read inside DIR; without --dir, a path to a sheet elsewhere serves that sheet's folder.
const ownFile = !args.includes('--dir') && !existsSync(path.join('worksheets', given)) && existsSync(given);
const dir = ownFile ? path.dirname(path.resolve(given)) : option('--dir', 'worksheets');
const sheet = ownFile ? path.basename(given) : given;
// A picture of the "no such sheet" page is never what was asked for.
if (!existsSync(path.join(dir, sheet))) {
  process.stderr.write(`no sheet ${sheet} in ${dir}\n${USAGE}\n`);
  process.exit(2);
}
const print = flag('--print');
const out = path.resolve(option('-o', print ? 'docs/live-page.pdf' : 'docs/live-page.png'));
const width = Number(option('--width', '1280'));
const height = Number(option('--height', '900'));

const server = await startServer({ dir, port: 0, host: '127.0.0.1', warn: () => {} });
const browser = await openChromium({ width, height });
const context = browser.context;
try {
  const page = context.pages()[0] ?? (await context.newPage());
  await page.goto(new URL(sheetUrl(sheet.split(path.sep).join('/')), server.url).href, { waitUntil: 'networkidle' });
  await page.evaluate(() => document.fonts.ready);
  const at = option('--at', '');
  if (at) {
    const found = page.locator('main').getByText(at).first();
    // Text typeset as mathematics (a name such as Re_mast) is not page text: say so rather than time out.
    if ((await found.count()) === 0) throw new Error(`no text "${at}" on the sheet (--at looks for words on the page, such as a label or a description, not a name typeset as mathematics)`);
    await found.evaluate((el) => el.scrollIntoView({ block: 'start' }));
  }
  await mkdir(path.dirname(out), { recursive: true });
  if (print) await page.pdf({ path: out, format: 'A4', printBackground: true });
  else await page.screenshot({ path: out, fullPage: flag('--full') });
  console.log(`wrote ${path.relative(process.cwd(), out)}`);
} catch (e) {
  process.stderr.write(`${(e as Error).message}\n`);
  process.exitCode = 2;
} finally {
  await browser.close();
  await server.close();
}
