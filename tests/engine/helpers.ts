import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { renderSheet } from '../../server/pipeline/index.js';
import type { RunOptions, SheetResult } from '../../server/pipeline/index.js';

/** Render a sheet made of one basis block holding `lines` (first statement on file line 2). */
export function sheet(lines: string[], front = ''): Promise<SheetResult> {
  const head = front ? `---\n${front}\n---\n` : '';
  return renderSheet(`${head}\`\`\`basis\n${lines.join('\n')}\n\`\`\`\n`);
}

export function si(r: SheetResult, name: string): number {
  const v = r.values[name];
  if (!v || v.si === null) throw new Error(`${name} has no SI value: ${JSON.stringify(r.errors)}`);
  return v.si;
}

/** Html with its character references (&#x3bd; and the like) read as the characters they stand for. */
export function decodeReferences(html: string): string {
  return html.replace(/&#x([0-9a-f]+);/gi, (_, hex: string) => String.fromCodePoint(parseInt(hex, 16)));
}

/** One basis block of these lines, as a sheet's text. */
export const block = (...lines: string[]) => '```basis\n' + lines.join('\n') + '\n```\n';

/** A project folder with these files; returns its root and a runner for one of them. */
export function project(files: Record<string, string>) {
  const root = mkdtempSync(path.join(tmpdir(), 'ws-project-'));
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(path.dirname(path.join(root, name)), { recursive: true });
    writeFileSync(path.join(root, name), text);
  }
  const run = (name: string, opts: RunOptions = {}) => renderSheet(files[name]!, { path: path.join(root, name), root, ...opts });
  return { root, run };
}
