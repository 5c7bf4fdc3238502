// Updating in place must end where a fresh load would: after each save, the
// live page's <main> is compared with that of a page opened afterwards. A
// changed input takes the cheap path (text and attributes edited, no node
// added or removed); a changed structure takes the morph. Both are checked.
import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { startServer, type RunningServer } from '../../server/serve/index.js';
import { makeFolder } from '../serve/helpers.js';
import { describeInBrowser, launchBrowser, type Browser } from './launch.js';
import { waitForStatus, waitForValue } from './probes.js';

/** A block of inputs and results, prose with an inline value, and a table. */
function sheet(opts: { speed: number; above?: string; extra?: string; drop?: boolean }): string {
  return `---
title: Mast section
---
# Mast section
${opts.above ?? ''}
A mast section in a steady breeze; the speed is \`=U\` here.

\`\`\`basis
U = ${opts.speed} m/s    # gust speed
D = 0.3 m           # diameter
nu = 1.5e-5 m^2/s
${opts.drop ? '' : 'Re = U * D / nu\n'}${opts.extra ?? ''}check U < 40 m/s "within the range of the table"
\`\`\`

| station | height |
| --- | --- |
| base | 0 m |
| top | 12 m |
`;
}

describeInBrowser('updating in place', () => {
  let browser: Browser;
  let server: RunningServer;
  let folder: { dir: string; remove: () => Promise<void> };
  let live: Page;

  beforeAll(async () => {
    browser = await launchBrowser();
    folder = await makeFolder({ 'mast.md': sheet({ speed: 12 }) });
    server = await startServer({ dir: folder.dir, port: 0 });
    live = await browser.context.newPage();
    await live.goto(server.url + 'sheet/mast.md');
    await waitForStatus(live, 'live');
    // Counts nodes added or removed inside <main> from now on.
    await live.evaluate(() => {
      const w = window as unknown as { structural: number };
      w.structural = 0;
      new MutationObserver((records) => {
        for (const r of records) w.structural += r.addedNodes.length + r.removedNodes.length;
      }).observe(document.querySelector('main')!, { childList: true, subtree: true });
    });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
    await folder?.remove();
  });

  const mainHtml = (page: Page) => page.evaluate(() => document.querySelector('main')!.innerHTML);
  const structural = () => live.evaluate(() => (window as unknown as { structural: number }).structural);

  async function save(text: string, name: string, si: number) {
    await writeFile(path.join(folder.dir, 'mast.md'), text);
    await waitForValue(live, name, si);
    await waitForStatus(live, 'live');
  }

  async function expectSameAsFreshLoad() {
    const fresh = await browser.context.newPage();
    try {
      await fresh.goto(server.url + 'sheet/mast.md');
      await waitForStatus(fresh, 'live');
      expect(await mainHtml(live)).toBe(await mainHtml(fresh));
    } finally {
      await fresh.close();
    }
  }

  it('edits only text and attributes when an input changes', async () => {
    await save(sheet({ speed: 13.5 }), 'Re', (13.5 * 0.3) / 1.5e-5);
    expect(await structural()).toBe(0);
    await expectSameAsFreshLoad();
    await save(sheet({ speed: 9.25 }), 'Re', (9.25 * 0.3) / 1.5e-5);
    expect(await structural()).toBe(0);
    await expectSameAsFreshLoad();
  });

  it('ends as a fresh load does when statements are added, removed or moved down', async () => {
    await save(sheet({ speed: 10, extra: 'q = 0.5 * 1.2 kg/m^3 * U^2\n' }), 'q', 0.5 * 1.2 * 100);
    await expectSameAsFreshLoad();
    await save(sheet({ speed: 10, above: '\nTwo lines added above the block\nmove every line number down.\n' }), 'U', 10);
    await expectSameAsFreshLoad();
    await save(sheet({ speed: 11, drop: true }), 'U', 11);
    await expectSameAsFreshLoad();
    await save(sheet({ speed: 11.5 }), 'Re', (11.5 * 0.3) / 1.5e-5);
    await expectSameAsFreshLoad();
  });

  it('ends as a fresh load does when a formula changes form or a check flips', async () => {
    // Re = 20 is written plainly, Re = 2.7e5 in powers of ten: other markup.
    await save(sheet({ speed: 0.001 }), 'Re', (0.001 * 0.3) / 1.5e-5);
    await expectSameAsFreshLoad();
    await save(sheet({ speed: 45 }), 'Re', (45 * 0.3) / 1.5e-5); // the check now fails
    await expectSameAsFreshLoad();
    await save(sheet({ speed: 12 }), 'Re', (12 * 0.3) / 1.5e-5);
    await expectSameAsFreshLoad();
  });

  it('morphs any markup into any other, moving keyed nodes and keeping opened details', async () => {
    const cases: [string, string][] = [
      ['<p class="a" title="t">x</p>', '<p class="b">x</p>'], // an attribute removed, one changed
      ['<p>x</p>', '<p lang="en">x</p>'], // an attribute added
      ['<div id="s1"><b>1</b></div><div id="s2"><b>2</b></div>', '<div id="s2"><b>2</b></div><div id="s1"><b>1</b></div>'], // keyed, swapped
      ['<div id="s1">1</div><div id="s2">2</div><div id="s3">3</div>', '<div id="s1">1</div><div id="s3">3!</div>'], // keyed, one dropped
      ['<a id="L1"></a><p>one</p><a id="L2"></a><p>two</p>', '<a id="L2"></a><p>one</p><a id="L3"></a><p>two</p><p>three</p>'], // empty anchors renumbered
      ['<p>text</p>', '<p><b>text</b></p>'], // text became an element
      ['<ul><li>1</li><li>2</li></ul>', '<ol><li>1</li></ol>'], // other elements
      ['<svg viewBox="0 0 10 10"><path d="M0 0"></path></svg>', '<svg viewBox="0 0 20 10"><path d="M1 1"></path><circle r="2"></circle></svg>'],
    ];
    // Source text, not functions: the test runner rewrites import() inside functions.
    const results = (await live.evaluate(`(async () => {
      const { morphContent } = await import('/assets/morph.js');
      const box = document.createElement('div');
      const expected = document.createElement('div');
      return ${JSON.stringify(cases)}.map(([from, to]) => {
        box.innerHTML = from;
        morphContent(box, to);
        expected.innerHTML = to;
        return [box.innerHTML, expected.innerHTML];
      });
    })()`)) as [string, string][];
    for (const [got, want] of results) expect(got).toBe(want);

    const kept = await live.evaluate(`(async () => {
      const { morphContent } = await import('/assets/morph.js');
      const box = document.createElement('div');
      box.innerHTML = '<details><summary>Notes</summary><p>1</p></details>';
      box.querySelector('details').open = true;
      morphContent(box, '<details><summary>Notes</summary><p>2</p></details>');
      return { open: box.querySelector('details').open, text: box.querySelector('p').textContent };
    })()`);
    expect(kept).toEqual({ open: true, text: '2' });
  });
});
