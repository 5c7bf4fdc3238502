// What the sandbox parent and child say to each other. Both sides key their
// per-sheet state the same way, so the part diff stays in step.
import type { Limits } from '../evaluate/index.js';
import type { RunOptions, RunProgress, SheetReport } from '../pipeline/index.js';

export interface ChildRequest {
  id: number;
  text: string;
  opts: RunOptions;
  limits: Limits;
}

/** Parts the parent already has from this child are sent by key only. */
export type WireReport = Omit<SheetReport, 'parts'> & { parts: Array<{ key: string; html?: string }> };

export type ChildReply = { id: number; ok: true; report: WireReport } | { id: number; ok: false; message: string };

/** Sent while a run goes on, when it has taken long enough to be worth telling. */
export interface ChildProgress {
  id: number;
  progress: RunProgress;
}

/** A run is told of only once it has taken this long, and then at most this often. */
export const PROGRESS_AFTER_MS = 200;
export const PROGRESS_EVERY_MS = 100;

/** One pipeline per sheet path and set of limits, on both sides of the channel. */
export function pipelineKey(req: ChildRequest): string {
  return `${req.opts.path ?? ''}\u0000${JSON.stringify(req.limits)}`;
}
