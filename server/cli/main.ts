// The wakesheet command: argv → one of eval, render, check, verify, export, serve. Every
// failure is one plain line: exit 2 for bad usage, 1 for a sheet that fails.
import { CHECK_HELP, checkCommand } from './check.js';
import { EVAL_HELP, evalCommand } from './eval.js';
import { EXPORT_HELP, exportCommand } from './export.js';
import { RENDER_HELP, renderCommand } from './render.js';
import { VERIFY_HELP, verifyCommand } from './verify.js';
import { packageVersion } from '../read/paths.js';
import { UsageError } from './shared.js';

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
  run(argv: string[]): Promise<number>;
}

const COMMANDS: Record<string, Command> = {
  eval: { help: EVAL_HELP, run: evalCommand },
  render: { help: RENDER_HELP, run: renderCommand },
  check: { help: CHECK_HELP, run: checkCommand },
  verify: { help: VERIFY_HELP, run: verifyCommand },
  export: { help: EXPORT_HELP, run: exportCommand },
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
  const command = Object.hasOwn(COMMANDS, cmd) ? COMMANDS[cmd] : undefined;
  if (!command) {
    process.stderr.write(`wakesheet: unknown command "${cmd}"; the commands are eval, render, check, verify, export and serve (wakesheet --help)\n`);
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    process.stdout.write(command.help + '\n');
    return 0;
  }
  try {
    return await command.run(rest);
  } catch (e) {
    if (e instanceof UsageError) {
      process.stderr.write(`wakesheet ${cmd}: ${e.message} (wakesheet ${cmd} --help)\n`);
      return 2;
    }
    throw e;
  }
}
