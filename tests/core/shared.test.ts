// What the trade families share: argument readers, value constructors, number
// wording, escaping, the registry, declared-field records and delimited text.
// These are the project's own rules (no published source); each is checked as stated.
import { describe, expect, it } from 'vitest';
import { bool, describeValue, escapeHtml, fieldRecord, figure, list, num, record, Registry, shown, si, str, table, TradeError, type Args, type TradeFunction } from '../../server/core/index.js';
import { bareNumber, boolArg, choiceArg, fieldSi, fluidArg, optionalRecord, optionalSi, passThrough, recordArg, siArg, siListArg, stringArg } from '../../server/core/shared/args.js';
import { checkRowWidth, columnIndex, columnList, detectDelimiter, numberCell, readDelimited } from '../../server/core/shared/csv.js';
import { celsiusText, EXACT, exactText, lengthText, numberText, percentText, quotedList } from '../../server/core/shared/words.js';
import { readWallSamples } from '../../server/core/wall/samples.js';
import { correctedFirst, quantile, yplusStats } from '../../server/core/wall/yplus-report.js';

describe('argument readers', () => {
  const args: Args = { U: si(12, 'm/s'), T: shown(15, 'degC'), n: num(3), s: str('log'), b: bool(true), r: record([['rho', si(1.2, 'kg/m^3')], ['nu', si(1.5e-5, 'm^2/s')]]) };

  it('read SI numbers in the unit asked for, offsets included', () => {
    expect(siArg(args, 'U', 'm/s')).toBe(12);
    expect(siArg(args, 'U', 'km/h')).toBeCloseTo(43.2, 12);
    expect(siArg(args, 'T', 'K')).toBeCloseTo(288.15, 12);
    expect(siArg(args, 'T', 'degC')).toBeCloseTo(15, 12);
    expect(siArg(args, 'n')).toBe(3);
    expect(optionalSi(args, 'missing', 'm')).toBeUndefined();
    expect(optionalSi(args, 'U', 'm/s')).toBe(12);
  });

  it('name the argument and what it should have been', () => {
    expect(() => siArg(args, 'missing')).toThrow('missing argument missing');
    expect(() => siArg(args, 's')).toThrow('s must be a number, not text');
    expect(() => siArg(args, 's', 'm')).toThrow('s must be a quantity in m, not text');
    expect(() => siArg(args, 'U')).toThrow('U must be a plain number, not a quantity in m/s');
    expect(() => siArg(args, 'n', 'Pa')).toThrow('n must be in Pa, not a plain number');
    expect(() => stringArg(args, 'n')).toThrow('n must be text in double quotes, not a plain number');
    expect(() => boolArg(args, 'n')).toThrow('n must be true or false, not a plain number');
    expect(() => recordArg(args, 'n')).toThrow('n must be a record, not a plain number');
    expect(() => choiceArg(args, 's', ['linear', 'cubic'])).toThrow('s "log" is not one of "linear", "cubic"');
  });

  it('read text, choices, truth values, records, lists and record fields', () => {
    expect(stringArg(args, 's')).toBe('log');
    expect(choiceArg(args, 's', ['linear', 'log'])).toBe('log');
    expect(boolArg(args, 'b')).toBe(true);
    expect(recordArg(args, 'r').kind).toBe('record');
    expect(optionalRecord(args, 'r')).toBe(args['r']);
    expect(optionalRecord(args, 'none')).toBeUndefined();
    expect(siListArg({ l: list([si(1, 'km'), si(2, 'km')]) }, 'l', 'm')).toEqual([1000, 2000]);
    expect(siListArg(args, 'U', 'm/s')).toEqual([12]);
    expect(() => siListArg({ l: list([num(1), str('x')]) }, 'l')).toThrow('l[2] must be a number, not text');
    expect(fieldSi(recordArg(args, 'r'), 'rho', 'kg/m^3')).toBe(1.2);
    expect(fieldSi(recordArg(args, 'r'), 'mu', 'Pa s')).toBeUndefined();
    expect(passThrough(args, 'T')).toBe(args['T']);
  });

  it('tell a bare number from one written with a unit', () => {
    expect(bareNumber(args, 'n')).toBe(true);
    expect(bareNumber({ p: shown(60, '%') }, 'p')).toBe(false);
    expect(bareNumber(args, 'U')).toBe(false);
    expect(bareNumber(args, 's')).toBe(false);
    expect(bareNumber(args, 'missing')).toBe(false);
  });

  it('take any record with rho and mu (or nu) as a fluid, nu = mu/rho', () => {
    const fromNu = fluidArg(args, 'r');
    expect(fromNu).toEqual({ rho: 1.2, nu: 1.5e-5, mu: 1.5e-5 * 1.2 });
    const fromMu = fluidArg({ fluid: record([['rho', si(2, 'kg/m^3')], ['mu', si(4e-5, 'Pa s')], ['a', si(300, 'm/s')]]) });
    expect(fromMu).toEqual({ rho: 2, mu: 4e-5, nu: 2e-5, a: 300 });
    expect(fluidArg({ fluid: record([['rho', si(2, 'kg/m^3')], ['mu', si(4e-5, 'Pa s')]]) })).not.toHaveProperty('a');
    expect(() => fluidArg({ fluid: record([['mu', si(4e-5, 'Pa s')]]) })).toThrow('fluid has no density field rho');
    expect(() => fluidArg({ fluid: record([['rho', si(2, 'kg/m^3')]]) })).toThrow('fluid has neither mu nor nu');
  });
});

describe('values', () => {
  it('si() fixes the dimension from SI unit text and refuses offset units', () => {
    expect(si(2, 'km').si).toBe(2000);
    expect(si(3).dims).toEqual(num(3).dims);
    expect(() => si(1, 'degC')).toThrow('si() takes SI units, not degC');
  });

  it('describe each kind in words', () => {
    expect([num(1), si(1, 'm/s'), bool(true), str('x'), list([]), record([]), table(['a'], []), figure('<svg/>')].map(describeValue)).toEqual([
      'a plain number', 'a quantity in m/s', 'true/false', 'text', 'a list', 'a record', 'a table', 'a figure',
    ]);
    expect(table(['a'], [[num(1)]])).toEqual({ kind: 'table', columns: ['a'], rows: [[num(1)]] });
    expect(bool(false)).toEqual({ kind: 'bool', value: false });
    expect(figure('<svg/>', 'cap')).toEqual({ kind: 'figure', svg: '<svg/>', caption: 'cap' });
    expect(figure('<svg/>')).toEqual({ kind: 'figure', svg: '<svg/>' });
  });

  it('records keep their field order, notes, warnings, remarks, figure and tag', () => {
    const r = record([['a', num(1), 'first'], ['b', num(2)]], { warnings: ['w'], remarks: ['r'], figure: figure('<svg/>'), tag: 't' });
    expect([...r.fields.keys()]).toEqual(['a', 'b']);
    expect(r.fields.get('a')).toEqual({ value: num(1), note: 'first' });
    expect(r.fields.get('b')).toEqual({ value: num(2) });
    expect(r).toMatchObject({ warnings: ['w'], remarks: ['r'], figure: { svg: '<svg/>' }, tag: 't' });
    const bare = record([]);
    expect(bare).toEqual({ kind: 'record', fields: new Map(), warnings: [], remarks: [] });
  });

  it('fieldRecord follows the declared field list: order, symbols, notes', () => {
    const specs = [
      { name: 'x', symbol: 'x', unit: 'm', doc: 'length' },
      { name: 'y', symbol: 'y', unit: '1', doc: 'ratio' },
      { name: 'z', symbol: 'z', unit: '1', doc: 'unused' },
    ];
    const r = fieldRecord(specs, { y: num(2), x: si(1, 'm'), z: undefined }, { tag: 'k' }, { y: 'given note' });
    expect([...r.fields.entries()]).toEqual([
      ['x', { value: si(1, 'm'), note: 'length', symbol: 'x' }],
      ['y', { value: num(2), note: 'given note', symbol: 'y' }],
    ]);
    expect(r.tag).toBe('k');
    expect(() => fieldRecord(specs, { w: num(1) })).toThrow('field w is not in the declared field list');
  });
});

describe('the registry', () => {
  const f = (name: string): TradeFunction => ({ name, params: [], doc: 'd', source: 's', example: `${name}()`, compute: () => num(1) });

  it('holds each function once, by name, in order', () => {
    const reg = new Registry([f('a'), f('b')]);
    expect(reg.list().map((x) => x.name)).toEqual(['a', 'b']);
    expect(reg.has('a')).toBe(true);
    expect(reg.get('b')?.name).toBe('b');
    expect(reg.get('c')).toBeUndefined();
    expect(new Registry().list()).toEqual([]);
    expect(() => reg.add(f('a'))).toThrow('trade function a registered twice');
  });
});

describe('number wording', () => {
  it('keeps a few significant figures, a real minus, and powers of ten for big and small', () => {
    expect(numberText(0.04)).toBe('0.04');
    expect(numberText(101325)).toBe('101325');
    expect(numberText(2.345678)).toBe('2.35');
    expect(numberText(2.345678, { digits: 5 })).toBe('2.3457');
    expect(numberText(-3)).toBe('−3');
    expect(numberText(0)).toBe('0');
    expect(numberText(2.3e-5)).toBe('2.3e−5');
    expect(numberText(1e-3)).toBe('0.001');
    expect(numberText(1e6)).toBe('1e6');
    expect(numberText(999999)).toBe('999999');
    expect(numberText(5e5, { notation: 'sci' })).toBe('5e5');
    expect(numberText(1.25e7, { notation: 'sci' })).toBe('1.25e7');
    expect(numberText(12345678)).toBe('1.23e7');
    expect(numberText(Number.NaN)).toBe('not a number');
    expect(numberText(Number.POSITIVE_INFINITY)).toBe('infinity');
    expect(numberText(Number.NEGATIVE_INFINITY)).toBe('−infinity');
  });

  it('shows a refused value in full, and temperatures, lengths and shares in their words', () => {
    expect(EXACT).toBe(15);
    expect(exactText(20000.001)).toBe('20000.001');
    expect(exactText(0.1 + 0.2)).toBe('0.3');
    expect(celsiusText(288.15)).toBe('15 °C');
    expect(celsiusText(373.151, EXACT)).toBe('100.001 °C');
    expect(lengthText(2.3e-5)).toBe('23 µm');
    expect(lengthText(4.2e-3)).toBe('4.2 mm');
    expect(lengthText(1e-3)).toBe('1 mm');
    expect(lengthText(1)).toBe('1 m');
    expect(lengthText(-0.5)).toBe('−500 mm');
    expect(percentText(0.0512)).toBe('5.12 %');
    expect(percentText(0.05123, 2)).toBe('5.1 %');
    expect(quotedList(['a', 'b'])).toBe('"a", "b"');
  });
});

describe('escaping', () => {
  it('escapes the five characters HTML gives meaning to, and nothing else', () => {
    expect(escapeHtml(`a&b<c>d"e'f`)).toBe('a&amp;b&lt;c&gt;d&quot;e&#39;f');
    expect(escapeHtml('plain µ text')).toBe('plain µ text');
  });
});

describe('delimited text', () => {
  it('takes the delimiter seen most in the header outside quotes, a comma on a tie or none', () => {
    expect(detectDelimiter('a;b;c\n1;2;3')).toBe(';');
    expect(detectDelimiter('a\tb\n1\t2')).toBe('\t');
    expect(detectDelimiter('"x;y;z",b\n')).toBe(',');
    expect(detectDelimiter('a,b;c\n')).toBe(',');
    expect(detectDelimiter('single\n')).toBe(',');
    expect(detectDelimiter('\n\n  \na;b\n')).toBe(';');
    expect(detectDelimiter('a;b\r\n1,2,3,4\r\n')).toBe(';');
  });

  it('reads rows with their spreadsheet row numbers, past a byte-order mark and blank lines', () => {
    const t = readDelimited('\uFEFFface;yplus\n\na;0,5\nb;1\n');
    expect(t.header).toEqual(['face', 'yplus']);
    expect(t.rows.map((r) => [r.row, r.cells])).toEqual([[3, ['a', '0,5']], [4, ['b', '1']]]);
    expect(columnIndex(t, 'YPLUS')).toBe(1);
    expect(columnIndex(t, 'area')).toBe(-1);
    expect(columnList(t)).toBe('face, yplus');
    expect(numberCell(t, t.rows[0]!, 1)).toBe(0.5);
  });

  it('reads numbers as written, decimal commas only where the delimiter is not a comma', () => {
    const t = readDelimited('a,b\n1.5,2e3\n.5,+1\n1.,x\n1e,3\n');
    expect([numberCell(t, t.rows[0]!, 0), numberCell(t, t.rows[0]!, 1), numberCell(t, t.rows[1]!, 0), numberCell(t, t.rows[1]!, 1), numberCell(t, t.rows[2]!, 0)]).toEqual([1.5, 2000, 0.5, 1, 1]);
    expect(() => numberCell(t, t.rows[2]!, 1)).toThrow('row 4: "x" in column b is not a number');
    expect(() => numberCell(t, t.rows[3]!, 0)).toThrow('row 5: "1e" in column a is not a number');
    expect(() => numberCell(t, t.rows[0]!, 5)).toThrow('row 2: the cell in column 6 is empty');
    const semi = readDelimited('a;b\n1,5;2\n');
    expect(numberCell(semi, semi.rows[0]!, 0)).toBe(1.5);
    const comma = readDelimited('a\n"1,5"\n');
    expect(() => numberCell(comma, comma.rows[0]!, 0)).toThrow('"1,5" in column a is not a number');
    for (const bad of ['1.2.3', '1e5e', 'e5', '.', '1 2', '-.e1']) {
      const b = readDelimited(`a\n${bad}\n`);
      expect(() => numberCell(b, b.rows[0]!, 0), bad).toThrow(/is not a number/);
    }
  });

  it('checks row widths and reports unreadable text with its row', () => {
    const t = readDelimited('a,b\n1\n');
    expect(() => checkRowWidth(t, t.rows[0]!)).toThrow('row 2: 1 cells where the header has 2');
    expect(() => readDelimited('a,b\n"1,2\n')).toThrow(/^the file is not readable as delimited text near row \d+: /);
    expect(() => readDelimited('\n\n')).toThrow('the file is empty: it needs a header row and at least one row of values');
  });
});

describe('wall samples and their statistics', () => {
  it('reads a weight column anywhere, also first, and counts faces equally without one', () => {
    const first = readWallSamples('area,yplus\n2,1\n1,4\n', 'yplus', 'area');
    expect(first).toMatchObject({ values: [1, 4], weights: [2, 1], weighted: true, delimiter: ',', columns: ['area', 'yplus'] });
    const none = readWallSamples('yplus\n1\n4\n', 'yplus', 'area');
    expect(none).toMatchObject({ values: [1, 4], weights: [1, 1], weighted: false });
    const off = readWallSamples('yplus,area\n1,5\n', 'yplus', undefined);
    expect(off.weighted).toBe(false);
    expect(readWallSamples('yplus\n0\n', 'yplus', undefined).values).toEqual([0]);
  });

  it('refuses negative values and weights, all-zero weights, a missing column', () => {
    expect(() => readWallSamples('yplus,area\n-0.1,1\n', 'yplus', 'area')).toThrow('row 2: y+ −0.1 in column yplus is negative');
    expect(() => readWallSamples('yplus,area\n1,-2\n', 'yplus', 'area')).toThrow('row 2: weight −2 in column area is negative');
    expect(() => readWallSamples('yplus,area\n1,0\n2,0\n', 'yplus', 'area')).toThrow('every weight in column area is zero');
    expect(readWallSamples('yplus,area\n1,0\n2,1\n', 'yplus', 'area').weights).toEqual([0, 1]);
    expect(() => readWallSamples('yp,area\n1,1\n', 'yplus', 'area')).toThrow('no column "yplus" in the header (columns: yp, area)');
    expect(readWallSamples('yplus,area\n1,1\n', 'yplus', 'area').values).toEqual([1]);
  });

  it('quantiles by Hyndman & Fan (1996) definition 7, band edges counted in, and the height correction', () => {
    // Definition 7: h = (n − 1)p, interpolating between order statistics x[floor h] and x[floor h + 1].
    expect(quantile([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(quantile([1, 2, 3, 4], 1)).toBe(4);
    expect(quantile([1, 2, 3, 4], 0)).toBe(1);
    expect(quantile([7], 0.95)).toBe(7);
    const st = yplusStats([0.5, 5, 6], [1, 1, 2], [0.5, 5]);
    expect(st.in_band).toBe(0.5);
    expect(st.weighted_mean).toBe((0.5 + 5 + 12) / 4);
    expect(() => yplusStats([], [], [0.5, 5])).toThrow('no samples');
    expect(correctedFirst(40e-6, 1, 2)).toBe(20e-6);
    expect(correctedFirst(40e-6, 3, 2)).toBeCloseTo(60e-6, 18);
    expect(() => correctedFirst(40e-6, 1, 0)).toThrow('the observed mean y+ is zero, so no correction can be scaled from it');
  });
});

describe('trade errors', () => {
  it('are one type, with the message as given', () => {
    const e = new TradeError('plain words');
    expect(e).toBeInstanceOf(Error);
    expect(e.message).toBe('plain words');
  });
});
