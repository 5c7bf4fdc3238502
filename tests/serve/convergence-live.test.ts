// A solver writing its residual file while the page is open: the whole server
// (real sandbox) on 127.0.0.1 follows each write, and a last line still being
// written is left out with a remark, never shown as an error.
import { appendFile, readFile } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type RunningServer } from '../../server/serve/index.js';
import type { SheetUpdate } from '../../server/serve/protocol.js';
import { connect, makeFolder, type RecordingClient } from './helpers.js';

const SHEET = '# Run under way\n\n```basis\nres = residuals("data/run.csv", target_drop: 4, window: 20)\n```\n';
const HEADER = 'iteration,p,U\n';
/** Line of iteration n: both residuals fall steadily, p at 0.99 and U at 0.98 per iteration. */
const line = (n: number) => `${n},${(0.99 ** n).toExponential(5)},${(0.98 ** n).toExponential(5)}\n`;
const lines = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, k) => line(from + k)).join('');

let folder: { dir: string; remove: () => Promise<void> };
let server: RunningServer;
let follower: RecordingClient;
let version = 0;

beforeAll(async () => {
  folder = await makeFolder({ 'run.md': SHEET, 'data/run.csv': HEADER + lines(1, 40) });
  server = await startServer({ dir: folder.dir, port: 0, warn: () => {} });
  follower = await connect(server.url);
  follower.socket.send(JSON.stringify({ type: 'follow', target: 'sheet', sheet: 'run.md' }));
  const first = (await follower.next((m) => m.type === 'sheet' && m.parts.some((p) => p.html?.includes('data-name="res.iterations"')), 'the evaluated sheet')) as SheetUpdate;
  version = first.version;
}, 30_000);

afterAll(async () => {
  follower?.close();
  await server?.close();
  await folder?.remove();
});

/** The page as a new visitor gets it now. */
async function page(): Promise<string> {
  const res = await fetch(`${server.url}sheet/run.md`);
  return res.text();
}

function iterationsShown(html: string): number {
  const m = /data-name="res\.iterations" data-si="(\d+)"/.exec(html);
  if (!m) throw new Error('the page shows no res.iterations');
  return Number(m[1]);
}

/** Waits for the frame that follows a write, and returns the page it leaves. */
async function followed(what: string): Promise<{ frame: SheetUpdate; html: string }> {
  const frame = (await follower.next((m) => m.type === 'sheet' && m.version > version, what)) as SheetUpdate;
  version = frame.version;
  return { frame, html: await page() };
}

function expectNoError(html: string): void {
  expect(html).not.toContain('class="ws-error"');
  expect(html).not.toContain('ws-last-good');
}

describe('a residual file that grows while the page is open', () => {
  it('shows the file as it starts', async () => {
    const html = await page();
    expect(iterationsShown(html)).toBe(40);
    expectNoError(html);
  });

  it('follows each write, and waits for the line end of a half-written last line', async () => {
    await appendFile(path.join(folder.dir, 'data/run.csv'), lines(41, 50));
    let step = await followed('the patch after ten lines');
    expect(iterationsShown(step.html)).toBe(50);
    // The patch itself carries the new count, as html or as an attribute edit.
    expect(JSON.stringify(step.frame.parts)).toMatch(/data-si=\\"50\\"|"data-si","50"/);
    expectNoError(step.html);

    // The solver has written half of iteration 51, up to inside a number.
    await appendFile(path.join(folder.dir, 'data/run.csv'), '51,6.0501e-1,3.5');
    step = await followed('the patch after a half-written line');
    expect(iterationsShown(step.html)).toBe(50);
    expect(step.html).toContain('has no line end yet, so it is left out');
    expectNoError(step.html);

    // The rest of the line arrives, and one more.
    await appendFile(path.join(folder.dir, 'data/run.csv'), '701e-1\n' + line(52));
    step = await followed('the patch after the line end');
    expect(iterationsShown(step.html)).toBe(52);
    expect(step.html).not.toContain('has no line end yet');
    expectNoError(step.html);
  }, 30_000);

  it('never shows an error while a file is written in pieces cut anywhere', async () => {
    const file = path.join(folder.dir, 'data/run.csv');
    const start = await readFile(file, 'utf8');
    const all = start + lines(53, 160);
    let written = start.length;
    // Each piece is longer than a line, so every write ends at least one more line;
    // the cuts fall inside numbers, after a delimiter, inside an exponent, at line ends.
    for (const cut of [7, 23, 31, 3, 40, 19, 55, 13]) {
      const upTo = Math.min(all.length, written + cut * 11);
      await appendFile(file, all.slice(written, upTo));
      written = upTo;
      const { html } = await followed(`the write up to character ${upTo}`);
      const complete = all.slice(0, written).split('\n').length - 2; // lines ended, less the header
      expect(iterationsShown(html)).toBe(complete);
      expectNoError(html);
      expect(html.includes('has no line end yet')).toBe(!all.slice(0, written).endsWith('\n'));
    }
  }, 60_000);
});
