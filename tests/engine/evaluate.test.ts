// Dependency order, redefinition, cycles, stale marking, and the incremental
// cache (issue 2). Values are checked against hand arithmetic.
import { describe, expect, it } from 'vitest';
import { SheetPipeline } from '../../server/pipeline/index.js';
import { decodeReferences, sheet, si } from './helpers.js';

describe('dependency order', () => {
  it('uses a name above its definition and keeps the file order in the output', async () => {
    const r = await sheet(['Re = U * L / nu', 'U = 12 m/s', 'L = 4.2 m', 'nu = 1.47e-5 m^2/s']);
    expect(r.errors).toEqual([]);
    expect(si(r, 'Re')).toBeCloseTo((12 * 4.2) / 1.47e-5, 6);
    const html = r.parts.map((p) => p.html).join('');
    expect(html.indexOf('data-name="Re"')).toBeLessThan(html.indexOf('data-name="U"'));
  });

  it('reports a second definition at the second line and names the first', async () => {
    const r = await sheet(['U = 12 m/s', 'L = 2 m', 'U = 14 m/s']);
    expect(r.errors).toEqual([{ line: 4, column: 1, message: '"U" is already defined on line 2; a name is defined once', code: 'redefined' }]);
    expect(si(r, 'U')).toBe(12);
  });

  it('names the cycle', async () => {
    const r = await sheet(['a = b + 1', 'b = c * 2', 'c = a - 3', 'd = 4']);
    expect(r.errors.map((e) => e.line)).toEqual([2, 3, 4]);
    expect(r.errors[0]!.message).toBe('these definitions depend on each other in a circle: a → b → c → a');
    expect(si(r, 'd')).toBe(4);
  });

  it('says which name is missing, with its line', async () => {
    const r = await sheet(['x = 1 m', 'y = L_ref * 2']);
    expect(r.errors).toEqual([{ line: 3, column: 5, message: '`L_ref` is not defined (line 3)', code: 'unknown-name' }]);
  });

  it('names the nearest defined name when a name is mistyped', async () => {
    const r = await sheet(['D_strut = 0.14 m', 'A = D_strt * 2 m']);
    expect(r.errors).toEqual([{ line: 3, column: 5, message: '`D_strt` is not defined (line 3); did you mean `D_strut`?', code: 'unknown-name' }]);
  });

  it('marks everything downstream of a failure as not evaluated, naming the root', async () => {
    const r = await sheet(['bad = 12 m/s + 3 Pa', 'twice = bad * 2', 'thrice = twice * 3 / 2', 'ok = 5 m']);
    expect(r.errors).toHaveLength(1);
    const html = r.parts.map((p) => p.html).join('');
    expect(html).toMatch(/data-name="twice" data-state="not-evaluated"[\s\S]*waiting on <code>bad<\/code>, <a href="#L\d+">line \d+<\/a>/);
    expect(html).toMatch(/data-name="thrice" data-state="not-evaluated"[\s\S]*waiting on <code>bad<\/code>/);
    expect(r.values.ok).toBeDefined();
  });

  it('blocks users of a line that could not be parsed', async () => {
    const r = await sheet(['U = 12 m/', 'q = U * 2']);
    expect(r.errors).toHaveLength(1);
    expect(r.parts.map((p) => p.html).join('')).toContain('waiting on <code>U</code>');
  });

  it('evaluates chained comparisons, element-wise lists and checks', async () => {
    const r = await sheet(['speeds = [10, 20, 40] m/s', 'q = 0.5 * 1.225 kg/m^3 * speeds^2', 'check 0.5 <= 0.7 <= 0.8 "relaxation in range"', 'check q < 500 Pa "all below 500 Pa"']);
    // q = rho U^2 / 2 by hand: 61.25, 245 and 980 Pa.
    [61.25, 245, 980].forEach((want, i) => expect(r.values.q!.items![i]!.si).toBeCloseTo(want, 9));
    expect(r.checks).toEqual([
      { line: 4, passed: true, text: 'relaxation in range' },
      { line: 5, passed: false, text: 'all below 500 Pa' },
    ]);
  });
});

describe('calls', () => {
  it('a bare altitude is geopotential, a named one says which it is', async () => {
    const r = await sheet(['a = atmosphere(11 km)', 'b = atmosphere(geometric: 11 km)', 'c = atmosphere(h: 11 km)']);
    // Tropopause at geopotential 11 km, 216.65 K; Kutz Table 6 at geometric 11 km, 216.77 K.
    expect(r.values.a!.fields!.T!.si).toBeCloseTo(216.65, 9);
    expect(r.values.b!.fields!.T!.si).toBeCloseTo(216.77, 2);
    expect(r.errors.map((e) => e.message)).toEqual(['atmosphere() has no parameter "h"; it takes geopotential, geometric']);
  });

  it('speeds are magnitudes, in the same words for every function', async () => {
    const r = await sheet(['f = air(T: 15 degC)', 'a = reynolds(-3 m/s, 1 m, f)', 'b = first_cell(-3 m/s, 1 m, f)']);
    expect(r.errors.map((e) => e.message)).toEqual([
      "reynolds(): U = −3 m/s is negative; give the speed's magnitude (speeds are not signed here)",
      "first_cell(): U = −3 m/s is negative; give the speed's magnitude (speeds are not signed here)",
    ]);
  });
});

describe('incremental evaluation', () => {
  it('recomputes only what depends on a changed input', () => {
    const session = new SheetPipeline();
    const lines = ['U = 12 m/s', 'L = 4.2 m', 'nu = 1.5e-5 m^2/s', 'Re = U * L / nu', 'H = 2 m', 'A = H * L', 'Re_H = U * H / nu'];
    const text = (u: string) => '```basis\n' + lines.join('\n').replace('U = 12 m/s', `U = ${u}`) + '\n```\n';
    const first = session.run(text('12 m/s')) as unknown as { freshStatements: number; values: Record<string, { si: number }> };
    expect(first.freshStatements).toBe(7);
    const second = session.run(text('14 m/s')) as unknown as { freshStatements: number; values: Record<string, { si: number }> };
    // U, Re and Re_H change; L, nu, H and A are reused.
    expect(second.freshStatements).toBe(3);
    expect(second.values.Re!.si).toBeCloseTo((14 * 4.2) / 1.5e-5, 6);
  });
});

describe('last good values while a sheet has errors', () => {
  const text = (u: string) => '# Mast\n\nGust Reynolds number `=Re`.\n\n```basis\nU = ' + u + '\nD = 0.3 m\nnu = 1.5e-5 m^2/s\nRe = U * D / nu\n```\n';
  const statement = (html: string, name: string) => new RegExp(`<div class="ws-stmt[^"]*"[^>]*data-name="${name}"[\\s\\S]*?(?=<a id="L|$)`).exec(html)![0];

  it('keeps what depends on a broken input in view, marked stale, with only the real error listed', () => {
    const session = new SheetPipeline();
    session.run(text('12 m/s'));
    const broken = session.run(text('12 m/s + 1 Pa'));
    const html = decodeReferences(broken.parts.map((p) => p.html).join(''));
    expect(broken.errors.map((e) => [e.line, e.message])).toEqual([[6, 'cannot add m/s to Pa']]);
    // Re = 12 × 0.3 / 1.5e-5 = 2.4e5, computed before the break.
    const re = statement(html, 'Re');
    // One quiet line: what it waits on, where, and the last good value, marked stale; no box of its own.
    expect(re).toMatch(/waiting on <code>U<\/code>, <a href="#L6">line 6<\/a> · last good value <span class="ws-last-good-value">2\.4×10⁵<\/span> <span class="ws-stale-tag">stale<\/span>/);
    expect(re).not.toContain('ws-error');
    expect(re).toContain('data-state="not-evaluated"');
    expect(re).not.toContain('data-si'); // a stale number is not offered as current
    expect(statement(html, 'U')).toMatch(/ws-last-good-value">12 m\/s</); // the broken input shows its own last good value
    expect(html).toMatch(/<span class="ws-inline ws-stale-value"[^>]*>2\.4×10⁵ <span class="ws-stale-tag">stale<\/span><\/span>/);

    const mended = session.run(text('13 m/s'));
    const again = mended.parts.map((p) => p.html).join('');
    expect(again).not.toContain('ws-last-good');
    expect(again).not.toContain('ws-stale-value');
    expect(mended.values.Re!.si).toBeCloseTo((13 * 0.3) / 1.5e-5, 6);
  });

  it('has no last good value to show on a first evaluation', () => {
    const html = new SheetPipeline().run(text('12 m/s + 1 Pa')).parts.map((p) => p.html).join('');
    expect(html).not.toContain('ws-last-good');
    expect(html).toContain('ws-inline-error');
  });
});

describe('no way out to JavaScript', () => {
  it('never resolves names, fields or calls to JavaScript object properties', async () => {
    const r = await sheet([
      'a = constructor',
      'b = __proto__',
      'air_x = air(T: 15 degC)',
      'c = air_x.constructor',
      'd = air_x.__proto__',
      'e = toString(1)',
      'f = hasOwnProperty(1)',
      'g = air_x.rho.valueOf',
    ]);
    expect(r.errors.map((e) => e.code)).toEqual(['unknown-name', 'unknown-name', 'unknown-name', 'unknown-name', 'unknown-function', 'unknown-function', 'type']);
    expect(r.values.a).toBeUndefined();
    expect(r.values.c).toBeUndefined();
  });
});
