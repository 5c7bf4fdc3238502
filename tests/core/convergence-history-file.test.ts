// Reading a solver's history file: what makes one, and the plain words for
// each way a file falls short. The rules are the project's own (an iteration
// column that increases, then one or more value columns); the files are
// written here by hand.
import { describe, expect, it } from 'vitest';
import { readHistory, trailingRows, unfinishedRemark } from '../../server/core/convergence/history-file.js';

describe('a history file', () => {
  it('reads the iteration column and each value column, rows in order', () => {
    const h = readHistory('iter,p,Ux\n1,1e-1,2e-1\n2,5e-2,1e-1\n3,2.5e-2,5e-2\n');
    expect(h.iterationName).toBe('iter');
    expect([...h.iterations]).toEqual([1, 2, 3]);
    expect(h.columns.map((c) => c.name)).toEqual(['p', 'Ux']);
    expect([...h.columns[1]!.values]).toEqual([0.2, 0.1, 0.05]);
    expect(h.rows).toBe(3);
    expect(h.unfinished).toBeUndefined();
    expect(unfinishedRemark(h)).toBeUndefined();
  });

  it('leaves out a last line without its line end, and says so', () => {
    const h = readHistory('iter,p\n1,0.1\n2,0.05\n3,0.0');
    expect(h.rows).toBe(2);
    expect(unfinishedRemark(h)).toBe(
      'The last line (row 4) has no line end yet, so it is left out: a file still being written can stop inside a number. It is read once its line end is there (end a finished file with a line break).',
    );
  });

  it('refuses a file that cannot be a history, in plain words', () => {
    expect(() => readHistory('iter\n1\n2\n')).toThrow('the header has one column (iter); a history needs the iteration column first and at least one more');
    expect(() => readHistory('iter,p\n')).toThrow('the file has a header but no rows of values yet');
    expect(() => readHistory('iter,p\n1,0.')).toThrow('no complete row yet: the only row after the header is still being written');
    expect(() => readHistory('iter,p\n1,0.1\nnan,0.05\n')).toThrow(/^row 3: the iteration "not a number" in column iter is not a number of iterations$/);
    expect(() => readHistory('iter,p\n1,0.1\n2,0.05\n2,0.02\n')).toThrow(
      'row 4: iteration 2 does not come after iteration 2 (row 3); the iteration column must increase, so a run restarted from the beginning belongs in a new file',
    );
  });
});

describe('the trailing window (last − window, last]', () => {
  it('counts the rows whose iteration lies in it', () => {
    const its = Float64Array.from([10, 20, 30, 40, 50]);
    expect(trailingRows(its, 5, 20)).toEqual([3, 2]); // 40 and 50; 30 is at last − window, outside
    expect(trailingRows(its, 5, 100)).toEqual([0, 5]);
    expect(trailingRows(its, 3, 15)).toEqual([1, 2]); // up to 30: 20 and 30
  });
});
