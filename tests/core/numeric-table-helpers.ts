// The two readers of a table of numbers, side by side: what csv.ts (the
// general delimited-text reader) makes of a text, and what the fast
// numeric-table reader makes of it, in the same shape.
import { expect } from 'vitest';
import { checkRowWidth, numberCell, readDelimited } from '../../server/core/shared/csv.js';
import { readNumericTable } from '../../server/core/shared/numeric-table.js';
import { TradeError } from '../../server/core/index.js';

/** What csv.ts makes of a table of numbers: header, numbers by column, row numbers. */
export function viaCsv(text: string) {
  const t = readDelimited(text);
  const columns = t.header.map(() => [] as number[]);
  for (const row of t.rows) {
    checkRowWidth(t, row);
    t.header.forEach((_, c) => columns[c]!.push(numberCell(t, row, c)));
  }
  return { header: t.header, columns, lines: t.rows.map((r) => r.row) };
}

/** The same from the fast reader (`growing`: the file is one that grows while it is read). */
export function viaFast(text: string, growing = false) {
  const t = readNumericTable(text, { growing });
  return { header: t.header, columns: t.columns.map((c) => [...c.subarray(0, t.rows)]), lines: [...t.lines.subarray(0, t.rows)] };
}

/** The message of the TradeError that f throws. */
export function errorOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(TradeError);
    return (e as Error).message;
  }
  throw new Error('no error');
}
