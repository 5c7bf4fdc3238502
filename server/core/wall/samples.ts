// Wall samples a solver run exported (one face per row): a y+ column and,
// when the file has it, a column of face weights (areas).
import { checkRowWidth, columnIndex, columnList, numberCell, readDelimited, type Delimiter } from '../shared/csv.js';
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';

export interface WallSamples {
  values: number[];
  /** One weight per value; all ones when the file has no weight column. */
  weights: number[];
  weighted: boolean;
  delimiter: Delimiter;
  columns: string[];
}

/** Samples from column `column`, weighted by column `weight` when the file has it. */
export function readWallSamples(text: string, column: string, weight: string | undefined): WallSamples {
  const table = readDelimited(text);
  const vi = columnIndex(table, column);
  if (vi < 0) throw new TradeError(`no column "${column}" in the header (columns: ${columnList(table)})`);
  const wi = weight ? columnIndex(table, weight) : -1;
  const values: number[] = [];
  const weights: number[] = [];
  for (const row of table.rows) {
    checkRowWidth(table, row);
    const v = numberCell(table, row, vi);
    if (v < 0) throw new TradeError(`row ${row.row}: y+ ${numberText(v)} in column ${table.header[vi]} is negative`);
    values.push(v);
    if (wi >= 0) {
      const w = numberCell(table, row, wi);
      if (w < 0) throw new TradeError(`row ${row.row}: weight ${numberText(w)} in column ${table.header[wi]} is negative`);
      weights.push(w);
    } else weights.push(1);
  }
  if (values.length === 0) throw new TradeError('the file has a header but no rows of samples');
  if (weights.every((w) => w === 0)) throw new TradeError(`every weight in column ${table.header[wi]} is zero`);
  return { values, weights, weighted: wi >= 0, delimiter: table.delimiter, columns: table.header };
}
