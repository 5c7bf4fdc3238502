// Evaluation outside the server's heap: a warm forked child with a capped
// heap. A worker thread is not enough (some heap blow-ups abort the whole
// process); a child that dies takes nothing with it. Requests queue one at a
// time; a request that overruns its wall clock gets the child killed and a
// fresh one started. A request whose child died or hung is tried once more in
// a fresh child (which holds no other sheet: a sheet that fits alone gets
// the whole heap), and only then fails with the reason.
import type { ChildProcess } from 'node:child_process';
// Only light modules here: the parent (the command line, the server) does not load the engine.
import { DEFAULT_LIMITS, type Limits } from '../evaluate/limits.js';
import { withPage } from '../pipeline/page.js';
import type { RunOptions, RunProgress, SheetReport, SheetResult } from '../pipeline/types.js';
import { DEFAULT_HEAP_MB, startChild, takeEarly } from './spawn.js';
import { pipelineKey, type ChildProgress, type ChildReply, type ChildRequest, type WireReport } from './wire.js';

export interface SandboxOptions {
  /** Wall-clock limit per sheet (default 2000 ms). */
  timeoutMs?: number;
  /** Heap cap of the child process in MiB (default 256). */
  heapMb?: number;
  /** Interpreter limits; timeoutMs above overrides their time budget. */
  limits?: Partial<Limits>;
}

export class SandboxError extends Error {
  constructor(
    readonly code: 'timeout' | 'memory' | 'crash',
    message: string,
  ) {
    super(message);
  }
}

interface Pending {
  req: ChildRequest;
  /** Runs started for this request so far. */
  tries: number;
  resolve: (r: SheetResult) => void;
  reject: (e: Error) => void;
  onProgress: ((p: RunProgress) => void) | undefined;
}

/**
 * How long a run may take before its child is killed. The pipeline keeps to
 * its own time budget, evaluation and typesetting alike; this is for what it
 * cannot interrupt (one long formula, a huge Markdown file) and for faults.
 */
export function backstopMs(timeoutMs: number): number {
  // Reading, parsing and reporting an 8 MiB sheet take seconds of their own.
  return Math.max(3 * timeoutMs, timeoutMs + 8000);
}

export class Sandbox {
  private child: ChildProcess | undefined;
  private ready: Promise<void> | undefined;
  private readonly queue: Pending[] = [];
  private busy: Pending | undefined;
  private timer: NodeJS.Timeout | undefined;
  private nextId = 1;
  private closed = false;
  private readonly limits: Limits;
  private readonly heapMb: number;
  /** Part html the current child has sent, per sheet path: it sends unchanged parts by key only. */
  private parts = new Map<string, Map<string, string>>();

  constructor(options: SandboxOptions = {}) {
    this.limits = { ...DEFAULT_LIMITS, ...options.limits, timeoutMs: options.timeoutMs ?? options.limits?.timeoutMs ?? DEFAULT_LIMITS.timeoutMs };
    this.heapMb = options.heapMb ?? DEFAULT_HEAP_MB;
  }

  /**
   * Runs the pipeline over one sheet in the child; `onProgress` hears how far
   * a long statement has come. A sandbox is a runner of one lane: `lane` is
   * there so that it can stand wherever the server's runner does.
   */
  run(text: string, opts: RunOptions, _lane?: number, onProgress?: (p: RunProgress) => void): Promise<SheetResult> {
    if (this.closed) return Promise.reject(new Error('the sandbox is closed'));
    return new Promise((resolve, reject) => {
      this.queue.push({ req: { id: this.nextId++, text, opts, limits: this.limits }, tries: 0, resolve, reject, onProgress });
      void this.pump();
    });
  }

  /** Start the child now, so the first sheet does not wait for it. */
  warm(): Promise<void> {
    return this.start();
  }

  private start(): Promise<void> {
    if (this.ready) return this.ready;
    this.parts = new Map(); // a new child remembers nothing, and sends every part
    const started = takeEarly(this.heapMb) ?? startChild(this.heapMb);
    const child = started.child;
    this.child = child;
    const stderr = started.stderr;
    this.ready = started.ready.catch(() => {
      throw new SandboxError('crash', 'the evaluator could not start');
    });
    this.ready.catch(() => {});
    child.on('message', (m: ChildReply | ChildProgress | { ready: true }) => {
      if ('ready' in m) return;
      if ('progress' in m) {
        if (this.busy?.req.id === m.id) this.busy.onProgress?.(m.progress);
        return;
      }
      this.finish(m);
    });
    child.on('exit', (code, signal) => {
      if (this.child !== child) return;
      this.child = undefined;
      this.ready = undefined;
      const job = this.busy;
      if (job && !this.closed) {
        this.busy = undefined;
        clearTimeout(this.timer);
        const oom = /heap out of memory|Allocation failed|JavaScript heap/i.test(stderr()) || code === 134 || signal === 'SIGABRT';
        this.failOrRetry(
          job,
          oom
            ? new SandboxError('memory', `the sheet used more than the ${this.heapMb} MiB memory limit; evaluation stopped`)
            : new SandboxError('crash', `the evaluator stopped unexpectedly (${signal ?? `exit ${code}`})`),
        );
        void this.pump();
      }
    });
    child.unref();
    (child as unknown as { channel?: { unref(): void } }).channel?.unref();
    return this.ready;
  }

  private async pump(): Promise<void> {
    if (this.busy || this.queue.length === 0 || this.closed) return;
    const job = this.queue.shift()!;
    this.busy = job;
    job.tries++;
    try {
      await this.start();
    } catch (e) {
      this.busy = undefined;
      job.reject(e as Error);
      void this.pump();
      return;
    }
    const child = this.child!;
    (child as unknown as { channel?: { ref(): void } }).channel?.ref();
    // The pipeline stops itself at the time budget; this is the backstop.
    this.timer = setTimeout(() => {
      if (this.busy !== job) return;
      this.busy = undefined;
      this.kill();
      this.failOrRetry(job, new SandboxError('timeout', `evaluation took longer than ${this.limits.timeoutMs} ms and was stopped`));
      void this.pump();
    }, backstopMs(this.limits.timeoutMs));
    child.send(job.req);
  }

  /** A run lost with its child: once more, first in line, in a fresh child; then the reason. */
  private failOrRetry(job: Pending, error: SandboxError): void {
    if (job.tries < 2) {
      this.queue.unshift(job);
      return;
    }
    job.reject(new SandboxError(error.code, `${error.message} (also on a second try)`));
  }

  private finish(m: ChildReply): void {
    const job = this.busy;
    if (!job || job.req.id !== m.id) return;
    this.busy = undefined;
    clearTimeout(this.timer);
    if (this.queue.length === 0) (this.child as unknown as { channel?: { unref(): void } } | undefined)?.channel?.unref();
    if (m.ok) job.resolve(withPage(this.unwire(job.req, m.report)));
    else job.reject(new SandboxError('crash', m.message));
    void this.pump();
  }

  private unwire(req: ChildRequest, report: WireReport): SheetReport {
    const key = pipelineKey(req);
    const known = this.parts.get(key) ?? new Map<string, string>();
    const parts = report.parts.map((p) => ({ key: p.key, html: p.html ?? known.get(p.key) ?? '' }));
    this.parts.set(key, new Map(parts.map((p) => [p.key, p.html])));
    return { ...report, parts };
  }

  private kill(): void {
    const child = this.child;
    this.child = undefined;
    this.ready = undefined;
    child?.kill('SIGKILL');
  }

  async close(): Promise<void> {
    this.closed = true;
    clearTimeout(this.timer);
    for (const job of this.queue.splice(0)) job.reject(new Error('the sandbox is closed'));
    this.busy?.reject(new Error('the sandbox is closed'));
    this.busy = undefined;
    this.kill();
  }
}
