// The live page in real Chromium against the real server on 127.0.0.1.
import { createServer } from 'node:http';
import { rename, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, expect, it } from 'vitest';
import { SandboxPool } from '../../server/sandbox/pool.js';
import { startServer, type RunningServer, type ServeOptions } from '../../server/serve/index.js';
import { makeFolder, put } from '../serve/helpers.js';
import { describeInBrowser, launchBrowser, REBIND_HOST, type Browser } from './launch.js';
import { valueShown, waitForStatus, waitForValue } from './probes.js';
import { RUNAWAY, SandboxWithFaults, SLOW, UnsanitisedRunner, wingSheet } from './sheets.js';


describeInBrowser('live sheet page', () => {
  let browser: Browser;
  let cleanup: (() => Promise<void>)[] = [];
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  afterEach(async () => {
    for (const c of cleanup.reverse()) await c();
    cleanup = [];
  });

  async function serveFolder(files: Record<string, string>, options: Partial<ServeOptions> = {}) {
    const folder = await makeFolder(files);
    cleanup.push(folder.remove);
    const server = await startServer({ dir: folder.dir, port: 0, ...options });
    cleanup.push(() => server.close());
    return { dir: folder.dir, server };
  }

  async function openPage(url: string): Promise<Page> {
    const page = await browser.context.newPage();
    cleanup.push(() => page.close());
    const response = await page.goto(url);
    expect(response?.status()).toBe(200);
    return page;
  }

  it('shows a change saved on disk without reloading the page', async () => {
    const { dir, server } = await serveFolder({ 'wing.md': wingSheet('12 m/s') });
    const page = await openPage(server.url + 'sheet/wing.md');
    await waitForValue(page, 'U_inf', 12);
    await waitForStatus(page, 'live');
    await page.evaluate(() => ((window as unknown as { loadedOnce: boolean }).loadedOnce = true));

    await writeFile(path.join(dir, 'wing.md'), wingSheet('13.5 m/s'));
    await waitForValue(page, 'U_inf', 13.5);
    expect(await page.evaluate(() => (window as unknown as { loadedOnce?: boolean }).loadedOnce)).toBe(true);
    // The result follows the input: Re = U_inf L / nu.
    await waitForValue(page, 'Re', (13.5 * 4.2) / 1.47e-5);
    await waitForStatus(page, 'live');
    expect(await page.textContent('.live-status')).toMatch(/updated \d/);
  });

  it('re-pushes a sheet when a sheet it uses is saved, and links each used name to its definition', async () => {
    const inputs = (u: string) => `# Inputs\n\n\`\`\`basis\nU_inf = ${u}\nL_ref = 4.2 m\n\`\`\`\n`;
    const car = '# Car\n\n```basis\nuse "inputs.md" (U_inf, L_ref)\nRe = U_inf * L_ref / (1.5e-5 m^2/s)\n```\n';
    const { dir, server } = await serveFolder({ 'inputs.md': inputs('30 m/s'), 'car.md': car });
    const page = await openPage(server.url + 'sheet/car.md');
    await waitForValue(page, 'Re', (30 * 4.2) / 1.5e-5);
    await waitForStatus(page, 'live');
    await page.evaluate(() => ((window as unknown as { loadedOnce: boolean }).loadedOnce = true));
    await writeFile(path.join(dir, 'inputs.md'), inputs('12 m/s'));
    await waitForValue(page, 'Re', (12 * 4.2) / 1.5e-5);
    expect(await page.evaluate(() => (window as unknown as { loadedOnce?: boolean }).loadedOnce)).toBe(true);
    expect(await page.textContent('.ws-use')).toContain('12 m/s');
    await page.click('a.ws-used-name[href$="#v-U_inf"]');
    await page.waitForURL(/\/sheet\/inputs\.md#v-U_inf$/);
    await waitForValue(page, 'U_inf', 12);
  });

  it('says it is evaluating while a slow sheet runs, and not for a quick one', async () => {
    const { dir, server } = await serveFolder({ 'wing.md': wingSheet('12 m/s') }, { runner: new SandboxWithFaults() });
    const page = await openPage(server.url + 'sheet/wing.md');
    await waitForStatus(page, 'live');
    await page.evaluate(() => {
      const w = window as unknown as { states: string[] };
      w.states = [];
      const status = document.querySelector('.live-status') as HTMLElement;
      new MutationObserver(() => w.states.push(status.dataset.state!)).observe(status, { attributes: true });
    });
    const states = () => page.evaluate(() => (window as unknown as { states: string[] }).states);

    await writeFile(path.join(dir, 'wing.md'), wingSheet('13 m/s'));
    await waitForValue(page, 'U_inf', 13);
    expect(await states()).not.toContain('evaluating'); // a quick evaluation does not flash the status

    await writeFile(path.join(dir, 'wing.md'), wingSheet('14 m/s', SLOW));
    await waitForStatus(page, 'evaluating');
    await waitForValue(page, 'U_inf', 14);
    await waitForStatus(page, 'live');
  });

  it('shows how far a long Monte Carlo run has come while it runs, then its result', async () => {
    const plan = (samples: number) =>
      `# Plan\n\n\`\`\`basis\nU = 30 m/s ± 1.5 m/s\nfc = first_cell(U, 4 m, air(T: 20 degC), yplus: 1)\nh = fc.height\nmc = propagate(h, samples: ${samples}, seed: 2)\n\`\`\`\n`;
    // A time budget long enough for the run on a busy machine; the run itself takes about a second.
    const runner = new SandboxPool(1, { timeoutMs: 60000 });
    cleanup.push(() => runner.close());
    const { dir, server } = await serveFolder({ 'plan.md': plan(100) }, { runner });
    const page = await openPage(server.url + 'sheet/plan.md');
    await waitForStatus(page, 'live');
    await page.evaluate(() => {
      const w = window as unknown as { said: string[] };
      w.said = [];
      const status = document.querySelector('.live-status') as HTMLElement;
      new MutationObserver(() => w.said.push(status.textContent ?? '')).observe(status, { childList: true, subtree: true, characterData: true });
    });
    // Enough samples to take well past the moment after which the server tells its progress.
    await writeFile(path.join(dir, 'plan.md'), plan(100000));
    await page.waitForFunction(() => (window as unknown as { said: string[] }).said.some((t) => /line 7: [\d,]+ of 100,000 \(\d+ %\)/.test(t)), undefined, { timeout: 30000 });
    await page.waitForFunction(() => /100,000 samples/.test(document.querySelector('[data-name="mc"]')?.textContent ?? ''), undefined, { timeout: 60000 });
    await waitForStatus(page, 'live');
  }, 90000);

  it('keeps the scroll position and opened details across an update', async () => {
    const filler = Array.from({ length: 60 }, (_, i) => `Paragraph ${i} about the mesh, the far field and the wake.`).join('\n\n');
    const sheet = (speed: string) => wingSheet(speed, `${filler}\n\n<details><summary>Mesh notes</summary>\n\nTen cells across the layer.\n\n</details>\n\nEnd.`);
    const { dir, server } = await serveFolder({ 'wing.md': sheet('12 m/s') });
    const page = await openPage(server.url + 'sheet/wing.md');
    await page.setViewportSize({ width: 900, height: 500 });
    await waitForStatus(page, 'live');
    await page.click('summary:text("Mesh notes")');
    await page.evaluate(() => window.scrollTo(0, document.body.scrollHeight));
    const before = await page.evaluate(() => window.scrollY);
    expect(before).toBeGreaterThan(1000);

    await writeFile(path.join(dir, 'wing.md'), sheet('14 m/s'));
    await waitForValue(page, 'U_inf', 14);
    expect(await page.evaluate(() => document.querySelector('details')!.open)).toBe(true);
    expect(Math.abs((await page.evaluate(() => window.scrollY)) - before)).toBeLessThan(3);
  });

  it('lays the whole sheet out once updates pause, so that it prints and is captured whole', async () => {
    const filler = Array.from({ length: 80 }, (_, i) => `Paragraph ${i} about the mesh, the far field and the wake.`).join('\n\n');
    const { dir, server } = await serveFolder({ 'wing.md': wingSheet('12 m/s', `${filler}\n\n\`\`\`basis\nlast = 2 * U_inf\n\`\`\`\n`) });
    const page = await openPage(server.url + 'sheet/wing.md');
    await page.setViewportSize({ width: 900, height: 500 });
    await waitForStatus(page, 'live');
    // Asked after two frames: a change of content-visibility shows in the next rendering update.
    const partsShown = () =>
      page.evaluate(async () => {
        await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
        return [...document.querySelectorAll('main .live-part')].every((p) => !p.firstElementChild || p.firstElementChild.checkVisibility({ contentVisibilityAuto: true }));
      });
    expect(await partsShown()).toBe(true);
    await writeFile(path.join(dir, 'wing.md'), wingSheet('14 m/s', `${filler}\n\n\`\`\`basis\nlast = 2 * U_inf\n\`\`\`\n`));
    await waitForValue(page, 'last', 28);
    await page.waitForFunction(() => document.querySelector('main')!.classList.contains('live-updating'));
    await page.emulateMedia({ media: 'print' });
    expect(await partsShown()).toBe(true); // printed whole even in the middle of updates
    await page.emulateMedia({ media: 'screen' });
    // While updates come in, parts far out of view may be skipped; once they pause, none is.
    await page.waitForFunction(() => !document.querySelector('main')!.classList.contains('live-updating'), null, { timeout: 5000 });
    expect(await partsShown()).toBe(true);
  });

  it('keeps the paragraph being read in place while the summary above it grows and shrinks', async () => {
    const filler = Array.from({ length: 40 }, (_, i) => `Paragraph ${i} about the mesh, the far field and the wake.`).join('\n\n');
    const { dir, server } = await serveFolder({ 'wing.md': wingSheet('12 m/s', filler) });
    const page = await openPage(server.url + 'sheet/wing.md');
    await page.setViewportSize({ width: 900, height: 500 });
    await waitForStatus(page, 'live');
    const topOf = () => page.evaluate(() => [...document.querySelectorAll('main p')].find((p) => p.textContent === 'Paragraph 20 about the mesh, the far field and the wake.')!.getBoundingClientRect().top);
    await page.evaluate(() => [...document.querySelectorAll('main p')].find((p) => p.textContent!.startsWith('Paragraph 20 '))!.scrollIntoView());
    const before = await topOf();

    // A broken input: the summary above gains an error list, the block an error box.
    await writeFile(path.join(dir, 'wing.md'), wingSheet('12 m/s + 1 Pa', filler));
    await page.waitForSelector('main .ws-error');
    expect(Math.abs((await topOf()) - before)).toBeLessThan(3);
    await writeFile(path.join(dir, 'wing.md'), wingSheet('12 m/s', filler));
    await page.waitForSelector('main .ws-error', { state: 'detached' });
    expect(Math.abs((await topOf()) - before)).toBeLessThan(3);
  });

  it('keeps the last good content, marked stale, while evaluation fails, and recovers', async () => {
    const { dir, server } = await serveFolder({ 'wing.md': wingSheet('12 m/s') }, { runner: new SandboxWithFaults() });
    const page = await openPage(server.url + 'sheet/wing.md');
    await waitForStatus(page, 'live');

    await writeFile(path.join(dir, 'wing.md'), wingSheet('20 m/s', RUNAWAY));
    await page.waitForSelector('.live-notice:not([hidden])');
    expect(await page.textContent('.live-notice')).toContain('evaluation timed out after 2000 ms');
    expect(await page.getAttribute('main', 'class')).toContain('ws-stale');
    expect(await valueShown(page, 'U_inf')).toBe(12); // the last good values stay visible

    await writeFile(path.join(dir, 'wing.md'), wingSheet('21 m/s'));
    await waitForValue(page, 'U_inf', 21);
    expect(await page.isHidden('.live-notice')).toBe(true);
    expect(await page.getAttribute('main', 'class')).not.toContain('ws-stale');
  });

  it('shows an engine error in place with its line, keeps the rest, and recovers', async () => {
    const { dir, server } = await serveFolder({ 'wing.md': wingSheet('12 m/s') });
    const page = await openPage(server.url + 'sheet/wing.md');
    await waitForStatus(page, 'live');
    // Line 9 of the file: "U_inf = 12 m/s +" is cut short.
    await writeFile(path.join(dir, 'wing.md'), wingSheet('12 m/s +'));
    const error = await page.waitForSelector('main .ws-error');
    expect(await error.textContent()).toContain('line 9');
    expect(await valueShown(page, 'L')).toBe(4.2); // statements that do not depend on it still show
    // What depends on it keeps its last good value in view, marked stale: Re = 12 × 4.2 / 1.47e-5.
    expect(await page.textContent('main [data-name="Re"] .ws-blocked')).toMatch(/waiting on U_inf, line \d+ · last good value 3\.429×10⁶ stale/i);
    expect(await valueShown(page, 'Re')).toBeNull(); // and does not pass for a current value
    await writeFile(path.join(dir, 'wing.md'), wingSheet('15 m/s'));
    await page.waitForSelector('main .ws-error', { state: 'detached' });
    await waitForValue(page, 'Re', (15 * 4.2) / 1.47e-5);
  });

  it('reconnects by itself after the server restarts, and catches up', async () => {
    const folder = await makeFolder({ 'wing.md': wingSheet('12 m/s') });
    cleanup.push(folder.remove);
    let server: RunningServer = await startServer({ dir: folder.dir, port: 0 });
    cleanup.push(() => server.close());
    const page = await openPage(server.url + 'sheet/wing.md');
    await waitForStatus(page, 'live');

    await server.close();
    await waitForStatus(page, 'offline');
    // Changed while the server was down: the page must pick it up on reconnect.
    await writeFile(path.join(folder.dir, 'wing.md'), wingSheet('16 m/s'));
    server = await startServer({ dir: folder.dir, port: server.port });
    await waitForStatus(page, 'live');
    await waitForValue(page, 'U_inf', 16);

    await writeFile(path.join(folder.dir, 'wing.md'), wingSheet('17 m/s'));
    await waitForValue(page, 'U_inf', 17);
  });

  const attack = (n: number) =>
    `<script>window.pwned = "script ${n}"</script>\n\n<img src="nowhere.png" onerror="window.pwned = 'img ${n}'">\n\n` +
    `<svg><image href="x" onerror="window.pwned='svg ${n}'"></image></svg>\n\n<a href="javascript:void(window.pwned='link ${n}')" id="bad${n}">link</a>\n\nmarker ${n}`;

  async function expectNoScriptRuns(options: Partial<ServeOptions>) {
    const { dir, server } = await serveFolder({ 'wing.md': wingSheet('12 m/s', attack(1)) }, options);
    const page = await openPage(server.url + 'sheet/wing.md');
    await waitForStatus(page, 'live');
    await writeFile(path.join(dir, 'wing.md'), wingSheet('12 m/s', attack(2)));
    await page.waitForFunction(() => document.querySelector('main')!.textContent!.includes('marker 2'));
    await page.waitForTimeout(150); // time for a failed image load to fire its handler
    const pwned = () => page.evaluate(() => (window as unknown as { pwned?: string }).pwned);
    expect(await pwned()).toBeUndefined();
    await page.evaluate(() => (document.querySelector('#bad2') as HTMLAnchorElement | null)?.click());
    await page.waitForTimeout(50);
    expect(await pwned()).toBeUndefined();
    expect(await page.textContent('main')).toContain('marker 2'); // still the same document
  }

  it('runs no script from the Markdown, on load or in an update', async () => {
    await expectNoScriptRuns({});
  });

  it('stops scripts by its CSP alone, should markup ever get past the sanitiser', async () => {
    await expectNoScriptRuns({ runner: new UnsanitisedRunner() });
  });

  it('refuses a page asked for under a rebinding host name', async () => {
    const { server } = await serveFolder({ 'wing.md': wingSheet('12 m/s') });
    const page = await browser.context.newPage();
    cleanup.push(() => page.close());
    const response = await page.goto(`http://${REBIND_HOST}:${server.port}/sheet/wing.md`);
    expect(response?.status()).toBe(403);
    expect(await page.textContent('body')).not.toContain('U_inf');
  });

  it('refuses a WebSocket opened by a page of another origin', async () => {
    const { server } = await serveFolder({ 'wing.md': wingSheet('12 m/s') });
    const other = createServer((_req, res) => res.end('<!doctype html><title>another site</title><p>elsewhere</p>'));
    await new Promise<void>((resolve) => other.listen(0, '127.0.0.1', resolve));
    cleanup.push(() => new Promise((resolve) => (other.closeAllConnections(), other.close(() => resolve()))));
    const otherPort = (other.address() as { port: number }).port;

    const tryOpen = (page: Page) =>
      page.evaluate(
        (port) =>
          new Promise<string>((resolve) => {
            const ws = new WebSocket(`ws://127.0.0.1:${port}/live`);
            ws.onopen = () => resolve('open');
            ws.onclose = () => resolve('refused');
          }),
        server.port,
      );
    const foreign = await openPage(`http://127.0.0.1:${otherPort}/`);
    expect(await tryOpen(foreign)).toBe('refused');
    const own = await openPage(server.url);
    expect(await tryOpen(own)).toBe('open');
  });

  it('updates the index as sheets are added, evaluated and deleted', async () => {
    const { dir, server } = await serveFolder({ 'wing.md': wingSheet('12 m/s') });
    const page = await openPage(server.url);
    await waitForStatus(page, 'live');
    expect(await page.textContent('tr[data-path="wing.md"]')).toContain('wing.md');

    await put(dir, 'tail/fin.md', '---\ntitle: Fin\n---\nA fin.\n');
    const row = await page.waitForSelector('tr[data-path="tail/fin.md"][data-state="ready"]');
    expect(await row.getAttribute('data-state')).toBe('ready');
    await rm(path.join(dir, 'wing.md'));
    await page.waitForSelector('tr[data-path="wing.md"]', { state: 'detached' });
  });

  it('follows a sheet that is renamed while open', async () => {
    const { dir, server } = await serveFolder({ 'wing.md': wingSheet('12 m/s') });
    const page = await openPage(server.url + 'sheet/wing.md');
    await waitForStatus(page, 'live');
    await rename(path.join(dir, 'wing.md'), path.join(dir, 'wing-cruise.md'));
    await page.waitForURL(/\/sheet\/wing-cruise\.md$/);
    await page.waitForSelector('.live-notice:text("Renamed from wing.md to wing-cruise.md")');
    expect(await page.textContent('.live-crumb')).toBe('wing-cruise.md');
    await writeFile(path.join(dir, 'wing-cruise.md'), wingSheet('18 m/s'));
    await waitForValue(page, 'U_inf', 18);
  });
});
