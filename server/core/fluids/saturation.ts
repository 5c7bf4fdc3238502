// Saturation pressure of water over liquid, IAPWS-IF97 region 4
// (IAPWS R7-97(2012), Eq. 30), valid from 273.15 K to the critical point.

const N = [
  0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.12020824702470e5, -0.32325550322333e7,
  0.1491510861353e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
] as const;

export const T_TRIPLE = 273.16; // K
export const T_CRITICAL = 647.096; // K

/** Saturation pressure (Pa) of water at T (K), 273.15 K <= T <= 647.096 K. */
export function saturationPressure(T: number): number {
  const [n1, n2, n3, n4, n5, n6, n7, n8, n9, n10] = N;
  const theta = T + n9 / (T - n10);
  const A = theta * theta + n1 * theta + n2;
  const B = n3 * theta * theta + n4 * theta + n5;
  const C = n6 * theta * theta + n7 * theta + n8;
  const x = (2 * C) / (-B + Math.sqrt(B * B - 4 * A * C));
  return Math.pow(x, 4) * 1e6;
}
