// The live worksheet server: watch a folder, evaluate its sheets in the
// sandbox, serve them and push every change to the open pages.
import { createServer, type Server } from 'node:http';
import { realpath, stat } from 'node:fs/promises';
import path from 'node:path';
import { SandboxPool } from '../sandbox/pool.js';
import { createApp } from './http.js';
import { LiveHub, type LiveOptions } from './live.js';
import { HostPolicy, hostForUrl, isLoopbackHost, isWildcardHost } from './security.js';
import { SheetStore, type SheetRunner } from './store.js';
import { FolderWatcher, type FolderWatcherOptions } from './watch.js';

export interface ServeOptions {
  /** Folder of sheets; data files are readable only inside it. */
  dir: string;
  /** 0 picks a free port. */
  port?: number;
  /** Defaults to 127.0.0.1; anything that is not loopback gets a warning. */
  host?: string;
  /** Runs sheets; defaults to a Sandbox owned (and closed) by the server. */
  runner?: SheetRunner;
  live?: LiveOptions;
  watch?: Pick<FolderWatcherOptions, 'debounceMs' | 'settleMs' | 'removeGraceMs'>;
  /** Where warnings go (default: stderr). */
  warn?: (line: string) => void;
}

export interface RunningServer {
  url: string;
  port: number;
  host: string;
  /** The served folder's real path. */
  root: string;
  close(): Promise<void>;
}

export const DEFAULT_HOST = '127.0.0.1';
export const DEFAULT_PORT = 4180;

export async function startServer(options: ServeOptions): Promise<RunningServer> {
  const host = options.host ?? DEFAULT_HOST;
  const warn = options.warn ?? ((line: string) => console.error(line));
  const root = await realpath(path.resolve(options.dir));
  if (!(await stat(root)).isDirectory()) throw new Error(`not a folder: ${options.dir}`);

  const ownsRunner = options.runner === undefined;
  // Two evaluators: a sheet that takes its whole time budget holds back only one of them.
  const runner = options.runner ?? new SandboxPool(2, { timeoutMs: 2000 });
  void runner.warm?.().catch(() => {}); // a failing start shows up at the first sheet
  const store = new SheetStore(root, runner);
  const watcher = await FolderWatcher.start(root, {
    ...options.watch,
    onEvent: (event) => store.handle(event),
    onError: (error) => warn(`wakesheet serve: watching ${root}: ${error.message}`),
  });

  let policy: HostPolicy | null = null;
  const app = createApp({ store, realRoot: root, folderName: path.basename(root), policy: () => policy });
  const server = createServer(app);
  const hub = new LiveHub(store, () => policy, options.live);
  server.on('upgrade', (req, socket, head) => hub.handleUpgrade(req, socket, head));

  let port: number;
  try {
    port = await listen(server, options.port ?? DEFAULT_PORT, host);
  } catch (error) {
    await hub.close();
    await watcher.close();
    await store.close();
    if (ownsRunner) await runner.close();
    throw error;
  }
  policy = new HostPolicy(host, port);
  if (!isLoopbackHost(host)) {
    warn(
      `warning: listening on ${host}${isWildcardHost(host) ? ' (every network interface)' : ''}: ` +
        'anyone who can reach this machine on that address can read these sheets.',
    );
  }
  store.addInitial(watcher.files());

  const shownHost = isWildcardHost(host) ? DEFAULT_HOST : host;
  let closing: Promise<void> | null = null;
  return {
    url: `http://${hostForUrl(shownHost)}:${port}/`,
    port,
    host,
    root,
    close: () =>
      (closing ??= (async () => {
        await hub.close();
        server.closeAllConnections();
        await new Promise<void>((resolve) => server.close(() => resolve()));
        await watcher.close();
        await store.close();
        if (ownsRunner) await runner.close();
      })()),
  };
}

function listen(server: Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (error: Error) => reject(error);
    server.once('error', onError);
    server.listen(port, host, () => {
      server.off('error', onError);
      const address = server.address();
      resolve(typeof address === 'object' && address ? address.port : port);
    });
  });
}

export type { SheetRunner } from './store.js';
export { sheetUrl } from './pages.js';
