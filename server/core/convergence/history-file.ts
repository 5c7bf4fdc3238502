// A history a solver writes while it runs: the iteration column first, then
// one column per quantity (equation residuals, force coefficients), under a
// header row with any names. Read with the fast numeric reader in growing
// mode, so a last line still being written is left out rather than misread.
import { readNumericTable } from '../shared/numeric-table.js';
import { TradeError } from '../shared/trade-error.js';
import type { Delimiter } from '../shared/csv.js';
import { numberText } from '../shared/words.js';

export interface HistoryColumn {
  name: string;
  values: Float64Array;
}

export interface History {
  /** Name of the first column. */
  iterationName: string;
  iterations: Float64Array;
  columns: HistoryColumn[];
  /** Spreadsheet row number of each row (the header is row 1). */
  lines: Int32Array;
  rows: number;
  delimiter: Delimiter;
  /** The last line, left out because its line end has not been written yet. */
  unfinished?: { row: number; text: string };
}

export function readHistory(text: string): History {
  const table = readNumericTable(text, { growing: true });
  if (table.header.length < 2) {
    throw new TradeError(`the header has one column (${table.header[0] ?? ''}); a history needs the iteration column first and at least one more`);
  }
  if (table.rows === 0) {
    throw new TradeError(table.unfinished ? 'no complete row yet: the only row after the header is still being written' : 'the file has a header but no rows of values yet');
  }
  const iterations = table.columns[0]!.subarray(0, table.rows);
  for (let k = 0; k < table.rows; k++) {
    const it = iterations[k]!;
    if (!Number.isFinite(it)) throw new TradeError(`row ${table.lines[k]}: the iteration "${numberText(it)}" in column ${table.header[0]} is not a number of iterations`);
    if (k > 0 && !(it > iterations[k - 1]!)) {
      throw new TradeError(
        `row ${table.lines[k]}: iteration ${numberText(it)} does not come after iteration ${numberText(iterations[k - 1]!)} (row ${table.lines[k - 1]}); ` +
          'the iteration column must increase, so a run restarted from the beginning belongs in a new file',
      );
    }
  }
  const history: History = {
    iterationName: table.header[0]!,
    iterations,
    columns: table.header.slice(1).map((name, i) => ({ name, values: table.columns[i + 1]!.subarray(0, table.rows) })),
    lines: table.lines.subarray(0, table.rows),
    rows: table.rows,
    delimiter: table.delimiter,
  };
  if (table.unfinished) history.unfinished = table.unfinished;
  return history;
}

/** The remark for a last line left out. */
export function unfinishedRemark(h: History): string | undefined {
  if (!h.unfinished) return undefined;
  return (
    `The last line (row ${h.unfinished.row}) has no line end yet, so it is left out: a file still being written can stop inside a number. ` +
    'It is read once its line end is there (end a finished file with a line break).'
  );
}

/** Rows whose iteration lies in the trailing window (last − window, last], as [first row, row count]. */
export function trailingRows(iterations: Float64Array, upTo: number, window: number): [number, number] {
  const last = iterations[upTo - 1]!;
  let first = upTo - 1;
  while (first > 0 && iterations[first - 1]! > last - window) first--;
  return [first, upTo - first];
}
