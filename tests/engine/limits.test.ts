// A line too deep, too long or with a number out of range is an error on that
// line, with the limit in its words; the rest of the sheet evaluates (issue 17).
import katex from 'katex';
import { describe, expect, it } from 'vitest';
import { namesUsed } from '../../server/evaluate/graph.js';
import type { Expr } from '../../server/parse/ast.js';
import { MAX_LINE_CHARS, MAX_NESTING, parseExpression, parseStatement } from '../../server/parse/index.js';
import { SheetPipeline } from '../../server/pipeline/index.js';
import { exprLatex } from '../../server/render/latex.js';
import { untypesetHtml } from '../../server/render/statement.js';
import { textLatex } from '../../server/render/symbols.js';
import { sheet, si } from './helpers.js';

/** The rest of the sheet still evaluates around the bad line (line 3). */
async function badLine(line: string) {
  const r = await sheet(['U = 12 m/s', line, 'q = U * 2']);
  expect(si(r, 'q')).toBe(24);
  expect(r.errors).toHaveLength(1);
  expect(r.errors[0]!.line).toBe(3);
  return r.errors[0]!;
}

describe('lines past the limits', () => {
  it('1,500 nested brackets: a limit error on that line that names the limit', async () => {
    const e = await badLine('a = ' + '('.repeat(1500) + '1' + ')'.repeat(1500));
    expect(e.code).toBe('limit');
    expect(e.message).toContain(`more than ${MAX_NESTING} deep`);
    // Reported where the limit is crossed: at the bracket that opens level 201.
    expect(e.column).toBe(5 + MAX_NESTING);
  });

  it('20,000 minus signs and 3,000 nested lists: the line is too long', async () => {
    for (const line of ['b = ' + '-'.repeat(20_000) + '1', 'c = ' + '['.repeat(3000) + '1' + ']'.repeat(3000)]) {
      const e = await badLine(line);
      expect(e.code).toBe('limit');
      expect(e.message).toMatch(/^this line is [\d,]+ characters long; a statement may have at most 4,000/);
    }
  });

  it('nesting just inside the limit evaluates', async () => {
    const depth = MAX_NESTING - 1;
    const r = await sheet(['y = 3', 'p = ' + '('.repeat(depth) + 'y' + ')'.repeat(depth), 'n = ' + '-'.repeat(depth - 1) + 'y', 'w = ' + Array(depth).fill('1').join('^')]);
    expect(r.errors).toEqual([]);
    expect(si(r, 'p')).toBe(3);
    expect(si(r, 'n')).toBe((depth - 1) % 2 === 0 ? 3 : -3);
    expect(si(r, 'w')).toBe(1);
  });

  it('a / b / c counts each fraction as a level of nesting', async () => {
    const e = await badLine('d = ' + Array(MAX_NESTING + 2).fill('U').join(' / '));
    expect(e.message).toContain('fractions');
  });

  it('a sum as long as a line may be evaluates, and its dependency scan does not recurse', async () => {
    const terms = Math.floor((MAX_LINE_CHARS - 4) / 2);
    const r = await sheet(['y = 2', 's = ' + Array(terms).fill('y').join('+')]);
    expect(r.errors).toEqual([]);
    expect(si(r, 's')).toBe(2 * terms);
    // A 30,000-term chain built by hand, past anything the parser would give.
    let chain: Expr = { type: 'name', name: 'y', span: { line: 1, col: 1, end: 2 } };
    for (let i = 0; i < 30_000; i++) chain = { type: 'binary', op: '+', left: chain, right: { type: 'name', name: `z${i % 3}`, span: chain.span }, span: chain.span };
    const names = namesUsed(chain);
    expect(names).toHaveLength(30_001);
    expect(names.slice(0, 3).map((n) => n.name)).toEqual(['y', 'z0', 'z1']);
  });

  it('a comment may run past the line limit; the statement before it may not', async () => {
    const r = await sheet(['U = 12 m/s # ' + 'x'.repeat(MAX_LINE_CHARS * 2)]);
    expect(r.errors).toEqual([]);
    expect(si(r, 'U')).toBe(12);
    const e = await badLine('label = "' + 'x'.repeat(MAX_LINE_CHARS) + '"');
    expect(e.code).toBe('limit');
  });

  it('an inline value past the limits is an error in the prose, not the sheet', async () => {
    const pipeline = new SheetPipeline();
    const r = pipeline.run('Deep `=' + '('.repeat(400) + '1' + ')'.repeat(400) + '` here.\n\n```basis\nx = 2\n```\n');
    expect(r.values.x!.si).toBe(2);
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0]!.message).toContain('deep');
  });

  it('shows a cut copy of a very long broken line, not all of it', async () => {
    const r = await sheet(['x = ' + '1 + '.repeat(5000) + '1']);
    const html = r.parts.map((p) => p.html).join('');
    expect(html.length).toBeLessThan(20_000);
    expect(html).toContain('ws-source');
  });
});

describe('numbers past what a sheet can hold', () => {
  it('1e309 is an error at the number, naming the largest number', async () => {
    const e = await badLine('big = 2 * 1e309');
    expect(e).toEqual({ line: 3, column: 11, code: 'limit', message: '1e309 is beyond the largest number a sheet can hold, about 1.8e308' });
  });

  it('a literal that would become zero is an error too; one that fits is kept', async () => {
    const e = await badLine('tiny = 1e-400 m');
    expect(e.message).toContain('smallest number');
    const r = await sheet(['a = 1.7e308', 'b = 5e-324', 'c = 0.000e5']);
    expect(r.errors).toEqual([]);
    expect(si(r, 'a')).toBe(1.7e308);
    expect(si(r, 'b')).toBe(5e-324);
    expect(si(r, 'c')).toBe(0);
  });

  it('a literal whose unit takes it past the largest number is an error', async () => {
    const e = await badLine('far = 1e308 km');
    expect(e.code).toBe('limit');
    expect(e.message).toContain('largest number');
  });
});

describe('typesetting', () => {
  it('builds each side of a fraction or power once: work grows with the size of the expression', () => {
    // Counted through the substitution hook, which is asked once per name visited.
    const visits = (depth: number, op: '/' | '^') => {
      let text = 'x';
      for (let i = 0; i < depth; i++) text = op === '/' ? `1/(${text})` : `x^${text}`;
      let count = 0;
      exprLatex(parseExpression(text), { sig: 4, valueFor: () => (count++, undefined) });
      return count;
    };
    for (const op of ['/', '^'] as const) {
      // Before: 2^depth visits; now one per name (and a fixed few per level for brackets).
      expect(visits(24, op) / visits(12, op)).toBeLessThan(3);
      expect(visits(24, op)).toBeLessThan(24 * 4);
    }
  });

  it('text with ^ and ~ is typeset as those characters, not as accents (read back from KaTeX)', () => {
    const html = katex.renderToString(textLatex('a^b c~d \\ {x}'), { output: 'mathml' });
    const shown = html.replace(/<annotation[\s\S]*?<\/annotation>/, '').replace(/<[^>]+>/g, '').replace(/\u00a0/g, ' ');
    expect(shown).toBe('a^b c~d \\ {x}');
  });

  it('a statement past the time budget is shown as its source text with its value; a later run typesets it', () => {
    const text = '```basis\nU = 12 m/s\nRe = U * 2 m / 1.5e-5 m^2/s\ncheck Re > 1000 "turbulent"\n```\n';
    const cut = new SheetPipeline({ limits: { maxSteps: 1e6, maxListLength: 1e5, timeoutMs: -1 } });
    const first = cut.run(text);
    expect(first.untypeset).toBe(3);
    const html = first.parts.map((p) => p.html).join('');
    expect(html).not.toContain('class="katex"');
    // Out of time before the block began: the block's lines as they stand, and why.
    expect(html).toContain('<pre class="ws-plain-text">U = 12 m/s\nRe = U * 2 m / 1.5e-5 m^2/s\ncheck Re &gt; 1000 &quot;turbulent&quot;</pre>');
    expect(html).toContain('These 3 statements are not typeset: the sheet reached its -1 ms time limit first');
    expect(first.summaryHtml).toContain('shown as source text');
    expect(first.values.Re!.si).toBeCloseTo(1.6e6, 6);

    // Cut in the middle of a block, a statement is its source text with its value in words and the same data attributes.
    const one = untypesetHtml(
      { stmt: parseStatement('Re = U * 2 m / 1.5e-5 m^2/s', 7)!, value: { kind: 'quantity', si: 1.6e6, dims: [0, 0, 0, 0, 0, 0, 0] }, warnings: [], uses: ['U'], fresh: true },
      { sig: 4, values: new Map() },
      'the sheet reached its 2,000 ms time limit first',
    );
    expect(one).toContain('<code class="ws-source">Re = U * 2 m / 1.5e-5 m^2/s</code>');
    expect(one).toContain('data-name="Re" data-si="1600000"');
    expect(one).toContain('= 1.6×10⁶');
    expect(one).toContain('not typeset: the sheet reached its 2,000 ms time limit first');

    const full = new SheetPipeline().run(text);
    expect(full.untypeset).toBe(0);
    expect(full.parts.map((p) => p.html).join('')).toContain('class="katex"');
  });
});

describe('Markdown nested past what the Markdown reader can follow', () => {
  it('shows the prose as plain text and still evaluates the blocks', async () => {
    const r = new SheetPipeline().run('>'.repeat(20_000) + ' deep\n\n```basis\nx = 2 m\n```\n\nAfter `=x`.\n');
    expect(r.values.x!.si).toBe(2);
    const html = r.parts.map((p) => p.html).join('');
    expect(html).toContain('shown as plain text');
    expect(html).toContain('ws-plain-text');
  });
});
