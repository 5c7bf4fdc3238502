// Re-splitting after an edit must give exactly what a full lex gives.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { resplitParts, splitParts, type SplitSheet } from '../../server/read/parts.js';

function shape(s: SplitSheet) {
  return s.parts.map((x) => (x.kind === 'block' ? { kind: x.kind, fenceLine: x.fenceLine, lines: x.lines } : { kind: x.kind, firstLine: x.firstLine, raw: x.raw }));
}

const text = readFileSync('worksheets/van-near-wall.md', 'utf8');

describe('resplitParts', () => {
  const lines = text.split('\n');
  const edits: Array<[string, (ls: string[]) => string[]]> = [
    ['a line inside a block', (ls) => ls.map((l) => l.replace(/^U = U_design/, 'U = 120 km/h'))],
    ['a line of prose', (ls) => ls.map((l, i) => (i === lines.findIndex((x) => x.startsWith('This sheet')) ? l + ' Extra words.' : l))],
    ['a new fence-like line inside a block', (ls) => ls.map((l) => l.replace(/^U = U_design.*/, '```'))],
    ['a line added', (ls) => [...ls.slice(0, 12), 'New paragraph.', ...ls.slice(12)]],
    ['a block opened into prose', (ls) => ls.map((l, i) => (i === lines.findIndex((x) => x.startsWith('This sheet')) ? '```basis' : l))],
  ];
  for (const [what, edit] of edits) {
    it(`matches a full lex after ${what}`, () => {
      const next = edit(lines).join('\n');
      expect(next).not.toBe(text);
      expect(shape(resplitParts(text, splitParts(text), next))).toEqual(shape(splitParts(next)));
    });
  }
});

describe('inline values in prose', () => {
  it('are found with the line they are written on, in order, a quoted example and a bare "=" aside', () => {
    const text = ['# Sheet', '', 'Code starting with `=` shows a value: writing `` `=Re` ``', 'gives `=Re`, and `=U to km/h` converts.', '', '| a | b |', '| - | - |', '| x | `=L` |', ''].join('\n');
    const prose = splitParts(text).parts.flatMap((p) => (p.kind === 'prose' ? p.inline : []));
    expect(prose).toEqual([
      { text: 'Re', line: 4 },
      { text: 'U to km/h', line: 4 },
      { text: 'L', line: 8 },
    ]);
  });
});

describe('a fence one slip from basis', () => {
  // Without a word, a mistyped fence leaves the block as code and every number in it unevaluated.
  it('is an error at the fence, not a silent code block; other code blocks stay as they are', async () => {
    const { renderSheet } = await import('../../server/pipeline/index.js');
    const text = '# Slips\n\n```Basis\nU = 28 m/s\n```\n\n```bash\nls\n```\n\n```basic\n10 PRINT\n```\n\n  ~~~bsis x\nV = 1\n~~~\n\n```basis\nW = 2 m\n```\n';
    const r = await renderSheet(text);
    expect(r.errors.map((e) => [e.line, e.column, e.code])).toEqual([[3, 4, 'syntax'], [15, 6, 'syntax']]);
    expect(r.errors[0]!.message).toBe("this block's fence says `Basis`, so it is shown as code and nothing in it is evaluated: write `basis` to evaluate it, or another word (such as `text`) to keep it as code");
    expect(Object.keys(r.values)).toEqual(['W']);
    // An edit inside a block reuses the split, slips included.
    const prev = splitParts(text);
    expect(resplitParts(text, prev, text.replace('W = 2 m', 'W = 3 m')).fenceSlips).toEqual(prev.fenceSlips);
  });
});
