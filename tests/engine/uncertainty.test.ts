// Inputs with an uncertainty (± 1 m/s, ± 5 %, (uniform)) and first-order
// propagation through the sheet, checked against answers known exactly from
// the law of propagation of uncertainty (JCGM 100:2008, GUM, §5.1.2, eq. 10;
// relative form for products and powers, §5.1.6, eq. 12).
import { describe, expect, it } from 'vitest';
import { parseStatement } from '../../server/parse/index.js';
import { sheet, si } from './helpers.js';

const u = (r: Awaited<ReturnType<typeof sheet>>, name: string) => {
  const v = r.values[name];
  if (!v || v.u === undefined) throw new Error(`${name} has no u: ${JSON.stringify(r.errors)}`);
  return v.u;
};

describe('an uncertainty on an input', () => {
  it('is read as absolute, relative or a uniform half-width, in either spelling', async () => {
    const r = await sheet(['a = 12 m/s ± 1 m/s', 'b = 12 m/s +- 5 %', 'c = 3 m ± 0.3 m (uniform)', 'd = 3 m ± 30 cm (normal)', 'T = 15 degC ± 0.5 degC']);
    expect(r.errors).toEqual([]);
    expect(u(r, 'a')).toBe(1);
    expect(u(r, 'b')).toBeCloseTo(0.6, 12);
    // A rectangular distribution of half-width a has u = a/√3 (JCGM 100:2008 §4.3.7, eq. 7).
    expect(u(r, 'c')).toBeCloseTo(0.3 / Math.sqrt(3), 12);
    expect(u(r, 'd')).toBeCloseTo(0.3, 12);
    // An uncertainty is a difference: half a degree, not 273.65 K.
    expect(u(r, 'T')).toBeCloseTo(0.5, 12);
    // The nominal values are unchanged.
    expect(si(r, 'a')).toBe(12);
    expect(si(r, 'T')).toBeCloseTo(288.15, 12);
  });

  it('is refused, with its place, anywhere but after an input', () => {
    expect(() => parseStatement('y = 2 * U ± 1 m/s', 3)).toThrow(/only a name defined by a single number/);
    expect(() => parseStatement('check U +- 1 m/s > 0 m/s', 3)).toThrow(/uncertainty of an input/);
    expect(() => parseStatement('L = 3 m ± 0.1 m (gaussian)', 3)).toThrow(/\(normal\) or \(uniform\)/);
    try {
      parseStatement('y = 2 * U ± 1 m/s', 3);
    } catch (e) {
      expect((e as { span: { line: number; col: number } }).span).toMatchObject({ line: 3, col: 11 });
    }
  });

  it('must have the dimension of its value', async () => {
    const r = await sheet(['U = 12 m/s ± 1 m', 'y = 2 * U']);
    expect(r.errors[0]).toMatchObject({ line: 2, column: 12, code: 'unit-mismatch' });
    expect(r.errors[0]!.message).toContain('same dimension');
    expect(r.values.y).toBeUndefined();
  });

  it('leaves a sheet without one as it was: no u anywhere', async () => {
    const r = await sheet(['U = 12 m/s', 'y = 2 * U']);
    expect(r.values.y!.u).toBeUndefined();
    expect(r.checks.every((c) => c.range === undefined)).toBe(true);
  });
});

describe('first-order propagation', () => {
  it('adds the uncertainties of a sum in quadrature', async () => {
    // y = a + b - c: u(y)² = u(a)² + u(b)² + u(c)², c_i = ±1 (GUM eq. 10).
    const r = await sheet(['a = 3 m ± 0.3 m', 'b = 2 m ± 0.4 m', 'c = 1 m ± 1.2 m', 'y = a + b - c']);
    expect(u(r, 'y')).toBeCloseTo(Math.sqrt(0.09 + 0.16 + 1.44), 12);
  });

  it('adds relative uncertainties of a product and a quotient in quadrature: Re with 5 % on U and 1 % on L has √26 % = 5.099 %', async () => {
    // GUM §5.1.6, eq. 12: for Y = c X1^p1 X2^p2 …, (u(y)/y)² = Σ (p_i u(x_i)/x_i)².
    const r = await sheet(['U = 10 m/s ± 5 %', 'L = 2 m ± 1 %', 'nu = 1.5e-5 m^2/s', 'Re = U * L / nu']);
    const rel = u(r, 'Re') / si(r, 'Re');
    expect(rel).toBeCloseTo(Math.sqrt(26) / 100, 12);
    expect(Math.round(rel * 1e4) / 100).toBe(5.1);
  });

  it('multiplies the relative uncertainty of a power by its exponent', async () => {
    // GUM eq. 12 with one input: u(y)/y = |n| u(x)/x. The sensitivity is the secant over x ± u(x)
    // (GUM §5.1.3, note 2), which for x³ differs from the slope by (n−1)(n−2)/6·(u/x)² = 1/3·1e-4, relative.
    const r = await sheet(['x = 2 m ± 1 %', 'y = x^3', 'z = sqrt(x)']);
    expect(u(r, 'y') / si(r, 'y')).toBeCloseTo(0.03, 5);
    expect(Math.abs(u(r, 'y') / si(r, 'y') / 0.03 - 1)).toBeLessThan(0.34e-4);
    expect(u(r, 'z') / si(r, 'z')).toBeCloseTo(0.005, 6);
  });

  it('gives record fields their own u, and the JSON of every value that depends on an input', async () => {
    const r = await sheet(['U = 30 m/s ± 1 m/s', 'L = 4 m', 'gas = fluid(rho: 1.2 kg/m^3, mu: 1.8e-5 Pa s)', 'wall = first_cell(U, L, gas, yplus: 1)', 'other = 2 * L']);
    const h = r.values.wall!.fields!.height!;
    expect(h.u).toBeGreaterThan(0);
    // The first cell shrinks as the speed grows: y ∝ U^-(about 0.9); one m/s in 30 moves it about 3 %.
    expect(h.u! / h.si!).toBeGreaterThan(0.02);
    expect(h.u! / h.si!).toBeLessThan(0.04);
    expect(r.values.other!.u).toBeUndefined();
    expect(r.values.L!.u).toBeUndefined();
  });

  it('returns the expanded uncertainty with uncertainty(y, k: 2) and the budget as a table', async () => {
    const r = await sheet(['U = 10 m/s ± 5 %', 'L = 2 m ± 1 %', 'nu = 1.5e-5 m^2/s', 'Re = U * L / nu', 'U_Re = uncertainty(Re, k: 2)', 'u_Re = uncertainty(Re)', 'b = budget(Re)']);
    expect(r.errors).toEqual([]);
    expect(si(r, 'U_Re')).toBeCloseTo(2 * u(r, 'Re'), 6);
    expect(si(r, 'u_Re')).toBeCloseTo(u(r, 'Re'), 6);
    const t = r.values.b!.table!;
    expect(t.columns).toEqual(['input', 'u(x)', 'distribution', 'sensitivity c', '|c·u(x)|', 'share of u²']);
    expect(t.rows.map((row) => row[0]!.display)).toEqual(['U', 'L']);
    // Shares of u²: 25 : 1.
    expect(t.rows[0]![5]!.si).toBeCloseTo(25 / 26, 12);
    expect(t.rows[1]![5]!.si).toBeCloseTo(1 / 26, 12);
    expect(t.rows[0]![3]!.si).toBeCloseTo(si(r, 'Re') / 10, 3);
  });

  it('says plainly when a result depends on no uncertain input', async () => {
    const r = await sheet(['U = 10 m/s ± 1 m/s', 'L = 2 m', 'b = budget(L)']);
    expect(r.errors[0]).toMatchObject({ line: 4, code: 'bad-argument' });
    expect(r.errors[0]!.message).toContain('depends on none of the inputs with an uncertainty (U)');
  });
});

describe('fields that depend on no uncertain input', () => {
  it('carry u = 0 in the JSON and show no spread in text, as on the page', async () => {
    const r = await sheet(['U = 10 m/s ± 1 m/s', 'stack = layer_stack(first: U * 1 us, growth: 1.2, count: 10)']);
    expect(r.errors).toEqual([]);
    const fields = r.values['stack']!.fields!;
    expect(fields['growth']).toMatchObject({ u: 0 });
    expect(fields['growth']!.uDisplay).toBeUndefined();
    // first = U × 1 µs: 10 µm ± 1 µm.
    expect(fields['first']!.uDisplay).toBe('± 1 µm');
    expect(r.html).not.toMatch(/>± 0[ <]/);
  });
});

describe('the spread of a value shown in powers of ten', () => {
  it('is shown in powers of ten too', async () => {
    // Re = U L / ν = 1.8e5 with U ± 5 %: u = 9000, two digits (JCGM 100:2008 §7.2.6).
    const r = await sheet(['U = 18 m/s ± 5 %', 'Re = U * 1 m / (1e-4 m^2/s)']);
    expect(r.values['Re']).toMatchObject({ display: '1.8×10⁵', uDisplay: '± 9×10³' });
  });
});

describe('checks over the range', () => {
  it('holds at nominal and fails only at a corner of the ±2u box', async () => {
    // y = a + b is 10 m at nominal and 10.8 m at the corner (+2u, +2u); one input at its end alone gives 10.4 m.
    const r = await sheet(['a = 5 m ± 0.2 m', 'b = 5 m ± 0.2 m', 'y = a + b', 'check y < 10.7 m "short enough"']);
    const c = r.checks[0]!;
    expect(c.passed).toBe(true);
    expect(c.range).toEqual({ holds: false, text: 'holds at nominal, fails at a = 5.4 m, b = 5.4 m (1 of the 4 corners of the ±2u box)' });
    // Each end alone (5.4 + 5 = 10.4 m) passes: only the corner fails.
    const one = await sheet(['a = 5 m ± 0.2 m', 'b = 5 m', 'y = a + b', 'check y < 10.7 m "short enough"']);
    expect(one.checks[0]!.range).toEqual({ holds: true, text: 'holds at nominal and at both ends of the ±2u range' });
  });

  it('failing at nominal, names once where it fails and where it holds', async () => {
    // y = a + 5 m is 10 m at nominal, 9.6 m at a − 2u and 10.4 m at a + 2u: only the upper end clears 10.2 m.
    const r = await sheet(['a = 5 m ± 0.2 m', 'y = a + 5 m', 'check y > 10.2 m "long enough"']);
    expect(r.checks[0]!.passed).toBe(false);
    expect(r.checks[0]!.range).toEqual({ holds: false, text: 'fails at nominal and at a = 4.6 m (1 of the 2 ends of the ±2u range); holds at a = 5.4 m' });
  });

  it('failing at every point tried, says so in one phrase', async () => {
    // y is 10 m at nominal, 9.6 m and 10.4 m at the ends: none clears 10.5 m.
    const r = await sheet(['a = 5 m ± 0.2 m', 'y = a + 5 m', 'check y > 10.5 m "long enough"']);
    expect(r.checks[0]!.range).toEqual({ holds: false, text: 'fails at nominal and at both ends of the ±2u range (a = 4.6 m and a = 5.4 m)' });
    // Two inputs: 10 m at nominal, 9.2 to 10.8 m over the corners; every corner misses 9 m < y < 9.1 m.
    const two = await sheet(['a = 5 m ± 0.2 m', 'b = 5 m ± 0.2 m', 'y = a + b', 'check 9 m < y < 9.1 m "in the window"']);
    expect(two.checks[0]!.range).toEqual({ holds: false, text: 'fails at nominal and at all 4 corners of the ±2u box' });
    // Holding at nominal but at neither end: 10 m lies in 9.7 m < y < 10.3 m, 9.6 m and 10.4 m do not.
    const band = await sheet(['a = 5 m ± 0.2 m', 'y = a + 5 m', 'check 9.7 m < y < 10.3 m "in the band"']);
    expect(band.checks[0]!.range).toEqual({ holds: false, text: 'holds at nominal, fails at both ends of the ±2u range (a = 4.6 m and a = 5.4 m)' });
  });
});

describe('the page', () => {
  it('shows value ± u beside every number that has one, and nothing where none has', async () => {
    const r = await sheet(['U = 110 km/h ± 5 km/h', 'L = 5.9 m ± 1 % (uniform)', 'nu = 1.6e-5 m^2/s', 'Re = U * L / nu', 'gas = fluid(rho: 1.2 kg/m^3, mu: 1.8e-5 Pa s)', 'wr = first_cell(U, L, gas, yplus: 1)', 'plain = 2 * nu']);
    expect(r.html).toContain('>± 5 km/h<');
    expect(r.html).toContain('>± 0.034 m (uniform)<');
    // Re: √(4.545² + (1/√3)²) % = 4.58 %.
    const re = /data-u="([^"]+)"[^>]*>± ([^<]+) \(([\d.]+) %\)</.exec(r.html.slice(r.html.indexOf('id="v-Re"')))!;
    expect(Number(re[1])).toBeCloseTo(r.values.Re!.u!, 6);
    expect(Number(re[3])).toBeCloseTo(Math.hypot((100 * 5) / 110, 1 / Math.sqrt(3)), 1);
    // A record field the inputs move gets one; a field they do not move (rho) gets none.
    const record = r.html.slice(r.html.indexOf('id="v-wr"'));
    expect(record).toMatch(/data-name="wr.height"[^>]*>[^<]*<\/span> <span class="ws-u"/);
    const gas = r.html.slice(r.html.indexOf('id="v-gas"'), r.html.indexOf('id="v-wr"'));
    expect(gas).not.toContain('class="ws-u"');
    const plain = r.html.slice(r.html.indexOf('id="v-plain"'));
    expect(plain.slice(0, plain.indexOf('</div>'))).not.toContain('class="ws-u"');
  });

  it('says under a check whether it holds over the range', async () => {
    const r = await sheet(['a = 5 m ± 0.2 m', 'b = 5 m ± 0.2 m', 'y = a + b', 'check y < 10.7 m "short enough"']);
    expect(r.html).toContain('data-range-holds="false"');
    expect(r.html).toContain("over the inputs' range: holds at nominal, fails at a = 5.4 m, b = 5.4 m");
  });
});

describe('with overrides and sweeps', () => {
  const lines = ['U = 20 m/s ± 5 %', 'L = 2 m', 'gas = fluid(rho: 1.2 kg/m^3, mu: 1.8e-5 Pa s)', 'Re = U * L / gas.nu'];
  const text = (extra: string[] = []) => '```basis\n' + [...lines, ...extra].join('\n') + '\n```\n';

  it('keeps the sheet\'s uncertainty when --set replaces the value, and takes one given with it', async () => {
    const { renderSheet } = await import('../../server/pipeline/index.js');
    const set = await renderSheet(text(), { overrides: { U: '30 m/s' } });
    expect(set.errors).toEqual([]);
    expect(set.values.U!.si).toBe(30);
    // 5 % of the new value.
    expect(set.values.U!.u).toBeCloseTo(1.5, 12);
    expect(set.values.Re!.u! / set.values.Re!.si!).toBeCloseTo(0.05, 12);
    const own = await renderSheet(text(), { overrides: { U: '30 m/s ± 3 m/s' } });
    expect(own.values.U!.u).toBe(3);
    expect(own.overrides[0]).toMatchObject({ name: 'U', was: '20 m/s ± 5 %', now: '30 m/s ± 3 m/s' });
    const bad = await renderSheet(text(), { overrides: { U: '30 m/s ± 3 Pa' } });
    expect(bad.errors[0]!.message).toContain('the uncertainty of U is in Pa');
  });

  it('sweeps an uncertain input row by row at the nominal values, the rest unchanged', async () => {
    const { renderSheet } = await import('../../server/pipeline/index.js');
    const r = await renderSheet(text(['plan = sweep(U, [10, 20] m/s, Re)', 'check Re < 3e6 "modest"']));
    expect(r.errors).toEqual([]);
    const rows = r.values.plan!.table!.rows;
    expect(rows[1]![1]!.si).toBeCloseTo(r.values.Re!.si!, 9);
    expect(rows[1]![1]!.u).toBeUndefined();
    expect(r.values.Re!.u).toBeCloseTo(0.05 * r.values.Re!.si!, 6);
    expect(r.checks[0]!.range!.holds).toBe(true);
  });
});

describe('progress of a Monte Carlo run', () => {
  it('counts the samples done in steps, and never the last one: the result follows it', async () => {
    const { SheetPipeline } = await import('../../server/pipeline/index.js');
    const heard: Array<{ done: number; total: number }> = [];
    new SheetPipeline().run('```basis\nx = 0 ± 1\ny = 2 * x\nmc = propagate(y, samples: 6000)\n```\n', {}, { progress: (p) => heard.push(p) });
    expect(heard.map((p) => [p.done, p.total])).toEqual([[2000, 6000], [4000, 6000]]);
  });
});
