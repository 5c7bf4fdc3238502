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
  ['J', [1, 2, -2, 0, 0, 0, 0]],
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
