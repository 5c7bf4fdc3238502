// A rename shows up as a delete and an add of the same text within a short
// time, in either order. These find the other half of the pair.

/** A rename's delete and add come within this time of each other. */
export const MOVE_WINDOW_MS = 2000;

export interface RenameFacts {
  path: string;
  gone: boolean;
  goneAt: number;
  addedAt: number;
  movedTo: string | null;
  /** Text of the last evaluation. */
  lastText: string | null;
}

/** `added` has just been evaluated: the sheet deleted a moment ago that had its text, if any. */
export function renamedFrom<T extends RenameFacts>(added: T, records: Iterable<T>, now = Date.now()): T | undefined {
  if (now - added.addedAt > MOVE_WINDOW_MS) return undefined;
  for (const old of records) {
    if (old.gone && old.movedTo === null && old.lastText === added.lastText && now - old.goneAt < MOVE_WINDOW_MS) return old;
  }
  return undefined;
}

/** `removed` was just deleted: the sheet that appeared a moment ago with its text, if any. */
export function renamedTo<T extends RenameFacts>(removed: T, records: Iterable<T>, now = Date.now()): T | undefined {
  for (const other of records) {
    if (other !== removed && !other.gone && other.lastText !== null && other.lastText === removed.lastText && now - other.addedAt < MOVE_WINDOW_MS) return other;
  }
  return undefined;
}
