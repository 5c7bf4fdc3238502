// Messages between the live server and the page, as JSON over one WebSocket
// at /live. The browser client (web/*.js) is type-checked against these
// shapes through JSDoc imports of this file.
import type { PartEdits } from './html-edits.js';

/** One part of a sheet's <main>, identified by its key and content hash. */
export interface PartUpdate {
  key: string;
  /** Short hash of the html: the client replaces a part only when it differs. */
  hash: string;
  /** Present when the receiver may not have this content yet. */
  html?: string;
  /** Instead of html: small edits to the receiver's copy, when the markup kept its shape. */
  edits?: PartEdits;
}

/** What the page shows around the sheet's content. */
export interface SheetCondition {
  /** The content shown is not the current file's: last good parts are kept. */
  stale: boolean;
  /** Why evaluation itself failed (timeout, crash, unreadable file), if it did. */
  failure: string | null;
  /** The file no longer exists. */
  gone: boolean;
  /** The file was renamed to this path (relative to the served folder). */
  movedTo: string | null;
  /** ISO time of the last evaluation that produced the parts shown, if any. */
  evaluatedAt: string | null;
  elapsedMs: number | null;
  /** The notice above the sheet saying why what is shown may not be current, or null. */
  notice: string | null;
  /** The footer's html (an evaluation time as <time datetime>, which the page shows in local time). */
  footHtml: string;
}

/**
 * Server → client: an update of one sheet, complete or relative to `base`.
 * A complete update carries every part with its html; a relative one only the
 * parts that changed since `base` (html, or edits to the receiver's copy).
 */
export interface SheetUpdate {
  type: 'sheet';
  sheet: string;
  /** URL of the sheet's page. */
  url: string;
  /** URL its set-up record downloads from. */
  recordUrl: string;
  version: number;
  /** Version this update applies to; null when it is complete. */
  base: number | null;
  title: string;
  parts: PartUpdate[];
  /** Keys of all parts in page order: always in a complete update; in a relative one only when keys were added, removed or moved. */
  order: string[] | null;
  /** The sheet's header (title, front matter, caution); null when unchanged since `base`. */
  headerHtml: string | null;
  /** null when unchanged since `base`. */
  summaryHtml: string | null;
  condition: SheetCondition;
}

/** Server → client: the sheet is being evaluated right now. */
export interface BusyMessage {
  type: 'busy';
  sheet: string;
}

/** Server → client: a long statement of the sheet's evaluation (a Monte Carlo run) has come this far. */
export interface ProgressMessage {
  type: 'progress';
  sheet: string;
  /** The statement's line. */
  line: number;
  done: number;
  total: number;
}

export type SheetState = 'waiting' | 'evaluating' | 'ready' | 'failed';

/** One row of the index page. */
export interface IndexEntry {
  path: string;
  /** URL of the sheet's page. */
  url: string;
  title: string;
  state: SheetState;
  checksPassed: number;
  checksFailed: number;
  errors: number;
  evaluatedAt: string | null;
  elapsedMs: number | null;
  failure: string | null;
}

/** Server → client: the whole index (it is small). */
export interface IndexMessage {
  type: 'index';
  sheets: IndexEntry[];
  /** The index table's rows as the page shows them (one <tr> per sheet). */
  rowsHtml: string;
}

export type ServerMessage = SheetUpdate | BusyMessage | ProgressMessage | IndexMessage;

/** Client → server: send me this sheet (complete now, relative updates afterwards). */
export interface FollowSheetMessage {
  type: 'follow';
  target: 'sheet';
  sheet: string;
}

/** Client → server: send me the index (now and on every change). */
export interface FollowIndexMessage {
  type: 'follow';
  target: 'index';
}

export type ClientMessage = FollowSheetMessage | FollowIndexMessage;

/** Largest client message accepted; follow requests are tiny. */
export const MAX_CLIENT_MESSAGE_BYTES = 4096;

/** Parses a client message, or returns null for anything unexpected. */
export function parseClientMessage(raw: string): ClientMessage | null {
  let data: unknown;
  try {
    data = JSON.parse(raw);
  } catch {
    return null;
  }
  if (typeof data !== 'object' || data === null) return null;
  const msg = data as Record<string, unknown>;
  if (msg.type !== 'follow') return null;
  if (msg.target === 'index') return { type: 'follow', target: 'index' };
  if (msg.target === 'sheet' && typeof msg.sheet === 'string' && msg.sheet.length < 1024) {
    return { type: 'follow', target: 'sheet', sheet: msg.sheet };
  }
  return null;
}
