// Front matter of plain `key: text` lines is read without the yaml package (for the
// command line's start-up); whatever it reads must be exactly what yaml reads, and
// everything else must still go to yaml.
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { readPlainFrontMatter, splitFrontMatter } from '../../server/read/front-matter.js';

/** What front-matter.ts makes of yaml's answer: strings of each non-null value. */
function viaYaml(source: string): Record<string, string> {
  const data = parse(source) as Record<string, unknown>;
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(data ?? {})) if (v !== null && v !== undefined) out[k] = String(v);
  return out;
}

describe('plain front matter', () => {
  const plain = [
    'title: Flow conditions for the van and towed-body studies\nproject: Saltmarsh Survey Kit — external-flow CFD, set-up record\nrevision: A\nauthor: Wakesheet demo team',
    'sigfigs: 4\ncaution: true\nreviewed: False\nnote: ~\nempty:\ncount: 007',
    'title: Rev [B], {draft} & notes\n\nauthor:   padded value   \nsize: second run',
  ];
  for (const source of plain) {
    it(`reads ${JSON.stringify(source.slice(0, 40))}… as yaml does`, () => {
      expect(readPlainFrontMatter(source)).toEqual(viaYaml(source));
    });
  }

  const leftToYaml = [
    'title: "quoted"',
    "title: 'quoted'",
    'time: 12:30',
    'url: http://example.org',
    'ratio: 1e5',
    'ratio: 0.5',
    'n: 0x1F',
    'n: +1',
    'n: -1',
    'inf: .inf',
    'title: with # comment',
    'list: [a, b]',
    'map: {a: 1}',
    'anchor: &a x',
    'tag: !str x',
    'block: |',
    'key: a\n  continued',
    '# a comment\ntitle: x',
    'title: a\ntitle: b',
    'two words: x',
    'title:nospace',
  ];
  for (const source of leftToYaml) {
    it(`leaves ${JSON.stringify(source)} to yaml`, () => {
      expect(readPlainFrontMatter(source)).toBeUndefined();
    });
  }

  it('still reads the rest with yaml, and reports bad YAML on its line', () => {
    expect(splitFrontMatter('---\ntitle: "a: b"\nratio: 0.5\n---\nbody').meta).toEqual({ title: 'a: b', ratio: '0.5' });
    const bad = splitFrontMatter('---\ntitle: [unclosed\n---\nbody');
    expect(bad.problem?.message).toMatch(/^the front matter is not valid YAML/);
  });

  it('says how to quote a title with a colon in it, at the line of the file', () => {
    const bad = splitFrontMatter('---\nproject: Quay study\ntitle: Roof pod: near-wall plan\n---\nbody');
    expect(bad.problem?.line).toBe(3);
    expect(bad.problem?.message).toContain('a value with ": " in it needs quotes: title: "Roof pod: near-wall plan"');
    // yaml's own place counts from the front matter; only the file's is given.
    expect(bad.problem?.message).not.toMatch(/at line \d/);
  });
});
