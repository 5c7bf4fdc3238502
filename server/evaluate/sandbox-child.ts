// The sandbox child: a warm process with a capped heap that runs the whole
// pipeline. One session per sheet path keeps the incremental caches warm.
import { SheetSession, type SheetCore } from '../session.js';
import type { Limits } from './limits.js';
import type { RenderOptions } from '../sheet-types.js';

export interface ChildRequest {
  id: number;
  text: string;
  opts: RenderOptions;
  limits: Limits;
}

export type ChildReply = { id: number; ok: true; core: SheetCore } | { id: number; ok: false; message: string };

const sessions = new Map<string, SheetSession>();
const MAX_SESSIONS = 200;

function sessionFor(key: string, limits: Limits): SheetSession {
  let s = sessions.get(key);
  if (!s) {
    if (sessions.size >= MAX_SESSIONS) sessions.delete(sessions.keys().next().value!);
    s = new SheetSession({ limits });
    sessions.set(key, s);
  }
  return s;
}

process.on('message', (msg: ChildRequest) => {
  let reply: ChildReply;
  try {
    const key = `${msg.opts.path ?? ''}\u0000${JSON.stringify(msg.limits)}`;
    const core = sessionFor(key, msg.limits).render(msg.text, msg.opts);
    reply = { id: msg.id, ok: true, core };
  } catch (e) {
    reply = { id: msg.id, ok: false, message: e instanceof Error ? e.message : String(e) };
  }
  process.send!(reply);
});
process.send!({ ready: true });
