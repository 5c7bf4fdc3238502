// The wakesheet command: argv → one of eval, render, check, serve.
import { readFileSync, writeFileSync, readdirSync, statSync, existsSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { Sandbox, SandboxError } from './evaluate/sandbox.js';
import type { SheetResult } from './sheet-types.js';

const USAGE = `wakesheet — design-basis worksheets for external-flow CFD set-ups

usage:
  wakesheet eval SHEET.md [--json] [--root DIR]   evaluate one sheet, print its values
  wakesheet render SHEET.md -o OUT.html [--root DIR]
                                                write the rendered sheet as one HTML file
  wakesheet check [DIR]                          evaluate every sheet under DIR; list failures
  wakesheet serve [DIR] [--port N] [--host H]    serve DIR's sheets live in the browser
  wakesheet COMMAND --help                       help on one command

exit codes: 0 all good, 1 failed checks or errors, 2 bad usage`;

const HELP: Record<string, string> = {
  eval: `wakesheet eval SHEET.md [--json] [--root DIR]

Evaluates SHEET.md in the sandbox. With --json prints
{"values": {...}, "checks": [...], "errors": [...]} with SI values
(temperatures in kelvin, percentages as fractions); otherwise one line per value.
Data files are readable inside the sheet's folder, or inside --root DIR.`,
  render: `wakesheet render SHEET.md -o OUT.html [--root DIR]

Writes the rendered sheet as one self-contained HTML file (KaTeX fonts inlined),
to archive as the set-up record.`,
  check: `wakesheet check [DIR]

Evaluates every .md sheet under DIR (default: the current folder). Prints one line
per failed check or error as file:line: message, and exits 1 if there is any.`,
  serve: `wakesheet serve [DIR] [--port N] [--host H]

Serves the sheets under DIR (default: worksheets) on http://127.0.0.1:PORT and
updates open pages on every save. --host binds another address (with a warning).`,
};

class UsageError extends Error {}

interface Parsed {
  positional: string[];
  flags: Map<string, string | true>;
}

function parseArgs(argv: string[], valued: string[]): Parsed {
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

function colour(code: number, s: string): string {
  const on = process.stdout.isTTY && !process.env.NO_COLOR;
  return on ? `\u001b[${code}m${s}\u001b[0m` : s;
}

function readSheet(file: string): string {
  if (!existsSync(file)) throw new UsageError(`no such file: ${file}`);
  return readFileSync(file, 'utf8');
}

async function renderOne(sandbox: Sandbox, file: string, root: string): Promise<SheetResult> {
  try {
    return await sandbox.render(readSheet(file), { path: resolve(file), root });
  } catch (e) {
    if (!(e instanceof SandboxError)) throw e;
    return failedResult(e.message);
  }
}

function failedResult(message: string): SheetResult {
  return {
    title: '', meta: {}, html: '', caution: false, parts: [], summaryHtml: '', elapsedMs: 0, reads: [], values: {}, checks: [],
    summary: { inputs: 0, results: 0, checksPassed: 0, checksFailed: 0, errors: 1 },
    errors: [{ line: 1, column: 1, message, code: 'limit' }],
  };
}

function failing(r: SheetResult): boolean {
  return r.errors.length > 0 || r.checks.some((c) => !c.passed);
}

async function evalCommand(argv: string[]): Promise<number> {
  const { positional, flags } = parseArgs(argv, ['root']);
  if (positional.length !== 1) throw new UsageError('eval takes one sheet');
  const file = positional[0]!;
  const root = resolve((flags.get('root') as string | undefined) ?? dirname(resolve(file)));
  const sandbox = new Sandbox();
  try {
    const r = await renderOne(sandbox, file, root);
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

async function renderCommand(argv: string[]): Promise<number> {
  const { positional, flags } = parseArgs(argv, ['o', 'output', 'root']);
  const out = (flags.get('o') ?? flags.get('output')) as string | undefined;
  if (positional.length !== 1 || !out) throw new UsageError('render takes one sheet and -o OUT.html');
  const file = positional[0]!;
  const root = resolve((flags.get('root') as string | undefined) ?? dirname(resolve(file)));
  const sandbox = new Sandbox();
  try {
    const r = await renderOne(sandbox, file, root);
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

export function findSheets(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    for (const name of readdirSync(d).sort()) {
      if (name.startsWith('.') || name === 'node_modules') continue;
      const p = join(d, name);
      const st = statSync(p);
      if (st.isDirectory()) walk(p);
      else if (name.endsWith('.md')) out.push(p);
    }
  };
  walk(dir);
  return out;
}

async function checkCommand(argv: string[]): Promise<number> {
  const { positional } = parseArgs(argv, []);
  if (positional.length > 1) throw new UsageError('check takes at most one folder');
  const dir = resolve(positional[0] ?? '.');
  if (!existsSync(dir) || !statSync(dir).isDirectory()) throw new UsageError(`not a folder: ${positional[0]}`);
  const sandbox = new Sandbox();
  let bad = 0;
  let sheets = 0;
  try {
    for (const file of findSheets(dir)) {
      sheets++;
      const r = await renderOne(sandbox, file, dir);
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

async function serve(argv: string[]): Promise<number> {
  const { serveCommand } = await import('./serve/command.js');
  return serveCommand(argv);
}

const COMMANDS: Record<string, (argv: string[]) => Promise<number>> = { eval: evalCommand, render: renderCommand, check: checkCommand, serve };

export async function main(argv: string[]): Promise<number> {
  const [cmd, ...rest] = argv;
  if (!cmd || cmd === '--help' || cmd === '-h' || cmd === 'help') {
    process.stdout.write(USAGE + '\n');
    return cmd ? 0 : 2;
  }
  const run = Object.hasOwn(COMMANDS, cmd) ? COMMANDS[cmd] : undefined;
  if (!run) {
    process.stderr.write(`unknown command "${cmd}"\n\n${USAGE}\n`);
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    process.stdout.write((HELP[cmd] ?? USAGE) + '\n');
    return 0;
  }
  try {
    return await run(rest);
  } catch (e) {
    if (e instanceof UsageError) {
      process.stderr.write(`${e.message}\n\n${HELP[cmd]}\n`);
      return 2;
    }
    throw e;
  }
}
