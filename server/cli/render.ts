// `wakesheet render SHEET.md -o OUT.html [--root DIR]`: the standalone record.
import { dirname, extname, resolve } from 'node:path';
import { failing, parseArgs, runOne, Sandbox, sheetArgument, UsageError, writeOutput, type FlagSpec } from './shared.js';

export const RENDER_HELP = `wakesheet render SHEET.md -o OUT.html [--root DIR]

Writes the rendered sheet as one self-contained HTML file (KaTeX fonts inlined),
to archive as the set-up record. The file is written whole or not at all, and
never over the sheet itself or any other .md file.`;

const FLAGS: FlagSpec = { flags: { output: 'value', root: 'value' }, short: { o: 'output' } };

export async function renderCommand(argv: string[]): Promise<number> {
  const { positional, flags } = parseArgs(argv, FLAGS);
  const out = flags.get('output') as string | undefined;
  if (positional.length !== 1 || !out) throw new UsageError('render takes one sheet and -o OUT.html');
  const file = sheetArgument(positional[0]!, 'render');
  if (resolve(out) === resolve(file)) throw new UsageError(`-o ${out} is the sheet itself; name another file for the record`);
  if (extname(out).toLowerCase() === '.md') throw new UsageError(`-o ${out} would overwrite a Markdown file; the record is an .html file`);
  const root = resolve((flags.get('root') as string | undefined) ?? dirname(resolve(file)));
  const sandbox = new Sandbox();
  try {
    const r = await runOne(sandbox, file, root);
    if (!r.html) {
      process.stderr.write(`${file}: ${r.errors[0]?.message}\n`);
      return 1;
    }
    writeOutput(out, r.html);
    process.stdout.write(`wrote ${out} (${r.summary.checksPassed} checks passed, ${r.summary.checksFailed} failed, ${r.summary.errors} errors)\n`);
    return failing(r) ? 1 : 0;
  } finally {
    await sandbox.close();
  }
}
