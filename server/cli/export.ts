// `wakesheet export SHEET.md --json|--csv [-o FILE] [--root DIR]`: every value
// of a sheet (SI value, SI unit, as shown, warnings) for scripts that write a
// solver's own set-up files.
import { dirname, resolve } from 'node:path';
import type { ValueJson } from '../pipeline/index.js';
import { CAUTION } from '../render/page.js';
import { failing, overridesOf, parseArgs, runOne, Sandbox, sheetArgument, UsageError, writeOutput, type FlagSpec } from './shared.js';

export const EXPORT_HELP = `wakesheet export SHEET.md --json|--csv [-o FILE] [--root DIR] [--set NAME=VALUE …]

Writes every value of the sheet with its SI value, SI unit, the text the sheet
shows and its warnings. --json gives {"values": {...}} with records, lists and
tables nested; --csv gives one row per number: name, si, unit, display,
warnings, u (the standard uncertainty in SI, where the value has one;
records as name.field, lists as name[1], tables as name[1].column).
Without -o the export goes to standard output. --set (repeatable) replaces an
input for this run; the JSON then lists the inputs set. A sheet that computes a
load adds the planning caution: "caution" in the JSON, a note on standard
error with --csv.`;

const FLAGS: FlagSpec = { flags: { json: 'switch', csv: 'switch', output: 'value', root: 'value', set: 'repeat' }, short: { o: 'output' } };

export async function exportCommand(argv: string[], sandbox = new Sandbox()): Promise<number> {
  const parsed = parseArgs(argv, FLAGS);
  const { positional, flags } = parsed;
  const overrides = overridesOf(parsed);
  if (positional.length !== 1) throw new UsageError('export takes one sheet');
  if (flags.has('json') === flags.has('csv')) throw new UsageError('export needs one of --json or --csv');
  const file = sheetArgument(positional[0]!, 'export');
  const root = resolve((flags.get('root') as string | undefined) ?? dirname(resolve(file)));
  try {
    const { result, failure } = await runOne(sandbox, file, root, undefined, { ...(overrides ? { overrides } : {}), render: false });
    if (failure) {
      process.stderr.write(`${file}: ${failure}\n`);
      return 1;
    }
    const text = flags.has('json') ? JSON.stringify({ values: result.values, errors: result.errors, ...(result.overrides.length ? { overrides: result.overrides } : {}), ...(result.caution ? { caution: CAUTION } : {}) }, null, 2) + '\n' : csvOf(result.values);
    // A CSV has no place for it that a reader of the numbers cannot mistake for a value: the terminal gets it.
    if (result.caution && flags.has('csv')) process.stderr.write(`note: ${CAUTION}\n`);
    const out = flags.get('output') as string | undefined;
    if (out) writeOutput(out, text);
    else process.stdout.write(text);
    return failing(result) ? 1 : 0;
  } finally {
    await sandbox.close();
  }
}

/** One row per value that has an SI number or a text, records and lists flattened. */
export function csvOf(values: Record<string, ValueJson>): string {
  const rows: string[][] = [['name', 'si', 'unit', 'display', 'warnings', 'u']];
  const add = (name: string, v: ValueJson, inherited: readonly string[]) => {
    const warnings = [...inherited, ...(v.warnings ?? [])];
    if (v.table) {
      v.table.rows.forEach((row, i) => row.forEach((cell, c) => add(`${name}[${i + 1}].${v.table!.columns[c]}`, cell, [])));
      if (warnings.length) rows.push([name, '', '', '', warnings.join('; '), '']);
      return;
    }
    if (v.fields) {
      for (const [k, f] of Object.entries(v.fields)) add(`${name}.${k}`, f, warnings);
      return;
    }
    if (v.items) {
      v.items.forEach((item, i) => add(`${name}[${i + 1}]`, item, warnings));
      return;
    }
    rows.push([name, v.si === null ? '' : String(v.si), v.unit, v.display, warnings.join('; '), v.u === undefined ? '' : String(v.u)]);
  };
  for (const [name, v] of Object.entries(values)) add(name, v, []);
  return rows.map((r) => r.map(csvCell).join(',')).join('\n') + '\n';
}

function csvCell(s: string): string {
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}
