// worksheets/guide/functions.md is written by scripts/function-guide.ts from
// the registry. Here it is written again in memory: the committed file must be
// the same, list every function with its example, and render without an error.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { functionGuide, GUIDE_PATH } from '../../scripts/function-guide.js';
import { markdownText, symbolHtml } from '../../scripts/symbol-html.js';
import { createRegistry } from '../../server/core/index.js';
import { renderSheet } from '../../server/pipeline/index.js';

const committed = readFileSync(GUIDE_PATH, 'utf8');

/** The lines of every `basis` block of a Markdown text. */
function basisLines(text: string): string[] {
  return [...text.matchAll(/^```basis\n([\s\S]*?)^```$/gm)].flatMap((m) => m[1]!.split('\n').filter((l) => l !== ''));
}

describe('the function guide', () => {
  it('is what the script writes from the registry today', () => {
    if (committed !== functionGuide()) expect.fail('worksheets/guide/functions.md is out of date: run npm run guide');
  });

  it('gives every registered function a section and its example as a basis block', () => {
    const headings = committed.split('\n').filter((l) => l.startsWith('### '));
    const examples = basisLines(committed);
    for (const fn of createRegistry().list()) {
      expect(headings.filter((h) => h === `### ${markdownText(fn.name)}`), fn.name).toHaveLength(1);
      expect(examples, fn.name).toContain(fn.example);
    }
    expect(examples).toHaveLength(createRegistry().list().length);
  });

  it('renders where it lives with every example evaluated and no error', async () => {
    const r = await renderSheet(committed, { root: 'worksheets', path: GUIDE_PATH });
    expect(r.errors).toEqual([]);
    const shown = r.html.match(/class="ws-stmt ws-expr"/g) ?? [];
    expect(shown).toHaveLength(createRegistry().list().length);
    // Wind loads are among the results (abl, terrain): the page carries the planning caution.
    expect(r.caution).toBe(true);
  });
});

describe('symbols and words in the guide', () => {
  it('writes declared LaTeX symbols as text with sub- and superscripts', () => {
    expect(symbolHtml('\\tau_{w}')).toBe('τ<sub>w</sub>');
    expect(symbolHtml('\\bar{y}^{+}_{w}')).toBe('y\u0304<sup>+</sup><sub>w</sub>');
    expect(symbolHtml('\\Delta y_{1}')).toBe('Δy<sub>1</sub>');
    expect(symbolHtml('\\mathrm{GCI}^{32}')).toBe('GCI<sup>32</sup>');
    expect(symbolHtml('u_*')).toBe('u<sub>\\*</sub>');
  });

  it('refuses a command it has no text for, naming the symbol', () => {
    expect(() => symbolHtml('\\hat{x}')).toThrow('symbol \\hat{x}: \\hat has no text form here');
    expect(() => symbolHtml('x_{1')).toThrow('symbol x_{1: an opening brace without its closing one');
  });

  it('keeps Markdown and HTML characters of a doc as text', () => {
    expect(markdownText('|a − b| < 5 * c_d & [x]')).toBe('\\|a − b\\| &lt; 5 \\* c\\_d &amp; \\[x\\]');
  });
});
