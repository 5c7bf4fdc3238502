// Reading wall samples a solver exported as delimited text: a header row,
// then one face per row; comma, semicolon or tab, detected from the header.
import { parse } from 'csv-parse/sync';

export interface WallSamples {
  values: number[];
  /** One weight per value; all ones when the file has no weight column. */
  weights: number[];
  weighted: boolean;
  delimiter: ',' | ';' | '\t';
  columns: string[];
}

export class CsvProblem extends Error {}

const DELIMITERS = [',', ';', '\t'] as const;
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** The delimiter seen most often in the header line, outside quotes. */
export function detectDelimiter(text: string): ',' | ';' | '\t' {
  const header = text.split(/\r?\n/).find((l) => l.trim() !== '') ?? '';
  const unquoted = header.replace(/"[^"]*"/g, '');
  let best: ',' | ';' | '\t' = ',';
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

function labelOf(row: number): string {
  return `row ${row}`;
}

/**
 * Samples from column `column`, weighted by column `weight` when the file has it.
 * Rows are numbered as in a spreadsheet: the header is row 1. With ";" or tab as
 * delimiter a decimal comma ("0,85") reads as a decimal point, as such files use it.
 */
export function readWallSamples(text: string, column: string, weight: string | undefined): WallSamples {
  const body = text.replace(/^\uFEFF/, '');
  const delimiter = detectDelimiter(body);
  let rows: { record: string[]; info: { lines: number } }[];
  try {
    rows = parse(body, { delimiter, info: true, skip_empty_lines: true, trim: true, relax_column_count: true }) as unknown as typeof rows;
  } catch (e) {
    const line = (e as { lines?: number }).lines;
    throw new CsvProblem(`the file is not readable as delimited text${line ? ` near row ${line}` : ''}: ${(e as Error).message}`);
  }
  if (rows.length === 0) throw new CsvProblem('the file is empty: it needs a header row and at least one row of samples');
  const header = rows[0]!.record;
  const find = (name: string) => header.findIndex((h) => h.toLowerCase() === name.toLowerCase());
  const vi = find(column);
  if (vi < 0) throw new CsvProblem(`no column "${column}" in the header (columns: ${header.join(', ')})`);
  const wi = weight ? find(weight) : -1;
  const decimalComma = delimiter !== ',';
  const read = (cell: string | undefined, name: string, row: number): number => {
    const t = (cell ?? '').trim();
    if (t === '') throw new CsvProblem(`${labelOf(row)}: the cell in column ${name} is empty`);
    const s = decimalComma ? t.replace(',', '.') : t;
    if (!NUMBER.test(s)) throw new CsvProblem(`${labelOf(row)}: "${t}" in column ${name} is not a number`);
    return Number(s);
  };
  const values: number[] = [];
  const weights: number[] = [];
  for (const { record, info } of rows.slice(1)) {
    const row = info.lines;
    if (record.length !== header.length) {
      throw new CsvProblem(`${labelOf(row)}: ${record.length} cells where the header has ${header.length}`);
    }
    const v = read(record[vi], column, row);
    if (v < 0) throw new CsvProblem(`${labelOf(row)}: y+ ${t3(v)} in column ${column} is negative`);
    values.push(v);
    if (wi >= 0) {
      const w = read(record[wi], header[wi]!, row);
      if (w < 0) throw new CsvProblem(`${labelOf(row)}: weight ${t3(w)} in column ${header[wi]} is negative`);
      weights.push(w);
    } else weights.push(1);
  }
  if (values.length === 0) throw new CsvProblem('the file has a header but no rows of samples');
  if (weights.reduce((a, b) => a + b, 0) === 0) throw new CsvProblem(`every weight in column ${header[wi]} is zero`);
  return { values, weights, weighted: wi >= 0, delimiter, columns: header };
}

function t3(x: number): string {
  return String(Number(x.toPrecision(3)));
}
