import { describe, expect, it } from 'vitest';
import { num, si, str, TradeError } from '../../server/core/index.js';
import { layersInside, seriesSum, solveStack } from '../../server/core/wall/layer-stack.js';
import { asRecord, call, relErr, siField } from './wall-helpers.js';

// Finite geometric series (standard algebra): Σ_{i<n} y1 g^i = y1 (g^n − 1)/(g − 1); last term y1 g^(n−1).
const seriesTotal = (y1: number, g: number, n: number) => (y1 * (g ** n - 1)) / (g - 1);

const Y1 = 1e-5;
const G = 1.2;
const N = 10;
const TOTAL = seriesTotal(Y1, G, N);

describe('layer stack as a geometric series', () => {
  it('solves total and last from first, growth and count', () => {
    const s = solveStack({ first: Y1, growth: G, count: N });
    expect(s.solved).toBe('total');
    expect(relErr(s.total, TOTAL)).toBeLessThan(1e-12);
    expect(relErr(s.last, Y1 * G ** (N - 1))).toBeLessThan(1e-12);
    expect(s.heights).toHaveLength(N);
    expect(relErr(s.heights.reduce((a, b) => a + b, 0), TOTAL)).toBeLessThan(1e-12);
  });

  it('solves growth from first, count and total, and round-trips', () => {
    const s = solveStack({ first: Y1, count: N, total: TOTAL });
    expect(s.solved).toBe('growth');
    expect(Math.abs(s.growth - G)).toBeLessThan(1e-12);
    const back = solveStack({ first: Y1, growth: s.growth, count: N });
    expect(relErr(back.total, TOTAL)).toBeLessThan(1e-12);
  });

  it('solves a growth ratio below 1 when the total is less than count × first', () => {
    const total = seriesTotal(Y1, 0.9, 8);
    expect(Math.abs(solveStack({ first: Y1, count: 8, total }).growth - 0.9)).toBeLessThan(1e-12);
  });

  it('solves growth 1 for a uniform stack', () => {
    expect(solveStack({ first: Y1, count: 12, total: 12 * Y1 }).growth).toBeCloseTo(1, 12);
  });

  it('solves first from growth, count and total, and round-trips', () => {
    const s = solveStack({ growth: G, count: N, total: TOTAL });
    expect(relErr(s.first, Y1)).toBeLessThan(1e-12);
    expect(relErr(solveStack({ first: s.first, growth: G, count: N }).total, TOTAL)).toBeLessThan(1e-12);
  });

  it('solves count as whole layers: an exact series total gives back the count', () => {
    const s = solveStack({ first: Y1, growth: G, total: TOTAL });
    expect(s.count).toBe(N);
    expect(relErr(s.total, TOTAL)).toBeLessThan(1e-12);
  });

  it('rounds a solved count up and reports the resulting total', () => {
    const s = solveStack({ first: Y1, growth: G, total: TOTAL * 1.01 });
    expect(s.count).toBe(N + 1);
    expect(relErr(s.total, seriesTotal(Y1, G, N + 1))).toBeLessThan(1e-12);
    expect(s.askedTotal).toBe(TOTAL * 1.01);
  });

  it('keeps digits near growth 1, where (g^n − 1)/(g − 1) would cancel', () => {
    // Σ g^i = n + n(n−1)/2 (g−1) + O((g−1)²), the series expanded about g = 1.
    const g = 1 + 1e-9;
    expect(relErr(seriesSum(g, 50), 50 + (50 * 49) / 2 * 1e-9)).toBeLessThan(1e-12);
  });

  it('solves growth above 2 and below 0.5 by widening its bracket, and says when none reaches', () => {
    // Three layers of ratio 3: 1 + 3 + 9 = 13 first layers; of ratio 0.25: 1 + 0.25 + 0.0625.
    expect(solveStack({ first: Y1, count: 3, total: 13 * Y1 }).growth).toBeCloseTo(3, 12);
    expect(solveStack({ first: Y1, count: 3, total: 1.3125 * Y1 }).growth).toBeCloseTo(0.25, 12);
    expect(() => solveStack({ first: Y1, count: 2, total: 3e6 * Y1 })).toThrow('no growth ratio below 1e6 reaches that total');
    expect(() => solveStack({ first: Y1, count: 3, total: (1 + 1e-13) * Y1 })).toThrow('no positive growth ratio gives that total');
  });

  it('a single layer has growth 1 only when total equals first', () => {
    expect(solveStack({ first: Y1, count: 1, total: Y1 }).growth).toBe(1);
    expect(() => solveStack({ first: Y1, count: 1, total: 2 * Y1 })).toThrow('a single layer has no growth ratio unless total equals first');
    expect(solveStack({ first: Y1, growth: G, count: 1 }).total).toBe(Y1);
  });

  it('allows up to 10000 layers and no more, given or solved', () => {
    expect(solveStack({ first: Y1, growth: 1, count: 10000 }).count).toBe(10000);
    expect(() => solveStack({ first: Y1, growth: 1, count: 10001 })).toThrow('count 10001 is more than the 10000 layers a stack may have');
    expect(solveStack({ first: Y1, growth: 1, total: 10000 * Y1 }).count).toBe(10000);
    expect(() => solveStack({ first: Y1, growth: 1, total: 10000.5 * Y1 })).toThrow('the total needs 10001 layers, more than the 10000 a stack may have');
    expect(() => solveStack({ first: Y1, growth: G, count: 0.4 })).toThrow('count must be a whole number of layers, not 0.4');
    expect(solveStack({ first: Y1, growth: 1, total: 12 * Y1 }).count).toBe(12);
  });

  it('solves the count for layers that shrink, while their sum can still reach the total', () => {
    // growth 0.5: the sum approaches 2 first layers; 1.75 first is three layers.
    expect(solveStack({ first: Y1, growth: 0.5, total: 1.75 * Y1 }).count).toBe(3);
    expect(() => solveStack({ first: Y1, growth: 0.5, total: 2 * Y1 })).toThrow('with growth 0.5 the layers shrink and their sum never passes 2 × first, short of the total');
  });

  it('a uniform stack is count × first thick, and its growth is exactly 1 within 1e-12 of count', () => {
    expect(solveStack({ first: 1, count: 12, total: 12 * (1 + 5e-13) }).growth).toBe(1);
    expect(solveStack({ first: Y1, growth: 1, count: 7 }).total).toBe(7 * Y1);
    expect(solveStack({ first: Y1, count: 12, total: 12 * Y1 }).growth).toBe(1);
    expect(solveStack({ growth: G, count: N, total: TOTAL }).solved).toBe('first');
  });

  it('refuses a count that rounds to no layer, a total no more than first, and says where shrinking layers stop', () => {
    expect(() => solveStack({ first: Y1, growth: G, count: 1e-10 })).toThrow('count must be a whole number of layers, not 1e-10');
    expect(() => solveStack({ first: Y1, count: 3, total: Y1 })).toThrow('total must be more than first when there are 3 layers');
    // growth 0.7: the sum approaches 1/(1 − 0.7) = 3.333 first layers.
    expect(() => solveStack({ first: Y1, growth: 0.7, total: 4 * Y1 })).toThrow('with growth 0.7 the layers shrink and their sum never passes 3.333 × first, short of the total');
  });

  it('counts a layer whose top meets the boundary-layer edge as inside it, float noise and all', () => {
    // Five layers of 1 mm sum to 5.000000000000001 mm in floating point; δ = 5 mm holds all five.
    expect(layersInside([1e-3, 1e-3, 1e-3, 1e-3, 1e-3], 5e-3)).toBe(5);
    expect(layersInside([1e-3, 1e-3, 1e-3, 1e-3, 1e-3], 4.999e-3)).toBe(4);
  });

  it('refuses anything but exactly three of the four, and impossible stacks', () => {
    expect(() => solveStack({ first: Y1, growth: G })).toThrow('give exactly three of first, growth, count and total (given: first, growth)');
    expect(() => solveStack({})).toThrow('give exactly three of first, growth, count and total (given: none)');
    expect(() => solveStack({ first: 0, growth: G, count: N })).toThrow('first must be a positive number, not 0');
    expect(() => solveStack({ first: Y1, growth: G, count: N, total: TOTAL })).toThrow(/exactly three/);
    expect(() => solveStack({ first: Y1, growth: G, count: 2.5 })).toThrow(/whole number/);
    expect(() => solveStack({ first: Y1, count: 5, total: Y1 / 2 })).toThrow(/more than first/);
    expect(() => solveStack({ first: Y1, growth: 0.5, total: 10 * Y1 })).toThrow(/never passes/);
    expect(() => solveStack({ first: -Y1, growth: G, count: N })).toThrow(/positive/);
  });
});

describe('layer_stack entry', () => {
  const base = { scale: str('linear') };

  it('adds jump, inside and coverage and draws the stack to scale', () => {
    const delta = 1.5e-4;
    const core = 1e-4;
    const r = asRecord(call('layer_stack', { first: si(Y1, 'm'), growth: num(G), count: num(N), core: si(core, 'm'), delta: si(delta, 'm'), ...base }));
    expect([...r.fields.keys()]).toEqual(['first', 'growth', 'count', 'total', 'last', 'heights', 'jump', 'inside', 'coverage']);
    expect(relErr(siField(r, 'jump'), core / (Y1 * G ** (N - 1)))).toBeLessThan(1e-12);
    // Layers whose top lies below δ, counted here from the partial sums of the series.
    let inside = 0;
    while (inside < N && seriesTotal(Y1, G, inside + 1) <= delta) inside++;
    expect(siField(r, 'inside')).toBe(inside);
    expect(relErr(siField(r, 'coverage'), TOTAL / delta)).toBeLessThan(1e-12);
    const heights = r.fields.get('heights')!.value;
    expect(heights.kind === 'list' && heights.items.length).toBe(N);
    expect(r.figure?.svg).toMatch(/^<svg[^>]*viewBox="0 0 \d+ \d+"/);
    expect(r.figure?.svg).toMatch(/boundary-layer edge δ = 150 µm/);
    expect(r.figure?.svg).not.toMatch(/<script|on\w+=/i);
  });

  it('flags growth above 1.3, a jump above 2 and fewer than ten cells across δ (common practice)', () => {
    const r = asRecord(call('layer_stack', { first: si(1e-4, 'm'), growth: num(1.4), count: num(5), core: si(5e-3, 'm'), delta: si(2e-3, 'm'), ...base }));
    const text = r.warnings.join('\n');
    expect(text).toMatch(/growth ratio 1.4 is above about 1.3/);
    expect(text).toMatch(/core cell is .* above about 2/);
    expect(text).toMatch(/cells lie across the boundary layer/);
  });

  it('flags an implausible layer count: 1 µm growing by 1 % to 1 km takes 1620 layers (common practice: up to about 100)', () => {
    // The count solved by hand: n = ln(1 + (total/first)(g − 1))/ln g, rounded up (geometric series).
    const n = Math.ceil(Math.log(1 + (1e3 / 1e-6) * 0.01) / Math.log(1.01));
    expect(n).toBe(1620);
    const r = asRecord(call('layer_stack', { first: si(1e-6, 'm'), growth: num(1.01), total: si(1e3, 'm'), ...base }));
    expect(siField(r, 'count')).toBe(n);
    expect(r.warnings.join(' ')).toMatch(/1620 layers is far more than a wall-layer stack usually has \(up to about 100, common practice\)/);
    const usual = asRecord(call('layer_stack', { first: si(Y1, 'm'), growth: num(1.1), count: num(100), ...base }));
    expect(usual.warnings.join(' ')).not.toMatch(/layers is far more/);
  });

  it('raises no flag for a gentle, well-matched stack', () => {
    const r = asRecord(call('layer_stack', { first: si(Y1, 'm'), growth: num(1.15), count: num(30), core: si(1.2 * Y1 * 1.15 ** 29, 'm'), delta: si(1e-3, 'm'), ...base }));
    expect(r.warnings).toEqual([]);
  });

  it('the log-scale picture shows each thin layer the linear one merges', () => {
    const args = { first: si(2e-5, 'm'), growth: num(1.2), total: si(30e-3, 'm'), delta: si(60e-3, 'm') };
    const lin = asRecord(call('layer_stack', { ...args, scale: str('linear') })).figure!.svg;
    const log = asRecord(call('layer_stack', { ...args, scale: str('log') })).figure!.svg;
    expect(lin).toMatch(/not drawn separately/);
    expect(log).not.toMatch(/not drawn separately/);
    expect(log).toMatch(/log scale/);
  });

  it('turns bad input into a sheet error', () => {
    expect(() => call('layer_stack', { first: si(Y1, 'm'), ...base })).toThrow(TradeError);
    expect(() => call('layer_stack', { first: si(Y1, 'm'), growth: num(G), count: num(N), scale: str('cubic') })).toThrow(/scale "cubic" is not one of/);
  });
});
