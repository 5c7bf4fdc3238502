// What the sandbox parent and child say to each other. Both sides key their
// per-sheet state the same way, so the part diff stays in step.
import type { SheetCore } from '../session.js';
import type { RenderOptions } from '../sheet-types.js';
import type { Limits } from './limits.js';

export interface ChildRequest {
  id: number;
  text: string;
  opts: RenderOptions;
  limits: Limits;
}

/** Parts the parent already has from this child are sent by key only. */
export type WireCore = Omit<SheetCore, 'parts'> & { parts: Array<{ key: string; html?: string }> };

export type ChildReply = { id: number; ok: true; core: WireCore } | { id: number; ok: false; message: string };

/** One session per sheet path and set of limits, on both sides of the channel. */
export function sessionKey(req: ChildRequest): string {
  return `${req.opts.path ?? ''}\u0000${JSON.stringify(req.limits)}`;
}
