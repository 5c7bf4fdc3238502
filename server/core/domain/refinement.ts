// Octree refinement levels: each level halves the cell edge, so level n has
// size h0/2^n and reaching a target size h takes ceil(log2(h0/h)) halvings
// (the definition of octree cell splitting; e.g. Yerry & Shephard 1984,
// modified-octree mesh generation, Int. J. Numer. Meth. Eng. 20; from memory).
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';

/** More halvings than this make cells a billionth of the base size: surely a typing error. */
export const MAX_LEVEL = 30;

/** Cell edge at level n of an octree whose level-0 cells have edge `base`. */
export function levelSize(base: number, level: number): number {
  return base / Math.pow(2, level);
}

/** Whole halvings from base to target or finer; a ratio a hair above a power of two (0.8/0.1) is that power. */
export function levelsFor(base: number, target: number): number {
  if (!(Number.isFinite(base) && base > 0)) throw new TradeError(`base must be a positive cell size, not ${numberText(base)} m`);
  if (!(Number.isFinite(target) && target > 0)) throw new TradeError(`target must be a positive cell size, not ${numberText(target)} m`);
  if (target >= base) return 0;
  const levels = Math.ceil(Math.log2(base / target) - 1e-9);
  if (levels > MAX_LEVEL) throw new TradeError(`reaching ${numberText(target)} m from ${numberText(base)} m takes ${levels} halvings, more than the ${MAX_LEVEL} a sheet may ask for`);
  return levels;
}

export interface Refinement {
  levels: number;
  /** Cell size at levels 0 … levels. */
  sizes: number[];
}

export function refinement(base: number, target: number): Refinement {
  const levels = levelsFor(base, target);
  return { levels, sizes: Array.from({ length: levels + 1 }, (_, n) => levelSize(base, n)) };
}

/** A refinement level given on the sheet: a whole number from 0 to MAX_LEVEL. */
export function checkLevel(level: number, what = 'level'): number {
  const n = Math.round(level);
  if (!Number.isFinite(level) || Math.abs(level - n) > 1e-9 || n < 0) throw new TradeError(`${what} must be a whole number of halvings, 0 or more, not ${numberText(level)}`);
  if (n > MAX_LEVEL) throw new TradeError(`${what} ${n} is more than the ${MAX_LEVEL} halvings a sheet may ask for`);
  return n;
}
