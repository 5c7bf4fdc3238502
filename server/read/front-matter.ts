// YAML front matter between "---" lines at the very top of a sheet. The
// front matter's lines are blanked, not removed, so line numbers stay true.
// Front matter of plain `key: text` lines (what sheets use) is read here;
// anything else goes to the yaml package, loaded only then (it costs the
// command line's start-up tens of milliseconds).
import { createRequire } from 'node:module';
import type { parse as yamlParse } from 'yaml';

let parseYaml: typeof yamlParse | undefined;

export interface FrontMatter {
  meta: Record<string, string>;
  /** The text with the front matter replaced by as many empty lines. */
  body: string;
  /** A problem reading the YAML, if any (line is 1-based in the file). */
  problem?: { line: number; message: string };
}

/** The last YAML read and what it gave: a save rarely touches the front matter. */
let last: { source: string; read: Omit<FrontMatter, 'body'> } | null = null;

export function splitFrontMatter(text: string): FrontMatter {
  const m = /^---[ \t]*\n([\s\S]*?)\n(?:---|\.\.\.)[ \t]*(?:\n|$)/.exec(text);
  if (!m) return { meta: {}, body: text };
  const lines = m[0].split('\n').length - (m[0].endsWith('\n') ? 1 : 0);
  const body = '\n'.repeat(lines) + text.slice(m[0].length);
  if (last?.source !== m[1]) last = { source: m[1]!, read: readYaml(m[1]!) };
  return { meta: { ...last.read.meta }, body, ...(last.read.problem ? { problem: last.read.problem } : {}) };
}

/**
 * Plain `key: value` lines whose values YAML would read as the same text (or a
 * whole number, or true/false/null), else undefined. Anything YAML reads in
 * another way (quotes, colons, comments, floats, dates, nesting) is left to yaml.
 */
export function readPlainFrontMatter(source: string): Record<string, string> | undefined {
  const meta: Record<string, string> = {};
  for (const line of source.split('\n')) {
    if (line.trim() === '') continue;
    const m = /^([A-Za-z_][A-Za-z0-9_-]*):(?:[ \t]+(.*?))?[ \t]*$/.exec(line);
    if (!m || Object.hasOwn(meta, m[1]!)) return undefined;
    const value = m[2] ?? '';
    if (value === '' || /^(null|Null|NULL|~)$/.test(value)) {
      meta[m[1]!] = '\u0000'; // a key given no value: dropped below, as yaml's null is
      continue;
    }
    if (/^(true|True|TRUE|false|False|FALSE)$/.test(value)) meta[m[1]!] = value.toLowerCase();
    else if (/^[0-9]+$/.test(value)) meta[m[1]!] = String(Number(value));
    else if (/^[-+.0-9]/.test(value) || /[:#'"\\]/.test(value) || /^[?,[\]{}&*!|>%@`]/.test(value)) return undefined;
    else meta[m[1]!] = value;
  }
  for (const k of Object.keys(meta)) if (meta[k] === '\u0000') delete meta[k];
  return meta;
}

function readYaml(source: string): Omit<FrontMatter, 'body'> {
  const plain = readPlainFrontMatter(source);
  if (plain) return { meta: plain };
  try {
    parseYaml ??= (createRequire(import.meta.url)('yaml') as { parse: typeof yamlParse }).parse;
    const data: unknown = parseYaml(source);
    const meta: Record<string, string> = {};
    if (data && typeof data === 'object' && !Array.isArray(data)) {
      for (const [k, v] of Object.entries(data as Record<string, unknown>)) {
        if (v === null || v === undefined) continue;
        meta[k] = v instanceof Date ? v.toISOString().slice(0, 10) : typeof v === 'object' ? JSON.stringify(v) : String(v);
      }
    }
    return { meta };
  } catch (e) {
    const linePos = (e as { linePos?: Array<{ line: number }> }).linePos?.[0]?.line ?? 1;
    // The usual slip: a title with a colon in it, which YAML reads as a second key.
    const bad = /^([A-Za-z_][\w-]*):[ \t]+([^"'\s].*?:[ \t].*)$/.exec(source.split(/\r?\n/)[linePos - 1] ?? '');
    const hint = bad ? `; a value with ": " in it needs quotes: ${bad[1]}: "${bad[2]!.trim().replace(/"/g, '\\"')}"` : '';
    return { meta: {}, problem: { line: linePos + 1, message: `the front matter is not valid YAML: ${yamlReason(e as Error)}${hint}` } };
  }
}

/** yaml's first line of a message, without its place (counted from the front matter, not the file: ours is given instead). */
function yamlReason(e: Error): string {
  return e.message.split('\n')[0]!.replace(/ at line \d+, column \d+:?$/, '');
}
