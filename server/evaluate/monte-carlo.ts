// The statistics of the Monte Carlo method of JCGM 101:2008 (GUM Supplement
// 1): draws from the inputs' distributions (§6.4.2 rectangular, §6.4.7
// Gaussian), the estimate and standard uncertainty of the output (§7.6,
// eqs. 12 and 13), the probabilistically symmetric and the shortest coverage
// intervals (§7.7), the numerical tolerance of a value (§7.9.2) and the
// comparison with the first-order interval (§8.1). The generator is
// xoshiro128** (Blackman and Vigna, "Scrambled linear pseudorandom number
// generators", 2021), seeded through splitmix32; normal deviates come from the
// Box–Muller transform (JCGM 101 §C.4.2).

/** A seeded generator of uniform deviates in [0, 1). */
export class Xoshiro128 {
  private a: number;
  private b: number;
  private c: number;
  private d: number;
  private spare: number | undefined;
  constructor(seed: number) {
    // splitmix32 spreads the seed over the four words, none of them zero.
    let s = seed >>> 0;
    const next = () => {
      s = (s + 0x9e3779b9) >>> 0;
      let z = s;
      z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
      z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
      return (z ^ (z >>> 16)) >>> 0;
    };
    this.a = next();
    this.b = next();
    this.c = next();
    this.d = next();
  }
  /** 32 random bits. */
  bits(): number {
    const result = Math.imul(rotl(Math.imul(this.b, 5), 7), 9) >>> 0;
    const t = this.b << 9;
    this.c ^= this.a;
    this.d ^= this.b;
    this.b ^= this.c;
    this.a ^= this.d;
    this.c ^= t;
    this.d = rotl(this.d, 11);
    return result;
  }
  /** Uniform in [0, 1), 53 bits. */
  uniform(): number {
    return ((this.bits() >>> 5) * 67108864 + (this.bits() >>> 6)) / 9007199254740992;
  }
  /** A standard normal deviate (Box–Muller, both of each pair used). */
  normal(): number {
    if (this.spare !== undefined) {
      const z = this.spare;
      this.spare = undefined;
      return z;
    }
    const u1 = 1 - this.uniform(); // (0, 1]: the logarithm stays finite
    const u2 = this.uniform();
    const r = Math.sqrt(-2 * Math.log(u1));
    this.spare = r * Math.sin(2 * Math.PI * u2);
    return r * Math.cos(2 * Math.PI * u2);
  }
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}

export interface Summary {
  mean: number;
  u: number;
  low: number;
  high: number;
}

/** Estimate, standard uncertainty (M − 1 in the denominator) and a coverage interval of probability p. */
export function summarise(values: Float64Array, p: number, shortest: boolean): Summary {
  const m = values.length;
  let sum = 0;
  for (let i = 0; i < m; i++) sum += values[i]!;
  const mean = sum / m;
  let ss = 0;
  for (let i = 0; i < m; i++) ss += (values[i]! - mean) ** 2;
  const u = m > 1 ? Math.sqrt(ss / (m - 1)) : 0;
  const sorted = Float64Array.from(values).sort();
  const [low, high] = shortest ? shortestInterval(sorted, p) : symmetricInterval(sorted, p);
  return { mean, u, low, high };
}

/** §7.7.2: the ((1 − p)/2)M-th and ((1 + p)/2)M-th sorted values (r rounded as the standard says). */
export function symmetricInterval(sorted: Float64Array, p: number): [number, number] {
  const m = sorted.length;
  const q = Math.round(p * m);
  const r = Math.max(1, Math.floor(((m - q) / 2) + 0.5));
  return [sorted[r - 1]!, sorted[Math.min(m, r + q) - 1]!];
}

/** §7.7.3: of the intervals [y_(r), y_(r+q)] with q = pM, the shortest. */
export function shortestInterval(sorted: Float64Array, p: number): [number, number] {
  const m = sorted.length;
  const q = Math.min(m - 1, Math.round(p * m));
  let best = 0; // 0-based r − 1
  for (let i = 1; i + q < m; i++) if (sorted[i + q]! - sorted[i]! < sorted[best + q]! - sorted[best]!) best = i;
  return [sorted[best]!, sorted[best + q]!];
}

/** §7.9.2: u written with `digits` significant digits as c × 10^l gives δ = ½ × 10^l. */
export function numericalTolerance(u: number, digits = 2): number {
  if (!(u > 0)) return 0;
  const l = Math.floor(Math.log10(u)) - (digits - 1);
  // A u that rounds up to the next decade (9.96 → 10) has its digits one place further left.
  const c = Math.round(u / 10 ** l);
  return 0.5 * 10 ** (c >= 10 ** digits ? l + 1 : l);
}

/** k for a coverage probability p of a normal distribution: the GUM framework's interval y ± k u. */
export function normalCoverageFactor(p: number): number {
  return inverseNormal((1 + p) / 2);
}

/** The normal quantile by P. J. Acklam's rational approximation (2003; relative error below 1.2e-9). */
export function inverseNormal(q: number): number {
  const a = [-3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239];
  const b = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
  const c = [-7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
  const lowTail = 0.02425;
  let x: number;
  if (q < lowTail) {
    const t = Math.sqrt(-2 * Math.log(q));
    x = (((((c[0]! * t + c[1]!) * t + c[2]!) * t + c[3]!) * t + c[4]!) * t + c[5]!) / ((((d[0]! * t + d[1]!) * t + d[2]!) * t + d[3]!) * t + 1);
  } else if (q <= 1 - lowTail) {
    const t = q - 0.5;
    const r = t * t;
    x = ((((((a[0]! * r + a[1]!) * r + a[2]!) * r + a[3]!) * r + a[4]!) * r + a[5]!) * t) / (((((b[0]! * r + b[1]!) * r + b[2]!) * r + b[3]!) * r + b[4]!) * r + 1);
  } else {
    const t = Math.sqrt(-2 * Math.log(1 - q));
    x = -(((((c[0]! * t + c[1]!) * t + c[2]!) * t + c[3]!) * t + c[4]!) * t + c[5]!) / ((((d[0]! * t + d[1]!) * t + d[2]!) * t + d[3]!) * t + 1);
  }
  return x;
}

/**
 * Significant digits of u that a run of M samples can vouch for: two from
 * 10^6 samples on (JCGM 101 §7.2.2), one below, where the ends of a 95 %
 * interval still move by a few per cent of u from one seed to the next.
 */
export function digitsFor(samples: number): number {
  return samples >= 1_000_000 ? 2 : 1;
}

/** §8.1: the first-order interval y ± k u against the Monte Carlo one, endpoint by endpoint, with δ of the Monte Carlo u. */
export function validate(y: number, uFirst: number, k: number, mc: Summary, samples: number): { dLow: number; dHigh: number; delta: number; agrees: boolean } {
  const delta = numericalTolerance(mc.u, digitsFor(samples));
  const dLow = Math.abs(y - k * uFirst - mc.low);
  const dHigh = Math.abs(y + k * uFirst - mc.high);
  return { dLow, dHigh, delta, agrees: dLow <= delta && dHigh <= delta };
}
