// Evaluators side by side: one sandbox per lane, so a sheet that takes its
// whole time budget holds back only the sheets of its own lane. The server's
// queue decides which lane runs which sheet (serve/queue.ts).
import type { RunOptions, RunProgress, SheetResult } from '../pipeline/index.js';
import { Sandbox, type SandboxOptions } from './sandbox.js';

export class SandboxPool {
  private readonly sandboxes: Sandbox[];

  constructor(
    readonly lanes = 2,
    options: SandboxOptions = {},
  ) {
    this.sandboxes = Array.from({ length: Math.max(1, lanes) }, () => new Sandbox(options));
  }

  run(text: string, opts: RunOptions, lane = 0, onProgress?: (p: RunProgress) => void): Promise<SheetResult> {
    return this.sandboxes[Math.min(Math.max(0, lane), this.sandboxes.length - 1)]!.run(text, opts, 0, onProgress);
  }

  /** Starts the first lane's child now; the others start with their first sheet. */
  warm(): Promise<void> {
    return this.sandboxes[0]!.warm();
  }

  async close(): Promise<void> {
    await Promise.all(this.sandboxes.map((s) => s.close()));
  }
}
