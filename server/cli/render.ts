// `wakesheet render SHEET.md -o OUT.html [--root DIR]`: the standalone record.
import { dirname, extname, resolve } from 'node:path';
import { countText } from '../core/shared/words.js';
import { typesetProgress } from '../pipeline/report-basics.js';
import { recordData, recordPage } from '../pipeline/record.js';
import { failing, overridesOf, parseArgs, runOne, Sandbox, sheetArgument, UsageError, writeOutput, type FlagSpec } from './shared.js';

export const RENDER_HELP = `wakesheet render SHEET.md -o OUT.html [--root DIR] [--set NAME=VALUE …]

Writes the set-up record: the rendered sheet as one self-contained HTML file
that opens offline (KaTeX fonts, figures and images inside it, no request of any
kind), with its provenance: the sheet's source, the SHA-256 of every source and
data file, the version, the time, the front matter and every input. Check it
later with wakesheet verify. The file is written whole or not at all, and never
over the sheet itself or any other .md file. With --set (repeatable) the
record is of that run: its header lists each input set, with the sheet's value.`;

const FLAGS: FlagSpec = { flags: { output: 'value', root: 'value', set: 'repeat' }, short: { o: 'output' } };

export async function renderCommand(argv: string[], sandbox = new Sandbox()): Promise<number> {
  const parsed = parseArgs(argv, FLAGS);
  const { positional, flags } = parsed;
  const overrides = overridesOf(parsed);
  const extra = overrides ? { overrides } : {};
  const out = flags.get('output') as string | undefined;
  if (positional.length !== 1 || !out) throw new UsageError('render takes one sheet and -o OUT.html');
  const file = sheetArgument(positional[0]!, 'render');
  if (resolve(out) === resolve(file)) throw new UsageError(`-o ${out} is the sheet itself; name another file for the record`);
  if (extname(out).toLowerCase() === '.md') throw new UsageError(`-o ${out} would overwrite a Markdown file; the record is an .html file`);
  const root = resolve((flags.get('root') as string | undefined) ?? dirname(resolve(file)));
  try {
    let { result: r, text, failure } = await runOne(sandbox, file, root, undefined, extra);
    // The record must be typeset whole: a run that ran out of time goes on where it stopped.
    for (let before = Infinity; !failure && r.untypeset > 0 && typesetProgress(before, r.untypeset); ) {
      before = r.untypeset;
      ({ result: r, text, failure } = await runOne(sandbox, file, root, text, extra));
    }
    if (failure) {
      process.stderr.write(`${file}: ${failure}\n`);
      return 1;
    }
    writeOutput(out, recordPage(r, recordData(r, { source: text, path: resolve(file), root })));
    process.stdout.write(`wrote ${out} (${countText(r.summary.checksPassed, 'check')} passed, ${r.summary.checksFailed} failed, ${countText(r.summary.errors, 'error')})\n`);
    return failing(r) ? 1 : 0;
  } finally {
    await sandbox.close();
  }
}
