// The sandbox child: a warm process with a capped heap that runs the whole
// pipeline. One pipeline per sheet path keeps the incremental caches warm.
// The caches of other sheets give way to the sheet being run: past half of
// the heap, the child forgets every sheet but the one it runs, so whether a
// sheet fits never depends on which other sheets are open.
import { getHeapStatistics } from 'node:v8';
import type { Limits } from '../evaluate/index.js';
import { SheetPipeline } from '../pipeline/index.js';
import { pipelineKey, PROGRESS_AFTER_MS, PROGRESS_EVERY_MS, type ChildProgress, type ChildReply, type ChildRequest } from './wire.js';

/** Pipelines by key, least recently used first. */
const pipelines = new Map<string, SheetPipeline>();
/** What the parent holds for each pipeline: part key → token of the html last sent (see SheetPart). */
const sent = new Map<string, Map<string, string>>();
const MAX_PIPELINES = 200;
/** Share of the heap limit past which the other sheets' caches are dropped. */
const CROWDED = 0.5;

function pipelineFor(key: string, limits: Limits): SheetPipeline {
  let p = pipelines.get(key);
  if (p) pipelines.delete(key); // to the back: most recently used
  else {
    if (pipelines.size >= MAX_PIPELINES) forget(pipelines.keys().next().value!);
    p = new SheetPipeline({ limits });
  }
  pipelines.set(key, p);
  return p;
}

function forget(key: string): void {
  pipelines.delete(key);
  sent.delete(key);
}

/** Past half the heap, keep only `keep`: its run gets the room the others' caches took. */
function makeRoom(keep: string): void {
  const heap = getHeapStatistics();
  if (heap.used_heap_size < CROWDED * heap.heap_size_limit) return;
  for (const key of [...pipelines.keys()]) if (key !== keep) forget(key);
}

process.on('message', (msg: ChildRequest) => {
  let reply: ChildReply;
  try {
    const key = pipelineKey(msg);
    makeRoom(key);
    // The channel writes at once when nothing waits before it, so progress leaves while the run goes on.
    const started = Date.now();
    let told = 0;
    const progress = (p: ChildProgress['progress']) => {
      const now = Date.now();
      if (now - started < PROGRESS_AFTER_MS || now - told < PROGRESS_EVERY_MS) return;
      told = now;
      process.send!({ id: msg.id, progress: p } satisfies ChildProgress);
    };
    const report = pipelineFor(key, msg.limits).run(msg.text, msg.opts, { progress });
    const before = sent.get(key) ?? new Map<string, string>();
    // A kept part's html is unpacked only here, and only when the parent does not have it yet.
    const parts = report.parts.map((p) => (before.get(p.key) === (p.token ?? p.html) ? { key: p.key } : { key: p.key, html: p.html }));
    sent.set(key, new Map(report.parts.map((p) => [p.key, p.token ?? p.html])));
    reply = { id: msg.id, ok: true, report: { ...report, parts } };
    makeRoom(key);
  } catch (e) {
    reply = { id: msg.id, ok: false, message: e instanceof Error ? e.message : String(e) };
  }
  process.send!(reply);
});
process.send!({ ready: true });
