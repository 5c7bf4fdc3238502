// `wakesheet render SHEET.md -o OUT.html [--root DIR]`: the standalone record.
import { writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { failing, parseArgs, runOne, Sandbox, UsageError } from './shared.js';

export async function renderCommand(argv: string[], sandbox = new Sandbox()): Promise<number> {
  const { positional, flags } = parseArgs(argv, ['o', 'output', 'root']);
  const out = (flags.get('o') ?? flags.get('output')) as string | undefined;
  if (positional.length !== 1 || !out) throw new UsageError('render takes one sheet and -o OUT.html');
  const file = positional[0]!;
  const root = resolve((flags.get('root') as string | undefined) ?? dirname(resolve(file)));
  try {
    const r = await runOne(sandbox, file, root);
    if (!r.html) {
      process.stderr.write(`${file}: ${r.errors[0]?.message}\n`);
      return 1;
    }
    writeFileSync(out, r.html);
    process.stdout.write(`wrote ${out} (${r.summary.checksPassed} checks passed, ${r.summary.checksFailed} failed, ${r.summary.errors} errors)\n`);
    return failing(r) ? 1 : 0;
  } finally {
    await sandbox.close();
  }
}
