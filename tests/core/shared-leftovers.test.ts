// The shared rules a mutation run found unpinned: a U+FEFF inside a cell, the
// default plural, a list that carries its sweep, and the guard that names an
// entry whose record has a field its list does not declare.
// These are the project's own rules (no published source), checked as stated.
import { describe, expect, it } from 'vitest';
import { list, num, record, si, str, withDeclaredSymbols } from '../../server/core/index.js';
import { readDelimited } from '../../server/core/shared/csv.js';
import { countText, nounFor } from '../../server/core/shared/words.js';

describe('delimited text keeps what is not a byte-order mark', () => {
  it('keeps a U+FEFF that is not the first character', () => {
    // Only a leading U+FEFF is a byte-order mark; elsewhere it is the zero
    // width no-break space and part of the text (The Unicode Standard,
    // section 23.8 "Specials", from memory).
    const t = readDelimited('face,note\nwall,a\uFEFFb\n');
    expect(t.rows[0]!.cells).toEqual(['wall', 'a\uFEFFb']);
    expect(readDelimited('\uFEFFface,note\nwall,x\n').header).toEqual(['face', 'note']);
  });
});

describe('counts in words', () => {
  it('adds an s for the plural unless a plural is given', () => {
    expect(nounFor(2, 'layer')).toBe('layers');
    expect(nounFor(0, 'layer')).toBe('layers');
    expect(nounFor(1, 'layer')).toBe('layer');
    expect(nounFor(3, 'cell', 'cells in all')).toBe('cells in all');
    expect(countText(2, 'sheet')).toBe('2 sheets');
  });
});

describe('lists', () => {
  it('carry their sweep only when one is given', () => {
    const sweep = [{ name: 'U', values: [si(10, 'm/s'), si(20, 'm/s')] }];
    const swept = list([num(1), num(2)], sweep);
    expect(swept).toEqual({ kind: 'list', items: [num(1), num(2)], sweep });
    const plain = list([num(1)]);
    expect('sweep' in plain).toBe(false);
    expect(plain).toEqual({ kind: 'list', items: [num(1)] });
  });
});

describe('declared symbols', () => {
  const specs = [{ name: 'Re', symbol: 'Re', unit: '1', doc: 'Reynolds number' }];

  it('give each declared field its symbol and keep a symbol already set', () => {
    const r = withDeclaredSymbols(record([['Re', num(1e5)]]), specs, 'reynolds');
    expect(r.fields.get('Re')!.symbol).toBe('Re');
  });

  it('name the function and the field when a record field is not declared', () => {
    const stray = record([['Re', num(1e5)], ['regime', str('turbulent')]]);
    expect(() => withDeclaredSymbols(stray, specs, 'reynolds')).toThrow('reynolds() returned a field regime that its field list does not declare');
  });
});
