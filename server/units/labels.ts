// Names for SI dimensions as engineers write them: a derived unit where one
// fits the dimension exactly, base units otherwise.
import { type Dims, baseUnitText, dimsKey } from './dims.js';

const NAMED: Array<[string, Dims]> = [
  ['m', [0, 1, 0, 0, 0, 0, 0]],
  ['s', [0, 0, 1, 0, 0, 0, 0]],
  ['kg', [1, 0, 0, 0, 0, 0, 0]],
  ['K', [0, 0, 0, 0, 1, 0, 0]],
  ['m/s', [0, 1, -1, 0, 0, 0, 0]],
  ['m/s^2', [0, 1, -2, 0, 0, 0, 0]],
  ['m^2', [0, 2, 0, 0, 0, 0, 0]],
  ['m^3', [0, 3, 0, 0, 0, 0, 0]],
  ['m^2/s', [0, 2, -1, 0, 0, 0, 0]],
  ['m^3/s', [0, 3, -1, 0, 0, 0, 0]],
  ['m^2/s^2', [0, 2, -2, 0, 0, 0, 0]],
  ['m^2/s^3', [0, 2, -3, 0, 0, 0, 0]],
  ['1/s', [0, 0, -1, 0, 0, 0, 0]],
  ['kg/m^3', [1, -3, 0, 0, 0, 0, 0]],
  ['kg/s', [1, 0, -1, 0, 0, 0, 0]],
  ['Pa', [1, -1, -2, 0, 0, 0, 0]],
  ['Pa s', [1, -1, -1, 0, 0, 0, 0]],
  ['N', [1, 1, -2, 0, 0, 0, 0]],
  // Force times length: in an external-flow set-up that is a moment (a drag force's arm), far more often than an energy.
  ['N m', [1, 2, -2, 0, 0, 0, 0]],
  ['W', [1, 2, -3, 0, 0, 0, 0]],
  ['J/(kg K)', [0, 2, -2, 0, -1, 0, 0]],
  ['W/(m K)', [1, 1, -3, 0, -1, 0, 0]],
  ['W/m^2', [1, 0, -3, 0, 0, 0, 0]],
  ['N/m', [1, 0, -2, 0, 0, 0, 0]],
  ['K/m', [0, -1, 0, 0, 1, 0, 0]],
];
const byDims = new Map(NAMED.map(([t, d]) => [dimsKey(d), t]));

/** The SI unit text for a dimension: "Pa s", "m^2/s", or base units. */
export function unitLabel(d: Dims): string {
  return byDims.get(dimsKey(d)) ?? baseUnitText(d);
}

/** Units that take an engineering prefix when shown (23 µm, 4.2 kPa). */
export const PREFIXABLE = new Set(['m', 's', 'Pa', 'N', 'W', 'J', 'N m']);

const PREFIXES: Array<[string, number]> = [
  ['G', 1e9],
  ['M', 1e6],
  ['k', 1e3],
  ['', 1],
  ['m', 1e-3],
  ['µ', 1e-6],
  ['n', 1e-9],
];
// Prefixes that read naturally on each unit, as engineers write them: no Mm
// or ks, and no mPa (a wall shear stress is written 0.41 Pa).
const ALLOWED: Record<string, string> = { m: 'kmµn', s: 'mµn', Pa: 'GMk', N: 'Mkm', W: 'GMkm', J: 'GMkm', 'N m': 'km' };

/** The prefix that puts a magnitude of a PREFIXABLE unit between 1 and 1000 (µ for 2.3e-5 m), or null. */
export function engineeringPrefix(label: string, magnitude: number): { prefix: string; factor: number } | null {
  const allowed = ALLOWED[label];
  if (!PREFIXABLE.has(label) || allowed === undefined) return null;
  for (const [prefix, factor] of PREFIXES) {
    if (prefix !== '' && !allowed.includes(prefix)) continue;
    if (magnitude >= factor && magnitude < factor * 1000) return { prefix, factor };
  }
  return null;
}
