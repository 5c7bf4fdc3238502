// Re-segmenting after an edit must give exactly what a full lex gives.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { resegment, segment, type Segmented } from '../../server/read/segments.js';

function shape(s: Segmented) {
  return s.segments.map((x) => (x.kind === 'block' ? { kind: x.kind, fenceLine: x.fenceLine, lines: x.lines } : { kind: x.kind, firstLine: x.firstLine, raw: x.raw }));
}

const text = readFileSync('worksheets/van-near-wall.md', 'utf8');

describe('resegment', () => {
  const lines = text.split('\n');
  const edits: Array<[string, (ls: string[]) => string[]]> = [
    ['an input inside a block', (ls) => ls.map((l) => l.replace(/^U = 110 km\/h/, 'U = 120 km/h'))],
    ['a line of prose', (ls) => ls.map((l, i) => (i === lines.findIndex((x) => x.startsWith('This sheet')) ? l + ' Extra words.' : l))],
    ['a new fence-like line inside a block', (ls) => ls.map((l) => l.replace(/^U = 110 km\/h.*/, '```'))],
    ['a line added', (ls) => [...ls.slice(0, 12), 'New paragraph.', ...ls.slice(12)]],
    ['a block opened into prose', (ls) => ls.map((l, i) => (i === lines.findIndex((x) => x.startsWith('This sheet')) ? '```basis' : l))],
  ];
  for (const [what, edit] of edits) {
    it(`matches a full lex after ${what}`, () => {
      const next = edit(lines).join('\n');
      expect(next).not.toBe(text);
      expect(shape(resegment(text, segment(text), next))).toEqual(shape(segment(next)));
    });
  }
});
