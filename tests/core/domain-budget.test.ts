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
    // A record that is not a zone at all is named by the argument it was given as.
    expect(() => call('cell_budget', { domain: si(1000, 'm^3'), base: si(1, 'm'), surface: { ...zoneRec({ area: si(10, 'm^2'), level: num(3) }), tag: 'fluid' } })).toThrow(/^surface is not a zone; make one with zone\(/);
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

describe('cell budget: edges of the octree rules', () => {
  it('a surface with no zones takes its band out of the background', () => {
    // Base 1 m, surface 100 m² at level 2 (h_s = 0.25 m): band 25 m³ out of the 10 000 m³ background.
    const b = cellBudget(input({ volume: 10_000, base: 1, surface: { area: 100, level: 2 } }));
    expect(b.bandFrom).toBe('the background');
    expect(b.rows[0]!.volume).toBeCloseTo(10_000 - 25, 9);
    expect(b.surfaceCells).toBeCloseTo(100 / 0.25 ** 2, 9);
    expect(b.warnings).toEqual([]);
  });

  it('a band exactly as thick as its zone fills it without a warning, and a surface at the zone\'s level is not called coarser', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'skin', kind: 'shell', level: 2, volume: 25 }], surface: { area: 100, level: 2 } }));
    expect(b.warnings).toEqual([]);
    expect(b.rows.find((r) => r.label === 'skin')!.volume).toBe(0);
  });

  it('the band comes out of every finest shell, which the record names', () => {
    const b = cellBudget(
      input({ volume: 10_000, base: 1, zones: [{ label: 'front', kind: 'shell', level: 3, volume: 30 }, { label: 'rear', kind: 'shell', level: 3, volume: 10 }], surface: { area: 40, level: 3 } }),
    );
    expect(b.bandFrom).toBe('front, rear');
    // Band 40 × 1/8 = 5 m³ out of 40 m³: each keeps 7/8.
    expect(b.rows.find((r) => r.label === 'front')!.volume).toBeCloseTo(30 * (7 / 8), 12);
    expect(b.rows.find((r) => r.label === 'rear')!.volume).toBeCloseTo(10 * (7 / 8), 12);
  });

  it('the thicker-band warning says what to do', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'skin', kind: 'shell', level: 2, volume: 1 }], surface: { area: 100, level: 2 } }));
    expect(b.warnings).toEqual([
      'the surface band (area × surface cell = 25 m³) is larger than the 1 m³ of skin next to the wall; the zone there is thinner than one surface cell: make it thicker, or raise its level to meet the surface level.',
    ]);
  });

  it('levels are compared in order, whatever order the zones come in (common practice: at most 2 levels between nested regions)', () => {
    const zones = [
      { label: 'inner', kind: 'box', level: 4, volume: 10 },
      { label: 'outer', kind: 'box', level: 2, volume: 100 },
    ] as const;
    expect(cellBudget(input({ volume: 10_000, base: 1, zones })).warnings).toEqual([]);
    // Levels 2 and 3 next to each other are one apart.
    expect(cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'a', kind: 'box', level: 2, volume: 100 }, { label: 'b', kind: 'box', level: 3, volume: 10 }] })).warnings).toEqual([]);
  });

  it('a jump names every zone of the finer level, and only those', () => {
    const b = cellBudget(
      input({
        volume: 10_000,
        base: 1,
        zones: [
          { label: 'wake', kind: 'box', level: 3, volume: 100 },
          { label: 'roof', kind: 'box', level: 3, volume: 50 },
          { label: 'near', kind: 'box', level: 4, volume: 10 },
        ],
      }),
    );
    expect(b.warnings).toEqual([
      'the zones wake, roof (level 3) are 3 levels finer than the level-0 region around it; octree meshes keep neighbouring cells within one level, so the grading between them adds cells this budget does not count (common practice: at most 2 levels between nested regions); add an intermediate zone.',
    ]);
  });

  it('surface cells twice the last layer are still within the usual jump (common practice: about 2)', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'near', kind: 'box', level: 2, volume: 100 }], surface: { area: 10, level: 3 }, layers: { count: 5, last: 0.0625, total: 0.2 } }));
    expect(b.warnings).toEqual([]);
    const far = cellBudget(input({ volume: 10_000, base: 1, zones: [{ label: 'near', kind: 'box', level: 2, volume: 100 }], surface: { area: 10, level: 3 }, layers: { count: 5, last: 0.02, total: 0.06 } }));
    expect(far.warnings[0]).toMatch(/; add layers, grow them faster within the usual 1\.3, or refine the surface a level\.$/);
  });

  it('the layer row holds the area × the stack thickness, and CPU time scales with the iterations', () => {
    const b = cellBudget(input({ volume: 10_000, base: 1, surface: { area: 10, level: 3 }, layers: { count: 5, last: 0.1, total: 0.3 }, iterations: 3000 }));
    const layerRow = b.rows.at(-1)!;
    expect(layerRow).toEqual({ label: 'wall layers (5)', level: 'layers', size: 0.125, volume: 10 * 0.3, cells: b.layerCells });
    // 2 CPU-hours per million cells per 1000 iterations, for 3000 iterations.
    expect(b.cpuHours).toBeCloseTo((b.cells / 1e6) * 2 * 3, 12);
  });

  it('without a surface the budget names no band', () => {
    expect(cellBudget(input({ volume: 10_000, base: 1 }))).not.toHaveProperty('bandFrom');
  });

  it('zones that fill their container exactly are accepted, as nested and as exclusive', () => {
    expect(cellBudget(input({ volume: 1000, base: 1, zones: [{ label: 'all', kind: 'box', level: 1, volume: 1000 }] })).rows[0]!.volume).toBe(0);
    const nested = cellBudget(input({ volume: 1000, base: 1, zones: [{ label: 'a', kind: 'box', level: 1, volume: 100 }, { label: 'b', kind: 'box', level: 2, volume: 100 }] }));
    expect(nested.rows.map((r) => r.volume)).toEqual([900, 0, 100]);
    expect(cellBudget(input({ volume: 1000, base: 1, mode: 'exclusive', zones: [{ label: 'a', kind: 'box', level: 1, volume: 600 }, { label: 'b', kind: 'box', level: 2, volume: 400 }] })).rows[0]!.volume).toBe(0);
  });

  it('zones of no volume hold no cells', () => {
    const b = cellBudget(input({ volume: 1000, base: 1, zones: [{ label: 'empty', kind: 'box', level: 1, volume: 0 }, { label: 'none', kind: 'box', level: 2, volume: 0 }] }));
    expect(b.rows.map((r) => r.volume)).toEqual([1000, 0, 0]);
  });

  it('refuses rates and sizes that are not positive, naming which', () => {
    for (const [key, name] of [['volume', 'the domain volume'], ['base', 'base'], ['tetPerHex', 'tet_per_hex'], ['tetPerPoly', 'tet_per_poly'], ['memoryPerMillion', 'memory_per_million'], ['cpuPerMillion', 'cpu_per_million'], ['iterations', 'iterations']] as const) {
      expect(() => cellBudget(input({ [key]: 0 }))).toThrow(`${name} must be positive, not 0`);
      expect(() => cellBudget(input({ [key]: -2 }))).toThrow(`${name} must be positive, not −2`);
      expect(() => cellBudget(input({ [key]: Number.NaN }))).toThrow(new RegExp(`^${name} must be positive`));
    }
    expect(() => cellBudget(input({ zones: [{ label: 'w', kind: 'box', level: 1, volume: -1 }] }))).toThrow('zone w has no usable volume (−1 m³)');
    expect(() => cellBudget(input({ zones: [{ label: 'w', kind: 'box', level: 1, volume: Number.NaN }] }))).toThrow(/^zone w has no usable volume/);
    expect(() => cellBudget(input({ surface: { area: 0, level: 2 } }))).toThrow('the surface area must be positive');
    expect(() => cellBudget(input({ zones: [{ label: 'a', kind: 'box', level: 1, volume: 10 }, { label: 'b', kind: 'box', level: 2, volume: 20 }] }))).toThrow(
      'zones nest (each finer zone inside a coarser one), or give volumes: "exclusive" when each zone\'s volume is its own',
    );
  });
});

describe('cell budget entry: what it reads and what it states', () => {
  const domainVol = si(10_000, 'm^3');
  const zoneOf = (fields: Array<[string, Value]>, tag = 'zone'): RecordValue => ({ kind: 'record', fields: new Map(fields.map(([k, v]) => [k, { value: v }])), warnings: [], remarks: [], tag }) as RecordValue;

  it('labels unnamed zones by their place and kind, and takes a single zone without a list', () => {
    const box = zoneRec({ box: metres(20, 10, 8), level: num(1) });
    const r = asRecord(call('cell_budget', { domain: domainVol, base: si(1, 'm'), zones: box }));
    const t = r.fields.get('zones')!.value;
    if (t.kind !== 'table') throw new Error('zones is not a table');
    expect(t.rows.map((row) => row[0])).toEqual([str('background'), str('zone 1 (box)')]);
    const named = asRecord(call('cell_budget', { domain: domainVol, base: si(1, 'm'), zones: { kind: 'list', items: [zoneRec({ box: metres(20, 10, 8), level: num(1), label: str('wake') })] } }));
    const t2 = named.fields.get('zones')!.value;
    expect(t2.kind === 'table' && t2.rows[1]![0]).toEqual(str('wake'));
  });

  it('the table gives each region its level, cell size in m, volume in m³ and cells; the layer row says "layers"', () => {
    const stack = asRecord(createRegistry().get('layer_stack')!.compute({ first: si(0.015, 'm'), growth: num(1.2), count: num(10), scale: str('linear') }, stubContext()));
    const r = asRecord(call('cell_budget', { domain: domainVol, base: si(1, 'm'), surface: zoneRec({ area: si(100, 'm^2'), level: num(3) }), layers: stack }));
    const t = r.fields.get('zones')!.value;
    if (t.kind !== 'table') throw new Error('zones is not a table');
    const [bg, band, layers] = t.rows;
    expect(bg![1]).toEqual(num(0));
    expect(band![0]).toEqual(str('surface band'));
    expect(layers![0]).toEqual(str('wall layers (10)'));
    expect(layers![1]).toEqual(str('layers'));
    for (const row of t.rows) {
      expect(row).toHaveLength(5);
      expect(row[2]!.kind === 'quantity' && row[2]!.dims).toEqual(si(1, 'm').dims);
      expect(row[3]!.kind === 'quantity' && row[3]!.dims).toEqual(si(1, 'm^3').dims);
    }
    // With a surface and layers given, their counts carry their plain doc, not a "not given" note.
    expect(r.fields.get('layer_cells')!.note).toBe('cells in the wall layers');
    expect(r.fields.get('surface_cells')!.note).toBe('cells in the surface band');
    expect(r.tag).toBe('cell budget');
  });

  it('states the rules it counts by, for nested zones with a surface, layers and a solid', () => {
    const stack = asRecord(createRegistry().get('layer_stack')!.compute({ first: si(0.015, 'm'), growth: num(1.2), count: num(10), scale: str('linear') }, stubContext()));
    const r = asRecord(
      call('cell_budget', {
        domain: domainVol,
        base: si(1, 'm'),
        solid: si(200, 'm^3'),
        zones: { kind: 'list', items: [zoneRec({ box: metres(20, 10, 8), level: num(1), label: str('near') })] },
        surface: zoneRec({ area: si(100, 'm^2'), level: num(3) }),
        layers: stack,
      }),
    );
    expect(r.remarks).toEqual([
      'Refinement rule (common practice): cells far from the body can be coarse because the gradients there are small; zones refine towards the body and its wake, and the surface, where velocity and pressure gradients are highest, is finest.',
      'Cells per region N = V / h³ with h = h0 / 2^n (h0 = base, n = level), for cubic octree cells.',
      "Zones nest: each zone is given whole and the zones of a level lie inside those of the next coarser level, so a level's own volume is its zones' volume less the next finer level's (shared in proportion to volume), and the background is the domain less the coarsest zones. No volume is counted twice.",
      "The body's own volume (solid) is taken out of the domain.",
      'Surface band N_s = A / h_s² (one cell of size h_s = h0 / 2^n_s across, over the area A); its volume A h_s is taken out of near, next to the wall.',
      'Wall layers N_layer = count × A / h_s²: one cell per surface face per layer; layers push the surface cells out rather than replace them, so the surface cells keep their count.',
      'Tetrahedral equivalent: 5.5 tetrahedra per hexahedron (a cube splits into 5 or 6 tetrahedra, geometry), and 2 prisms per hexahedral layer cell (two triangles per square face).',
      'Polyhedral equivalent: the tetrahedral count / 4.5 (a polyhedral mesh needs about a quarter to a fifth the cells of a tetrahedral one at equal resolution, common practice), and 1 layer cell per hexahedral one (about one polygon per square face).',
      'Memory 2 GB and CPU time 2 h per million cells per 1000 iterations, for 1000 iterations: common-practice figures for a segregated incompressible RANS solver (about 1–2 GB per million cells); set memory_per_million and cpu_per_million from your own runs.',
      'Transition cells between levels are not counted; keep nested regions within 2 levels of each other.',
    ]);
  });

  it('states exclusive zones, and says nothing of a band or layers that are not there', () => {
    const r = asRecord(call('cell_budget', { domain: domainVol, base: si(1, 'm'), volumes: str('exclusive') }));
    expect(r.remarks[2]).toBe("Zones are exclusive: each zone's volume is the volume at its level only, and the background is the domain less all zones.");
    expect(r.remarks.join('\n')).not.toMatch(/Surface band|Wall layers N_layer/);
    expect(r.fields.get('surface_cells')!.note).toBe('no surface given (surface:)');
  });

  it('refuses what it cannot read, in plain words', () => {
    const base = { domain: domainVol, base: si(1, 'm') };
    expect(() => call('cell_budget', { base: si(1, 'm') })).toThrow('missing argument domain');
    expect(() => call('cell_budget', { ...base, domain: zoneOf([['length', si(10, 'm')]], 'domain') })).toThrow('domain must be a domain(…) record with a volume field, or a volume in m³');
    expect(() => call('cell_budget', { ...base, solid: si(10_000, 'm^3') })).toThrow(/^solid 10000 m³ fills the domain of 10000 m³/);
    const notZone = /^zones\[1\] is not a zone; make one with zone\(box: \[l, w, h\] m, level: n\)/;
    expect(() => call('cell_budget', { ...base, zones: zoneOf([['kind', str('box')], ['level', num(1)], ['volume', si(1, 'm^3')]], 'domain') })).toThrow(notZone);
    expect(() => call('cell_budget', { ...base, zones: zoneOf([['level', num(1)], ['volume', si(1, 'm^3')]]) })).toThrow(notZone);
    expect(() => call('cell_budget', { ...base, zones: zoneOf([['kind', num(1)], ['level', num(1)]]) })).toThrow(notZone);
    expect(() => call('cell_budget', { ...base, zones: zoneOf([['kind', str('cone')], ['level', num(1)]]) })).toThrow(notZone);
    expect(() => call('cell_budget', { ...base, zones: zoneOf([['kind', str('box')], ['level', num(1.5)], ['volume', si(1, 'm^3')]]) })).toThrow(/^zones\[1\]\.level must be a whole number/);
    expect(() => call('cell_budget', { ...base, zones: { kind: 'list', items: [zoneRec({ box: metres(1, 1, 1), level: num(1) }), num(3)] } })).toThrow(/^zones\[2\] is a plain number, not a zone/);
    // A shell, though it has an area, is not the surface band; nor is a zone record without one.
    expect(() => call('cell_budget', { ...base, surface: zoneRec({ shell: si(0.2, 'm'), area: si(10, 'm^2'), level: num(3) }) })).toThrow('surface must be the surface band, zone(area: A, level: n), not a shell zone');
    expect(() => call('cell_budget', { ...base, surface: zoneOf([['kind', str('surface')], ['level', num(3)]]) })).toThrow('surface must be the surface band, zone(area: A, level: n), not a surface zone');
    // A level or a layer count is a plain number.
    expect(() => call('cell_budget', { ...base, zones: zoneOf([['kind', str('box')], ['level', si(1, 'm')], ['volume', si(1, 'm^3')]]) })).toThrow(/^level must be a plain number, not /);
    const surface = zoneRec({ area: si(10, 'm^2'), level: num(3) });
    expect(() => call('cell_budget', { ...base, surface, layers: zoneOf([['count', si(5, 'm')], ['last', si(0.01, 'm')], ['total', si(0.03, 'm')]], 'layer stack') })).toThrow(/^count must be a plain number, not /);
    const stackMsg = 'layers must be a layer_stack(…) record (with count, last and total)';
    for (const missing of ['count', 'last', 'total']) {
      const fields: Array<[string, Value]> = ([['count', num(5)], ['last', si(0.01, 'm')], ['total', si(0.03, 'm')]] as Array<[string, Value]>).filter(([k]) => k !== missing);
      expect(() => call('cell_budget', { ...base, surface, layers: zoneOf(fields, 'layer stack') }), missing).toThrow(stackMsg);
    }
  });
});
