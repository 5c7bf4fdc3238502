// Dimension vectors over the seven SI base quantities. Angles count as
// dimensionless (SI Brochure, 9th ed., 2019, section 2.3.3: rad = m/m).
export const BASE_SYMBOLS = ['kg', 'm', 's', 'A', 'K', 'cd', 'mol'] as const;
export type Dims = readonly [number, number, number, number, number, number, number];

export const DIMENSIONLESS: Dims = [0, 0, 0, 0, 0, 0, 0];
export const TEMPERATURE: Dims = [0, 0, 0, 0, 1, 0, 0];

export function dimsEqual(a: Dims, b: Dims): boolean {
  for (let i = 0; i < 7; i++) if (a[i] !== b[i]) return false;
  return true;
}

export function isDimensionless(d: Dims): boolean {
  return dimsEqual(d, DIMENSIONLESS);
}

// Every result is one shared array per dimension: a list of 100,000 speeds
// then holds one dimension vector, not 100,000 copies of it (they were most of
// a list's memory).
const interned = new Map<number | string, Dims>();

function intern(d: number[]): Dims {
  let key: number | string = 0;
  for (let i = 0; i < 7; i++) {
    const x = d[i]!;
    if (!Number.isInteger(x) || x < -15 || x > 15) {
      key = d.join(',');
      break;
    }
    key = (key as number) * 32 + x + 16;
  }
  const hit = interned.get(key);
  if (hit) return hit;
  const frozen = Object.freeze(d.slice()) as unknown as Dims;
  if (interned.size < 10_000) interned.set(key, frozen);
  return frozen;
}

export function dimsMul(a: Dims, b: Dims, sign = 1): Dims {
  if (isDimensionless(b)) return a;
  if (sign === 1 && isDimensionless(a)) return b;
  return intern(a.map((x, i) => x + sign * b[i]!));
}

export function dimsPow(a: Dims, n: number): Dims {
  if (n === 1 || isDimensionless(a)) return a;
  // Round to avoid 1.5000000000000002 from fractional powers such as sqrt.
  return intern(a.map((x) => Math.round(x * n * 1e9) / 1e9));
}

/** SI base-unit text, e.g. "kg m^-1 s^-2" written as "kg/(m s^2)". */
export function baseUnitText(d: Dims): string {
  const num: string[] = [];
  const den: string[] = [];
  d.forEach((e, i) => {
    if (e === 0) return;
    const sym = BASE_SYMBOLS[i]!;
    const mag = Math.abs(e);
    const part = mag === 1 ? sym : `${sym}^${trimPower(mag)}`;
    (e > 0 ? num : den).push(part);
  });
  if (num.length === 0 && den.length === 0) return '';
  const top = num.length ? num.join(' ') : '1';
  if (den.length === 0) return top;
  return den.length === 1 ? `${top}/${den[0]}` : `${top}/(${den.join(' ')})`;
}

function trimPower(x: number): string {
  return Number.isInteger(x) ? String(x) : String(Math.round(x * 1000) / 1000);
}

export function dimsKey(d: Dims): string {
  return d.join(',');
}
