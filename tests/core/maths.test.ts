// The basic maths of worksheets: each function against its definition (ECMAScript Math,
// IEEE 754 double precision), with the unit rules of the language: sqrt halves the powers,
// abs/min/max/sum/mean keep the unit, temperatures keep their sense.
import { describe, expect, it } from 'vitest';
import { list, num, shown, si, str, TradeError, type Value } from '../../server/core/index.js';
import { mathsEntries } from '../../server/core/maths/entries.js';
import { fromUnit } from '../../server/units/quantity.js';

function call(name: string, args: Record<string, Value>): Value {
  const f = mathsEntries.find((e) => e.name === name)!;
  return f.compute(args, { readData: () => '', warn: () => {} });
}

function q(v: Value) {
  if (v.kind !== 'quantity') throw new Error(`expected a quantity, got ${v.kind}`);
  return v;
}

describe('functions of plain numbers', () => {
  it('exp, ln, log10, sin, cos, tan follow their definitions', () => {
    expect(q(call('exp', { x: num(1) })).si).toBe(Math.E);
    expect(q(call('ln', { x: num(Math.E) })).si).toBe(1);
    expect(q(call('log10', { x: num(1e6) })).si).toBe(6);
    // 30° = π/6 rad: sin 30° = 1/2, tan 45° = 1 (deg is π/180, SI Brochure 2019, Table 8).
    expect(q(call('sin', { x: shown(30, 'deg') })).si).toBeCloseTo(0.5, 15);
    expect(q(call('cos', { x: num(Math.PI / 3) })).si).toBeCloseTo(0.5, 15);
    expect(q(call('tan', { x: shown(45, 'deg') })).si).toBeCloseTo(1, 15);
  });

  it('refuse a quantity with units, and arguments outside their domain', () => {
    expect(() => call('exp', { x: si(1, 'm') })).toThrow('exp needs a plain number, not a quantity in m');
    expect(() => call('ln', { x: num(0) })).toThrow('ln is not defined for this argument');
    expect(() => call('log10', { x: num(-1) })).toThrow('log10 is not defined for this argument');
    expect(() => call('ln', {})).toThrow('x must be a number or quantity');
    expect(() => call('ln', { x: str('e') })).toThrow('x must be a number or quantity');
    expect(() => call('log10', { x: num(0) })).toThrow('log10 is not defined for this argument');
  });
});

describe('sqrt and abs', () => {
  it('sqrt halves the powers of the unit', () => {
    const r = q(call('sqrt', { x: si(16, 'm^2/s^2') }));
    expect(r.si).toBe(4);
    expect(r.dims).toEqual(si(1, 'm/s').dims);
    expect(() => call('sqrt', { x: num(-1) })).toThrow('sqrt of a negative value');
    expect(q(call('sqrt', { x: num(0) })).si).toBe(0);
  });

  it('abs keeps the unit and a temperature difference stays one', () => {
    const r = q(call('abs', { x: fromUnit(-3, 'm/s') }));
    expect(r.si).toBe(3);
    expect(r.unit?.text).toBe('m/s');
    const d = q(call('abs', { x: fromUnit(-20, 'delta_degC') }));
    expect(d.si).toBe(20);
    expect(d.interval).toBe(true);
  });
});

describe('min and max', () => {
  it('take a list or several arguments, and keep the winner as it was', () => {
    expect(q(call('min', { values: list([si(3, 'm'), si(1, 'm'), si(2, 'm')]) })).si).toBe(1);
    expect(q(call('max', { values: list([si(3, 'm'), si(1, 'm'), si(2, 'm')]) })).si).toBe(3);
    expect(q(call('max', { values: list([num(1), list([num(7), num(2)])]) })).si).toBe(7);
    expect(q(call('min', { values: si(5, 'm'), _2: si(4, 'm') })).si).toBe(4);
    // Of equal values the first is kept, unit and all; parameters left out are skipped.
    expect(q(call('min', { values: list([fromUnit(1, 'km'), fromUnit(1000, 'm')]) })).unit?.text).toBe('km');
    expect(q(call('max', { values: list([fromUnit(1, 'km'), fromUnit(1000, 'm')]) })).unit?.text).toBe('km');
    expect(q(call('max', { values: si(5, 'm'), _2: undefined as unknown as Value })).si).toBe(5);
  });

  it('refuse mixed units, text, and nothing at all', () => {
    expect(() => call('max', { values: list([si(1, 'm'), si(1, 's')]) })).toThrow('max cannot compare s with m');
    expect(() => call('min', { values: list([{ kind: 'string', value: 'a' }]) })).toThrow('min and max take numbers or quantities');
    expect(() => call('min', { values: list([]) })).toThrow('min of nothing');
  });
});

describe('linspace', () => {
  it('gives count evenly spaced values from start to stop, in the start\'s unit', () => {
    const r = call('linspace', { start: fromUnit(10, 'm/s'), stop: fromUnit(40, 'm/s'), count: num(4) });
    expect(r.kind === 'list' && r.items.map((i) => q(i).si)).toEqual([10, 20, 30, 40]);
    expect(r.kind === 'list' && q(r.items[1]!).unit?.text).toBe('m/s');
  });

  it('keeps temperatures absolute: linspace(10 degC, 20 degC, 3)', () => {
    const r = call('linspace', { start: fromUnit(10, 'degC'), stop: fromUnit(20, 'degC'), count: num(3) });
    const items = r.kind === 'list' ? r.items.map(q) : [];
    expect(items.map((i) => i.si)).toEqual([283.15, 288.15, 293.15]);
    expect(items.every((i) => i.absolute && i.unit?.text === 'degC')).toBe(true);
  });

  it('refuses a count that is not a whole number from 2 to 100000, and mixed units', () => {
    const start = si(1, 'm');
    expect(() => call('linspace', { start, stop: si(2, 'm'), count: num(1) })).toThrow('count must be a whole number from 2 to 100000, not 1');
    const two = call('linspace', { start, stop: si(2, 'm'), count: num(2) });
    expect(two.kind === 'list' && two.items.map((i) => q(i).si)).toEqual([1, 2]);
    expect(() => call('linspace', { start, stop: si(2, 'm'), count: num(2.5) })).toThrow(/not 2.5/);
    expect(() => call('linspace', { start, stop: si(2, 'm'), count: num(100001) })).toThrow(/not 100001/);
    const long = call('linspace', { start, stop: si(2, 'm'), count: num(100000) });
    expect(long.kind === 'list' && q(long.items[99999]!).si).toBe(2);
    expect(() => call('linspace', { start, stop: si(2, 's'), count: num(3) })).toThrow('start and stop must have the same unit (m and s)');
  });
});

describe('sum and mean', () => {
  it('add in the first value\'s unit', () => {
    const s = q(call('sum', { values: list([fromUnit(1, 'km'), fromUnit(500, 'm')]) }));
    expect(s.si).toBe(1500);
    expect(s.unit?.text).toBe('km');
    expect(q(call('mean', { values: list([si(1, 'm'), si(2, 'm'), si(6, 'm')]) })).si).toBe(3);
    expect(q(call('sum', { values: list([]) })).si).toBe(0);
  });

  it('follow the temperature rules: a mean of temperatures is one, a sum of them is refused', () => {
    const m = q(call('mean', { values: list([fromUnit(10, 'degC'), fromUnit(20, 'degC')]) }));
    expect(m.si).toBeCloseTo(288.15, 12);
    expect(m.absolute).toBe(true);
    expect(() => call('sum', { values: list([fromUnit(10, 'degC'), fromUnit(20, 'degC')]) })).toThrow(/cannot add two absolute temperatures/);
    const d = q(call('sum', { values: list([fromUnit(1, 'delta_degC'), fromUnit(2, 'delta_degC')]) }));
    expect(d.si).toBe(3);
    expect(d.interval).toBe(true);
  });

  it('refuse mixed units and an empty mean', () => {
    expect(() => call('sum', { values: list([si(1, 'm'), si(1, 's')]) })).toThrow('cannot add m to s');
    expect(() => call('mean', { values: list([si(1, 'm'), si(1, 's')]) })).toThrow('cannot add s to m');
    expect(() => call('mean', { values: list([]) })).toThrow('mean of an empty list');
  });
});
