// The sandbox child: a warm process with a capped heap that runs the whole
// pipeline. One session per sheet path keeps the incremental caches warm.
import { SheetSession } from '../session.js';
import type { Limits } from './limits.js';
import { sessionKey, type ChildReply, type ChildRequest } from './sandbox-wire.js';

const sessions = new Map<string, SheetSession>();
/** What the parent holds for each session: part key → html last sent. */
const sent = new Map<string, Map<string, string>>();
const MAX_SESSIONS = 200;

function sessionFor(key: string, limits: Limits): SheetSession {
  let s = sessions.get(key);
  if (!s) {
    if (sessions.size >= MAX_SESSIONS) {
      const oldest = sessions.keys().next().value!;
      sessions.delete(oldest);
      sent.delete(oldest);
    }
    s = new SheetSession({ limits });
    sessions.set(key, s);
  }
  return s;
}

process.on('message', (msg: ChildRequest) => {
  let reply: ChildReply;
  try {
    const key = sessionKey(msg);
    const core = sessionFor(key, msg.limits).render(msg.text, msg.opts);
    const before = sent.get(key) ?? new Map<string, string>();
    const parts = core.parts.map((p) => (before.get(p.key) === p.html ? { key: p.key } : p));
    sent.set(key, new Map(core.parts.map((p) => [p.key, p.html])));
    reply = { id: msg.id, ok: true, core: { ...core, parts } };
  } catch (e) {
    reply = { id: msg.id, ok: false, message: e instanceof Error ? e.message : String(e) };
  }
  process.send!(reply);
});
process.send!({ ready: true });
