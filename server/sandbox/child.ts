// The sandbox child: a warm process with a capped heap that runs the whole
// pipeline. One pipeline per sheet path keeps the incremental caches warm.
import type { Limits } from '../evaluate/index.js';
import { SheetPipeline } from '../pipeline/index.js';
import { pipelineKey, type ChildReply, type ChildRequest } from './wire.js';

const pipelines = new Map<string, SheetPipeline>();
/** What the parent holds for each pipeline: part key → html last sent. */
const sent = new Map<string, Map<string, string>>();
const MAX_PIPELINES = 200;

function pipelineFor(key: string, limits: Limits): SheetPipeline {
  let p = pipelines.get(key);
  if (!p) {
    if (pipelines.size >= MAX_PIPELINES) {
      const oldest = pipelines.keys().next().value!;
      pipelines.delete(oldest);
      sent.delete(oldest);
    }
    p = new SheetPipeline({ limits });
    pipelines.set(key, p);
  }
  return p;
}

process.on('message', (msg: ChildRequest) => {
  let reply: ChildReply;
  try {
    const key = pipelineKey(msg);
    const report = pipelineFor(key, msg.limits).run(msg.text, msg.opts);
    const before = sent.get(key) ?? new Map<string, string>();
    const parts = report.parts.map((p) => (before.get(p.key) === p.html ? { key: p.key } : p));
    sent.set(key, new Map(report.parts.map((p) => [p.key, p.html])));
    reply = { id: msg.id, ok: true, report: { ...report, parts } };
  } catch (e) {
    reply = { id: msg.id, ok: false, message: e instanceof Error ? e.message : String(e) };
  }
  process.send!(reply);
});
process.send!({ ready: true });
