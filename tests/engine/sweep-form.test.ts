// sweep() and sweep2(): the sheet run again for each value of an input, only
// downstream of it; a table of outputs labelled by the input; each row as a
// separate run would give it; a failing row shows its error; checks per row.
import { describe, expect, it } from 'vitest';
import { renderSheet, SheetPipeline } from '../../server/pipeline/index.js';

const base = (u: string) => [
  `U = ${u}`,
  'L = 4 m',
  'gas = fluid(rho: 1.2 kg/m^3, mu: 1.8e-5 Pa s)',
  'Re = U * L / gas.nu',
  'wall = first_cell(U, L, gas, yplus: 1)',
  'check wall.height > 25 um "tall enough to mesh"',
];
const sheet = (lines: string[]) => renderSheet('```basis\n' + lines.join('\n') + '\n```\n');

describe('sweep', () => {
  it('gives each row exactly what a separate run with that input gives', async () => {
    const r = await sheet([...base('30 m/s'), 'plan = sweep(U, [10, 25, 40] m/s, Re, wall.height)']);
    expect(r.errors).toEqual([]);
    const t = r.values.plan!.table!;
    expect(t.columns).toEqual(['U', 'Re', 'wall.height']);
    for (const [i, u] of ['10 m/s', '25 m/s', '40 m/s'].entries()) {
      const alone = await sheet(base(u));
      expect(t.rows[i]![0]!.si).toBe(alone.values.U!.si);
      expect(t.rows[i]![1]!.si).toBe(alone.values.Re!.si);
      expect(t.rows[i]![2]!.si).toBe(alone.values.wall!.fields!.height!.si);
    }
  });

  it('runs again only what lies downstream of the swept input', async () => {
    const r = await sheet([...base('30 m/s'), 'other = 2 * L', 'plan = sweep(U, [10, 20] m/s, Re)']);
    // Re is wanted and wall feeds the check; gas, L and other are not downstream of U.
    expect(r.values.plan!.remarks!.join(' ')).toContain("(2 of the sheet's statements)");
    const noCheck = await sheet([...base('30 m/s').slice(0, 5), 'other = 2 * L', 'plan = sweep(U, [10, 20] m/s, Re)']);
    expect(noCheck.values.plan!.remarks!.join(' ')).toContain("(1 of the sheet's statements)");
  });

  it('plots each output in the units its column reads in, not bare SI', async () => {
    const r = await renderSheet('```basis\n' + [...base('30 km/h'), 'plan = sweep(U, [20, 60, 100] km/h, wall.height, plot: true)'].join('\n') + '\n```\n');
    expect(r.errors).toEqual([]);
    const svg = r.html.slice(r.html.indexOf('wall.height against U'));
    // The speeds as the sheet gave them, the heights with the prefix that puts them between 1 and 1000.
    expect(svg).toContain('U (km/h)');
    expect(svg).toMatch(/wall\.height \((µm|&#181;m|&#xb5;m)\)/);
    expect(svg).not.toContain(', SI)');
  });

  it('says for which rows a check downstream holds', async () => {
    const r = await sheet([...base('30 m/s'), 'plan = sweep(U, [10, 20, 30, 40] m/s, wall.height)']);
    expect(r.values.plan!.warnings).toEqual(['the check "tall enough to mesh" (line 7) holds from U = 10 m/s to U = 30 m/s; fails at U = 40 m/s']);
  });

  it('names a check by the line it is on now, after lines above it moved, with the sweep kept in the cache', () => {
    const pipeline = new SheetPipeline();
    const lines = [...base('30 m/s'), 'plan = sweep(U, [10, 40] m/s, wall.height)'];
    const at = (text: string) => pipeline.run(text).values.plan!.warnings!.join(' ');
    expect(at('```basis\n' + lines.join('\n') + '\n```\n')).toContain('(line 7)');
    expect(at('A line of prose above.\n\n```basis\n' + lines.join('\n') + '\n```\n')).toContain('(line 9)');
  });

  it('shows a row that fails with its error, and the other rows', async () => {
    // A speed below zero is refused by first_cell: that row fails, the next does not.
    const r = await sheet([...base('30 m/s'), 'wall2 = first_cell(U, L, gas, yplus: 1, method: "power")', 'plan = sweep(U, [-1, 20] m/s, wall2.height)']);
    const rows = r.values.plan!.table!.rows;
    expect(rows[0]![1]!.display).toBe("⚠ line 8: first_cell(): U = −1 m/s is negative; give the speed's magnitude (speeds are not signed here)");
    expect(rows[1]![1]!.si).toBeGreaterThan(0);
  });

  it('sweeps two inputs over their grid', async () => {
    const r = await sheet([...base('30 m/s'), 'g = sweep2(U, [10, 20] m/s, L, [2, 4] m, wall.height)']);
    const t = r.values.g!.table!;
    expect(t.columns).toEqual(['U', 'L', 'wall.height']);
    expect(t.rows.map((row) => [row[0]!.si, row[1]!.si])).toEqual([[10, 2], [10, 4], [20, 2], [20, 4]]);
    const alone = await sheet(base('20 m/s').map((l) => l.replace('L = 4 m', 'L = 2 m')));
    expect(t.rows[2]![2]!.si).toBe(alone.values.wall!.fields!.height!.si);
  });

  it('refuses what it cannot sweep, in plain words', async () => {
    const r = await sheet([...base('30 m/s'), 'a = sweep(V, [1, 2] m/s, Re)', 'b = sweep(U * 2, [1, 2] m/s, Re)', 'c = sweep(U, [1, 2] m/s)']);
    expect(r.errors.map((e) => e.message)).toEqual([
      '`V` is not defined (line 8)',
      'sweep() sweeps a name defined on the sheet, such as U_inf, not an expression',
      'sweep() needs an input, its values and at least one output: sweep(U, [10, 20] m/s, output, …)',
    ]);
  });
});
