// A trade function given a list of values for an input gives a sweep: one
// table, a row per value of the swept input labelled by it, each warning once,
// and items picked by place or by the swept input's value.
import { describe, expect, it } from 'vitest';
import { sheet } from './helpers.js';

const lines = ['U = [10, 20, 40] m/s', 'c = first_cell(U, 4 m, fluid(rho: 1.2 kg/m^3, mu: 1.8e-5 Pa s), yplus: 1, method: "power")'];

describe('sweeps of a trade function', () => {
  it('show as one table: a row per swept value, labelled by the input, a column per field', async () => {
    const r = await sheet(lines);
    const html = r.parts.map((p) => p.html).join('');
    expect(html.match(/<table class="ws-table" data-name="c"/g)).toHaveLength(1);
    expect(html).not.toContain('class="ws-fields"'); // not one record table per value
    const rows = [...html.matchAll(/<tr data-name="c\[(\d)\]">/g)].map((m) => m[1]);
    expect(rows).toEqual(['1', '2', '3']);
    expect(html).toContain('data-name="c[2].U" data-si="20"');
    expect(html).toContain('data-name="c[3].height"');
  });

  it('give each distinct warning once, with the rows it belongs to when not all of them', async () => {
    // The power law is fitted from 5e5 to 1e7 (Schlichting Eq. 21.12): only the fastest row leaves it.
    const r = await sheet(lines);
    const html = r.parts.map((p) => p.html).join('');
    const above = [...html.matchAll(/<li>([^<]*above 1e7[^<]*)<\/li>/g)].map((m) => m[1]);
    expect(above).toHaveLength(1);
    expect(above[0]).toMatch(/^U = 40 m\/s: /);
  });

  it('are indexed by place from 1, and by the swept input\'s value', async () => {
    const r = await sheet([...lines, 'second = c[2].height', 'fast = c[U: 40 m/s].height', 'third = c[3].height']);
    expect(r.errors).toEqual([]);
    expect(r.values.fast!.si).toBe(r.values.third!.si);
    expect(r.values.second!.si).toBeGreaterThan(r.values.third!.si!); // slower flow, thicker first cell
  });

  it('refuse an index outside the list, naming the range, and a value that was not swept', async () => {
    const r = await sheet([...lines, 'a = c[0]', 'b = c[U: 15 m/s]', 'd = c[L: 4 m]']);
    expect(r.errors.map((e) => [e.line, e.message])).toEqual([
      [4, 'item 0 is not in this list of 3; pick 1 to 3 (items count from 1)'],
      [5, 'no item of this sweep has U = 15 m/s; its values are 10 m/s, 20 m/s, 40 m/s'],
      [6, 'this list was swept over U, not L'],
    ]);
  });

  it('hand on a table in JSON: the swept input first, then the fields, in SI', async () => {
    const r = await sheet(lines);
    const t = r.values.c!.table!;
    expect(t.columns.slice(0, 3)).toEqual(['U', 'Re', 'cf']);
    expect(t.rows.map((row) => row[0]!.si)).toEqual([10, 20, 40]);
    expect(t.rows[1]![t.columns.indexOf('height')]!.si).toBe(r.values.c!.items![1]!.fields!.height!.si);
  });

  it('keep what was swept through a field and a conversion', async () => {
    const r = await sheet([...lines, 'h = c.height to um']);
    const html = r.parts.map((p) => p.html).join('');
    expect(r.values.h!.display).toMatch(/^\[.*\] µm$/);
    expect(html).toContain('data-name="h"');
  });
});
