// Wall-layer (prism) stacks as a geometric series: layer i has height
// first·growth^i, so total = first (growth^count − 1)/(growth − 1) and
// last = first·growth^(count−1). Any three of the four give the fourth.
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';

export type StackUnknown = 'first' | 'growth' | 'count' | 'total';

export interface StackGiven {
  first?: number;
  growth?: number;
  count?: number;
  total?: number;
}

export interface Stack {
  first: number;
  growth: number;
  count: number;
  total: number;
  last: number;
  heights: number[];
  solved: StackUnknown;
  /** The total asked for, when the count was solved and rounded up. */
  askedTotal?: number;
}

/** Keeps a mistyped total from building a list the sheet cannot show. */
export const MAX_LAYERS = 10000;

/** Σ_{i<n} g^i, written with expm1/log1p so that g close to 1 keeps its digits. */
export function seriesSum(g: number, n: number): number {
  if (g === 1) return n;
  return Math.expm1(n * Math.log1p(g - 1)) / (g - 1);
}

/** Solves the one missing quantity of the geometric series; a solved count is rounded up. */
export function solveStack(given: StackGiven): Stack {
  const names: StackUnknown[] = ['first', 'growth', 'count', 'total'];
  const missing = names.filter((k) => given[k] === undefined);
  if (missing.length !== 1) {
    const have = names.filter((k) => given[k] !== undefined);
    throw new TradeError(
      `give exactly three of first, growth, count and total (given: ${have.length ? have.join(', ') : 'none'})`,
    );
  }
  checkPositive(given);
  const unknown = missing[0]!;
  switch (unknown) {
    case 'total':
      return build(given.first!, given.growth!, wholeCount(given.count!), 'total');
    case 'first': {
      const n = wholeCount(given.count!);
      return build(given.total! / seriesSum(given.growth!, n), given.growth!, n, 'first');
    }
    case 'growth': {
      const n = wholeCount(given.count!);
      return build(given.first!, solveGrowth(given.total! / given.first!, n), n, 'growth');
    }
    case 'count': {
      const n = solveCount(given.first!, given.growth!, given.total!);
      const s = build(given.first!, given.growth!, n, 'count');
      return { ...s, askedTotal: given.total! };
    }
  }
}

function checkPositive(given: StackGiven): void {
  for (const [k, v] of Object.entries(given)) {
    if (v !== undefined && !(Number.isFinite(v) && v > 0)) throw new TradeError(`${k} must be a positive number, not ${v}`);
  }
}

function wholeCount(count: number): number {
  const n = Math.round(count);
  if (Math.abs(count - n) > 1e-9 || n < 1) throw new TradeError(`count must be a whole number of layers, not ${count}`);
  if (n > MAX_LAYERS) throw new TradeError(`count ${n} is more than the ${MAX_LAYERS} layers a stack may have`);
  return n;
}

function build(first: number, growth: number, count: number, solved: StackUnknown): Stack {
  const heights = Array.from({ length: count }, (_, i) => first * Math.pow(growth, i));
  return { first, growth, count, total: first * seriesSum(growth, count), last: heights[count - 1]!, heights, solved };
}

/** Whole number of layers whose sum first reaches `total` (rounded up). */
function solveCount(first: number, growth: number, total: number): number {
  const ratio = total / first;
  let exact: number;
  if (growth === 1) exact = ratio;
  else {
    const arg = 1 + ratio * (growth - 1);
    if (arg <= 0) {
      throw new TradeError(
        `with growth ${numberText(growth)} the layers shrink and their sum never passes ${numberText(1 / (1 - growth), { digits: 4 })} × first, short of the total`,
      );
    }
    exact = Math.log(arg) / Math.log(growth);
  }
  // A total that is an exact series sum must not gain a layer from rounding noise.
  const n = Math.max(1, Math.ceil(exact - 1e-9));
  if (n > MAX_LAYERS) throw new TradeError(`the total needs ${n} layers, more than the ${MAX_LAYERS} a stack may have`);
  return n;
}

/**
 * Growth ratio g with Σ_{i<n} g^i = ratio. The sum rises steadily with g, so a
 * bracket [lo, hi] is widened until it holds the root and then halved (bisection).
 */
export function solveGrowth(ratio: number, n: number): number {
  if (n === 1) {
    if (Math.abs(ratio - 1) < 1e-12) return 1;
    throw new TradeError('a single layer has no growth ratio unless total equals first');
  }
  if (ratio <= 1) throw new TradeError(`total must be more than first when there are ${n} layers`);
  if (Math.abs(ratio - n) <= 1e-12 * n) return 1;
  const f = (g: number) => seriesSum(g, n) - ratio;
  let lo: number;
  let hi: number;
  if (ratio > n) {
    lo = 1;
    hi = 2;
    while (f(hi) < 0) {
      lo = hi;
      hi *= 2;
      if (hi > 1e6) throw new TradeError('no growth ratio below 1e6 reaches that total');
    }
  } else {
    hi = 1;
    lo = 0.5;
    while (f(lo) > 0) {
      hi = lo;
      lo /= 2;
      if (lo < 1e-12) throw new TradeError('no positive growth ratio gives that total');
    }
  }
  for (let i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) < 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Layers whose top lies at or below the boundary-layer edge. */
export function layersInside(heights: readonly number[], delta: number): number {
  let top = 0;
  let inside = 0;
  for (const h of heights) {
    top += h;
    if (top > delta * (1 + 1e-12)) break;
    inside++;
  }
  return inside;
}

/**
 * Rules of thumb for stacks (common practice; e.g. COST 732 and AIJ guidelines, stretching
 * below 1.3); more than about 100 layers means a typing slip or a total far past δ.
 */
export const STACK_LIMITS = { growth: 1.3, jump: 2, cellsAcross: 10, count: 100 } as const;
