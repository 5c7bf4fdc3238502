// Delimited text a solver exported: a header row, then one record per row;
// comma, semicolon or tab, detected from the header. Rows are numbered as in
// a spreadsheet (the header is row 1). With ";" or tab as delimiter a decimal
// comma ("0,85") reads as a decimal point, as such files use it.
import { parse } from 'csv-parse/sync';
import { TradeError } from './trade-error.js';

export type Delimiter = ',' | ';' | '\t';

export interface DelimitedRow {
  cells: string[];
  /** Spreadsheet row number of this line in the file. */
  row: number;
}

export interface DelimitedTable {
  header: string[];
  rows: DelimitedRow[];
  delimiter: Delimiter;
}

const DELIMITERS: readonly Delimiter[] = [',', ';', '\t'];
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** The delimiter seen most often in the header line, outside quotes. */
export function detectDelimiter(text: string): Delimiter {
  const header = text.split(/\r?\n/).find((l) => l.trim() !== '') ?? '';
  const unquoted = header.replace(/"[^"]*"/g, '');
  let best: Delimiter = ',';
  let most = 0;
  for (const d of DELIMITERS) {
    const n = unquoted.split(d).length - 1;
    if (n > most) {
      best = d;
      most = n;
    }
  }
  return best;
}

export function readDelimited(text: string): DelimitedTable {
  const body = text.replace(/^\uFEFF/, '');
  const delimiter = detectDelimiter(body);
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(body, { delimiter, info: true, skip_empty_lines: true, trim: true, relax_column_count: true }) as unknown as typeof records;
  } catch (e) {
    const line = (e as { lines?: number }).lines;
    throw new TradeError(`the file is not readable as delimited text${line ? ` near row ${line}` : ''}: ${(e as Error).message}`);
  }
  if (records.length === 0) throw new TradeError('the file is empty: it needs a header row and at least one row of values');
  return {
    header: records[0]!.record,
    rows: records.slice(1).map(({ record, info }) => ({ cells: record, row: info.lines })),
    delimiter,
  };
}

/** The index of a column by its header name, ignoring case. */
export function columnIndex(table: DelimitedTable, name: string): number {
  const wanted = name.toLowerCase();
  return table.header.findIndex((h) => h.toLowerCase() === wanted);
}

/** The header's column names, for messages. */
export function columnList(table: DelimitedTable): string {
  return table.header.join(', ');
}

/** A cell as a number, or a TradeError naming its row and column. */
export function numberCell(table: DelimitedTable, row: DelimitedRow, column: number): number {
  const name = table.header[column] ?? `${column + 1}`;
  const t = (row.cells[column] ?? '').trim();
  if (t === '') throw new TradeError(`row ${row.row}: the cell in column ${name} is empty`);
  const s = table.delimiter !== ',' ? t.replace(',', '.') : t;
  if (!NUMBER.test(s)) throw new TradeError(`row ${row.row}: "${t}" in column ${name} is not a number`);
  return Number(s);
}

/** Every row must have as many cells as the header. */
export function checkRowWidth(table: DelimitedTable, row: DelimitedRow): void {
  if (row.cells.length !== table.header.length) {
    throw new TradeError(`row ${row.row}: ${row.cells.length} cells where the header has ${table.header.length}`);
  }
}
