// The html a pipeline keeps between runs (packed, each statement a place in
// its block's) must read back exactly as a fresh render of the same text, and
// a part's token must change exactly when its html does.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { SheetPipeline } from '../../server/pipeline/index.js';

const text = readFileSync('worksheets/van-near-wall.md', 'utf8');
/** The sheet in its project, so that its use line finds the shared inputs. */
const at = { path: 'worksheets/van-near-wall.md', root: 'worksheets' };

describe('html kept between runs', () => {
  const edits: Array<[string, string]> = [
    ['one input changed', text.replace(/^U = U_design/m, 'U = U_design * 1.1')],
    ['the input changed back', text],
    ['a line of prose added, moving every line below', text.replace(/^## /m, 'One more line.\n\n## ')],
    ['as it was', text],
  ];
  // Edits that leave no statement failing: a failing one shows its last good value, which only the kept pipeline has.

  it('reads back as a fresh render after each edit, with tokens that follow the html', () => {
    expect(edits[0]![1]).not.toBe(text);
    const kept = new SheetPipeline();
    let before = new Map(kept.run(text, at).parts.map((p) => [p.key, { html: p.html, token: p.token ?? p.html }]));
    for (const [what, next] of edits) {
      const parts = kept.run(next, at).parts;
      const fresh = new SheetPipeline().run(next, at).parts;
      expect(parts.map((p) => p.html), what).toEqual(fresh.map((p) => p.html));
      for (const p of parts) {
        const last = before.get(p.key);
        if (last) expect(last.token === (p.token ?? p.html), `${what}: ${p.key}`).toBe(last.html === p.html);
      }
      before = new Map(parts.map((p) => [p.key, { html: p.html, token: p.token ?? p.html }]));
    }
  });

  it('packs the blocks of a large sheet', () => {
    const parts = new SheetPipeline().run(text, at).parts;
    const packed = parts.filter((p) => p.token !== undefined && p.token !== p.html);
    expect(packed.length).toBeGreaterThan(0);
    for (const p of packed) expect(p.token!.length).toBeLessThan(p.html.length / 3);
  });
});
