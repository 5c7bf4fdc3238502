// `wakesheet serve [DIR] [--port N] [--host H]`: parse the flags, start the
// server, print where it listens, and stop cleanly on Ctrl-C.
import { statSync } from 'node:fs';
import { basename, dirname } from 'node:path';
import { DEFAULT_HOST, DEFAULT_PORT, sheetUrl, startServer, type RunningServer } from '../serve/index.js';

export const SERVE_HELP = `Usage: wakesheet serve [DIR] [--port N] [--host H]

Serve the worksheets in DIR (default: the current folder) and update every
open page when a sheet or a data file it reads is saved. Given a sheet
(SHEET.md) instead, serves its folder and prints that sheet's address.

Options:
  --port N   port to listen on (default ${DEFAULT_PORT}; 0 picks a free one)
  --host H   address to bind (default ${DEFAULT_HOST}). Any other address makes
             the sheets readable from the network; a warning is printed.
  -h, --help show this help
`;

export interface ServeArgs {
  dir: string;
  port: number;
  host: string;
}

export type ParsedServeArgs = { kind: 'run'; args: ServeArgs } | { kind: 'help' } | { kind: 'error'; message: string };

export function parseServeArgs(argv: string[]): ParsedServeArgs {
  const args: ServeArgs = { dir: '.', port: DEFAULT_PORT, host: DEFAULT_HOST };
  let dirSeen = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === '-h' || arg === '--help') return { kind: 'help' };
    const flag = /^--(port|host)(?:=(.*))?$/.exec(arg);
    if (flag) {
      const value = flag[2] ?? argv[++i];
      if (value === undefined || value === '') return { kind: 'error', message: `--${flag[1]} needs a value` };
      if (flag[1] === 'port') {
        if (!/^\d+$/.test(value) || Number(value) > 65535) return { kind: 'error', message: `--port must be a number from 0 to 65535, not "${value}"` };
        args.port = Number(value);
      } else {
        args.host = value;
      }
      continue;
    }
    if (arg.startsWith('-') && arg !== '-') return { kind: 'error', message: `unknown option ${arg}` };
    if (dirSeen) return { kind: 'error', message: `only one folder can be served (got "${args.dir}" and "${arg}")` };
    args.dir = arg;
    dirSeen = true;
  }
  return { kind: 'run', args };
}

export interface ServeIo {
  out: (text: string) => void;
  err: (text: string) => void;
  /** Resolves when the server should stop; defaults to SIGINT or SIGTERM. */
  stopSignal?: Promise<void>;
}

/** Runs the command; resolves with the exit code once the server has stopped. */
export async function serveCommand(argv: string[], io: ServeIo = defaultIo()): Promise<number> {
  const parsed = parseServeArgs(argv);
  if (parsed.kind === 'help') {
    io.out(SERVE_HELP);
    return 0;
  }
  if (parsed.kind === 'error') {
    io.err(`wakesheet serve: ${parsed.message}\n\n${SERVE_HELP}`);
    return 2;
  }
  const { port, host } = parsed.args;
  // A sheet given where a folder is expected: serve its folder, and say where the sheet is.
  const sheet = isSheetFile(parsed.args.dir) ? basename(parsed.args.dir) : undefined;
  const dir = sheet ? dirname(parsed.args.dir) : parsed.args.dir;
  let server: RunningServer;
  try {
    server = await startServer({ dir, port, host, warn: (line) => io.err(line + '\n') });
  } catch (error) {
    io.err(`wakesheet serve: ${explainStartFailure(error, parsed.args)}\n`);
    return 1;
  }
  const sheetLine = sheet ? `This sheet: ${new URL(sheetUrl(sheet), server.url).href}\n` : '';
  io.out(`Serving ${server.root} at ${server.url}\n${sheetLine}Press Ctrl-C to stop.\n`);
  await (io.stopSignal ?? untilSignal());
  await server.close();
  return 0;
}

function isSheetFile(path: string): boolean {
  try {
    return path.toLowerCase().endsWith('.md') && statSync(path).isFile();
  } catch {
    return false;
  }
}

function explainStartFailure(error: unknown, args: ServeArgs): string {
  const code = (error as NodeJS.ErrnoException | null)?.code;
  if (code === 'EADDRINUSE') return `port ${args.port} on ${args.host} is in use; choose another with --port`;
  if (code === 'EADDRNOTAVAIL') return `${args.host} is not an address of this machine`;
  if (code === 'ENOENT') return `no such folder: ${args.dir}`;
  if (code === 'EACCES') return `not allowed to listen on port ${args.port}; try a port above 1024`;
  return error instanceof Error ? error.message : String(error);
}

function untilSignal(): Promise<void> {
  return new Promise((resolve) => {
    const stop = () => {
      process.off('SIGINT', stop);
      process.off('SIGTERM', stop);
      resolve();
    };
    process.on('SIGINT', stop);
    process.on('SIGTERM', stop);
  });
}

function defaultIo(): ServeIo {
  return { out: (t) => process.stdout.write(t), err: (t) => process.stderr.write(t) };
}
