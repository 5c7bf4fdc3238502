// TEMPORARY STUB: the real sandbox evaluates in a warm forked child with a
// capped heap and a time limit; the exported class keeps this shape.
import { renderSheet } from '../sheet.js';
import type { RenderOptions, SheetResult } from '../sheet-types.js';

export interface SandboxOptions {
  /** Wall-clock limit per sheet (default 2000 ms). */
  timeoutMs?: number;
  /** Heap cap of the child process in MiB. */
  heapMb?: number;
}

export class Sandbox {
  constructor(private readonly options: SandboxOptions = {}) {}

  render(text: string, opts: RenderOptions): Promise<SheetResult> {
    void this.options;
    return renderSheet(text, opts);
  }

  async close(): Promise<void> {}
}
