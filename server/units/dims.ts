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

export function dimsMul(a: Dims, b: Dims, sign = 1): Dims {
  return a.map((x, i) => x + sign * b[i]!) as unknown as Dims;
}

export function dimsPow(a: Dims, n: number): Dims {
  // Round to avoid 1.5000000000000002 from fractional powers such as sqrt.
  return a.map((x) => Math.round(x * n * 1e9) / 1e9) as unknown as Dims;
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
