// What the commands share: the usage error, flag parsing, colour, and
// running one sheet in the sandbox with a sandbox failure as an error line.
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { RunOptions, SheetResult } from '../pipeline/types.js';
import { Sandbox, SandboxError } from '../sandbox/sandbox.js';

export class UsageError extends Error {}

export interface Parsed {
  positional: string[];
  flags: Map<string, string | true>;
}

export function parseArgs(argv: string[], valued: string[]): Parsed {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a.startsWith('-') && a !== '-') {
      const name = a.replace(/^--?/, '');
      if (valued.includes(name)) {
        const v = argv[++i];
        if (v === undefined) throw new UsageError(`${a} needs a value`);
        flags.set(name, v);
      } else flags.set(name, true);
    } else positional.push(a);
  }
  return { positional, flags };
}

export function colour(code: number, s: string): string {
  const on = process.stdout.isTTY && !process.env.NO_COLOR;
  return on ? `\u001b[${code}m${s}\u001b[0m` : s;
}

function readSheet(file: string): string {
  if (!existsSync(file)) throw new UsageError(`no such file: ${file}`);
  return readFileSync(file, 'utf8');
}

/** Runs one sheet; a sandbox failure (timeout, memory, crash) comes back as the sheet's one error. */
export async function runOne(sandbox: Sandbox, file: string, root: string, opts: Omit<RunOptions, 'path' | 'root'> = {}): Promise<SheetResult> {
  try {
    return await sandbox.run(readSheet(file), { ...opts, path: resolve(file), root });
  } catch (e) {
    if (!(e instanceof SandboxError)) throw e;
    return failedResult(e.message);
  }
}

function failedResult(message: string): SheetResult {
  return {
    title: '', meta: {}, html: '', headerHtml: '', caution: false, parts: [], summaryHtml: '', elapsedMs: 0, reads: [], values: {}, checks: [], freshStatements: 0,
    summary: { inputs: 0, results: 0, checksPassed: 0, checksFailed: 0, errors: 1 },
    errors: [{ line: 1, column: 1, message, code: 'limit' }],
  };
}

export function failing(r: SheetResult): boolean {
  return r.errors.length > 0 || r.checks.some((c) => !c.passed);
}

export { Sandbox };
