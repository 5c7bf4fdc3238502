// Cell budget of an octree (hexahedral) background mesh: each region holds
// its fluid volume / h³ cells with h = h0/2^level (the octree halving rule);
// the surface band holds area / h_s² cells (one cell layer thick); a wall-layer
// stack adds area / h_s² cells per layer. Tetrahedral and polyhedral counts
// follow from stated ratios (a cube splits into 5 or 6 tetrahedra; a
// polyhedral mesh has about a quarter to a fifth the cells of a tetrahedral
// one, common practice); memory and CPU time from per-million figures (common
// practice).
import { TradeError } from '../shared/trade-error.js';
import { lengthText, numberText } from '../shared/words.js';
import { STACK_LIMITS } from '../wall/layer-stack.js';
import { levelSize } from './refinement.js';
import type { ZoneKind } from './zones.js';

export const VOLUME_MODES = ['nested', 'exclusive'] as const;
export type VolumeMode = (typeof VOLUME_MODES)[number];

/** Neighbouring regions more than this many levels apart leave a wide grading to the mesher (common practice). */
export const MAX_LEVEL_JUMP = 2;
/** Layer faces per quadrilateral face: a triangulated surface has two triangles per square, a polygonal one about one polygon (one per triangulation vertex; Euler's relation F ≈ 2V). */
export const LAYER_FACES = { tet: 2, poly: 1 } as const;

export interface BudgetZone {
  label: string;
  kind: ZoneKind;
  level: number;
  /** Fluid volume of the zone: its whole volume ("nested") or its own ("exclusive"). */
  volume: number;
}

export interface BudgetInput {
  /** Fluid volume of the domain. */
  volume: number;
  /** Level-0 (background) cell size h0. */
  base: number;
  zones: readonly BudgetZone[];
  mode: VolumeMode;
  surface?: { area: number; level: number };
  layers?: { count: number; last: number; total: number };
  tetPerHex: number;
  tetPerPoly: number;
  /** GB per million cells. */
  memoryPerMillion: number;
  /** CPU-hours per million cells per 1000 iterations. */
  cpuPerMillion: number;
  iterations: number;
}

export interface BudgetRow {
  label: string;
  /** Level, or "layers" for the wall-layer row. */
  level: number | 'layers';
  size: number;
  volume: number;
  cells: number;
}

export interface Budget {
  rows: BudgetRow[];
  volumeCells: number;
  surfaceCells: number;
  layerCells: number;
  cells: number;
  tetCells: number;
  polyCells: number;
  memory: number;
  cpuHours: number;
  /** Where the surface band's volume was taken from. */
  bandFrom?: string;
  warnings: string[];
}

const SLACK = 1e-9;

export function cellBudget(input: BudgetInput): Budget {
  checkInput(input);
  const warnings: string[] = [];
  const own = input.mode === 'nested' ? nestedVolumes(input) : exclusiveVolumes(input);
  const background = input.volume - (input.mode === 'nested' ? coarsestTotal(input.zones) : sum(input.zones.map((z) => z.volume)));

  let surfaceCells = 0;
  let bandFrom: string | undefined;
  let backgroundOwn = background;
  const h = (level: number) => levelSize(input.base, level);
  const surfaceRows: BudgetRow[] = [];
  if (input.surface) {
    const { area, level } = input.surface;
    const hs = h(level);
    surfaceCells = area / (hs * hs);
    const band = area * hs;
    const next = adjacentZones(input.zones);
    const nextLevel = next.length ? input.zones[next[0]!]!.level : 0;
    bandFrom = next.length ? next.map((i) => input.zones[i]!.label).join(', ') : 'the background';
    const from = next.length ? sum(next.map((i) => own[i]!)) : backgroundOwn;
    if (band > from * (1 + SLACK)) {
      warnings.push(
        `the surface band (area × surface cell = ${numberText(band)} m³) is larger than the ${numberText(from)} m³ of ${bandFrom} next to the wall; ` +
          'the zone there is thinner than one surface cell: make it thicker, or raise its level to meet the surface level.',
      );
    }
    const keep = from > 0 ? Math.max(0, 1 - band / from) : 0;
    if (next.length) for (const i of next) own[i] = own[i]! * keep;
    else backgroundOwn *= keep;
    if (level < nextLevel) {
      warnings.push(`the surface level ${level} is coarser than level ${nextLevel} of ${bandFrom} next to it; the surface is usually the finest level, where the gradients are highest.`);
    } else if (level - nextLevel > MAX_LEVEL_JUMP) {
      warnings.push(jumpWarning(nextLevel, level, `the surface (level ${level})`));
    }
    surfaceRows.push({ label: 'surface band', level, size: hs, volume: band, cells: surfaceCells });
  }

  const rows: BudgetRow[] = [{ label: 'background', level: 0, size: input.base, volume: backgroundOwn, cells: backgroundOwn / input.base ** 3 }];
  const order = input.zones.map((_, i) => i).sort((a, b) => input.zones[a]!.level - input.zones[b]!.level);
  for (const i of order) {
    const z = input.zones[i]!;
    const size = h(z.level);
    rows.push({ label: z.label, level: z.level, size, volume: own[i]!, cells: own[i]! / size ** 3 });
  }
  rows.push(...surfaceRows);

  let layerCells = 0;
  if (input.layers) {
    if (!input.surface) throw new TradeError('layers are counted on the surface: give surface: zone(area: …, level: …) with the layers');
    const hs = h(input.surface.level);
    layerCells = (input.layers.count * input.surface.area) / (hs * hs);
    rows.push({ label: `wall layers (${input.layers.count})`, level: 'layers', size: hs, volume: input.surface.area * input.layers.total, cells: layerCells });
    const jump = hs / input.layers.last;
    if (jump > STACK_LIMITS.jump) {
      warnings.push(
        `the surface cells (${lengthText(hs)}) are ${numberText(jump)} × the last wall layer (${lengthText(input.layers.last)}), above about ${STACK_LIMITS.jump} (common practice); ` +
          'add layers, grow them faster within the usual 1.3, or refine the surface a level.',
      );
    }
  }

  const levels = [...new Set([0, ...input.zones.map((z) => z.level)])].sort((a, b) => a - b);
  for (let k = 1; k < levels.length; k++) {
    if (levels[k]! - levels[k - 1]! > MAX_LEVEL_JUMP) {
      const names = input.zones.filter((z) => z.level === levels[k]).map((z) => z.label);
      warnings.push(jumpWarning(levels[k - 1]!, levels[k]!, `${names.length > 1 ? 'the zones' : 'the zone'} ${names.join(', ')} (level ${levels[k]})`, names.length > 1));
    }
  }

  const volumeCells = sum(rows.filter((r) => r.level !== 'layers').map((r) => r.cells));
  const cells = volumeCells + layerCells;
  return {
    rows,
    volumeCells,
    surfaceCells,
    layerCells,
    cells,
    tetCells: volumeCells * input.tetPerHex + layerCells * LAYER_FACES.tet,
    polyCells: (volumeCells * input.tetPerHex) / input.tetPerPoly + layerCells * LAYER_FACES.poly,
    memory: (cells / 1e6) * input.memoryPerMillion,
    cpuHours: (cells / 1e6) * input.cpuPerMillion * (input.iterations / 1000),
    ...(bandFrom === undefined ? {} : { bandFrom }),
    warnings,
  };
}

function checkInput(input: BudgetInput): void {
  const positive: Array<[string, number]> = [
    ['the domain volume', input.volume],
    ['base', input.base],
    ['tet_per_hex', input.tetPerHex],
    ['tet_per_poly', input.tetPerPoly],
    ['memory_per_million', input.memoryPerMillion],
    ['cpu_per_million', input.cpuPerMillion],
    ['iterations', input.iterations],
  ];
  for (const [name, v] of positive) if (!(Number.isFinite(v) && v > 0)) throw new TradeError(`${name} must be positive, not ${numberText(v)}`);
  for (const z of input.zones) if (!(Number.isFinite(z.volume) && z.volume >= 0)) throw new TradeError(`zone ${z.label} has no usable volume (${numberText(z.volume)} m³)`);
  if (input.surface && !(input.surface.area > 0)) throw new TradeError('the surface area must be positive');
}

function sum(xs: readonly number[]): number {
  let s = 0;
  for (const x of xs) s += x;
  return s;
}

function levelTotals(zones: readonly BudgetZone[]): Map<number, number> {
  const totals = new Map<number, number>();
  for (const z of zones) totals.set(z.level, (totals.get(z.level) ?? 0) + z.volume);
  return totals;
}

function coarsestTotal(zones: readonly BudgetZone[]): number {
  if (zones.length === 0) return 0;
  const totals = levelTotals(zones);
  return totals.get(Math.min(...totals.keys()))!;
}

/**
 * Nested: the zones of each level lie inside those of the next coarser level,
 * so a level's own volume is its zones' volume less the next finer level's,
 * shared among its zones in proportion to their volumes.
 */
function nestedVolumes(input: BudgetInput): number[] {
  const totals = levelTotals(input.zones);
  const levels = [...totals.keys()].sort((a, b) => a - b);
  if (levels.length && totals.get(levels[0]!)! > input.volume * (1 + SLACK)) {
    throw new TradeError(`the level-${levels[0]} zones hold ${numberText(totals.get(levels[0]!)!)} m³, more than the domain's ${numberText(input.volume)} m³ of fluid; check the zone sizes`);
  }
  const inner = new Map<number, number>();
  levels.forEach((lv, k) => {
    const finer = k + 1 < levels.length ? totals.get(levels[k + 1]!)! : 0;
    const here = totals.get(lv)!;
    if (finer > here * (1 + SLACK)) {
      throw new TradeError(
        `the level-${levels[k + 1]} zones hold ${numberText(finer)} m³, more than the ${numberText(here)} m³ of the level-${lv} zones they lie in; ` +
          'zones nest (each finer zone inside a coarser one), or give volumes: "exclusive" when each zone\'s volume is its own',
      );
    }
    inner.set(lv, finer);
  });
  return input.zones.map((z) => {
    const here = totals.get(z.level)!;
    return here > 0 ? z.volume - (z.volume / here) * inner.get(z.level)! : 0;
  });
}

function exclusiveVolumes(input: BudgetInput): number[] {
  const total = sum(input.zones.map((z) => z.volume));
  if (total > input.volume * (1 + SLACK)) {
    throw new TradeError(`the zones hold ${numberText(total)} m³ together, more than the domain's ${numberText(input.volume)} m³ of fluid; with volumes: "exclusive" no two zones may overlap`);
  }
  return input.zones.map((z) => z.volume);
}

/** The zones next to the wall: the finest shells, or without shells the finest zones; none means the background. */
function adjacentZones(zones: readonly BudgetZone[]): number[] {
  const shells = zones.map((z, i) => [z, i] as const).filter(([z]) => z.kind === 'shell');
  const pool = shells.length ? shells : zones.map((z, i) => [z, i] as const);
  if (pool.length === 0) return [];
  const finest = Math.max(...pool.map(([z]) => z.level));
  return pool.filter(([z]) => z.level === finest).map(([, i]) => i);
}

function jumpWarning(from: number, to: number, what: string, plural = false): string {
  return (
    `${what} ${plural ? 'are' : 'is'} ${to - from} levels finer than the level-${from} region around it; octree meshes keep neighbouring cells within one level, ` +
    `so the grading between them adds cells this budget does not count (common practice: at most ${MAX_LEVEL_JUMP} levels between nested regions); add an intermediate zone.`
  );
}
