// Inputs set for one run (`--set U_inf=20m/s`): only an input, only by a
// value; the page says plainly which were set, with both values; a sweep row
// is exactly the run with that input set.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { renderSheet } from '../../server/pipeline/index.js';

const near = [
  'U = 30 m/s',
  'L = 4 m',
  'gas = fluid(rho: 1.2 kg/m^3, mu: 1.8e-5 Pa s)',
  'Re = U * L / gas.nu',
  'wall = first_cell(U, L, gas, yplus: 1)',
  'check wall.height > 25 um "tall enough to mesh"',
];
const text = (lines: string[]) => '```basis\n' + lines.join('\n') + '\n```\n';

describe('inputs set for one run', () => {
  it('replaces the input and everything downstream follows', async () => {
    const r = await renderSheet(text(near), { overrides: { U: '20 m/s' } });
    expect(r.errors).toEqual([]);
    expect(r.values.U!.si).toBe(20);
    // Re = 20 × 4 / 1.5e-5
    expect(r.values.Re!.si).toBeCloseTo(80 / 1.5e-5, 3);
    expect(r.overrides).toEqual([{ name: 'U', was: '30 m/s', now: '20 m/s', sheet: '' }]);
    expect(r.values.U!.warnings).toEqual(['set for this run to 20 m/s; the sheet says 30 m/s']);
  });

  it('says in the header which inputs were set, with the old and new values', async () => {
    const r = await renderSheet(text(near), { overrides: { U: '20 m/s', L: '2 m' } });
    expect(r.headerHtml).toContain('2 inputs were set for it');
    expect(r.headerHtml).toContain('<code>U</code> = 20 m/s');
    expect(r.headerHtml).toContain('says 30 m/s');
    expect((await renderSheet(text(near))).headerHtml).not.toContain('ws-replaced');
  });

  it('refuses a name that is not an input, an expression for a value, and a name nowhere', async () => {
    const computed = await renderSheet(text(near), { overrides: { Re: '1e6' } });
    expect(computed.errors).toEqual([{ line: 5, column: 1, code: 'bad-argument', message: '--set Re: Re is computed here, not an input; only a name defined by a value can be set' }]);
    expect(computed.overridesMatched).toEqual(['Re']);
    const expression = await renderSheet(text(near), { overrides: { U: 'L / 1 s' } });
    expect(expression.errors[0]!.message).toBe('--set U=L / 1 s: give a value (a number with its unit, a list, text), not an expression');
    expect(expression.values.U!.si).toBe(30);
    const nowhere = await renderSheet(text(near), { overrides: { LL: '2 m' } });
    expect(nowhere.errors).toEqual([{ line: 1, column: 1, code: 'unknown-name', message: '--set LL: no input `LL` in this sheet or the sheets it uses; did you mean L?' }]);
  });

  it('refuses a value of another dimension or kind, which would otherwise run without a word', async () => {
    const pressure = await renderSheet(text(near), { overrides: { U: '20 Pa' } });
    expect(pressure.errors).toEqual([{ line: 2, column: 1, code: 'bad-argument', message: '--set U=20 Pa: the sheet gives U as a quantity in m/s, and 20 Pa is a quantity in Pa' }]);
    expect(pressure.values.U!.si).toBe(30);
    const bare = await renderSheet(text(near), { overrides: { U: '20' } });
    expect(bare.errors[0]!.message).toBe('--set U=20: the sheet gives U as a quantity in m/s, and 20 is a plain number');
    const kmh = await renderSheet(text(near), { overrides: { U: '72 km/h' } });
    expect(kmh.errors).toEqual([]);
    expect(kmh.values.U!.si).toBeCloseTo(20, 12);
  });

  it('sets an input of a used sheet, and says which sheet it belongs to', async () => {
    const root = mkdtempSync(path.join(tmpdir(), 'ws-set-'));
    writeFileSync(path.join(root, 'inputs.md'), text(['U_inf = 30 m/s']));
    const car = text(['use "inputs.md"', 'q = U_inf * 2 s']);
    const r = await renderSheet(car, { path: path.join(root, 'car.md'), root, overrides: { U_inf: '12 m/s' } });
    expect(r.values.q!.si).toBe(24);
    expect(r.overrides).toEqual([{ name: 'U_inf', was: '30 m/s', now: '12 m/s', sheet: 'inputs.md' }]);
    expect(r.headerHtml).toContain('inputs.md says 30 m/s');
  });

  it('gives each sweep row exactly what the run with that input set gives', async () => {
    const swept = await renderSheet(text([...near, 'plan = sweep(U, [10, 25, 40] m/s, Re, wall.height)']));
    const rows = swept.values.plan!.table!.rows;
    for (const [i, u] of ['10 m/s', '25 m/s', '40 m/s'].entries()) {
      const alone = await renderSheet(text(near), { overrides: { U: u } });
      expect(rows[i]![1]!.si).toBe(alone.values.Re!.si);
      expect(rows[i]![2]!.si).toBe(alone.values.wall!.fields!.height!.si);
      const check = alone.checks[0]!.passed;
      expect(check).toBe(i < 2); // the sweep says it fails at 40 m/s only
    }
    expect(swept.values.plan!.warnings).toEqual(['the check "tall enough to mesh" (line 7) holds from U = 10 m/s to U = 25 m/s; fails at U = 40 m/s']);
  });
});
