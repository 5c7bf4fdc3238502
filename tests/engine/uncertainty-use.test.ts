// Uncertainties that come with names brought in by `use`: an input of the
// other sheet is an input here too, a result comes with its first-order u,
// two correlated names are refused, and what cannot come along is said on the
// use line. The answers are the law of propagation of uncertainty (JCGM
// 100:2008, GUM, §5.1.2, eq. 10; relative form for a product, §5.1.6, eq. 12).
import { describe, expect, it } from 'vitest';
import { block, project } from './helpers.js';

const inputs = block(
  'U_design = 30 m/s ± 5 %',
  'L_ref = 4.2 m ± 1 %',
  'w = 2 m ± 0.1 m (uniform)',
  'nu = 1.5e-5 m^2/s',
  'Re_design = U_design * L_ref / nu',
);

describe('an uncertainty brought in by use', () => {
  it('comes with an input, so a product here has its relative uncertainties added in quadrature', async () => {
    const { run } = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md" (U_design, L_ref, nu)', 'Re = U_design * L_ref / nu') });
    const r = await run('car.md');
    expect(r.errors).toEqual([]);
    expect(r.values.U_design).toMatchObject({ si: 30, u: 1.5, from: 'inputs.md' });
    // Re = U L / ν with 5 % on U and 1 % on L: √(5² + 1²) % = 5.099 % (GUM §5.1.6, eq. 12).
    expect(r.values.Re!.u! / r.values.Re!.si!).toBeCloseTo(Math.sqrt(26) / 100, 5);
    // ν is exact: it carries nothing.
    expect(r.values.nu!.u).toBeUndefined();
  });

  it('keeps an input’s distribution: a uniform half-width stays a/√3', async () => {
    const { run } = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md" (w)', 'A = w * 3 m', 'table_A = budget(A)') });
    const r = await run('car.md');
    expect(r.errors).toEqual([]);
    // A rectangular distribution of half-width a has u = a/√3 (JCGM 100:2008 §4.3.7, eq. 7); A = 3 m · w.
    expect(r.values.A!.u).toBeCloseTo((3 * 0.1) / Math.sqrt(3), 12);
    const html = r.parts.map((p) => p.html).join('');
    expect(html).toContain('w (from inputs.md)');
    expect(html).toContain('uniform');
  });

  it('comes with a result as its first-order u, and goes on through a sheet that uses the user', async () => {
    const { run } = project({
      'inputs.md': inputs,
      'mid.md': block('use "inputs.md" (Re_design)', 'Re_half = Re_design / 2'),
      'top.md': block('use "mid.md" (Re_half)', 'Re_quarter = Re_half / 2'),
    });
    const mid = await run('mid.md');
    const top = await run('top.md');
    expect(mid.errors).toEqual([]);
    expect(top.errors).toEqual([]);
    // Re_design = 30 × 4.2 / 1.5e-5 = 8.4e6 with √26 % (GUM §5.1.6); halving halves u (GUM §5.1.2, c = 1/2).
    const uRe = 8.4e6 * (Math.sqrt(26) / 100);
    expect(mid.values.Re_design!.u).toBeCloseTo(uRe, 0);
    expect(mid.values.Re_half!.u).toBeCloseTo(uRe / 2, 0);
    expect(top.values.Re_quarter!.u).toBeCloseTo(uRe / 4, 0);
  });

  it('refuses two names whose uncertainties rest on one input, and what reads the second waits', async () => {
    const { run } = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md" (U_design, Re_design)', 'x = Re_design * 2', 'y = U_design * 2') });
    const r = await run('car.md');
    expect(r.errors.map((e) => e.line)).toEqual([2]);
    expect(r.errors[0]!.message).toBe(
      '`Re_design` and `U_design` (line 2) both rest on the uncertain `U_design` of inputs.md, so their uncertainties are correlated, which a use cannot carry; bring in `U_design` and compute `Re_design` on this sheet',
    );
    expect(r.values.x).toBeUndefined();
    expect(r.parts.map((p) => p.html).join('')).toMatch(/waiting on <code>Re_design<\/code>/);
    // The other name is unharmed.
    expect(r.values.y!.u).toBeCloseTo(3, 12);
  });

  it('lets two results that rest on different inputs come together', async () => {
    const { run } = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md" (U_design, w)', 'x = U_design * w') });
    const r = await run('car.md');
    expect(r.errors).toEqual([]);
    // x = U w: u² = (w u_U)² + (U u_w)² (GUM eq. 10), u_w = 0.1/√3.
    expect(r.values.x!.u).toBeCloseTo(Math.hypot(2 * 1.5, 30 * (0.1 / Math.sqrt(3))), 10);
  });

  it('tries a check over the range of an input brought in', async () => {
    const { run } = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md" (U_design)', 'check U_design < 32 m/s "below the tunnel limit"') });
    const r = await run('car.md');
    // 30 ± 2 × 1.5 m/s: 33 m/s at the upper end, past 32.
    expect(r.checks[0]).toMatchObject({ passed: true, range: { holds: false } });
    expect(r.checks[0]!.range!.text).toBe('holds at nominal, fails at U_design = 33 m/s (1 of the 2 ends of the ±2u range)');
    // The summary at the top of the page lists it, so it is not found only by scrolling.
    expect(r.summaryHtml).toContain('<li class="ws-range"><a href="#L3">line 3</a> below the tunnel limit: holds at nominal, fails at U_design = 33 m/s');
  });

  it('says on the use line what comes at its nominal value only: a record with uncertain fields, a list', async () => {
    const { run } = project({
      'inputs.md': inputs + block('air_d = air(T: 20 degC)', 'fc = first_cell(U_design, L_ref, air_d, yplus: 1)', 'speeds = [U_design, 2 * U_design]'),
      'car.md': block('use "inputs.md" (fc, speeds, nu)', 'h = fc.height'),
    });
    const r = await run('car.md');
    expect(r.errors).toEqual([]);
    const html = r.parts.map((p) => p.html).join('');
    expect(html).toContain('`fc` depends on inputs with an uncertainty in inputs.md, and shows here at its nominal value only: the uncertainties of its fields do not come through a use');
    expect(html).toContain('`speeds` depends on inputs with an uncertainty in inputs.md, and shows here at its nominal value only: it is a list');
    expect(html).not.toContain('`nu` depends');
    expect(r.values.h!.u).toBeUndefined();
  });

  it('keeps working with --set on the used sheet’s input: the new value, the same uncertainty', async () => {
    const { run } = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md" (U_design)', 'q = U_design * 2') });
    const r = await run('car.md', { overrides: { U_design: '40 m/s' } });
    expect(r.errors).toEqual([]);
    // 5 % of the new value: the relative uncertainty is kept (language guide, uncertainty with --set).
    expect(r.values.q).toMatchObject({ si: 80 });
    expect(r.values.q!.u).toBeCloseTo(4, 10);
  });

  it('runs Monte Carlo over an input brought in, with a local name swept as well', async () => {
    const { run } = project({
      'inputs.md': inputs,
      'car.md': block('use "inputs.md" (U_design)', 'U = U_design', 'q = U * 2 s', 'mc = propagate(q, samples: 2000, seed: 3)', 'rows = sweep(U, [20, 40] m/s, q)'),
    });
    const r = await run('car.md');
    expect(r.errors).toEqual([]);
    // A linear model: the Monte Carlo standard uncertainty is the first-order one, 2 s × 1.5 m/s = 3 m,
    // to the sampling error of 2,000 draws (about 1/√(2·2000) ≈ 1.6 % of u, JCGM 101:2008 §7.2).
    const mc = r.values.mc!.fields!;
    expect(mc.u!.si).toBeCloseTo(3, 0);
    expect(Math.abs(mc.u!.si! - 3) / 3).toBeLessThan(0.05);
    expect(r.values.rows!.table!.rows.map((row) => row[1]!.si)).toEqual([40, 80]);
  });
});

describe('an uncertainty in prose and in lists', () => {
  it('gives a value in prose its ±, for a name and for an expression', async () => {
    const { run } = project({ 'one.md': block('U = 30 m/s ± 1.5 m/s', 'L = 4 m ± 0.2 m') + '\nAt `=U` the product is `=U * L`.\n' });
    const r = await run('one.md');
    const html = r.parts.map((p) => p.html).join('');
    const us = [...html.matchAll(/class="ws-inline"[^>]*>[^<]*<span class="ws-u" data-u="([^"]+)"/g)].map((m) => Number(m[1]));
    // U L: u² = (L u_U)² + (U u_L)² = 6² + 6² (GUM eq. 10).
    expect(us[0]).toBeCloseTo(1.5, 12);
    expect(us[1]).toBeCloseTo(Math.hypot(4 * 1.5, 30 * 0.2), 10);
  });

  it('says under a list that depends on an uncertain input that its items are nominal', async () => {
    const { run } = project({ 'one.md': block('U = 30 m/s ± 1.5 m/s', 'speeds = [U, 2 * U]', 'top = speeds[2]', 'plain = [1 m, 2 m]') });
    const r = await run('one.md');
    expect(r.values.speeds!.warnings).toEqual([
      'this list depends on an input with an uncertainty (U), but a list carries none: its items are nominal values; name an item (x = speeds[1]) to see its uncertainty',
    ]);
    expect(r.values.plain!.warnings).toBeUndefined();
    expect(r.values.top!.u).toBeCloseTo(3, 12);
  });
});
