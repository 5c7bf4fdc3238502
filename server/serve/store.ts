// The server's memory of every sheet in the folder: the last good parts, their
// hashes, a version that grows with every change the page must see, and the
// sheet's condition (stale, failed, gone, moved). Evaluation goes through one
// renderer (the sandbox), one sheet at a time, sheets someone is looking at
// first. The store reads sheets; it never writes them.
import { createHash } from 'node:crypto';
import { EventEmitter } from 'node:events';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { cautionHtml, headerHtml } from '../render/page.js';
import type { RenderOptions, SheetResult } from '../sheet-types.js';
import { DependencyMap } from './deps.js';
import { htmlEdits, type PartEdits } from './html-edits.js';
import type { IndexEntry, PartFrame, SheetCondition, SheetFrameMessage, SheetState } from './protocol.js';
import { resolveSheetFileSync, SheetPathError } from './security.js';
import { isSheetFile, type FileEvent } from './watch.js';

/** What the store needs from the sandbox; tests may pass a stand-in. */
export interface SheetRenderer {
  render(text: string, opts: RenderOptions): Promise<SheetResult>;
  close(): Promise<void>;
  /** Starts the evaluator ahead of the first sheet, where that helps. */
  warm?(): Promise<void>;
}

interface HashedPart {
  key: string;
  hash: string;
  html: string;
}

interface SheetRecord {
  path: string;
  title: string;
  version: number;
  state: SheetState;
  parts: HashedPart[];
  headerHtml: string;
  summaryHtml: string;
  result: SheetResult | null;
  failure: string | null;
  gone: boolean;
  goneAt: number;
  addedAt: number;
  movedTo: string | null;
  evaluatedAt: string | null;
  /** Text of the last evaluation, to recognise the same sheet after a rename. */
  lastText: string | null;
  /** The last read found the sheet empty, and a second look is due. */
  emptyOnce: boolean;
  waiters: (() => void)[];
}

export interface StoreEvents {
  /** A sheet's frame changed; `delta` patches the previous version. */
  sheet: [delta: SheetFrameMessage];
  busy: [sheet: string];
  index: [];
}

/** A rename shows up as a delete and an add of the same text within this time. */
const MOVE_WINDOW_MS = 2000;
/** How long an emptied sheet waits for the rest of its save before it is shown empty. */
const EMPTY_RECHECK_MS = 25;

export function hashHtml(html: string): string {
  return createHash('sha1').update(html).digest('base64url').slice(0, 12);
}

export class SheetStore extends EventEmitter<StoreEvents> {
  readonly deps = new DependencyMap();
  private readonly records = new Map<string, SheetRecord>();
  private readonly dirty = new Set<string>();
  private running: Promise<void> | null = null;
  private closed = false;
  /** Set by the live layer: sheets with a page open are evaluated first. */
  isFollowed: (sheet: string) => boolean = () => false;

  constructor(
    private readonly realRoot: string,
    private readonly renderer: SheetRenderer,
  ) {
    super();
  }

  /** Registers the sheets found by the first scan and queues their evaluation. */
  addInitial(files: string[]): void {
    for (const file of files) if (isSheetFile(file)) this.ensure(file, 0);
    for (const file of files) if (isSheetFile(file)) this.schedule(file);
  }

  /** Reacts to one watcher event. */
  handle(event: FileEvent): void {
    if (this.closed) return;
    const { file, kind } = event;
    if (isSheetFile(file)) {
      if (kind === 'removed') this.markGone(file);
      else {
        const record = this.ensure(file, Date.now());
        if (record.gone) this.revive(record);
        this.schedule(file);
      }
    }
    for (const reader of this.deps.readersOf(file)) this.schedule(reader);
  }

  has(sheet: string): boolean {
    const record = this.records.get(sheet);
    return record !== undefined && !record.gone;
  }

  /** Known, including sheets that were deleted while a page still shows them. */
  knows(sheet: string): boolean {
    return this.records.has(sheet);
  }

  /** Resolves once the sheet has been evaluated at least once (or is gone). */
  whenEvaluated(sheet: string): Promise<void> {
    const record = this.records.get(sheet);
    if (!record || record.version > 0 || record.gone) return Promise.resolve();
    return new Promise((resolve) => record.waiters.push(resolve));
  }

  /** Resolves once every sheet known now has been evaluated at least once. */
  whenAllEvaluated(): Promise<void> {
    return Promise.all([...this.records.keys()].map((sheet) => this.whenEvaluated(sheet))).then(() => undefined);
  }

  /** The complete frame of a sheet, for a page that (re)connects. */
  frame(sheet: string): SheetFrameMessage | null {
    const record = this.records.get(sheet);
    if (!record) return null;
    return {
      type: 'sheet',
      sheet,
      version: record.version,
      base: null,
      title: record.title,
      parts: record.parts.map((p) => ({ key: p.key, hash: p.hash, html: p.html })),
      order: record.parts.map((p) => p.key),
      headerHtml: record.headerHtml,
      summaryHtml: record.summaryHtml,
      condition: this.condition(record),
    };
  }

  index(): IndexEntry[] {
    const entries: IndexEntry[] = [];
    for (const record of this.records.values()) {
      if (record.gone) continue;
      const summary = record.result?.summary;
      entries.push({
        path: record.path,
        title: record.title,
        state: record.state,
        checksPassed: summary?.checksPassed ?? 0,
        checksFailed: summary?.checksFailed ?? 0,
        errors: summary?.errors ?? 0,
        evaluatedAt: record.evaluatedAt,
        elapsedMs: record.result ? Math.round(record.result.elapsedMs * 10) / 10 : null,
        failure: record.failure,
      });
    }
    return entries.sort((a, b) => a.path.localeCompare(b.path));
  }

  /** Waits for the evaluation in progress, if any, and stops taking work. */
  async close(): Promise<void> {
    this.closed = true;
    this.dirty.clear();
    await this.running;
    for (const record of this.records.values()) record.waiters.splice(0).forEach((w) => w());
  }

  private ensure(sheet: string, addedAt: number): SheetRecord {
    let record = this.records.get(sheet);
    if (!record) {
      record = {
        path: sheet,
        title: path.posix.basename(sheet, '.md'),
        version: 0,
        state: 'waiting',
        parts: [],
        headerHtml: '',
        summaryHtml: '',
        result: null,
        failure: null,
        gone: false,
        goneAt: 0,
        addedAt,
        movedTo: null,
        evaluatedAt: null,
        lastText: null,
        emptyOnce: false,
        waiters: [],
      };
      this.records.set(sheet, record);
      this.emit('index');
    }
    return record;
  }

  private condition(record: SheetRecord): SheetCondition {
    return {
      stale: record.gone || (record.failure !== null && record.result !== null),
      failure: record.failure,
      gone: record.gone,
      movedTo: record.movedTo,
      evaluatedAt: record.evaluatedAt,
      elapsedMs: record.result ? Math.round(record.result.elapsedMs * 10) / 10 : null,
    };
  }

  private schedule(sheet: string): void {
    if (this.closed || !this.records.has(sheet)) return;
    this.dirty.add(sheet);
    this.kick();
  }

  private kick(): void {
    if (this.running || this.closed) return;
    this.running = this.drain().finally(() => {
      this.running = null;
      // Work may have arrived between the last loop check and now.
      if (this.dirty.size > 0) this.kick();
    });
  }

  private async drain(): Promise<void> {
    while (this.dirty.size > 0 && !this.closed) {
      let next: string | undefined;
      for (const sheet of this.dirty) {
        if (this.isFollowed(sheet)) {
          next = sheet;
          break;
        }
        next ??= sheet;
      }
      this.dirty.delete(next!);
      await this.evaluate(next!);
    }
  }

  private async evaluate(sheet: string): Promise<void> {
    const record = this.records.get(sheet);
    if (!record || record.gone) return;
    let text: string;
    let file: string;
    try {
      // Synchronous on purpose: sheets are small local text files (see resolveSheetFileSync).
      file = resolveSheetFileSync(this.realRoot, sheet);
      text = readFileSync(file, 'utf8');
    } catch (error) {
      if (error instanceof SheetPathError && error.code === 'outside-folder') {
        // A symlink out of the folder: not ours to show.
        this.records.delete(sheet);
        record.waiters.splice(0).forEach((w) => w());
        this.emit('index');
        return;
      }
      // Missing just now: the watcher reports the removal in a moment.
      this.fail(record, `Could not read the sheet: ${describe(error)}`);
      return;
    }
    if (text.trim() === '' && record.lastText?.trim() && !record.emptyOnce) {
      // Caught mid-save (truncated, not yet written)? Look again shortly rather
      // than blank the page; a sheet still empty then really is empty.
      record.emptyOnce = true;
      setTimeout(() => this.schedule(sheet), EMPTY_RECHECK_MS).unref();
      return;
    }
    record.emptyOnce = false;
    record.state = 'evaluating';
    this.emit('busy', sheet);
    this.emit('index');
    let result: SheetResult;
    try {
      result = await this.renderer.render(text, { path: file, root: this.realRoot });
    } catch (error) {
      record.lastText = text;
      this.fail(record, `Evaluation failed: ${describe(error)}`);
      return;
    }
    if (this.closed) return;
    record.lastText = text;
    this.deps.setReads(sheet, result.reads);
    this.accept(record, result);
    this.detectMoveTo(record);
  }

  private accept(record: SheetRecord, result: SheetResult): void {
    const previousKeys = record.parts;
    const before = new Map(record.parts.map((p) => [p.key, p]));
    // Unchanged parts arrive as the very same strings: keep their hash instead of rehashing megabytes.
    const parts = result.parts.map((p) => {
      const old = before.get(p.key);
      return { key: p.key, hash: old && old.html === p.html ? old.hash : hashHtml(p.html), html: p.html };
    });
    const title = result.title || result.meta.title || path.posix.basename(record.path, '.md');
    const header = headerHtml(title, result.meta) + (hasCaution(result) ? cautionHtml() : '');
    const changed = { header: header !== record.headerHtml, summary: result.summaryHtml !== record.summaryHtml };
    const base = record.version;
    record.parts = parts;
    record.headerHtml = header;
    record.summaryHtml = result.summaryHtml;
    record.result = result;
    record.title = title;
    record.failure = null;
    record.state = 'ready';
    record.evaluatedAt = new Date().toISOString();
    const frames: PartFrame[] = [];
    for (const p of parts) {
      const old = before.get(p.key);
      if (old?.hash === p.hash) continue;
      const edits = old ? htmlEdits(old.hash, old.html, p.html) : null;
      frames.push(edits && editsAreSmaller(edits, p.html) ? { key: p.key, hash: p.hash, edits } : { key: p.key, hash: p.hash, html: p.html });
    }
    const order = sameKeys(previousKeys, parts) ? null : parts.map((p) => p.key);
    this.publish(record, base, frames, order, changed.header ? header : null, changed.summary ? record.summaryHtml : null);
  }

  private fail(record: SheetRecord, message: string): void {
    record.failure = message;
    record.state = 'failed';
    this.publish(record, record.version, [], null, null, null);
  }

  private markGone(sheet: string): void {
    const record = this.records.get(sheet);
    if (!record || record.gone) return;
    record.gone = true;
    record.goneAt = Date.now();
    this.dirty.delete(sheet);
    this.deps.forget(sheet);
    this.detectMoveFrom(record);
    this.publish(record, record.version, [], null, null, null);
    record.waiters.splice(0).forEach((w) => w());
  }

  private revive(record: SheetRecord): void {
    record.gone = false;
    record.movedTo = null;
    record.addedAt = Date.now();
    this.emit('index');
  }

  /** `record` has just been evaluated: was it a sheet deleted a moment ago? */
  private detectMoveTo(record: SheetRecord): void {
    if (Date.now() - record.addedAt > MOVE_WINDOW_MS) return;
    for (const old of this.records.values()) {
      if (old.gone && old.movedTo === null && old.lastText === record.lastText && Date.now() - old.goneAt < MOVE_WINDOW_MS) {
        old.movedTo = record.path;
        this.publish(old, old.version, [], null, null, null);
        return;
      }
    }
  }

  /** `record` was just deleted: did the same text appear under another name? */
  private detectMoveFrom(record: SheetRecord): void {
    for (const other of this.records.values()) {
      if (other !== record && !other.gone && other.lastText !== null && other.lastText === record.lastText && Date.now() - other.addedAt < MOVE_WINDOW_MS) {
        record.movedTo = other.path;
        return;
      }
    }
  }

  private publish(record: SheetRecord, base: number, parts: PartFrame[], order: string[] | null, headerHtml: string | null, summaryHtml: string | null): void {
    record.version = base + 1;
    record.waiters.splice(0).forEach((w) => w());
    this.emit('sheet', {
      type: 'sheet',
      sheet: record.path,
      version: record.version,
      base,
      title: record.title,
      parts,
      order,
      headerHtml,
      summaryHtml,
      condition: this.condition(record),
    });
    this.emit('index');
  }
}

function sameKeys(a: readonly { key: string }[], b: readonly { key: string }[]): boolean {
  return a.length === b.length && a.every((p, i) => p.key === b[i]!.key);
}

/** Edits win unless nearly everything changed (a rough size count, no serialising). */
function editsAreSmaller(edits: PartEdits, html: string): boolean {
  let size = 0;
  for (const [, was, is] of edits.texts) size += was.length + is.length + 12;
  for (const [, tag, name, value] of edits.attrs) size += tag.length + name.length + (value?.length ?? 0) + 16;
  return size < html.length / 2;
}

/** The engine flags sheets whose figures need a licensed engineer's check. */
function hasCaution(result: SheetResult): boolean {
  return result.caution;
}

function describe(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
