// The wakesheet command: argv → one of eval, render, check, verify, export, serve. Every
// failure is one plain line: exit 2 for bad usage, 1 for a sheet that fails.
// Each command's module is loaded only when it runs, and the evaluator starts
// while it loads: a command line that starts in a few tens of milliseconds is
// one a pre-commit hook can call per sheet.
import { packageVersion } from '../read/paths.js';
import { Sandbox, UsageError } from './shared.js';

const USAGE = `wakesheet — design-basis worksheets for external-flow CFD set-ups

usage:
  wakesheet eval SHEET.md [--json] [--root DIR]   evaluate one sheet, print its values
  wakesheet render SHEET.md -o RECORD.html [--root DIR]
                                                write the set-up record: one self-contained HTML file
  wakesheet verify RECORD.html [--root DIR]     run a record again; list what changed since
  wakesheet export SHEET.md --json|--csv [-o FILE]
                                                every value, for scripts
  wakesheet check [DIR]                          evaluate every sheet under DIR; list failures
  wakesheet serve [DIR] [--port N] [--host H]    serve DIR's sheets live in the browser
  wakesheet COMMAND --help                       help on one command
  wakesheet --version                            the version of this wakesheet

exit codes: 0 all good, 1 failed checks or errors, 2 bad usage`;

interface Command {
  help: string;
  run(argv: string[], sandbox: Sandbox): Promise<number>;
}

const COMMANDS: Record<string, () => Promise<Command>> = {
  eval: async () => import('./eval.js').then((m) => ({ help: m.EVAL_HELP, run: m.evalCommand })),
  render: async () => import('./render.js').then((m) => ({ help: m.RENDER_HELP, run: m.renderCommand })),
  check: async () => import('./check.js').then((m) => ({ help: m.CHECK_HELP, run: m.checkCommand })),
  verify: async () => import('./verify.js').then((m) => ({ help: m.VERIFY_HELP, run: m.verifyCommand })),
  export: async () => import('./export.js').then((m) => ({ help: m.EXPORT_HELP, run: m.exportCommand })),
};

export async function main(argv: string[]): Promise<number> {
  const [cmd, ...rest] = argv;
  if (!cmd || cmd === '--help' || cmd === '-h' || cmd === 'help') {
    process.stdout.write(USAGE + '\n');
    return cmd ? 0 : 2;
  }
  if (cmd === '--version' || cmd === '-v' || cmd === 'version') {
    process.stdout.write(`wakesheet ${packageVersion()}\n`);
    return 0;
  }
  if (cmd === 'serve') {
    // Loaded only for serve: the server's modules are not needed by the other commands.
    const { serveCommand } = await import('./serve.js');
    return serveCommand(rest);
  }
  const load = Object.hasOwn(COMMANDS, cmd) ? COMMANDS[cmd] : undefined;
  if (!load) {
    process.stderr.write(`wakesheet: unknown command "${cmd}"; the commands are eval, render, check, verify, export and serve (wakesheet --help)\n`);
    return 2;
  }
  const help = rest.includes('--help') || rest.includes('-h');
  // The evaluator process starts now, while this one loads the command: the two start-ups overlap.
  const sandbox = help ? undefined : new Sandbox();
  void sandbox?.warm();
  try {
    const command = await load();
    if (!sandbox) {
      process.stdout.write(command.help + '\n');
      return 0;
    }
    return await command.run(rest, sandbox);
  } catch (e) {
    if (e instanceof UsageError) {
      process.stderr.write(`wakesheet ${cmd}: ${e.message} (wakesheet ${cmd} --help)\n`);
      return 2;
    }
    throw e;
  } finally {
    await sandbox?.close();
  }
}
