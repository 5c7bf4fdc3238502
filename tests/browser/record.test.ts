// The set-up record opened as a reader years later would: from disk, with
// every request blocked and counted. And the live page's link to it.
import { mkdtemp, readFile, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { renderSheet } from '../../server/pipeline/index.js';
import { readRecord, recordData, recordPage } from '../../server/pipeline/record.js';
import { startServer } from '../../server/serve/index.js';
import { makeFolder } from '../serve/helpers.js';
import { describeInBrowser, launchBrowser, type Browser } from './launch.js';
import { wingSheet } from './sheets.js';

describeInBrowser('the set-up record in Chromium', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('opens from disk with no request of any kind, its formulas in KaTeX fonts and its figures drawn', async () => {
    const dir = await mkdtemp(path.join(tmpdir(), 'ws-record-browser-'));
    const sheet = wingSheet('12 m/s', '```basis\nstack = layer_stack(first: 20 um, growth: 1.2, count: 12)\n```\n');
    const file = path.join(dir, 'wing.md');
    await writeFile(file, sheet);
    const r = await renderSheet(sheet, { path: file, root: dir });
    const record = path.join(dir, 'wing-record.html');
    await writeFile(record, recordPage(r, recordData(r, { source: sheet, path: file, root: dir })));
    const url = `file://${record}`;
    const page = await browser.context.newPage();
    const requests: string[] = [];
    await page.route('**/*', (route) => {
      if (route.request().url() === url) return route.continue();
      requests.push(route.request().url());
      return route.abort();
    });
    page.on('request', (req) => {
      if (req.url() !== url && !requests.includes(req.url())) requests.push(req.url());
    });
    await page.goto(url);
    const state = await page.evaluate(async () => {
      await document.fonts.ready;
      return {
        katex: document.fonts.check('16px KaTeX_Main') && [...document.fonts].some((f) => f.family === 'KaTeX_Main' && f.status === 'loaded'),
        formulas: document.querySelectorAll('.katex').length,
        figure: document.querySelector('figure svg') instanceof SVGSVGElement && document.querySelector('figure svg')!.getBoundingClientRect().height > 100,
        provenance: document.querySelector('.ws-provenance h2')?.textContent,
      };
    });
    expect(requests).toEqual([]);
    expect(state).toEqual({ katex: true, formulas: expect.any(Number), figure: true, provenance: 'Set-up record' });
    expect(state.formulas).toBeGreaterThan(5);
    await page.close();
  });

  it('downloads from the live page\'s link as the record `wakesheet render` writes', async () => {
    const folder = await makeFolder({ 'wing.md': wingSheet('12 m/s') });
    const server = await startServer({ dir: folder.dir, port: 0 });
    try {
      const page = await browser.context.newPage();
      await page.goto(server.url + 'sheet/wing.md');
      const href = await page.getAttribute('a.live-record', 'href');
      expect(href).toBe('/record/wing.md');
      const download = await Promise.all([page.waitForEvent('download'), page.click('a.live-record')]).then(([d]) => d);
      expect(download.suggestedFilename()).toBe('wing-record.html');
      const data = readRecord(await readFile((await download.path())!, 'utf8'))!;
      expect(data.sources[0]!.text).toBe(wingSheet('12 m/s'));
      expect(data.values.U_inf!.si).toBe(12);
      await page.close();
    } finally {
      await server.close();
      await folder.remove();
    }
  });
});
