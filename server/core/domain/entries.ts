// The domain family's worksheet entries: the domain box and its picture, the
// domain-independence verdict, octree refinement levels, refinement zones and
// the cell budget. The maths lives in the sibling files as functions of SI
// numbers; here arguments are read and results are given units and words.
import { boolArg, choiceArg, fieldSi, optionalSi, recordArg, siArg, siListArg, siOf, stringArg } from '../shared/args.js';
import type { Args, FieldSpec, TradeFunction } from '../shared/registry.js';
import { TradeError } from '../shared/trade-error.js';
import { fieldRecord } from '../shared/records.js';
import { describeValue, figure, list, num, shown, si, str, table, type RecordValue, type Value } from '../shared/values.js';
import { lengthText, numberText, percentText } from '../shared/words.js';
import { dimsEqual } from '../../units/dims.js';
import { DISTANCES, domainBox, type DistanceName, type DomainBox } from './box.js';
import { cellBudget, LAYER_FACES, MAX_LEVEL_JUMP, VOLUME_MODES, type Budget, type BudgetZone, type VolumeMode } from './budget.js';
import { domainSvg } from './domain-svg.js';
import { checkLevel, refinement as refine } from './refinement.js';
import { RULE_NAMES } from './rules.js';
import { domainStudy } from './study.js';
import { boxVolume, shellVolume, solidOut, surfaceArea, ZONE_KINDS, type ZoneKind } from './zones.js';

// ---------------------------------------------------------------- domain

const DOMAIN_FIELDS: readonly FieldSpec[] = [
  { name: 'upstream', symbol: 'd_{\\mathrm{up}}', unit: 'm', doc: 'inlet to the body front' },
  { name: 'downstream', symbol: 'd_{\\mathrm{down}}', unit: 'm', doc: 'body rear to the outlet' },
  { name: 'lateral', symbol: 'd_{\\mathrm{side}}', unit: 'm', doc: 'body side to each side boundary' },
  { name: 'top', symbol: 'd_{\\mathrm{top}}', unit: 'm', doc: 'body top to the top boundary' },
  { name: 'length', symbol: 'L_{D}', unit: 'm', doc: 'domain length along the flow' },
  { name: 'width', symbol: 'W_{D}', unit: 'm', doc: 'domain width' },
  { name: 'height', symbol: 'H_{D}', unit: 'm', doc: 'domain height' },
  { name: 'volume', symbol: 'V_{D}', unit: 'm^3', doc: 'domain box volume (body included)' },
  { name: 'frontal', symbol: 'A_{f}', unit: 'm^2', doc: 'frontal area of the body' },
  { name: 'blockage', symbol: '\\mathit{BR}', unit: '1', doc: 'A_f / (W_D H_D)' },
  { name: 'rule', symbol: '', unit: 'text', doc: 'the rule the distances come from' },
];

const domain: TradeFunction = {
  name: 'domain',
  params: [
    { name: 'body', type: 'list', unit: 'm', doc: "[L, W, H]: the body's streamwise length, width and height" },
    { name: 'rule', type: 'string', default: '"three-lengths"', choices: RULE_NAMES, doc: 'three-lengths (common practice), cost732 (Franke et al. 2007) or aij (Tominaga et al. 2008)' },
    { name: 'upstream', type: 'quantity', unit: 'm', optional: true, doc: "inlet to body front; overrides the rule's" },
    { name: 'downstream', type: 'quantity', unit: 'm', optional: true, doc: "body rear to outlet; overrides the rule's" },
    { name: 'lateral', type: 'quantity', unit: 'm', optional: true, doc: "body side to each side boundary; overrides the rule's" },
    { name: 'top', type: 'quantity', unit: 'm', optional: true, doc: "body top to top boundary (and floor to body when ground: false); overrides the rule's" },
    { name: 'ground', type: 'bool', default: 'true', doc: 'true: the body stands on the domain floor; false: top clearance below it too' },
    { name: 'frontal', type: 'quantity', unit: 'm^2', optional: true, doc: 'frontal (projected) area; W × H by default' },
  ],
  fields: DOMAIN_FIELDS,
  doc: 'computational domain around a body: boundary distances, box, volume, blockage and a dimensioned picture',
  source:
    'COST Action 732 best practice guideline (Franke et al. 2007): 5H upstream, to each side and above, 15H downstream, blockage below 3 %; ' +
    'AIJ guidelines (Tominaga et al. 2008): 5H to each side and above, 10H downstream, blockage below 3 %; three body lengths on every side (common practice)',
  example: 'domain([20, 10, 10] m, rule: "cost732")',
  compute(args) {
    const body = siListArg(args, 'body', 'm');
    if (body.length !== 3) throw new TradeError(`body must be a list of three lengths [L, W, H], not ${body.length}`);
    const rule = choiceArg(args, 'rule', RULE_NAMES);
    const given: Partial<Record<DistanceName, number>> = {};
    for (const k of DISTANCES) {
      const v = optionalSi(args, k, 'm');
      if (v !== undefined) given[k] = v;
    }
    const ground = boolArg(args, 'ground');
    const frontal = optionalSi(args, 'frontal', 'm^2');
    const d = domainBox({ body: [body[0]!, body[1]!, body[2]!], rule, given, ground, ...(frontal === undefined ? {} : { frontal }) });
    const notes = Object.fromEntries(DISTANCES.map((k) => [k, distanceNote(d, k)]));
    if (!ground) notes.top = `${notes.top}; also floor to body (ground: false)`;
    return fieldRecord(
      DOMAIN_FIELDS,
      {
        upstream: si(d.upstream, 'm'),
        downstream: si(d.downstream, 'm'),
        lateral: si(d.lateral, 'm'),
        top: si(d.top, 'm'),
        length: si(d.length, 'm'),
        width: si(d.width, 'm'),
        height: si(d.height, 'm'),
        volume: si(d.volume, 'm^3'),
        frontal: si(d.frontal, 'm^2'),
        blockage: shown(d.blockage * 100, '%'),
        rule: str(rule),
      },
      {
        warnings: d.warnings,
        remarks: domainRemarks(d, ground, frontal === undefined),
        figure: figure(
          domainSvg({ body: [body[0]!, body[1]!, body[2]!], ...d, ground, rule, blockage: d.blockage }),
          `Domain to scale, plan and side elevation (${rule} rule)`,
        ),
        tag: 'domain',
      },
      notes,
    );
  },
};

function distanceNote(d: DomainBox, k: DistanceName): string {
  const base = DOMAIN_FIELDS.find((f) => f.name === k)!.doc;
  const ask = `${numberText(d.rule[k].times)}${d.rule.symbol} = ${lengthText(d.required[k])}`;
  return d.overridden.includes(k) ? `${base}: given (the ${d.rule.name} rule asks ${ask})` : `${base}: ${ask}`;
}

function domainRemarks(d: DomainBox, ground: boolean, frontalDefault: boolean): string[] {
  const r = d.rule;
  const ref = r.reference === 'height' ? `H = ${lengthText(d.reference)}, the body height` : `L_max = ${lengthText(d.reference)}, the body's largest dimension`;
  const remarks = [
    `Rule: ${r.title}; distances in multiples of ${ref}. Distances given on the sheet override the rule's.`,
    ...DISTANCES.map((k) => `${k} ${numberText(r[k].times)}${r.symbol}: ${r[k].source}.`),
    `Blockage below ${percentText(r.blockage.limit)}: ${r.blockage.source}.`,
    `length = upstream + L + downstream; width = W + 2 × lateral; height = ${ground ? 'H + top (the body on the floor)' : '2 × top + H (top clearance below and above)'}; ` +
      `blockage = frontal / (width × height)${frontalDefault ? ', frontal = W × H (the body\'s outline as a box; give frontal: for the real projected area)' : ''}.`,
  ];
  return remarks;
}

// ---------------------------------------------------------------- domain_study

const STUDY_FIELDS: readonly FieldSpec[] = [
  { name: 'change', symbol: '\\varepsilon_{D}', unit: '1', doc: '(large − small) / large' },
  { name: 'verdict', symbol: '', unit: 'text', doc: 'domain independent when |change| ≤ tol' },
];

const domain_study: TradeFunction = {
  name: 'domain_study',
  params: [
    { name: 'small', type: 'quantity', unit: 'any', doc: 'the quantity of interest on the domain (a drag coefficient, a force)' },
    { name: 'large', type: 'quantity', unit: 'any', doc: 'the same quantity on the enlarged domain (same dimension)' },
    { name: 'tol', type: 'quantity', unit: '1', default: '1 %', doc: 'the largest relative change that counts as negligible' },
  ],
  fields: STUDY_FIELDS,
  doc: 'domain-independence check: relative change of a quantity between a domain and an enlarged one, and the verdict',
  source: 'relative change against the enlarged (better) domain, as the approximate relative error e_a = |(φ1 − φ2)/φ1| of Celik et al. (2008), J. Fluids Eng. 130, 078001',
  example: 'domain_study(0.412, 0.409)',
  compute(args) {
    const small = args.small;
    const large = args.large;
    if (!small || small.kind !== 'quantity' || !large || large.kind !== 'quantity') {
      throw new TradeError(`small and large must be numbers or quantities, not ${describeValue((small ?? large)!)}`);
    }
    if (!dimsEqual(small.dims, large.dims)) throw new TradeError(`small is ${describeValue(small)} but large is ${describeValue(large)}; compare the same quantity on both domains`);
    const tol = siArg(args, 'tol');
    const s = domainStudy(small.si, large.si, tol);
    const warnings =
      s.verdict === 'enlarge the domain'
        ? [`the quantity changes by ${percentText(s.change)} when the domain is enlarged, more than the ${percentText(tol)} allowed; enlarge the domain again and compare the two largest.`]
        : [];
    return fieldRecord(STUDY_FIELDS, { change: shown(s.change * 100, '%'), verdict: str(s.verdict) }, {
      warnings,
      remarks: [
        'change = (large − small) / large: the enlarged domain is the better estimate, as the finer grid is in the approximate relative error of Celik et al. (2008).',
        `Verdict "domain independent" when |change| ≤ ${percentText(tol)}; otherwise "enlarge the domain" and repeat until the change is negligible.`,
      ],
      tag: 'domain study',
    });
  },
};

// ---------------------------------------------------------------- refinement

const REFINEMENT_FIELDS: readonly FieldSpec[] = [
  { name: 'levels', symbol: 'n', unit: '1', doc: 'halvings from base to target or finer' },
  { name: 'sizes', symbol: 'h_{i}', unit: 'list', doc: 'cell size at levels 0 … n' },
  { name: 'finest', symbol: 'h_{n}', unit: 'm', doc: 'cell size at the last level' },
];

const refinement: TradeFunction = {
  name: 'refinement',
  params: [
    { name: 'base', type: 'quantity', unit: 'm', doc: 'background (level-0) cell size h0' },
    { name: 'target', type: 'quantity', unit: 'm', doc: 'cell size to reach' },
  ],
  fields: REFINEMENT_FIELDS,
  doc: 'octree refinement levels from a base cell size to a target size: levels, sizes, finest',
  source: 'octree halving: h_n = h0 / 2^n, levels = ceil(log2(h0 / h)) (the definition of octree cell splitting; e.g. Yerry & Shephard 1984)',
  example: 'refinement(1 m, 40 mm)',
  compute(args) {
    const base = siArg(args, 'base', 'm');
    const target = siArg(args, 'target', 'm');
    const r = refine(base, target);
    const finest = r.sizes[r.levels]!;
    const remarks = [`levels = ceil(log2(h0 / h)) = ceil(log2(${numberText(base)} / ${numberText(target)})); the cell size at level n is h0 / 2^n.`];
    remarks.push(
      r.levels === 0
        ? `The target ${lengthText(target)} is not finer than the base ${lengthText(base)}: no refinement is needed.`
        : `Level ${r.levels} gives ${lengthText(finest)}, ${percentText(finest / target)} of the target; one level fewer would give ${lengthText(2 * finest)}, coarser than the target.`,
    );
    // One unit for the whole list keeps it short: [1000, 500, …, 7.81] mm.
    const [unit, per] = finest >= 1 ? ['m', 1] : finest >= 1e-3 ? ['mm', 1e-3] : ['um', 1e-6];
    const sizes = list(r.sizes.map((h) => ({ ...shown(h / per, unit), pinned: true })));
    return fieldRecord(REFINEMENT_FIELDS, { levels: num(r.levels), sizes, finest: si(finest, 'm') }, { remarks, tag: 'refinement' });
  },
};

// ---------------------------------------------------------------- zone

const ZONE_FIELDS: readonly FieldSpec[] = [
  { name: 'kind', symbol: '', unit: 'text', doc: 'box, volume, shell or surface' },
  { name: 'level', symbol: 'n', unit: '1', doc: 'refinement level (halvings of the base size)' },
  { name: 'volume', symbol: 'V', unit: 'm^3', doc: 'fluid volume of the zone' },
  { name: 'area', symbol: 'A', unit: 'm^2', doc: 'surface area the zone wraps' },
  { name: 'distance', symbol: 'd', unit: 'm', doc: 'shell thickness from the surface' },
  { name: 'label', symbol: '', unit: 'text', doc: 'name in the budget table' },
];

const zone: TradeFunction = {
  name: 'zone',
  params: [
    { name: 'box', type: 'list', unit: 'm', optional: true, doc: 'a box zone: [l, w, h]' },
    { name: 'level', type: 'quantity', unit: '1', doc: 'refinement level: cells of base / 2^level' },
    { name: 'shell', type: 'quantity', unit: 'm', optional: true, doc: 'a shell zone: distance from the surface' },
    { name: 'area', type: 'quantity', unit: 'm^2', optional: true, doc: "the body's surface area (a shell, or alone: the surface band one cell thick)" },
    { name: 'body', type: 'list', unit: 'm', optional: true, doc: "[L, W, H] of a box-shaped body, for a shell's edges and corners" },
    { name: 'ground', type: 'bool', default: 'true', doc: 'with body: the body stands on the floor (floor face not wetted)' },
    { name: 'volume', type: 'quantity', unit: 'm^3', optional: true, doc: 'a zone given by its volume' },
    { name: 'solid', type: 'quantity', unit: 'm^3', optional: true, doc: "the body's own volume inside a box or volume zone, taken out" },
    { name: 'label', type: 'string', optional: true, doc: 'name shown in the budget table' },
  ],
  fields: ZONE_FIELDS,
  doc: 'a refinement zone for cell_budget: a box, a volume, a shell at a distance from the surface, or the surface itself',
  source: "box l·w·h; shell around a box body by Steiner's formula for parallel bodies (Steiner 1840): A d + π(L + W + H) d² + (4/3)π d³; thin shell A d",
  example: 'zone(box: [12, 4, 4] m, level: 2, label: "near body")',
  compute(args) {
    const level = checkLevel(siArg(args, 'level'));
    const given = (['box', 'shell', 'volume'] as const).filter((k) => args[k] !== undefined);
    if (given.length > 1) throw new TradeError(`give one of box, shell and volume, not ${given.join(' and ')}`);
    const kind: ZoneKind = given.length ? given[0]! : 'surface';
    const solid = optionalSi(args, 'solid', 'm^3');
    if (solid !== undefined && (kind === 'shell' || kind === 'surface')) throw new TradeError(`solid belongs to a box or volume zone that holds the body; a ${kind} lies outside the body`);
    const z = zoneShape(kind, args, solid);
    const values: Record<string, Value> = { kind: str(kind), level: num(level), ...z.values };
    if (args.label !== undefined) values.label = str(stringArg(args, 'label'));
    return fieldRecord(ZONE_FIELDS, values, { warnings: z.warnings, remarks: z.remarks, tag: 'zone' });
  },
};

interface ZoneShape {
  values: Record<string, Value>;
  warnings: string[];
  remarks: string[];
}

function zoneShape(kind: ZoneKind, args: Args, solid: number | undefined): ZoneShape {
  const area = optionalSi(args, 'area', 'm^2');
  const body = args.body === undefined ? undefined : siListArg(args, 'body', 'm');
  const ground = boolArg(args, 'ground');
  switch (kind) {
    case 'box':
      return {
        values: { volume: si(boxVolume(siListArg(args, 'box', 'm'), solid), 'm^3') },
        warnings: [],
        remarks: [`Box volume l × w × h${solid ? ' less the solid it holds' : ''}.`],
      };
    case 'volume': {
      const v = siArg(args, 'volume', 'm^3');
      if (!(v > 0)) throw new TradeError(`volume must be positive, not ${numberText(v)} m³`);
      return { values: { volume: si(solid === undefined ? v : solidOut(v, solid, 'the zone'), 'm^3') }, warnings: [], remarks: [] };
    }
    case 'shell': {
      const d = siArg(args, 'shell', 'm');
      const sh = shellVolume(d, area, body, ground);
      const remarks = [
        body === undefined
          ? 'Shell volume = area × distance (thin-shell limit; edges and corners of the body are left out).'
          : ground
            ? "Shell around a box body on the floor: A d + (π/2)(L + W + 2H) d² + (2/3)π d³ (Steiner's formula for the body mirrored in the floor, halved)."
            : "Shell around a box body: A d + π(L + W + H) d² + (4/3)π d³ (Steiner's formula: face slabs, edge quarter-cylinders, corner eighth-spheres).",
      ];
      if (body !== undefined && area !== undefined) remarks.push("The given area replaces the box's own in the first term; edges and corners are the box's.");
      return { values: { volume: si(sh.volume, 'm^3'), area: si(sh.area, 'm^2'), distance: si(d, 'm') }, warnings: sh.warnings, remarks };
    }
    case 'surface':
      if (area === undefined && body === undefined) throw new TradeError('give box, shell or volume for a zone, or area: (or body:) alone for the surface');
      return {
        values: { area: si(surfaceArea(area, body, ground), 'm^2') },
        warnings: [],
        remarks: [`The surface band: one cell layer at this level over the ${area === undefined ? "box body's wetted area" : 'area'}.`],
      };
  }
}

// ---------------------------------------------------------------- cell_budget

const BUDGET_FIELDS: readonly FieldSpec[] = [
  { name: 'cells', symbol: 'N', unit: '1', doc: 'hexahedral (octree) cells in total, layers included' },
  { name: 'zones', symbol: '', unit: 'table', doc: 'cells per region' },
  { name: 'layer_cells', symbol: 'N_{\\mathrm{layer}}', unit: '1', doc: 'cells in the wall layers' },
  { name: 'surface_cells', symbol: 'N_{s}', unit: '1', doc: 'cells in the surface band' },
  { name: 'tet_cells', symbol: 'N_{\\mathrm{tet}}', unit: '1', doc: 'tetrahedral mesh of the same resolution' },
  { name: 'poly_cells', symbol: 'N_{\\mathrm{poly}}', unit: '1', doc: 'polyhedral mesh of the same resolution' },
  { name: 'memory_gb', symbol: 'M', unit: '1', doc: 'memory in GB (common practice figure)' },
  { name: 'cpu_time', symbol: 't_{\\mathrm{CPU}}', unit: 's', doc: 'CPU time for the iterations (common practice figure)' },
];

const cell_budget: TradeFunction = {
  name: 'cell_budget',
  params: [
    { name: 'domain', type: 'any', doc: 'a domain record (its volume is used), or the domain volume' },
    { name: 'base', type: 'quantity', unit: 'm', doc: 'background (level-0) cell size h0' },
    { name: 'zones', type: 'list', optional: true, doc: 'refinement zones: a list of zone(…) records' },
    { name: 'surface', type: 'record', optional: true, doc: "the body's surface: zone(area: A, level: n)" },
    { name: 'layers', type: 'record', optional: true, doc: 'the wall-layer stack: a layer_stack(…) record' },
    { name: 'solid', type: 'quantity', unit: 'm^3', optional: true, doc: "the body's own volume, taken out of the domain" },
    { name: 'volumes', type: 'string', default: '"nested"', choices: VOLUME_MODES, doc: 'nested: each zone given whole, finer zones inside coarser; exclusive: each zone\'s own volume' },
    { name: 'tet_per_hex', type: 'quantity', unit: '1', default: '5.5', doc: 'tetrahedra per hexahedron of the same edge (a cube splits into 5 or 6)' },
    { name: 'tet_per_poly', type: 'quantity', unit: '1', default: '4.5', doc: 'tetrahedral cells per polyhedral cell (common practice 4 to 5)' },
    { name: 'memory_per_million', type: 'quantity', unit: '1', default: '2', doc: 'GB of memory per million cells (common practice 1 to 2)' },
    { name: 'cpu_per_million', type: 'quantity', unit: 's', default: '2 h', doc: 'CPU time per million cells per 1000 iterations (common practice)' },
    { name: 'iterations', type: 'quantity', unit: '1', default: '1000', doc: 'solver iterations for the run' },
  ],
  fields: BUDGET_FIELDS,
  doc: 'cell budget of an octree mesh: cells per zone and in total, layer cells, tetrahedral and polyhedral equivalents, memory and CPU time',
  source:
    'N = V / (h0/2^n)³ per region; surface band A / h_s²; layers n A / h_s²; a cube splits into 5 or 6 tetrahedra; polyhedral cells about 1/4–1/5 of tetrahedral (common practice); memory and CPU time per million cells (common practice)',
  example: 'cell_budget(domain([20, 10, 10] m, rule: "cost732"), base: 2 m, zones: [zone(box: [60, 30, 20] m, level: 2)], surface: zone(area: 800 m^2, level: 5))',
  compute(args) {
    const base = siArg(args, 'base', 'm');
    const mode = choiceArg(args, 'volumes', VOLUME_MODES);
    const gross = domainVolume(args);
    const solid = optionalSi(args, 'solid', 'm^3');
    const volume = solid === undefined ? gross : solidOut(gross, solid, 'the domain');
    const zones = zoneList(args);
    const surface = surfaceArg(args);
    const layers = layersArg(args);
    const iterations = siArg(args, 'iterations');
    const b = cellBudget({
      volume,
      base,
      zones,
      mode,
      ...(surface ? { surface } : {}),
      ...(layers ? { layers } : {}),
      tetPerHex: siArg(args, 'tet_per_hex'),
      tetPerPoly: siArg(args, 'tet_per_poly'),
      memoryPerMillion: siArg(args, 'memory_per_million'),
      cpuPerMillion: siArg(args, 'cpu_per_million', 'h'),
      iterations,
    });
    const values: Record<string, Value> = {
      cells: num(b.cells),
      zones: budgetTable(b),
      layer_cells: num(b.layerCells),
      surface_cells: num(b.surfaceCells),
      tet_cells: num(b.tetCells),
      poly_cells: num(b.polyCells),
      memory_gb: num(b.memory),
      cpu_time: shown(b.cpuHours, 'h'),
    };
    const notes: Record<string, string> = {};
    if (!layers) notes.layer_cells = 'no wall layers given (layers:)';
    if (!surface) notes.surface_cells = 'no surface given (surface:)';
    return fieldRecord(BUDGET_FIELDS, values, { warnings: b.warnings, remarks: budgetRemarks(b, args, mode, solid !== undefined, iterations), tag: 'cell budget' }, notes);
  },
};

function domainVolume(args: Args): number {
  const d = args.domain;
  if (d === undefined) throw new TradeError('missing argument domain');
  if (d.kind === 'record') {
    const v = fieldSi(d, 'volume', 'm^3');
    if (v === undefined) throw new TradeError('domain must be a domain(…) record with a volume field, or a volume in m³');
    return v;
  }
  return siOf(d, 'm^3', 'domain');
}

function zoneRecord(r: RecordValue, name: string): { kind: ZoneKind; level: number; label?: string; volume?: number; area?: number } {
  const kind = r.fields.get('kind')?.value;
  if (r.tag !== 'zone' || kind?.kind !== 'string' || !(ZONE_KINDS as readonly string[]).includes(kind.value)) {
    throw new TradeError(`${name} is not a zone; make one with zone(box: [l, w, h] m, level: n), zone(shell: d, area: A, level: n) or zone(volume: V, level: n)`);
  }
  const label = r.fields.get('label')?.value;
  const volume = fieldSi(r, 'volume', 'm^3');
  const area = fieldSi(r, 'area', 'm^2');
  return {
    kind: kind.value as ZoneKind,
    level: checkLevel(fieldSi(r, 'level', '1') ?? NaN, `${name}.level`),
    ...(label?.kind === 'string' ? { label: label.value } : {}),
    ...(volume === undefined ? {} : { volume }),
    ...(area === undefined ? {} : { area }),
  };
}

function zoneList(args: Args): BudgetZone[] {
  const v = args.zones;
  if (v === undefined) return [];
  // A sweep of zone(…) (several shells at once) is a list inside the list: take its items.
  const items = (v.kind === 'list' ? v.items : [v]).flatMap((item) => (item.kind === 'list' ? item.items : [item]));
  return items.map((item, i) => {
    const name = `zones[${i + 1}]`;
    if (item.kind !== 'record') throw new TradeError(`${name} is ${describeValue(item)}, not a zone; make one with zone(box: [l, w, h] m, level: n)`);
    const z = zoneRecord(item, name);
    if (z.kind === 'surface') throw new TradeError(`${name} is a surface band; pass it as surface:, not among the zones`);
    return { label: z.label ?? `zone ${i + 1} (${z.kind})`, kind: z.kind, level: z.level, volume: z.volume! };
  });
}

function surfaceArg(args: Args): { area: number; level: number } | undefined {
  if (args.surface === undefined) return undefined;
  const z = zoneRecord(recordArg(args, 'surface'), 'surface');
  if (z.kind !== 'surface' || z.area === undefined) throw new TradeError(`surface must be the surface band, zone(area: A, level: n), not a ${z.kind} zone`);
  return { area: z.area, level: z.level };
}

function layersArg(args: Args): { count: number; last: number; total: number } | undefined {
  if (args.layers === undefined) return undefined;
  const r = recordArg(args, 'layers');
  const count = fieldSi(r, 'count', '1');
  const last = fieldSi(r, 'last', 'm');
  const total = fieldSi(r, 'total', 'm');
  if (count === undefined || last === undefined || total === undefined) throw new TradeError('layers must be a layer_stack(…) record (with count, last and total)');
  return { count, last, total };
}

function budgetTable(b: Budget): Value {
  return table(
    ['region', 'level', 'cell size', 'volume', 'cells'],
    b.rows.map((r) => [str(r.label), r.level === 'layers' ? str('layers') : num(r.level), si(r.size, 'm'), si(r.volume, 'm^3'), num(r.cells)]),
  );
}

function budgetRemarks(b: Budget, args: Args, mode: VolumeMode, solid: boolean, iterations: number): string[] {
  const tetPerHex = siArg(args, 'tet_per_hex');
  const tetPerPoly = siArg(args, 'tet_per_poly');
  const r = [
    'Refinement rule (common practice): cells far from the body can be coarse because the gradients there are small; zones refine towards the body and its wake, and the surface, where velocity and pressure gradients are highest, is finest.',
    'Cells per region N = V / h³ with h = h0 / 2^n (h0 = base, n = level), for cubic octree cells.',
    mode === 'nested'
      ? "Zones nest: each zone is given whole and the zones of a level lie inside those of the next coarser level, so a level's own volume is its zones' volume less the next finer level's (shared in proportion to volume), and the background is the domain less the coarsest zones. No volume is counted twice."
      : "Zones are exclusive: each zone's volume is the volume at its level only, and the background is the domain less all zones.",
    solid ? "The body's own volume (solid) is taken out of the domain." : "The body's own volume is counted as fluid unless solid: is given (to cell_budget, and to box zones that hold the body).",
  ];
  if (b.bandFrom !== undefined) {
    r.push(`Surface band N_s = A / h_s² (one cell of size h_s = h0 / 2^n_s across, over the area A); its volume A h_s is taken out of ${b.bandFrom}, next to the wall.`);
  }
  if (b.layerCells > 0) {
    r.push('Wall layers N_layer = count × A / h_s²: one cell per surface face per layer; layers push the surface cells out rather than replace them, so the surface cells keep their count.');
  }
  r.push(
    `Tetrahedral equivalent: ${numberText(tetPerHex)} tetrahedra per hexahedron (a cube splits into 5 or 6 tetrahedra, geometry), and ${LAYER_FACES.tet} prisms per hexahedral layer cell (two triangles per square face).`,
    `Polyhedral equivalent: the tetrahedral count / ${numberText(tetPerPoly)} (a polyhedral mesh needs about a quarter to a fifth the cells of a tetrahedral one at equal resolution, common practice), and ${LAYER_FACES.poly} layer cell per hexahedral one (about one polygon per square face).`,
    `Memory ${numberText(siArg(args, 'memory_per_million'))} GB and CPU time ${numberText(siArg(args, 'cpu_per_million', 'h'))} h per million cells per 1000 iterations, for ${numberText(iterations)} iterations: common-practice figures for a segregated incompressible RANS solver (about 1–2 GB per million cells); set memory_per_million and cpu_per_million from your own runs.`,
    `Transition cells between levels are not counted; keep nested regions within ${MAX_LEVEL_JUMP} levels of each other.`,
  );
  return r;
}

export const domainEntries: TradeFunction[] = [domain, domain_study, refinement, zone, cell_budget];
