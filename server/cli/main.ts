// The wakesheet command: argv → one of eval, render, check, serve. Each
// command's module is loaded only when it runs: a command line that starts in
// a few tens of milliseconds is one a pre-commit hook can call per sheet.
import { Sandbox, UsageError } from './shared.js';

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

/** The commands that evaluate in the sandbox get one started before their own code loads. */
const COMMANDS: Record<string, (argv: string[], sandbox: () => Sandbox) => Promise<number>> = {
  eval: async (argv, sandbox) => (await import('./eval.js')).evalCommand(argv, sandbox()),
  render: async (argv, sandbox) => (await import('./render.js')).renderCommand(argv, sandbox()),
  check: async (argv, sandbox) => (await import('./check.js')).checkCommand(argv, sandbox()),
  serve: async (argv) => (await import('./serve.js')).serveCommand(argv),
};

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
  // The evaluator process starts now, while this one loads the command: the two
  // start-ups overlap instead of adding up.
  let sandbox: Sandbox | undefined;
  const early = () => {
    if (!sandbox) {
      sandbox = new Sandbox();
      void sandbox.warm();
    }
    return sandbox;
  };
  if (cmd !== 'serve') early();
  try {
    return await run(rest, early);
  } catch (e) {
    if (e instanceof UsageError) {
      process.stderr.write(`${e.message}\n\n${HELP[cmd]}\n`);
      return 2;
    }
    throw e;
  } finally {
    await sandbox?.close();
  }
}
