// The fast numeric-table reader against the one rule it must keep: csv.ts
// decides the delimiter, the header, what a number is and how a bad cell is
// worded. Every check compares the two readers on the same text.
import { describe, expect, it } from 'vitest';
import { readDelimited } from '../../server/core/shared/csv.js';
import { errorOf, viaCsv, viaFast } from './numeric-table-helpers.js';
import { readNumericTable } from '../../server/core/shared/numeric-table.js';
import { TradeError } from '../../server/core/index.js';


/** Deterministic numbers in the forms solvers write: plain, exponent, signs, many digits, tiny and huge. */
function numberTexts(count: number): string[] {
  let seed = 7;
  const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  const out: string[] = [];
  for (let i = 0; i < count; i++) {
    const x = (rnd() - 0.3) * Math.pow(10, Math.floor(rnd() * 60) - 30);
    switch (i % 7) {
      case 0: out.push(x.toExponential(4)); break;
      case 1: out.push(x.toExponential(16)); break;
      case 2: out.push(String(x)); break;
      case 3: out.push(x.toPrecision(3).toUpperCase()); break;
      case 4: out.push((rnd() * 1000).toFixed(6)); break;
      case 5: out.push(`+${Math.abs(x).toExponential(2)}`); break;
      default: out.push(`${Math.floor(rnd() * 1e6)}.`); break;
    }
  }
  return out;
}

describe('numeric tables read as csv.ts reads them', () => {
  it('gives the same numbers, bit for bit, for every form a solver writes', () => {
    const cells = numberTexts(6000);
    const lines = ['iter,a,b,c'];
    for (let k = 0; k < cells.length; k += 3) lines.push([k, cells[k], cells[k + 1], cells[k + 2]].join(','));
    const text = lines.join('\n') + '\n';
    const fast = viaFast(text);
    const csv = viaCsv(text);
    expect(fast.header).toEqual(csv.header);
    expect(fast.lines).toEqual(csv.lines);
    fast.columns.forEach((col, c) => col.forEach((v, r) => expect(Object.is(v, csv.columns[c]![r]), `${cells[r * 3 + c - 1]}`).toBe(true)));
  });

  it('semicolons with decimal commas, tabs, spaces around cells, CRLF line ends, blank lines and a byte-order mark', () => {
    for (const text of [
      'it;p;U\n1;0,5;1,5e-3\n2;0,25;7,5e-4\n',
      'it\tp\tU\n1\t0,5\t1.5e-3\n2\t0.25\t7,5e-4\n',
      '\uFEFFit, p , U\r\n1, 0.5 ,1.5e-3\r\n\r\n2,0.25, 7.5e-4 \r\n',
      '\nit,p,U\n\n1,0.5,1.5e-3\n   \n2,0.25,7.5e-4',
    ]) {
      const fast = viaFast(text);
      // csv-parse keeps a line of spaces as a record, which csv.ts then calls short; the fast reader skips it.
      const csv = viaCsv(text.replace(/\n {3}\n/, '\n\n'));
      expect(fast).toEqual(csv);
      expect(fast.columns[1]).toEqual([0.5, 0.25]);
    }
  });

  it('words a bad cell exactly as csv.ts does, naming its spreadsheet row', () => {
    for (const text of ['it,p\n1,2\n3,abc\n', 'it,p\n1,2\n\n3,\n', 'it,p\n1,0x10\n', 'it,p\n1,2\n3\n', 'it,p\n1,2,3\n', 'it,p\n1,1e\n', 'it;p\n1;2;\n']) {
      expect(errorOf(() => readNumericTable(text))).toBe(errorOf(() => viaCsv(text)));
    }
    expect(errorOf(() => readNumericTable('it,p\n1,2\n\n3,x\n'))).toBe('row 4: "x" in column p is not a number');
  });

  it('keeps what a solver writes for a blown-up value as NaN or infinity', () => {
    const t = readNumericTable('it,p\n1,nan\n2,-inf\n3,Infinity\n4,-NaN\n');
    expect([...t.columns[1]!.subarray(0, t.rows)]).toEqual([NaN, -Infinity, Infinity, NaN]);
  });

  it('in growing mode leaves out a last line without its line end, and says which', () => {
    const t = readNumericTable('it,p\n1,0.5\n2,1.2e-', { growing: true });
    expect(t.rows).toBe(1);
    expect(t.unfinished).toEqual({ row: 3, text: '2,1.2e-' });
    // A last line that looks whole may still be cut inside a number (1.2e-0 of 1.2e-05): it waits too.
    const whole = readNumericTable('it,p\n1,0.5\n2,1.2e-0', { growing: true });
    expect(whole.rows).toBe(1);
    expect(whole.unfinished?.row).toBe(3);
    // Read as a finished file, the same line counts.
    expect(readNumericTable('it,p\n1,0.5\n2,1.2e-0').rows).toBe(2);
    expect(readNumericTable('it,p\n1,0.5\n', { growing: true }).unfinished).toBeUndefined();
    expect(errorOf(() => readNumericTable('it,p', { growing: true }))).toMatch(/no complete line yet/);
  });

  it('an empty file is csv.ts\'s empty file', () => {
    expect(errorOf(() => readNumericTable(''))).toBe(errorOf(() => readDelimited('')));
    expect(errorOf(() => readNumericTable('\n\n'))).toMatch(/the file is empty/);
  });
});

describe('a growing file read again and again', () => {
  const whole = ['it,p,U', ...Array.from({ length: 400 }, (_, k) => `${k + 1},${(0.99 ** k).toExponential(6)},${(0.97 ** k).toPrecision(9)}`)].join('\n') + '\n';

  it('reads each longer text as a fresh reader would, wherever a write stopped', () => {
    let cut = 20;
    for (const step of [3, 17, 40, 1, 99, 260, 23, 511, 7, 1300, 4000, 9000]) {
      cut = Math.min(whole.length, cut + step);
      const text = whole.slice(0, cut);
      const t = readNumericTable(text, { growing: true });
      const complete = text.slice(0, text.lastIndexOf('\n') + 1);
      expect({ header: t.header, columns: t.columns.map((c) => [...c.subarray(0, t.rows)]), lines: [...t.lines.subarray(0, t.rows)] }).toEqual(viaCsv(complete));
      const tail = text.slice(complete.length);
      expect(t.unfinished).toEqual(tail ? { row: complete.split('\n').length, text: tail } : undefined);
    }
  });

  it('the same text gives the same table; a rewritten file is read afresh', () => {
    const text = whole.slice(0, 3000);
    expect(readNumericTable(text, { growing: true })).toBe(readNumericTable(text, { growing: true }));
    const rewritten = whole.replace(/^(it,p,U\n1,)[^,]+/, '$19.5e-1');
    const t = readNumericTable(rewritten, { growing: true });
    expect(t.columns[1]![0]).toBe(0.95);
    expect(t.rows).toBe(400);
  });

  it('a bad line written after the last read is named by its own row, and is read again once fixed', () => {
    const start = whole.slice(0, whole.indexOf('\n', 2000) + 1);
    const rows = readNumericTable(start, { growing: true }).rows;
    const bad = start + '999,abc,1\n';
    expect(errorOf(() => readNumericTable(bad, { growing: true }))).toBe(`row ${rows + 2}: "abc" in column p is not a number`);
    expect(readNumericTable(start + '999,0.5,1\n', { growing: true }).rows).toBe(rows + 1);
  });
});
