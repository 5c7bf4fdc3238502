import { describe, expect, it } from 'vitest';
import { createRegistry, num, si, str, TradeError, type RecordValue, type Value } from '../../server/core/index.js';
import { cellBudget, type BudgetInput } from '../../server/core/domain/budget.js';
import { renderSheet } from '../../server/pipeline/index.js';
import { asRecord, call, metres, relErr, siField, stubContext } from './domain-helpers.js';

const RATES = { tetPerHex: 5.5, tetPerPoly: 4.5, memoryPerMillion: 2, cpuPerMillion: 2, iterations: 1000 } as const;

function input(over: Partial<BudgetInput>): BudgetInput {
  return { volume: 200_000, base: 2, zones: [], mode: 'nested', ...RATES, ...over };
}

function zoneRec(args: Record<string, Value>): RecordValue {
  return asRecord(call('zone', args));
}

describe('cell budget by hand: one box zone, a known surface and a layer stack', () => {
  // Domain 100 × 50 × 40 m = 200 000 m³, base h0 = 2 m.
  // Box zone 20 × 10 × 8 m = 1600 m³ at level 2 (h = 0.5 m).
  // Surface 100 m² at level 4 (h_s = 0.125 m); stack of 10 layers.
  const background = (200_000 - 1600) / 2 ** 3; // 24 800
  const band = 100 * 0.125; // 12.5 m³, taken out of the box zone next to the wall
  const box = (1600 - band) / 0.5 ** 3; // 12 700
  const surface = 100 / 0.125 ** 2; // 6 400
  const layers = 10 * surface; // 64 000
  const total = background + box + surface + layers; // 107 900

  it('counts each region as volume / h³ and the surface and layers per face', () => {
    const b = cellBudget(
      input({
        zones: [{ label: 'near body', kind: 'box', level: 2, volume: 1600 }],
        surface: { area: 100, level: 4 },
        layers: { count: 10, last: 0.1, total: 0.5 },
      }),
    );
    expect(b.rows.map((r) => r.label)).toEqual(['background', 'near body', 'surface band', 'wall layers (10)']);
    expect(b.rows[0]!.cells).toBeCloseTo(background, 9);
    expect(b.rows[1]!.cells).toBeCloseTo(box, 9);
    expect(b.surfaceCells).toBeCloseTo(surface, 9);
    expect(b.layerCells).toBeCloseTo(layers, 9);
    expect(b.cells).toBeCloseTo(total, 9);
    expect(b.bandFrom).toBe('near body');
    // Tetrahedra: 5.5 per hexahedron in the volume, two prisms per layer cell.
    expect(b.tetCells).toBeCloseTo((background + box + surface) * 5.5 + layers * 2, 6);
    // Polyhedra: the tetrahedral volume count / 4.5, one per layer cell.
    expect(b.polyCells).toBeCloseTo(((background + box + surface) * 5.5) / 4.5 + layers, 6);
    // 2 GB and 2 CPU-hours per million cells per 1000 iterations.
    expect(b.memory).toBeCloseTo((total / 1e6) * 2, 12);
    expect(b.cpuHours).toBeCloseTo((total / 1e6) * 2, 12);
    expect(b.warnings).toEqual([]);
  });

  it('the entry gives the same numbers from sheet values', () => {
    const d = asRecord(call('domain', { body: metres(10, 5, 4), upstream: si(30, 'm'), downstream: si(60, 'm'), lateral: si(22.5, 'm'), top: si(36, 'm') }));
    expect(siField(d, 'volume')).toBe(200_000);
    // A real stack from the near-wall family: 10 layers from 15 mm growing by 1.2 (last 77 mm, under 2 × 0.125 m).
    const stack = asRecord(createRegistry().get('layer_stack')!.compute({ first: si(0.015, 'm'), growth: num(1.2), count: num(10), scale: str('linear') }, stubContext()));
    expect(siField(stack, 'count')).toBe(10);
    const r = asRecord(
      call('cell_budget', {
        domain: d,
        base: si(2, 'm'),
        zones: { kind: 'list', items: [zoneRec({ box: metres(20, 10, 8), level: num(2), label: str('near body') })] },
        surface: zoneRec({ area: si(100, 'm^2'), level: num(4) }),
        layers: stack,
      }),
    );
    expect([...r.fields.keys()]).toEqual(['cells', 'zones', 'layer_cells', 'surface_cells', 'tet_cells', 'poly_cells', 'memory_gb', 'cpu_time']);
    expect(siField(r, 'cells')).toBeCloseTo(total, 9);
    expect(siField(r, 'layer_cells')).toBeCloseTo(layers, 9);
    expect(r.warnings).toEqual([]);
    expect(siField(r, 'cpu_time')).toBeCloseTo((total / 1e6) * 2 * 3600, 9);
    const t = r.fields.get('zones')!.value;
    expect(t.kind === 'table' && t.columns).toEqual(['region', 'level', 'cell size', 'volume', 'cells']);
    expect(t.kind === 'table' && t.rows.length).toBe(4);
    // The formulas and the common-practice figures are stated on the sheet.
    const remarks = r.remarks.join('\n');
    expect(remarks).toMatch(/N = V \/ h³ with h = h0 \/ 2\^n/);
    expect(remarks).toMatch(/Surface band N_s = A \/ h_s²/);
    expect(remarks).toMatch(/N_layer = count × A \/ h_s²/);
    expect(remarks).toMatch(/a cube splits into 5 or 6 tetrahedra/);
    expect(remarks).toMatch(/quarter to a fifth .* common practice/);
    expect(remarks).toMatch(/common-practice figures/);
    expect(remarks).toMatch(/gradients there are small/);
  });
});

describe('nesting and overlaps', () => {
  it('nested zones: each level keeps its volume less the next finer level', () => {
    // 1000 m³ at level 1 holding 100 m³ at level 2 holding 10 m³ at level 3; base 1 m.
    const b = cellBudget(
      input({
        volume: 10_000,
        base: 1,
        zones: [
          { label: 'c', kind: 'box', level: 3, volume: 10 },
          { label: 'a', kind: 'box', level: 1, volume: 1000 },
          { label: 'b', kind: 'box', level: 2, volume: 100 },
        ],
      }),
    );
    expect(b.rows.map((r) => [r.label, r.volume])).toEqual([['background', 9000], ['a', 900], ['b', 90], ['c', 10]]);
    expect(b.cells).toBeCloseTo(9000 + 900 * 8 + 90 * 64 + 10 * 512, 9);
    // No volume is counted twice: the regions add up to the domain.
    expect(b.rows.reduce((s, r) => s + r.volume, 0)).toBeCloseTo(10_000, 9);
  });

  it('exclusive zones: each zone keeps its own volume', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, mode: 'exclusive', zones: [{ label: 'a', kind: 'box', level: 1, volume: 900 }, { label: 'b', kind: 'volume', level: 2, volume: 100 }] }));
    expect(b.rows.map((r) => r.volume)).toEqual([9000, 900, 100]);
  });

  it('two zones of one level share the finer zone in proportion to their volumes', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'a', kind: 'box', level: 1, volume: 300 }, { label: 'b', kind: 'box', level: 1, volume: 100 }, { label: 'c', kind: 'box', level: 2, volume: 40 }] }));
    expect(b.rows.map((r) => r.volume)).toEqual([9600, 270, 90, 40]);
  });

  it('refuses finer zones larger than the coarser ones they lie in, and zones larger than the domain', () => {
    expect(() => cellBudget(input({ zones: [{ label: 'a', kind: 'box', level: 1, volume: 10 }, { label: 'b', kind: 'box', level: 2, volume: 20 }] }))).toThrow(/level-2 zones hold 20 m³, more than the 10 m³ of the level-1 zones/);
    expect(() => cellBudget(input({ volume: 100, zones: [{ label: 'a', kind: 'box', level: 1, volume: 150 }] }))).toThrow(/more than the domain's 100 m³/);
    expect(() => cellBudget(input({ volume: 100, mode: 'exclusive', zones: [{ label: 'a', kind: 'box', level: 1, volume: 60 }, { label: 'b', kind: 'box', level: 2, volume: 60 }] }))).toThrow(/no two zones may overlap/);
  });

  it('takes the surface band out of the finest shell, even when a finer box lies elsewhere', () => {
    const b = cellBudget(
      input({
        volume: 10_000,
        base: 1,
        zones: [{ label: 'shell', kind: 'shell', level: 3, volume: 50 }, { label: 'mirror', kind: 'box', level: 4, volume: 2 }],
        surface: { area: 40, level: 4 },
      }),
    );
    expect(b.bandFrom).toBe('shell');
    // Shell: 50 − 2 (nested finer box) − 40 × 1/16 (the band) = 45.5 m³.
    expect(b.rows.find((r) => r.label === 'shell')!.volume).toBeCloseTo(45.5, 12);
  });

  it("takes the body's solid out of the domain when given", () => {
    const d = { kind: 'record', fields: new Map([['volume', { value: si(1000, 'm^3') }]]), warnings: [], remarks: [] } as RecordValue;
    const r = asRecord(call('cell_budget', { domain: d, base: si(1, 'm'), solid: si(100, 'm^3') }));
    expect(siField(r, 'cells')).toBeCloseTo(900, 9);
    // Without a surface or layers their counts are zero, and the notes say why.
    expect(siField(r, 'layer_cells')).toBe(0);
    expect(r.fields.get('layer_cells')!.note).toMatch(/no wall layers given/);
    expect(asRecord(call('cell_budget', { domain: si(1000, 'm^3'), base: si(1, 'm') })).remarks.join('\n')).toMatch(/counted as fluid unless solid/);
  });
});

describe('cell budget warnings', () => {
  it('a surface band thicker than the zone next to the wall', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'skin', kind: 'shell', level: 2, volume: 1 }], surface: { area: 100, level: 2 } }));
    expect(b.warnings.join('\n')).toMatch(/surface band .* is larger than the 1 m³ of skin next to the wall/);
    expect(b.rows.find((r) => r.label === 'skin')!.volume).toBe(0);
  });

  it('a surface coarser than the zone around it', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'near', kind: 'box', level: 3, volume: 100 }], surface: { area: 10, level: 2 } }));
    expect(b.warnings.join('\n')).toMatch(/surface level 2 is coarser than level 3 of near/);
  });

  it('a jump of more than two levels between nested regions, and to the surface', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'wake', kind: 'box', level: 3, volume: 100 }], surface: { area: 10, level: 6 } }));
    const text = b.warnings.join('\n');
    expect(text).toMatch(/the zone wake \(level 3\) is 3 levels finer than the level-0 region/);
    expect(text).toMatch(/the surface \(level 6\) is 3 levels finer than the level-3 region/);
    expect(cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'wake', kind: 'box', level: 2, volume: 100 }], surface: { area: 10, level: 4 } })).warnings).toEqual([]);
  });

  it('surface cells far larger than the last wall layer (common practice: at most about 2)', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'near', kind: 'box', level: 2, volume: 100 }], surface: { area: 10, level: 3 }, layers: { count: 5, last: 0.02, total: 0.06 } }));
    // h_s = 1/8 m = 6.25 × the 20 mm last layer.
    expect(b.warnings.join('\n')).toMatch(/surface cells \(125 mm\) are 6.25 × the last wall layer \(20 mm\), above about 2/);
  });

  it('refuses layers without a surface, surface bands among the zones, and records that are not zones', () => {
    expect(() => cellBudget(input({ layers: { count: 5, last: 0.02, total: 0.06 } }))).toThrow(/layers are counted on the surface/);
    const surface = zoneRec({ area: si(10, 'm^2'), level: num(3) });
    expect(() => call('cell_budget', { domain: si(1000, 'm^3'), base: si(1, 'm'), zones: { kind: 'list', items: [surface] } })).toThrow(/pass it as surface:/);
    const box = zoneRec({ box: metres(1, 1, 1), level: num(1) });
    expect(() => call('cell_budget', { domain: si(1000, 'm^3'), base: si(1, 'm'), surface: box })).toThrow(/surface must be the surface band/);
    expect(() => call('cell_budget', { domain: si(1000, 'm^3'), base: si(1, 'm'), zones: { kind: 'list', items: [num(3)] } })).toThrow(TradeError);
    expect(() => call('cell_budget', { domain: si(1000, 'm^2'), base: si(1, 'm') })).toThrow(/domain must be in m\^3/);
  });
});

describe('cell budget in the sheet language', () => {
  it('zones written as a list of zone(…) records', async () => {
    const sheet = [
      '```basis',
      'd = domain([10, 5, 4] m, upstream: 30 m, downstream: 60 m, lateral: 22.5 m, top: 36 m)',
      'near = zone(box: [20, 10, 8] m, level: 2, label: "near body")',
      'skin = zone(area: 100 m^2, level: 4)',
      'b = cell_budget(d, base: 2 m, zones: [near], surface: skin)',
      'b_sweep = cell_budget(d, base: [2, 4] m, zones: [near], surface: skin)',
      'shells = zone(volume: [20, 30] m^3, level: 4)',
      'b_shells = cell_budget(d, base: 2 m, zones: [near, shells], surface: skin)',
      '```',
    ].join('\n');
    const r = await renderSheet(sheet);
    expect(r.errors).toEqual([]);
    const cells = r.values.b!.fields!.cells!.si!;
    // By hand, as above but without the layers.
    expect(relErr(cells, (200_000 - 1600) / 8 + (1600 - 12.5) / 0.125 + 6400)).toBeLessThan(1e-12);
    // A list of base sizes sweeps the budget.
    expect(r.values.b_sweep!.items).toHaveLength(2);
    // A swept zone(…) gives several zones in one item of the list.
    // Level 4 holds 20 + 30 m³ and gives up the 12.5 m³ surface band in proportion: 15 + 22.5 m³.
    expect(relErr(r.values.b_shells!.fields!.cells!.si!, (200_000 - 1600) / 8 + (1600 - 50) / 0.125 + (15 + 22.5) / 0.125 ** 3 + 6400)).toBeLessThan(1e-12);
    expect(r.html).toContain('surface band');
    // The per-region table spans its row of the record rather than squeezing the other fields.
    expect(r.parts.map((p) => p.html).join('')).toMatch(/<div class="ws-subtable"><div class="ws-subtable-head">.*?<\/div><div class="ws-table-wrap"><table class="ws-table" data-name="b.zones">/);
  });
});
