// The statement grammar of issue 2, and exact error positions (1-based line:column).
import { describe, expect, it } from 'vitest';
import { parseStatement } from '../../server/parse/index.js';
import { SheetError } from '../../server/diagnostics.js';

function parse(text: string) {
  return parseStatement(text, 7)!;
}

function failure(text: string): string {
  try {
    parseStatement(text, 7);
  } catch (e) {
    if (e instanceof SheetError) return `${e.code} at ${e.span!.line}:${e.span!.col}: ${e.message}`;
    throw e;
  }
  throw new Error('expected a syntax error');
}

describe('statements', () => {
  it('reads a definition with its description', () => {
    const s = parse('U_inf = 12 m/s   # design speed');
    expect(s.type).toBe('define');
    if (s.type !== 'define') return;
    expect(s.name).toBe('U_inf');
    expect(s.description).toBe('design speed');
    expect(s.expr.type).toBe('number');
    expect(s.expr.type === 'number' && s.expr.unit?.unit.text).toBe('m/s');
  });

  it('reads a check with its label', () => {
    const s = parse('check layers.count >= 10 "about ten cells across the boundary layer"');
    expect(s.type).toBe('check');
    if (s.type !== 'check') return;
    expect(s.label).toBe('about ten cells across the boundary layer');
    expect(s.expr.type).toBe('compare');
  });

  it('reads a bare expression and skips comment and blank lines', () => {
    expect(parse('Re * 2').type).toBe('expr');
    expect(parseStatement('# just a note', 1)).toBeNull();
    expect(parseStatement('   ', 1)).toBeNull();
  });

  it('reads calls with positional and named arguments', () => {
    const s = parse('a = air(T: 15 degC, p: 101.325 kPa)');
    if (s.type !== 'define' || s.expr.type !== 'call') throw new Error('not a call');
    expect(s.expr.callee).toBe('air');
    expect(s.expr.args.map((a) => a.name)).toEqual(['T', 'p']);
    const t = parse('r = reynolds(U, L, air)');
    if (t.type !== 'define' || t.expr.type !== 'call') throw new Error('not a call');
    expect(t.expr.args.every((a) => a.name === undefined)).toBe(true);
  });

  it('binds power tighter than unary minus, and ^ to the right', () => {
    const s = parse('q = -2^2');
    expect(s.type === 'define' && s.expr.type).toBe('unary');
    const t = parse('q = 2^3^2');
    if (t.type !== 'define' || t.expr.type !== 'binary') throw new Error();
    expect(t.expr.right.type).toBe('binary');
  });

  it('reads chained comparisons, and/or/not, lists with units, strings, conversions, fields', () => {
    const c = parse('ok = 0.5 <= a <= 3 and not b or c');
    expect(c.type === 'define' && c.expr.type).toBe('binary');
    const l = parse('speeds = [5, 10, 20] m/s');
    expect(l.type === 'define' && l.expr.type === 'list' && l.expr.unit?.unit.text).toBe('m/s');
    const s = parse('m = "schlichting"');
    expect(s.type === 'define' && s.expr.type).toBe('string');
    const v = parse('y = y1 to um');
    expect(v.type === 'define' && v.expr.type).toBe('convert');
    const f = parse('n = air.nu');
    expect(f.type === 'define' && f.expr.type).toBe('field');
  });

  it('reads compound units: juxtaposition binds tighter than /', () => {
    const s = parse('cp = 1005 J/kg K');
    if (s.type !== 'define' || s.expr.type !== 'number') throw new Error();
    // J/(kg K) has the dimension m^2 s^-2 K^-1.
    expect(s.expr.unit!.unit.dims).toEqual([0, 2, -2, 0, -1, 0, 0]);
    const mu = parse('mu = 1.8e-5 Pa s');
    if (mu.type !== 'define' || mu.expr.type !== 'number') throw new Error();
    expect(mu.expr.unit!.unit.dims).toEqual([1, -1, -1, 0, 0, 0, 0]);
  });

  it('keeps a variable in the denominator when it is no unit', () => {
    const s = parse('r = 12 m / L_ref');
    expect(s.type === 'define' && s.expr.type).toBe('binary');
  });
});

describe('error positions', () => {
  it('points at an unknown unit', () => {
    expect(failure('x = 12 furlongz')).toBe('unknown-unit at 7:8: "furlongz" is not a known unit');
  });
  it('points at the end of a line that stops early', () => {
    expect(failure('x = 12 m/')).toBe('syntax at 7:10: expected a value, found the end of the line');
  });
  it('points at an unclosed call', () => {
    expect(failure('a = air(T: 15 degC')).toBe('syntax at 7:19: expected "," or ")" in the call to air, found the end of the line');
  });
  it('points at an unclosed string', () => {
    expect(failure('check a > 1 "label')).toBe('syntax at 7:13: this text has no closing double quote');
  });
  it('points at a stray character', () => {
    expect(failure('x = 3 $ 4')).toBe('syntax at 7:7: unexpected character "$"');
  });
  it('refuses a positional argument after a named one', () => {
    expect(failure('r = reynolds(U: 1 m/s, L)')).toBe('syntax at 7:24: a positional argument cannot follow a named one');
  });
  it('refuses a keyword as a name', () => {
    expect(failure('and = 3')).toBe('syntax at 7:1: "and" is a keyword and cannot be a name');
  });
  it('counts columns from the block line start', () => {
    expect(() => parseStatement('x = ', 3, 5)).toThrow(SheetError);
    try {
      parseStatement('x = 1 +', 3, 5);
    } catch (e) {
      expect((e as SheetError).span).toEqual({ line: 3, col: 12, end: 12 });
    }
  });
});
