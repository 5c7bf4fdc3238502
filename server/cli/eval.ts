// `wakesheet eval SHEET.md [--json] [--root DIR]`: values, checks and errors.
import { dirname, resolve } from 'node:path';
import type { CheckJson, ValueJson } from '../pipeline/index.js';
import { CAUTION } from '../render/page.js';
import { colour, failing, overridesOf, parseArgs, runOne, Sandbox, sheetArgument, UsageError, type FlagSpec } from './shared.js';

export const EVAL_HELP = `wakesheet eval SHEET.md [--json] [--root DIR] [--set NAME=VALUE …]

Evaluates SHEET.md in the sandbox and prints every value, check and error.
With --json prints {"values": {...}, "checks": [...], "errors": [...]} with SI
values (temperatures in kelvin, percentages as fractions); otherwise one line
per value, with the fields of records indented below them.
Data files are readable inside the sheet's folder, or inside --root DIR.
--set U_inf=20m/s (repeatable) replaces an input for this run only, here or in
a sheet this one uses; a name that is not an input is an error.`;

const FLAGS: FlagSpec = { flags: { json: 'switch', root: 'value', set: 'repeat' } };

export async function evalCommand(argv: string[], sandbox = new Sandbox()): Promise<number> {
  const parsed = parseArgs(argv, FLAGS);
  const { positional, flags } = parsed;
  if (positional.length !== 1) throw new UsageError('eval takes one sheet');
  const overrides = overridesOf(parsed);
  const file = sheetArgument(positional[0]!, 'eval');
  const root = resolve((flags.get('root') as string | undefined) ?? dirname(resolve(file)));
  try {
    const { result: r } = await runOne(sandbox, file, root, undefined, { ...(overrides ? { overrides } : {}), render: false });
    if (flags.has('json')) {
      const errors = r.errors.map((e) => ({ line: e.line, column: e.column, message: e.message, code: e.code }));
      process.stdout.write(JSON.stringify({ values: r.values, checks: r.checks, errors, ...(r.overrides.length ? { overrides: r.overrides } : {}), ...(r.caution ? { caution: CAUTION } : {}) }, null, 2) + '\n');
    } else {
      const lines: string[] = r.overrides.map((o) => `${colour(33, 'set')} ${o.name} = ${o.now} (${o.sheet || file} says ${o.was})`);
      for (const [name, v] of Object.entries(r.values)) valueLines(name, v, '', lines);
      for (const c of r.checks) lines.push(`${c.passed ? colour(32, 'pass') : colour(31, 'FAIL')} line ${c.line}: ${c.text}${checkNotes(c)}`);
      for (const e of r.errors) lines.push(`${colour(31, 'error')} ${file}:${e.line}:${e.column}: ${e.message}`);
      // The page's caution travels with its numbers: a load read off the terminal is still a planning estimate.
      if (r.caution) lines.push(colour(33, CAUTION));
      process.stdout.write(lines.map((l) => l + '\n').join(''));
    }
    return failing(r) ? 1 : 0;
  } finally {
    await sandbox.close();
  }
}

/** What a check line adds in brackets: the values a failed check compared, its verdict over the inputs' range. */
function checkNotes(c: CheckJson): string {
  const notes = [...(c.compared ? [c.compared] : []), ...(c.range ? [`over the inputs' range: ${c.range.text}`] : [])];
  return notes.length ? ` (${notes.join('; ')})` : '';
}

/** A value as text lines: a record's fields indented under its name, a table as rows. */
function valueLines(name: string, v: ValueJson, indent: string, out: string[]): void {
  if (v.table) {
    out.push(`${indent}${name} =`);
    out.push(...tableLines(v.table, indent + '  '));
    return;
  }
  if (!v.fields) {
    out.push(`${indent}${name} = ${v.display}${v.uDisplay ? ` ${v.uDisplay}` : ''}`);
    return;
  }
  out.push(`${indent}${name}:`);
  for (const [field, f] of Object.entries(v.fields)) valueLines(field, f, indent + '  ', out);
}

function tableLines(t: NonNullable<ValueJson['table']>, indent: string): string[] {
  const cells = [t.columns, ...t.rows.map((row) => row.map((c) => c.display))];
  const widths = t.columns.map((_, i) => Math.max(...cells.map((row) => (row[i] ?? '').length)));
  return cells.map((row) => indent + row.map((c, i) => (c ?? '').padEnd(widths[i]!)).join('  ').trimEnd());
}
