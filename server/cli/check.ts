// `wakesheet check [DIR]`: every sheet under DIR, one line per failure.
import { existsSync, statSync } from 'node:fs';
import { dirname, relative, resolve } from 'node:path';
import { countText } from '../core/shared/words.js';
import { findSheets } from '../read/sheet-files.js';
import { colour, overridesOf, parseArgs, runOne, Sandbox, sheetArgument, UsageError } from './shared.js';

export const CHECK_HELP = `wakesheet check [DIR | SHEET.md] [--set NAME=VALUE …]

Evaluates every sheet under DIR (default: the current folder), or one sheet.
Prints one line per failed check or error as file:line: message, and exits 1
if there is any. A check that holds at nominal but not over the ±2u range of
the uncertain inputs it depends on is listed too, as a note: it does not
change the exit code, nor does a sheet with no \`basis\` block (noted: nothing
on it was evaluated); a folder with no sheet at all is refused (exit 2).
--set U_inf=20m/s (repeatable) replaces an input for this run in every sheet
that defines it; a name no sheet defines is an error.`;

export async function checkCommand(argv: string[], sandbox = new Sandbox()): Promise<number> {
  const parsed = parseArgs(argv, { flags: { set: 'repeat' } });
  const { positional } = parsed;
  const overrides = overridesOf(parsed);
  if (positional.length > 1) throw new UsageError('check takes at most one folder or sheet');
  const target = resolve(positional[0] ?? '.');
  if (!existsSync(target)) throw new UsageError(`no such folder or sheet: ${positional[0]}`);
  const one = !statSync(target).isDirectory();
  if (one) sheetArgument(target, 'check');
  const dir = one ? dirname(target) : target;
  const files = one ? [target] : findSheets(dir);
  // A folder with no sheet is most often the wrong folder: "0 sheets" with exit 0 would pass it.
  if (files.length === 0) throw new UsageError(`no sheets (.md files) under ${positional[0] ?? '.'}`);
  let bad = 0;
  let sheets = 0;
  let overRange = 0;
  let checks = 0;
  const taken = new Set<string>();
  try {
    for (const file of files) {
      sheets++;
      const extra = { ...(overrides ? { overrides, overridesElsewhere: !one } : {}), render: false };
      const { result: r } = await runOne(sandbox, file, dir, undefined, extra);
      for (const name of r.overridesMatched) taken.add(name);
      const rel = relative(process.cwd(), file) || file;
      checks += r.checks.length;
      // A mistyped fence ("```ws") leaves a sheet with nothing to evaluate: "all checks pass" alone would hide it.
      if (r.summary.inputs + r.summary.results + r.checks.length === 0 && r.errors.length === 0) {
        process.stdout.write(`${rel}: ${colour(36, 'note')} no \`basis\` block, nothing evaluated\n`);
      }
      for (const e of r.errors) {
        bad++;
        process.stdout.write(`${rel}:${e.line}:${e.column}: ${colour(31, 'error')} ${e.message}\n`);
      }
      for (const c of r.checks.filter((x) => !x.passed)) {
        bad++;
        process.stdout.write(`${rel}:${c.line}: ${colour(33, 'check failed')} ${c.text}${c.compared ? ` (${c.compared})` : ''}\n`);
      }
      for (const c of r.checks.filter((x) => x.passed && x.range && !x.range.holds)) {
        overRange++;
        process.stdout.write(`${rel}:${c.line}: ${colour(36, 'note')} ${c.text}: ${c.range!.text}\n`);
      }
    }
  } finally {
    await sandbox.close();
  }
  if (!one) {
    for (const name of Object.keys(overrides ?? {}).filter((n) => !taken.has(n))) {
      bad++;
      process.stdout.write(`${colour(31, 'error')} --set ${name}: no sheet under ${positional[0] ?? '.'} has an input \`${name}\`\n`);
    }
  }
  if (overrides) process.stdout.write(`with ${Object.entries(overrides).map(([k, v]) => `${k} = ${v}`).join(', ')} set for this run\n`);
  const range = overRange ? `; ${countText(overRange, 'check')} ${overRange === 1 ? 'holds' : 'hold'} at nominal only, not over the inputs' ±2u range` : '';
  const counted = checks ? countText(checks, 'check') : 'no checks';
  const verdict = bad ? `, ${colour(31, countText(bad, 'problem'))}` : checks ? `, ${colour(32, checks === 1 ? 'it passes' : 'all pass')}` : '';
  process.stdout.write(`${countText(sheets, 'sheet')}, ${counted}${verdict}${range}\n`);
  return bad ? 1 : 0;
}
