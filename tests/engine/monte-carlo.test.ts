// propagate(y, samples:, seed:): the Monte Carlo method of JCGM 101:2008
// (GUM Supplement 1) on the sheet's graph, against distributions whose
// moments and quantiles are known exactly, and against the first-order
// result where the model is linear (JCGM 101 §8).
import { describe, expect, it } from 'vitest';
import { numericalTolerance, shortestInterval, symmetricInterval, Xoshiro128 } from '../../server/evaluate/monte-carlo.js';
import { sheet } from './helpers.js';

const fields = (r: Awaited<ReturnType<typeof sheet>>, name: string) => {
  const f = r.values[name]?.fields;
  if (!f) throw new Error(`${name} is no record: ${JSON.stringify(r.errors)}`);
  return Object.fromEntries(Object.entries(f).map(([k, v]) => [k, v.si ?? v.display]));
};

const additive = (spec: string) => ['x1 = 0 ± ' + spec, 'x2 = 0 ± ' + spec, 'x3 = 0 ± ' + spec, 'x4 = 0 ± ' + spec, 'y = x1 + x2 + x3 + x4'];

/** The CDF of the sum of four independent U(0, 1) (the Irwin–Hall distribution, n = 4). */
function irwinHall4(x: number): number {
  const binom = [1, 4, 6, 4, 1];
  let s = 0;
  for (let k = 0; k <= Math.min(4, Math.floor(x)); k++) s += (-1) ** k * binom[k]! * (x - k) ** 4;
  return s / 24;
}

function bisect(f: (x: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

describe('propagate(): the Monte Carlo method of JCGM 101:2008', () => {
  it('reproduces the additive model with normal inputs (JCGM 101:2008 §9.2.2): u(y) = 2, 95 % interval ±3.92', async () => {
    // Y = X1 + X2 + X3 + X4 with X_i ~ N(0, 1) is N(0, 4) exactly: u = 2 and the interval is ±1.95996·2 = ±3.9199.
    // Tolerance δ = 0.05, the numerical tolerance of u = 2.0 at two significant digits (JCGM 101 §7.9.2).
    const r = await sheet([...additive('1'), 'mc = propagate(y, samples: 200000, seed: 7)']);
    expect(r.errors).toEqual([]);
    const f = fields(r, 'mc');
    expect(Math.abs((f.u as number) - 2)).toBeLessThan(0.05);
    expect(Math.abs((f.low as number) + 3.9199)).toBeLessThan(0.05);
    expect(Math.abs((f.high as number) - 3.9199)).toBeLessThan(0.05);
    expect(Math.abs(f.mean as number)).toBeLessThan(0.05);
    // A linear model with normal inputs: first order is exact, and the sheet says it is validated (§8).
    expect(f.agrees).toBe('true');
    expect(r.values.mc!.warnings ?? []).toEqual([]);
  });

  it('reproduces the additive model with rectangular inputs (JCGM 101:2008 §9.2.3): u(y) = 2, interval narrower than first order', async () => {
    // X_i rectangular with u = 1 (half-width √3). The 97.5 % point of the sum is exact from the Irwin–Hall CDF;
    // JCGM 101 §9.2.3 gives ±3.88 (from memory). Tolerance δ = 0.05 as above.
    const half = Math.sqrt(3);
    const s975 = bisect((s) => irwinHall4(s) - 0.975, 0, 4);
    const exact = 2 * half * s975 - 4 * half;
    expect(exact).toBeCloseTo(3.88, 2);
    const r = await sheet([...additive(`${half} (uniform)`), 'mc = propagate(y, samples: 200000, seed: 7)']);
    const f = fields(r, 'mc');
    expect(Math.abs((f.u as number) - 2)).toBeLessThan(0.05);
    expect(Math.abs((f.high as number) - exact)).toBeLessThan(0.05);
    expect(Math.abs((f.low as number) + exact)).toBeLessThan(0.05);
  });

  it('says where first order and Monte Carlo disagree: y = x² at x = 0 is a chi-square of one degree of freedom', async () => {
    // First order gives u = 0 (the slope is zero); the samples give mean 1, u = √2, and a 95 % symmetric
    // interval whose upper end q has P(|X| ≤ √q) = 0.975, so √q = Φ⁻¹(0.9875) = 2.2414 and q = 5.024.
    const r = await sheet(['x = 0 ± 1', 'y = x * x', 'mc = propagate(y, samples: 200000, seed: 3)']);
    const f = fields(r, 'mc');
    expect(f.u_first).toBe(0);
    expect(Math.abs((f.mean as number) - 1)).toBeLessThan(0.02);
    expect(Math.abs((f.u as number) - Math.SQRT2)).toBeLessThan(0.02);
    expect(Math.abs((f.high as number) - 5.024)).toBeLessThan(0.06);
    expect(f.agrees).toBe('false');
    expect(r.values.mc!.warnings!.join(' ')).toContain('first order and Monte Carlo disagree beyond the tolerance of JCGM 101:2008 §8');
  });

  it('gives the same numbers for the same seed and others for another', async () => {
    const run = async (seed: number) => fields(await sheet([...additive('1'), `mc = propagate(y, seed: ${seed})`]), 'mc');
    const a = await run(11);
    expect(await run(11)).toEqual(a);
    expect((await run(12)).mean).not.toBe(a.mean);
  });

  it('draws a histogram and refuses options it does not know', async () => {
    const r = await sheet([...additive('1'), 'mc = propagate(y, samples: 1000)', 'bad = propagate(y, sample: 10)', 'few = propagate(y, samples: 5)']);
    expect(r.html).toContain('Distribution of y');
    const lines = r.errors.map((e) => [e.line, e.message]);
    expect(lines).toContainEqual([8, 'propagate() has no option "sample"; it takes samples, seed, interval']);
    expect(lines).toContainEqual([9, 'samples: a whole number from 100 to 1,000,000, not 5']);
  });
});

describe('propagate() and the sheet\'s budget', () => {
  it('names the call when its samples use up the sheet\'s steps, and the rest of the sheet is listed', async () => {
    const { SheetPipeline } = await import('../../server/pipeline/index.js');
    const { DEFAULT_LIMITS } = await import('../../server/evaluate/limits.js');
    const pipeline = new SheetPipeline({ limits: { ...DEFAULT_LIMITS, maxSteps: 50_000 } });
    const r = pipeline.run('```basis\n' + [...additive('1'), 'mc = propagate(y, samples: 100000)', 'check y < 100 "small"'].join('\n') + '\n```\n');
    expect(r.errors[0]).toMatchObject({ line: 7, column: 6, code: 'limit' });
    expect(r.errors[0]!.message).toBe('the sheet went past 50,000 evaluation steps, in the Monte Carlo samples of propagate(); take fewer samples');
    // The values before it stand; the check after it is not run.
    expect(r.values.y!.si).toBe(0);
    expect(r.checks).toEqual([]);
  });
});

describe('the statistics under propagate()', () => {
  it('takes the interval ends the standard names (§7.7.2: the 500th and 19,500th of 20,000)', () => {
    const sorted = Float64Array.from({ length: 20000 }, (_, i) => i + 1);
    expect(symmetricInterval(sorted, 0.95)).toEqual([500, 19500]);
    // Evenly spaced values: every window is as short as the first.
    expect(shortestInterval(sorted, 0.95)).toEqual([1, 19001]);
  });

  it('finds the shortest interval of a skewed sample at its dense end', () => {
    const sorted = Float64Array.from({ length: 1000 }, (_, i) => (i / 1000) ** 2);
    const [low] = shortestInterval(sorted, 0.95);
    expect(low).toBe(0);
  });

  it('takes δ from the significant digits of u (§7.9.2: u = 0.0213 with two digits gives δ = 0.0005)', () => {
    expect(numericalTolerance(0.0213, 2)).toBeCloseTo(0.0005, 15);
    expect(numericalTolerance(2.0, 2)).toBeCloseTo(0.05, 15);
    expect(numericalTolerance(2.0, 1)).toBeCloseTo(0.5, 15);
    expect(numericalTolerance(9.97, 2)).toBeCloseTo(0.5, 15);
  });

  it('draws uniform deviates with mean ½ and variance 1/12, normal ones with 0 and 1', () => {
    const g = new Xoshiro128(42);
    let s = 0;
    let ss = 0;
    let n1 = 0;
    let n2 = 0;
    const M = 100000;
    for (let i = 0; i < M; i++) {
      const x = g.uniform();
      s += x;
      ss += x * x;
      const z = g.normal();
      n1 += z;
      n2 += z * z;
    }
    // Five standard errors: 1/√(12M) for the mean of a uniform, 1/√M and √(2/M) for the normal's.
    expect(Math.abs(s / M - 0.5)).toBeLessThan(5 / Math.sqrt(12 * M));
    expect(Math.abs(ss / M - (s / M) ** 2 - 1 / 12)).toBeLessThan(0.002);
    expect(Math.abs(n1 / M)).toBeLessThan(5 / Math.sqrt(M));
    expect(Math.abs(n2 / M - 1)).toBeLessThan(5 * Math.sqrt(2 / M));
  });
});
