// Starting the sandbox child: which file to run, with which flags, and a child
// started ahead of time. The command line starts one before it loads anything
// else (bin/wakesheet.js), so the two processes' start-ups overlap; the first
// Sandbox with the same heap cap takes it over. Only Node built-ins here.
import { fork, type ChildProcess } from 'node:child_process';
import { statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/**
 * The child as one bundled file run from V8's code cache when the build made
 * them after the compiled child (scripts/bundle-child.ts; it starts several
 * times faster than a hundred modules), else the compiled child, else (tests
 * under tsx) the source.
 */
function childModule(): string {
  if (import.meta.url.endsWith('.ts')) return fileURLToPath(new URL('./child.ts', import.meta.url));
  const compiled = fileURLToPath(new URL('./child.js', import.meta.url));
  const loader = fileURLToPath(new URL('./child-loader.cjs', import.meta.url));
  const bundle = fileURLToPath(new URL('./child.bundle.cjs', import.meta.url));
  try {
    const built = statSync(compiled).mtimeMs;
    return statSync(bundle).mtimeMs >= built && statSync(loader).mtimeMs >= built ? loader : compiled;
  } catch {
    return compiled;
  }
}

const childPath = childModule();

export interface StartedChild {
  child: ChildProcess;
  /** Resolves at the child's "ready"; rejects if it exits first. */
  ready: Promise<void>;
  /** The tail of what the child wrote to stderr (for telling a memory overrun from a crash). */
  stderr(): string;
}

export const DEFAULT_HEAP_MB = 256;

export function startChild(heapMb: number): StartedChild {
  const execArgv = [`--max-old-space-size=${heapMb}`, '--stack-size=2000'];
  if (childPath.endsWith('.ts')) execArgv.push('--import', 'tsx');
  const child = fork(childPath, [], { execArgv, stdio: ['ignore', 'ignore', 'pipe', 'ipc'], serialization: 'advanced' });
  let tail = '';
  child.stderr?.on('data', (d: Buffer) => {
    tail = (tail + d.toString()).slice(-4000);
  });
  const ready = new Promise<void>((resolve, reject) => {
    const onReady = (m: unknown) => {
      if (m && typeof m === 'object' && 'ready' in m) {
        child.off('message', onReady);
        resolve();
      }
    };
    child.on('message', onReady);
    child.once('exit', () => reject(new Error('the evaluator could not start')));
  });
  ready.catch(() => {});
  // Until a Sandbox takes it, the child must not keep this process alive.
  child.unref();
  (child as unknown as { channel?: { unref(): void } }).channel?.unref();
  return { child, ready, stderr: () => tail };
}

let early: { heapMb: number; started: StartedChild } | undefined;

/** Start a child now, for the first Sandbox (with this heap cap) to take. */
export function startEarly(heapMb = DEFAULT_HEAP_MB): void {
  early ??= { heapMb, started: startChild(heapMb) };
}

/** The child started early, if one with this heap cap is waiting and still alive. */
export function takeEarly(heapMb: number): StartedChild | undefined {
  const e = early;
  early = undefined;
  if (!e || e.heapMb !== heapMb || e.started.child.exitCode !== null || e.started.child.signalCode !== null) {
    e?.started.child.kill('SIGKILL');
    return undefined;
  }
  return e.started;
}
