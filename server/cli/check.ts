// `wakesheet check [DIR]`: every sheet under DIR, one line per failure.
import { existsSync, statSync } from 'node:fs';
import { relative, resolve } from 'node:path';
import { findSheets } from '../read/sheet-files.js';
import { colour, parseArgs, runOne, Sandbox, UsageError } from './shared.js';

export async function checkCommand(argv: string[], sandbox = new Sandbox()): Promise<number> {
  const { positional } = parseArgs(argv, []);
  if (positional.length > 1) throw new UsageError('check takes at most one folder');
  const dir = resolve(positional[0] ?? '.');
  if (!existsSync(dir) || !statSync(dir).isDirectory()) throw new UsageError(`not a folder: ${positional[0]}`);
  let bad = 0;
  let sheets = 0;
  try {
    for (const file of findSheets(dir)) {
      sheets++;
      const r = await runOne(sandbox, file, dir, { render: false });
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
  process.stdout.write(`${sheets} sheets, ${bad === 0 ? colour(32, 'all checks pass') : colour(31, `${bad} problems`)}\n`);
  return bad ? 1 : 0;
}
