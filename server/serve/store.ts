// The server's memory of every sheet in the folder: the last good parts, their
// hashes, a version that grows with every change the page must see, and the
// sheet's condition (stale, failed, gone, moved). Evaluation goes through one
// runner (the sandbox), one sheet at a time (queue.ts). The store reads
// sheets; it never writes them.
import { EventEmitter } from 'node:events';
import { readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { typesetProgress, type RunOptions, type RunProgress, type SheetReport } from '../pipeline/index.js';
import { recordData, recordPage } from '../pipeline/record.js';
import { isSheetFile, sheetTooLarge } from '../read/sheet-files.js';
import { DependencyMap } from './deps.js';
import { footHtml, indexRowsHtml, noticeText, recordUrl, sheetUrl } from './pages.js';
import type { IndexEntry, PartUpdate, SheetCondition, SheetState, SheetUpdate } from './protocol.js';
import { EvaluationQueue } from './queue.js';
import { MOVE_WINDOW_MS, renamedFrom, renamedTo } from './renames.js';
import { resolveSheetFileSync, SheetPathError } from './security.js';
import { changeOfParts, type HashedPart } from './updates.js';
import type { FileEvent } from './watch.js';

/** What the store needs from the sandbox; tests may pass a stand-in. */
export interface SheetRunner {
  /** `lane` picks one of the runner's evaluators (0 … lanes − 1); `onProgress` hears how far a long statement has come. */
  run(text: string, opts: RunOptions, lane?: number, onProgress?: (p: RunProgress) => void): Promise<SheetReport>;
  close(): Promise<void>;
  /** Starts the evaluator ahead of the first sheet, where that helps. */
  warm?(): Promise<void>;
  /** Evaluators that work side by side (default 1): that many sheets are evaluated at once. */
  readonly lanes?: number;
}

interface SheetRecord {
  path: string;
  title: string;
  version: number;
  state: SheetState;
  parts: HashedPart[];
  headerHtml: string;
  summaryHtml: string;
  result: SheetReport | null;
  failure: string | null;
  gone: boolean;
  goneAt: number;
  addedAt: number;
  movedTo: string | null;
  /** This sheet is a renamed one, until its next evaluation: the old name. */
  movedFrom: string | null;
  evaluatedAt: string | null;
  /** Text of the last evaluation, to recognise the same sheet after a rename. */
  lastText: string | null;
  /** The text and file of the evaluation whose result is shown. */
  resultText: string | null;
  resultFile: string | null;
  /** The last read found the sheet empty, and a second look is due. */
  emptyOnce: boolean;
  /** Statements the last run left untypeset (its time ran out), and the text it ran on. */
  untypeset: { count: number; text: string } | null;
  waiters: (() => void)[];
}

export interface StoreEvents {
  /** A sheet changed; the update applies to the previous version. */
  sheet: [update: SheetUpdate];
  busy: [sheet: string];
  /** A long statement of the sheet's evaluation has come this far. */
  progress: [sheet: string, progress: RunProgress];
  index: [];
  /** A deleted sheet is no longer kept (no page follows it). */
  forgotten: [sheet: string];
}

/** How often deleted sheets that no page follows any more are let go. */
const FORGET_GONE_MS = 5000;

/** How long an emptied sheet waits for the rest of its save before it is shown empty. */
const EMPTY_RECHECK_MS = 25;

export class SheetStore extends EventEmitter<StoreEvents> {
  readonly deps = new DependencyMap();
  private readonly records = new Map<string, SheetRecord>();
  private readonly queue: EvaluationQueue;
  private closed = false;
  /** Set by the live layer: sheets with a page open are evaluated first. */
  isFollowed: (sheet: string) => boolean = () => false;
  private readonly sweeper: NodeJS.Timeout;

  constructor(
    private readonly realRoot: string,
    private readonly runner: SheetRunner,
  ) {
    super();
    this.queue = new EvaluationQueue(
      (sheet, lane) => this.evaluate(sheet, lane),
      (sheet) => this.isFollowed(sheet),
      runner.lanes ?? 1,
    );
    this.sweeper = setInterval(() => this.forgetGone(), FORGET_GONE_MS);
    this.sweeper.unref();
  }

  /**
   * A deleted sheet is kept while a page shows it (that page was told, and
   * keeps its content); after that, and past the time a rename takes, it is
   * let go: its URL answers 404 and its memory is returned.
   */
  forgetGone(now = Date.now()): void {
    for (const [sheet, record] of this.records) {
      if (!record.gone || now - record.goneAt < MOVE_WINDOW_MS || this.isFollowed(sheet)) continue;
      this.records.delete(sheet);
      this.emit('forgotten', sheet);
    }
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

  /** The complete update of a sheet, for a page that (re)connects. */
  complete(sheet: string): SheetUpdate | null {
    const record = this.records.get(sheet);
    if (!record) return null;
    return {
      type: 'sheet',
      sheet,
      url: sheetUrl(sheet),
      recordUrl: recordUrl(sheet),
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
        url: sheetUrl(record.path),
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

  /** The set-up record of the last good evaluation, or null before there is one. */
  record(sheet: string): string | null {
    const r = this.records.get(sheet);
    if (!r?.result || r.resultText === null || r.resultFile === null) return null;
    return recordPage(r.result, recordData(r.result, { source: r.resultText, path: r.resultFile, root: this.realRoot }));
  }

  /** The index as a message, rows included. */
  indexMessage(): { type: 'index'; sheets: IndexEntry[]; rowsHtml: string } {
    const sheets = this.index();
    return { type: 'index', sheets, rowsHtml: indexRowsHtml(sheets) };
  }

  /** Waits for the evaluation in progress, if any, and stops taking work. */
  async close(): Promise<void> {
    this.closed = true;
    clearInterval(this.sweeper);
    await this.queue.close();
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
        movedFrom: null,
        evaluatedAt: null,
        lastText: null,
        resultText: null,
        resultFile: null,
        emptyOnce: false,
        untypeset: null,
        waiters: [],
      };
      this.records.set(sheet, record);
      this.emit('index');
    }
    return record;
  }

  private condition(record: SheetRecord): SheetCondition {
    const stale = record.gone || (record.failure !== null && record.result !== null);
    const elapsedMs = record.result ? Math.round(record.result.elapsedMs * 10) / 10 : null;
    const facts = { stale, failure: record.failure, gone: record.gone, movedTo: record.movedTo, movedFrom: record.movedFrom, path: record.path };
    return { stale, failure: record.failure, gone: record.gone, movedTo: record.movedTo, evaluatedAt: record.evaluatedAt, elapsedMs, notice: noticeText(facts), footHtml: footHtml(record.evaluatedAt, elapsedMs) };
  }

  private schedule(sheet: string): void {
    if (this.closed || !this.records.has(sheet)) return;
    this.queue.add(sheet);
  }

  private async evaluate(sheet: string, lane = 0): Promise<void> {
    const record = this.records.get(sheet);
    if (!record || record.gone) return;
    let text: string;
    let file: string;
    try {
      // Synchronous on purpose: sheets are small local text files (see resolveSheetFileSync).
      file = resolveSheetFileSync(this.realRoot, sheet);
      const tooLarge = sheetTooLarge(statSync(file).size);
      if (tooLarge) {
        this.fail(record, tooLarge);
        return;
      }
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
    let result: SheetReport;
    try {
      result = await this.runner.run(text, { path: file, root: this.realRoot }, lane, (p) => this.emit('progress', sheet, p));
    } catch (error) {
      record.lastText = text;
      this.fail(record, `Evaluation failed: ${describe(error)}`);
      return;
    }
    if (this.closed) return;
    record.lastText = text;
    record.resultText = text;
    record.resultFile = file;
    this.deps.setReads(sheet, result.reads);
    this.accept(record, result);
    this.detectMoveTo(record);
    this.continueTypesetting(record, text, result.untypeset);
  }

  /**
   * A run that ran out of time while typesetting showed the rest as source
   * text; the next run of the same text reuses what was typeset and goes on.
   * Run again while each run typesets a good share of what is left (a sheet
   * too large to typeset in any run stops after one), behind whatever else waits.
   */
  private continueTypesetting(record: SheetRecord, text: string, untypeset: number): void {
    const before = record.untypeset;
    record.untypeset = untypeset > 0 ? { count: untypeset, text } : null;
    if (untypeset === 0) return;
    if (before && before.text === text && !typesetProgress(before.count, untypeset)) return;
    this.schedule(record.path);
  }

  private accept(record: SheetRecord, result: SheetReport): void {
    const { parts, changed: updated, order } = changeOfParts(record.parts, result.parts);
    const title = result.title;
    const header = result.headerHtml;
    const changed = { header: header !== record.headerHtml, summary: result.summaryHtml !== record.summaryHtml };
    const base = record.version;
    record.parts = parts;
    record.headerHtml = header;
    record.summaryHtml = result.summaryHtml;
    record.result = result;
    record.title = title;
    record.failure = null;
    record.movedFrom = null;
    record.state = 'ready';
    record.evaluatedAt = new Date().toISOString();
    this.publish(record, base, updated, order, changed.header ? header : null, changed.summary ? record.summaryHtml : null);
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
    this.queue.drop(sheet);
    this.deps.forget(sheet);
    const to = renamedTo(record, this.records.values());
    if (to) {
      record.movedTo = to.path;
      to.movedFrom = record.path;
    }
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
    const old = renamedFrom(record, this.records.values());
    if (!old) return;
    old.movedTo = record.path;
    record.movedFrom = old.path;
    this.publish(old, old.version, [], null, null, null);
  }

  private publish(record: SheetRecord, base: number, parts: PartUpdate[], order: string[] | null, headerHtml: string | null, summaryHtml: string | null): void {
    record.version = base + 1;
    record.waiters.splice(0).forEach((w) => w());
    this.emit('sheet', {
      type: 'sheet',
      sheet: record.path,
      url: sheetUrl(record.path),
      recordUrl: recordUrl(record.path),
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

function describe(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
