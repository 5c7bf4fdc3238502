// Tables of numbers a solver writes as it runs (residual histories, monitored
// forces): a header row, then rows of numbers only. csv.ts stays the one rule
// for the delimiter, the header, what counts as a number and how a bad cell is
// worded; this reader only adds speed. A general CSV parser builds a string
// per cell and takes a few hundred milliseconds over a 100,000-row history of
// eight columns, which a live page reads again on every write; here one pass
// over the characters reads short decimals directly, any cell off that fast
// path goes through csv.ts, and a growing file's lines already read are not
// read again.
import { checkRowWidth, detectDelimiter, numberCell, readDelimited, type DelimitedTable, type Delimiter } from './csv.js';
import { TradeError } from './trade-error.js';

export interface NumericTable {
  header: string[];
  delimiter: Delimiter;
  /** One array per header column; only its first `rows` items are the table (the rest is spare room for a growing file). */
  columns: Float64Array[];
  rows: number;
  /** Spreadsheet row number of each data row (the header is row 1; blank lines count). */
  lines: Int32Array;
  /** With `growing`: the last line, left out because its line end has not been written yet. */
  unfinished?: { row: number; text: string };
}

export interface NumericTableOptions {
  /**
   * The file may still be being written. Its last line is read only once its
   * line end is there: a write can stop anywhere, even inside a number
   * ("1.2e-0" of "1.2e-05"), so a line without its end is left out.
   */
  growing?: boolean;
}

/** What a solver writes for a value that blew up; kept as NaN or ±Infinity for the caller to judge. */
const NON_FINITE = /^([+-]?)(nan|inf|infinity)$/i;

/** Powers of ten that are exact doubles: m / 10^k with m < 2^53 is then correctly rounded (Clinger's fast path). */
const EXACT_POWERS: number[] = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

const NL = 10;
const CR = 13;
const SPACE = 32;
const TAB = 9;
const PLUS = 43;
const MINUS = 45;
const DOT = 46;
const COMMA = 44;

interface Shape {
  header: string[];
  delimiter: Delimiter;
  /** For csv.ts's cell rules and messages. */
  csv: DelimitedTable;
}

/**
 * A growing file read before: its text, how far its complete lines reach,
 * and the table read from them. A file a solver appends to is read again on
 * every write; the lines read last time are not read again.
 */
interface Memo {
  text: string;
  shape: Shape;
  /** Offset just past the last complete line read. */
  resume: number;
  /** Spreadsheet row number of the last line before `resume`. */
  resumeRow: number;
  table: NumericTable;
}

/** Growing files remembered (a sheet usually follows one or two: residuals and forces). */
const MEMO_SIZE = 3;
const memos: Memo[] = [];

export function readNumericTable(source: string, options: NumericTableOptions = {}): NumericTable {
  const text = source.charCodeAt(0) === 0xfeff ? source.slice(1) : source;
  const growing = options.growing === true;
  const memo = growing ? recall(text) : undefined;
  if (memo && memo.text === text) return memo.table;

  let shape: Shape;
  let pos: number;
  let row: number;
  if (memo) {
    ({ shape, resume: pos, resumeRow: row } = memo);
  } else {
    const head = readHeader(text, growing);
    if (!head) {
      const header = readDelimited(text).header;
      return { header, delimiter: detectDelimiter(text), columns: header.map(() => new Float64Array(0)), rows: 0, lines: new Int32Array(0) };
    }
    ({ shape, pos, row } = head);
  }

  let end = text.length;
  if (growing && text.charCodeAt(end - 1) !== NL) end = text.lastIndexOf('\n') + 1;
  const kept = memo ? memo.table.rows : 0;
  const capacity = kept + countLines(text, pos, end) + 1;
  const columns = shape.header.map((_, c) => {
    const column = new Float64Array(capacity);
    if (memo) column.set(memo.table.columns[c]!.subarray(0, kept));
    return column;
  });
  const lines = new Int32Array(capacity);
  if (memo) lines.set(memo.table.lines.subarray(0, kept));
  const read = readRows(text, pos, end, row, shape, columns, lines, kept);

  const table: NumericTable = { header: shape.header, delimiter: shape.delimiter, columns, rows: read.rows, lines };
  const tail = text.slice(end);
  if (tail.trim() !== '') table.unfinished = { row: read.row + 1, text: tail };
  if (growing) remember({ text, shape, resume: end, resumeRow: read.row, table });
  return table;
}

/** The memo this text continues (or equals), if any. */
function recall(text: string): Memo | undefined {
  for (const m of memos) {
    if (m.text === text) return m;
    if (text.length >= m.resume && text.startsWith(m.resume === m.text.length ? m.text : m.text.slice(0, m.resume))) return m;
  }
  return undefined;
}

function remember(m: Memo): void {
  const old = memos.findIndex((x) => m.text.startsWith(x.text.slice(0, x.resume)));
  if (old >= 0) memos.splice(old, 1);
  memos.unshift(m);
  memos.length = Math.min(memos.length, MEMO_SIZE);
}

/**
 * The header: the first line with anything on it, read by csv.ts (quotes and
 * all). Null for a finished file that holds only its header line.
 */
function readHeader(text: string, growing: boolean): { shape: Shape; pos: number; row: number } | null {
  let headerStart = 0;
  let headerRow = 1;
  for (;;) {
    const lineEnd = text.indexOf('\n', headerStart);
    const line = text.slice(headerStart, lineEnd < 0 ? text.length : lineEnd);
    if (line.trim() !== '') break;
    if (lineEnd < 0) throw new TradeError('the file is empty: it needs a header row and at least one row of values');
    headerStart = lineEnd + 1;
    headerRow++;
  }
  const headerEnd = text.indexOf('\n', headerStart);
  if (headerEnd < 0 && growing) throw new TradeError('the file holds no complete line yet: the header row has no line end');
  if (headerEnd < 0) return null;
  // csv.ts detects the delimiter from the header line; handing it only the lines up to the header spares it splitting the whole file.
  const delimiter = detectDelimiter(text.slice(0, headerEnd));
  const header = readDelimited(text.slice(headerStart, headerEnd)).header;
  return { shape: { header, delimiter, csv: { header, rows: [], delimiter } }, pos: headerEnd + 1, row: headerRow };
}

/**
 * Reads the lines from `pos` up to `end` into the columns from index `rows`
 * on; `row` is the spreadsheet row number of the line before `pos`.
 */
function readRows(text: string, pos: number, end: number, row: number, shape: Shape, columns: Float64Array[], lines: Int32Array, rows: number): { rows: number; row: number } {
  const width = shape.header.length;
  const delimiter = shape.delimiter;
  const delim = delimiter.charCodeAt(0);
  const decimalComma = delimiter !== ',';
  while (pos < end) {
    row++;
    const lineEnd = lineEndFrom(text, pos, end);
    if (blank(text, pos, lineEnd)) {
      pos = lineEnd + 1;
      continue;
    }
    let cell = pos;
    for (let c = 0; c < width; c++) {
      const last = c === width - 1;
      // Fast path: [+-]digits[.digits][e[+-]digits] with spaces around, read as m × 10^k.
      let i = cell;
      let ch = text.charCodeAt(i);
      while (ch === SPACE || (ch === TAB && delim !== TAB)) ch = text.charCodeAt(++i);
      let negative = false;
      if (ch === MINUS || ch === PLUS) {
        negative = ch === MINUS;
        ch = text.charCodeAt(++i);
      }
      let mantissa = 0;
      let digits = 0;
      let exponent = 0;
      let seen = false;
      while (ch >= 48 && ch <= 57) {
        seen = true;
        if (digits < 16) {
          mantissa = mantissa * 10 + (ch - 48);
          if (mantissa !== 0) digits++;
        } else exponent++;
        ch = text.charCodeAt(++i);
      }
      if (ch === DOT || (decimalComma && ch === COMMA)) {
        ch = text.charCodeAt(++i);
        while (ch >= 48 && ch <= 57) {
          seen = true;
          if (digits < 16) {
            mantissa = mantissa * 10 + (ch - 48);
            if (mantissa !== 0) digits++;
            exponent--;
          }
          ch = text.charCodeAt(++i);
        }
      }
      let fast = seen;
      if (fast && (ch === 101 || ch === 69)) {
        ch = text.charCodeAt(++i);
        let sign = 1;
        if (ch === MINUS || ch === PLUS) {
          sign = ch === MINUS ? -1 : 1;
          ch = text.charCodeAt(++i);
        }
        let e = 0;
        let any = false;
        while (ch >= 48 && ch <= 57) {
          any = true;
          if (e < 1000) e = e * 10 + (ch - 48);
          ch = text.charCodeAt(++i);
        }
        fast = any;
        exponent += sign * e;
      }
      while (ch === SPACE || ch === CR || (ch === TAB && delim !== TAB)) ch = text.charCodeAt(++i);
      const ends = last ? i === lineEnd : ch === delim && i < lineEnd;
      let value: number;
      if (fast && ends && digits <= 15 && exponent >= -22 && exponent <= 22) {
        value = exponent < 0 ? mantissa / EXACT_POWERS[-exponent]! : mantissa * EXACT_POWERS[exponent]!;
        if (negative) value = -value;
        cell = i + 1;
      } else {
        // Anything else: find the cell's end and let csv.ts judge it.
        let cellEnd = last ? lineEnd : text.indexOf(delimiter, cell);
        if (cellEnd < 0 || cellEnd > lineEnd) cellEnd = lineEnd;
        if (!last && cellEnd === lineEnd) widthError(shape.csv, text, pos, lineEnd, row);
        if (last && text.indexOf(delimiter, cell) >= 0 && text.indexOf(delimiter, cell) < lineEnd) widthError(shape.csv, text, pos, lineEnd, row);
        value = slowCell(shape.csv, text.slice(cell, cellEnd).trim(), row, c);
        cell = cellEnd + 1;
      }
      columns[c]![rows] = value;
    }
    lines[rows] = row;
    rows++;
    pos = lineEnd + 1;
  }
  return { rows, row };
}

/** Where the line starting at `pos` ends (its "\n", or `end`). */
function lineEndFrom(text: string, pos: number, end: number): number {
  const i = text.indexOf('\n', pos);
  return i < 0 || i > end ? end : i;
}

function blank(text: string, from: number, to: number): boolean {
  for (let i = from; i < to; i++) {
    const ch = text.charCodeAt(i);
    if (ch !== SPACE && ch !== TAB && ch !== CR) return false;
  }
  return true;
}

function countLines(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = text.indexOf('\n', from); i >= 0 && i < to; i = text.indexOf('\n', i + 1)) n++;
  return n;
}

/** A field enclosed in double quotes, a quote inside written twice (RFC 4180, section 2, rules 5 and 7). */
const QUOTED = /^"((?:[^"]|"")*)"$/;

/** A cell off the fast path: a non-finite word a solver writes, or whatever csv.ts makes of it. */
function slowCell(shape: DelimitedTable, raw: string, row: number, column: number): number {
  // csv.ts reads a quoted field by its content; so must this reader, or "2.5" in quotes would be refused here and read there.
  const quoted = QUOTED.exec(raw);
  const cell = quoted ? quoted[1]!.replace(/""/g, '"') : raw;
  const nonFinite = NON_FINITE.exec(cell);
  if (nonFinite) return nonFinite[2]!.toLowerCase() === 'nan' ? NaN : nonFinite[1] === '-' ? -Infinity : Infinity;
  const cells: string[] = [];
  cells[column] = cell;
  return numberCell(shape, { cells, row }, column);
}

function widthError(shape: DelimitedTable, text: string, from: number, to: number, row: number): never {
  const cells = text.slice(from, to).split(shape.delimiter);
  checkRowWidth(shape, { cells, row });
  throw new Error('a row of the wrong width passed the width check');
}
