// YAML front matter between "---" lines at the very top of a sheet. The
// front matter's lines are blanked, not removed, so line numbers stay true.
import { parse as parseYaml } from 'yaml';

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

function readYaml(source: string): Omit<FrontMatter, 'body'> {
  try {
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
    return { meta: {}, problem: { line: linePos + 1, message: `the front matter is not valid YAML: ${(e as Error).message.split('\n')[0]}` } };
  }
}
