// Watches the served folder and reports, per file, that it was added, changed
// or removed. Raw watcher events only mark a file dirty; a short debounce later
// the file is stat-ed and the event is decided from what is on disk. That one
// rule covers in-place writes (which may fire while the file is still empty),
// editors that write a temporary file and rename it over the sheet, deletes
// and renames. A second look after a settling delay catches writes that were
// still going on at the first one, since the watcher may fire only once.
import { stat } from 'node:fs/promises';
import path from 'node:path';
import { watch, type FSWatcher } from 'chokidar';
import { isIgnoredName } from '../read/sheet-files.js';

export type FileEventKind = 'added' | 'changed' | 'removed';

export interface FileEvent {
  kind: FileEventKind;
  /** Relative to the watched folder, forward slashes. */
  file: string;
}

export interface FolderWatcherOptions {
  onEvent: (event: FileEvent) => void;
  onError?: (error: Error) => void;
  /** Quiet time after the last raw event before the file is looked at; 0 means the next turn of the event loop. */
  debounceMs?: number;
  /** Delay of the second look that catches writes still in progress. */
  settleMs?: number;
  /** How long a file must stay missing before it counts as removed. */
  removeGraceMs?: number;
}

// chokidar reports the first change of a burst at once and drops the rest for
// 50 ms. Looking on the very next turn of the event loop instead of 1 ms later
// caught some saves still empty (truncated, not yet written: up to 5 in 50 in
// the benchmark), and those then waited for a second look: 1 ms is cheaper.
const DEFAULTS = { debounceMs: 1, settleMs: 60, removeGraceMs: 40 };

interface Tracked {
  /** Cancels the pending look, if one is due. */
  timer: (() => void) | null;
  settleTimer: NodeJS.Timeout | null;
  /** ino:size:mtime as last reported, or null while unknown. */
  signature: string | null;
}

export class FolderWatcher {
  private readonly tracked = new Map<string, Tracked>();
  private readonly known = new Set<string>();
  private readonly options: Required<Omit<FolderWatcherOptions, 'onError'>> & Pick<FolderWatcherOptions, 'onError'>;
  private closed = false;

  private constructor(
    readonly root: string,
    private readonly watcher: FSWatcher,
    options: FolderWatcherOptions,
  ) {
    this.options = { ...DEFAULTS, ...options };
  }

  /** Starts watching `root` (absolute) and resolves once the first scan is done. */
  static async start(root: string, options: FolderWatcherOptions): Promise<FolderWatcher> {
    const chokidar = watch(root, {
      ignoreInitial: false,
      followSymlinks: false,
      ignored: (p: string) => p !== root && isIgnoredName(path.basename(p)),
    });
    const self = new FolderWatcher(root, chokidar, options);
    const initial: string[] = [];
    let ready = false;
    await new Promise<void>((resolve, reject) => {
      chokidar.on('error', (error) => {
        if (!ready) reject(error);
        else self.options.onError?.(error instanceof Error ? error : new Error(String(error)));
      });
      chokidar.on('all', (event, absolute) => {
        const file = self.relative(absolute);
        if (file === null) return;
        if (!ready) {
          if (event === 'add') initial.push(file);
          return;
        }
        if (event === 'unlinkDir') self.touchUnder(file);
        else if (event === 'add' || event === 'change' || event === 'unlink') self.touch(file);
      });
      chokidar.once('ready', () => {
        ready = true;
        for (const file of initial) self.known.add(file);
        resolve();
      });
    });
    return self;
  }

  /** Files present after the first scan and kept up to date since. */
  files(): string[] {
    return [...this.known].sort();
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const t of this.tracked.values()) {
      t.timer?.();
      if (t.settleTimer) clearTimeout(t.settleTimer);
    }
    this.tracked.clear();
    await this.watcher.close();
  }

  private relative(absolute: string): string | null {
    const rel = path.relative(this.root, absolute);
    if (rel === '' || rel.startsWith('..') || path.isAbsolute(rel)) return null;
    return rel.split(path.sep).join('/');
  }

  private entry(file: string): Tracked {
    let t = this.tracked.get(file);
    if (!t) this.tracked.set(file, (t = { timer: null, settleTimer: null, signature: null }));
    return t;
  }

  /** A raw event arrived for `file`: look at it once things are quiet. */
  private touch(file: string, delay = this.options.debounceMs): void {
    if (this.closed) return;
    const t = this.entry(file);
    t.timer?.();
    t.timer = later(() => {
      t.timer = null;
      void this.look(file);
    }, delay);
  }

  private touchUnder(dir: string): void {
    for (const file of this.known) if (file.startsWith(dir + '/')) this.touch(file);
  }

  private async look(file: string, missingSince?: number): Promise<void> {
    const t = this.entry(file);
    const signature = await signatureOf(path.join(this.root, ...file.split('/')));
    if (this.closed) return;
    if (signature === null) {
      if (!this.known.has(file)) return;
      const waited = missingSince === undefined ? 0 : Date.now() - missingSince;
      if (waited < this.options.removeGraceMs) {
        // Some editors delete the sheet just before renaming the new one in.
        const since = missingSince ?? Date.now();
        setTimeout(() => void this.look(file, since), this.options.removeGraceMs - waited);
        return;
      }
      this.known.delete(file);
      t.signature = null;
      this.emit({ kind: 'removed', file });
      return;
    }
    if (t.timer) return; // a newer event is pending; it will look again
    const added = !this.known.has(file);
    if (!added && signature === t.signature) return;
    this.known.add(file);
    t.signature = signature;
    this.emit({ kind: added ? 'added' : 'changed', file });
    if (t.settleTimer) clearTimeout(t.settleTimer);
    t.settleTimer = setTimeout(() => {
      t.settleTimer = null;
      void this.look(file);
    }, this.options.settleMs);
  }

  private emit(event: FileEvent): void {
    if (!this.closed) this.options.onEvent(event);
  }
}

/** Runs `fn` after `ms` (0: on the next turn of the event loop); returns a cancel function. */
function later(fn: () => void, ms: number): () => void {
  if (ms === 0) {
    const immediate = setImmediate(fn);
    return () => clearImmediate(immediate);
  }
  const timeout = setTimeout(fn, ms);
  return () => clearTimeout(timeout);
}

async function signatureOf(file: string): Promise<string | null> {
  try {
    const s = await stat(file, { bigint: true });
    if (!s.isFile()) return null;
    return `${s.ino}:${s.size}:${s.mtimeNs}`;
  } catch {
    return null;
  }
}
