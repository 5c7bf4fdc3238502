// `wakesheet check [DIR]`: every sheet under DIR, one line per failure.
import { existsSync, statSync } from 'node:fs';
import { relative, resolve } from 'node:path';
import { countText } from '../core/index.js';
import { findSheets } from '../read/sheet-files.js';
import { colour, parseArgs, runOne, Sandbox, UsageError } from './shared.js';

export const CHECK_HELP = `wakesheet check [DIR]

Evaluates every sheet under DIR (default: the current folder). Prints one line
per failed check or error as file:line: message, and exits 1 if there is any.`;

export async function checkCommand(argv: string[]): Promise<number> {
  const { positional } = parseArgs(argv, { flags: {} });
  if (positional.length > 1) throw new UsageError('check takes at most one folder');
  const dir = resolve(positional[0] ?? '.');
  if (!existsSync(dir) || !statSync(dir).isDirectory()) throw new UsageError(`not a folder: ${positional[0]}`);
  const sandbox = new Sandbox();
  let bad = 0;
  let sheets = 0;
  try {
    for (const file of findSheets(dir)) {
      sheets++;
      const { result: r } = await runOne(sandbox, file, dir);
      const rel = relative(process.cwd(), file) || file;
      for (const e of r.errors) {
        bad++;
        process.stdout.write(`${rel}:${e.line}:${e.column}: ${colour(31, 'error')} ${e.message}\n`);
      }
      for (const c of r.checks.filter((x) => !x.passed)) {
        bad++;
        process.stdout.write(`${rel}:${c.line}: ${colour(33, 'check failed')} ${c.text}\n`);
      }
    }
  } finally {
    await sandbox.close();
  }
  process.stdout.write(`${countText(sheets, 'sheet')}, ${bad === 0 ? colour(32, 'all checks pass') : colour(31, countText(bad, 'problem'))}\n`);
  return bad ? 1 : 0;
}
