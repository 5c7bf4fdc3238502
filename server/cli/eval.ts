// `wakesheet eval SHEET.md [--json] [--root DIR]`: values, checks and errors.
import { dirname, resolve } from 'node:path';
import { colour, failing, parseArgs, runOne, Sandbox, UsageError } from './shared.js';

export async function evalCommand(argv: string[], sandbox = new Sandbox()): Promise<number> {
  const { positional, flags } = parseArgs(argv, ['root']);
  if (positional.length !== 1) throw new UsageError('eval takes one sheet');
  const file = positional[0]!;
  const root = resolve((flags.get('root') as string | undefined) ?? dirname(resolve(file)));
  try {
    const r = await runOne(sandbox, file, root, { render: false });
    if (flags.has('json')) {
      const errors = r.errors.map((e) => ({ line: e.line, column: e.column, message: e.message, code: e.code }));
      process.stdout.write(JSON.stringify({ values: r.values, checks: r.checks, errors }, null, 2) + '\n');
    } else {
      for (const [name, v] of Object.entries(r.values)) process.stdout.write(`${name} = ${v.display}\n`);
      for (const c of r.checks) process.stdout.write(`${c.passed ? colour(32, 'pass') : colour(31, 'FAIL')} line ${c.line}: ${c.text}\n`);
      for (const e of r.errors) process.stdout.write(`${colour(31, 'error')} ${file}:${e.line}:${e.column}: ${e.message}\n`);
    }
    return failing(r) ? 1 : 0;
  } finally {
    await sandbox.close();
  }
}
