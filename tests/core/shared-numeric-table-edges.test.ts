// Edges of the fast numeric-table reader, each checked against what csv.ts
// (the general delimited-text reader) makes of the same text, or against the
// syntax of a decimal number: the fast path must give the same number or the
// same refusal as the slow one, wherever a cell stops it.
import { describe, expect, it } from 'vitest';
import { readDelimited } from '../../server/core/shared/csv.js';
import { errorOf, viaCsv, viaFast } from './numeric-table-helpers.js';
import { readNumericTable } from '../../server/core/shared/numeric-table.js';
import { TradeError } from '../../server/core/index.js';


// First in this file, so that the reader's memory of growing files starts empty.
describe('growing files followed in turn', () => {
  it('a file read, then another, is still remembered when read again', () => {
    const a = 'it,p\n1,0.5\n';
    const b = 'it,U\n1,2.5\n';
    const first = readNumericTable(a, { growing: true });
    readNumericTable(b, { growing: true });
    expect(readNumericTable(a, { growing: true })).toBe(first);
  });

  it('a file growing write by write takes one place, not one per write', () => {
    const b = 'it,U\n1,2.5\n';
    const first = readNumericTable(b, { growing: true });
    let a = 'it,p\n';
    for (let k = 1; k <= 4; k++) {
      a += `${k},${k / 4}\n`;
      expect(viaFast(a, true)).toEqual(viaCsv(a));
    }
    expect(readNumericTable(b, { growing: true })).toBe(first);
  });

  it('a file that ends as another began is read as itself', () => {
    // Header names may be numbers: "1\n2\n" is a file, and "7\n1\n2\n" ends with it.
    readNumericTable('1\n2\n', { growing: true });
    expect(viaFast('7\n1\n2\n', true)).toEqual(viaCsv('7\n1\n2\n'));
  });

  it('a finished read of a cut line does not stand for the grown file', () => {
    expect(readNumericTable('it,p\n1,1.2e-0').columns[1]![0]).toBe(1.2);
    expect(viaFast('it,p\n1,1.2e-05\n', true)).toEqual(viaCsv('it,p\n1,1.2e-05\n'));
  });

  it('a last line of spaces only is not an unfinished row', () => {
    expect(readNumericTable('it,p\n1,2\n   ', { growing: true }).unfinished).toBeUndefined();
    expect(readNumericTable('it,p\n1,2\n3,', { growing: true }).unfinished).toEqual({ row: 3, text: '3,' });
  });
});

describe('a file that holds only its header', () => {
  it('has the header, its delimiter and empty columns', () => {
    const t = readNumericTable('it;p;U');
    expect(t.header).toEqual(readDelimited('it;p;U').header);
    expect(t.delimiter).toBe(';');
    expect(t.rows).toBe(0);
    expect(t.columns.map((c) => c.length)).toEqual([0, 0, 0]);
  });

  it('of a single name without a line end', () => {
    expect(readNumericTable('x').header).toEqual(['x']);
    expect(readNumericTable('\n  \nx').header).toEqual(['x']);
  });

  it('a line of spaces before the header is blank, and rows keep their numbers', () => {
    expect(viaFast(' \t \nit,p\n1,2\n')).toEqual({ header: ['it', 'p'], columns: [[1], [2]], lines: [3] });
    expect(viaFast('it,p\n1,2\n\t\n3,4\n')).toEqual({ header: ['it', 'p'], columns: [[1, 3], [2, 4]], lines: [2, 4] });
  });
});

describe('cells that stop the fast path', () => {
  it('an exponent without its sign, after a fraction (1.5e3 = 1500)', () => {
    // Decimal number syntax: digits [. digits] [e|E [sign] digits]; the exponent's sign is optional (ECMA-262, StrDecimalLiteral).
    for (const text of ['it,p\n1,1.5e3\n', 'it,p\n1,2.5E2\n', 'it,p\n1,1e2 ']) expect(viaFast(text)).toEqual(viaCsv(text));
    expect(viaFast('it,p\n1,1.5e3\n').columns[1]).toEqual([1500]);
    expect(viaFast('it,p\n1,1e2 ').columns[1]).toEqual([100]);
  });

  it('a long run of zeros before an exponent (0.0…01e0 = 1e-100)', () => {
    const text = `it,p\n1,0.${'0'.repeat(99)}1e0\n`;
    expect(viaFast(text)).toEqual(viaCsv(text));
    expect(viaFast(text).columns[1]![0]).toBe(1e-100);
  });

  it('a number followed by a letter is refused as csv.ts refuses it', () => {
    for (const text of ['it,p\n1x,2\n', 'it,p,q\n1,2 x,3\n']) expect(errorOf(() => readNumericTable(text))).toBe(errorOf(() => viaCsv(text)));
  });

  it('short and long rows, wherever the next delimiter is', () => {
    for (const text of ['it,p\n3\n4,5\n', 'it,p\n3', 'it\tp\n1\t2\t\n', 'it\tp\n1\t\t2\n']) {
      expect(errorOf(() => readNumericTable(text))).toBe(errorOf(() => viaCsv(text)));
    }
  });

  it('a non-finite word with spaces around', () => {
    const t = readNumericTable('it,p\n1, nan \n2,  -inf\n');
    expect([...t.columns[1]!.subarray(0, t.rows)]).toEqual([NaN, -Infinity]);
  });
});

describe('quoted fields (RFC 4180, 2005, section 2, rules 5 and 7)', () => {
  it('a number enclosed in double quotes is read by its content, as csv.ts reads it', () => {
    for (const text of ['it,p\n1,"2.5"\n2,"-3e-2"\n', 'it;p\n"1";"0,5"\n', 'it,p\n1," 4 "\n']) expect(viaFast(text)).toEqual(viaCsv(text));
    expect(viaFast('it,p\n1,"2.5"\n').columns[1]).toEqual([2.5]);
  });

  it('a quoted field that is not a number is refused naming its row', () => {
    expect(errorOf(() => readNumericTable('it,p\n1,"a"\n'))).toBe(errorOf(() => viaCsv('it,p\n1,"a"\n')));
    // A quote inside a quoted field is written twice and read once (rule 7).
    expect(errorOf(() => readNumericTable('it,p\n1,"a""b"\n'))).toBe(errorOf(() => viaCsv('it,p\n1,"a""b"\n')));
    expect(errorOf(() => readNumericTable('it,p\n1,"2\n'))).toMatch(/^row 2: /);
  });
});
