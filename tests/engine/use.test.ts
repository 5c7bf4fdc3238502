// `use "other.md"`: another sheet's definitions brought in read-only; only the
// names listed when a list is given; circles, a name from two sheets, a name
// the other sheet lacks and a path outside the project each an error on the
// use line; what fails there makes what reads it here wait.
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { renderSheet, SheetPipeline } from '../../server/pipeline/index.js';
import { block, project } from './helpers.js';

const inputs = block('U_inf = 30 m/s', 'L_ref = 4.2 m', 'gas = fluid(rho: 1.2 kg/m^3, mu: 1.8e-5 Pa s)');

describe('use', () => {
  it('brings every definition of the other sheet in, and computes with it', async () => {
    const p = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md"', 'Re = U_inf * L_ref / gas.nu') });
    const r = await p.run('car.md');
    expect(r.errors).toEqual([]);
    // 30 m/s × 4.2 m / (1.8e-5 / 1.2 m²/s) = 8.4e6
    expect(r.values.Re!.si).toBeCloseTo(8.4e6, 6);
    expect(r.values.U_inf).toMatchObject({ si: 30, from: 'inputs.md' });
    expect(r.reads).toContain('inputs.md');
    expect(r.usedSheets).toEqual([{ path: 'inputs.md', text: inputs }]);
    // The summary counts the names brought in beside the sheet's own inputs.
    expect(r.summary).toMatchObject({ inputs: 0, used: 3 });
    expect(r.summaryHtml).toContain('<span class="ws-n">3</span> brought in');
  });

  it('brings only the listed names when a list is given', async () => {
    const p = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md" (U_inf)', 'x = U_inf * 2 s', 'y = L_ref') });
    const r = await p.run('car.md');
    expect(r.values.x!.si).toBe(60);
    expect(r.errors.map((e) => [e.line, e.message])).toEqual([[4, '`L_ref` is not defined (line 4)']]);
  });

  it('shows each name it brings in as a link to where the other sheet defines it', async () => {
    const p = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md" (U_inf, L_ref)') });
    const html = (await p.run('car.md')).parts.map((x) => x.html).join('');
    expect(html).toContain('href="inputs.md#v-U_inf"');
    expect(html).toContain('href="inputs.md#v-L_ref"');
    expect(html).toContain('30 m/s');
  });

  it('keeps the names read-only: defining one again here is an error on that line', async () => {
    const p = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md"', 'U_inf = 20 m/s') });
    const r = await p.run('car.md');
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0]).toMatchObject({ line: 3, code: 'redefined' });
    expect(r.errors[0]!.message).toContain('comes from inputs.md (used on line 2) and is read-only here');
    expect(r.values.U_inf!.si).toBe(30);
  });

  it('names the sheets of a circle of uses', async () => {
    const p = project({ 'a.md': block('use "b.md"', 'x = 1'), 'b.md': block('use "a.md"', 'y = 2') });
    const r = await p.run('a.md');
    const circle = r.errors.find((e) => e.code === 'cycle');
    expect(circle?.message).toContain('a.md → b.md → a.md');
    expect(r.values.x!.si).toBe(1);
  });

  it('refuses a name brought in from two different sheets, and accepts one definition reached two ways', async () => {
    const p = project({
      'one.md': block('U_inf = 30 m/s'),
      'two.md': block('U_inf = 40 m/s'),
      'mid.md': block('use "one.md"', 'k = 2'),
      'clash.md': block('use "one.md"', 'use "two.md"', 'v = U_inf'),
      'diamond.md': block('use "one.md"', 'use "mid.md"', 'v = U_inf * k'),
    });
    const clash = await p.run('clash.md');
    expect(clash.errors.map((e) => [e.line, e.code])).toEqual([[3, 'redefined']]);
    expect(clash.errors[0]!.message).toContain('defined in two sheets, one.md and two.md');
    const diamond = await p.run('diamond.md');
    expect(diamond.errors).toEqual([]);
    expect(diamond.values.v!.si).toBe(60);
  });

  it('says which name the other sheet lacks, at that name', async () => {
    const p = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md" (U_inf, H_ref)') });
    const r = await p.run('car.md');
    expect(r.errors).toEqual([{ line: 2, column: 25, message: 'inputs.md defines no `H_ref`', code: 'unknown-name' }]);
  });

  it('stays inside the project and reads only sheets', async () => {
    const p = project({ 'sub/car.md': block('use "../../elsewhere.md"'), 'data.csv': 'a\n1\n', 'csv.md': block('use "data.csv"'), 'gone.md': block('use "nothere.md"') });
    expect((await p.run('sub/car.md')).errors[0]!.code).toBe('data-file');
    expect((await p.run('csv.md')).errors[0]!.message).toContain('"data.csv" is not a sheet');
    expect((await p.run('gone.md')).errors[0]!.code).toBe('data-file');
  });

  it('makes what reads a failed name wait, and says on the use line that the other sheet has an error', async () => {
    const p = project({ 'inputs.md': block('U_inf = 30 m/s + 2 Pa', 'L_ref = 4 m'), 'car.md': block('use "inputs.md"', 'x = U_inf * 1 s', 'y = L_ref * 2') });
    const r = await p.run('car.md');
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0]).toMatchObject({ line: 2, code: 'unit-mismatch' });
    expect(r.errors[0]!.message).toMatch(/^inputs\.md has an error; the first, on its line 2: cannot add/);
    expect(r.values.x).toBeUndefined();
    expect(r.values.y!.si).toBe(8);
  });

  it('reads a used sheet again when it changes, through the same pipeline', async () => {
    const files = { 'inputs.md': inputs, 'car.md': block('use "inputs.md" (U_inf)', 'q = U_inf * 2 s') };
    const p = project(files);
    const pipeline = new SheetPipeline();
    const opts = { path: path.join(p.root, 'car.md'), root: p.root };
    expect(pipeline.run(files['car.md'], opts).values.q!.si).toBe(60);
    writeFileSync(path.join(p.root, 'inputs.md'), block('U_inf = 12 m/s'));
    const again = pipeline.run(files['car.md'], opts);
    expect(again.values.q!.si).toBe(24);
    expect(again.freshStatements).toBe(1);
  });

  it('runs a sweep here, and says why a used name cannot be swept', async () => {
    const p = project({ 'inputs.md': inputs, 'car.md': block('use "inputs.md"', 'U = U_inf', 'Re = U * L_ref / gas.nu', 'plan = sweep(U, [10, 20] m/s, Re)', 't = sweep(U_inf, [10, 20] m/s, Re)') });
    const r = await p.run('car.md');
    const rows = r.values.plan!.table!.rows;
    // Re = U L / nu with nu = 1.8e-5 / 1.2 = 1.5e-5 m²/s
    expect(rows[0]![1]!.si).toBeCloseTo((10 * 4.2) / 1.5e-5, 3);
    expect(rows[1]![1]!.si).toBeCloseTo((20 * 4.2) / 1.5e-5, 3);
    expect(r.errors.find((e) => e.line === 6)?.message).toContain('`U_inf` comes from inputs.md, and a sweep runs only this sheet again');
  });
});
