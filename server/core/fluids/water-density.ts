// Density of liquid water by IAPWS-IF97 region 1 (IAPWS R7-97(2012), Eq. 7):
// v = (R T / p) * pi * dgamma/dpi of the dimensionless Gibbs free energy.
// IF97 is the industrial formulation fitted to IAPWS-95; region 1 spans
// 273.15 K to 623.15 K up to 100 MPa.

const P_STAR = 16.53e6; // Pa
const T_STAR = 1386; // K
const R_WATER = 461.526; // J/(kg K), specific gas constant of IF97

// [I, J, n] of region 1 (Table 2), the terms with I ≥ 1: the eight with I = 0
// do not depend on π, so they drop out of γπ and the specific volume.
const TERMS: ReadonlyArray<readonly [number, number, number]> = [
  [1, -9, 0.28319080123804e-3],
  [1, -7, -0.60706301565874e-3],
  [1, -1, -0.18990068218419e-1],
  [1, 0, -0.32529748770505e-1],
  [1, 1, -0.21841717175414e-1],
  [1, 3, -0.5283835796993e-4],
  [2, -3, -0.47184321073267e-3],
  [2, 0, -0.30001780793026e-3],
  [2, 1, 0.47661393906987e-4],
  [2, 3, -0.44141845330846e-5],
  [2, 17, -0.72694996297594e-15],
  [3, -4, -0.31679644845054e-4],
  [3, 0, -0.28270797985312e-5],
  [3, 6, -0.85205128120103e-9],
  [4, -5, -0.22425281908e-5],
  [4, -2, -0.65171222895601e-6],
  [4, 10, -0.14341729937924e-12],
  [5, -8, -0.40516996860117e-6],
  [8, -11, -0.12734301741641e-8],
  [8, -6, -0.17424871230634e-9],
  [21, -29, -0.68762131295531e-18],
  [23, -31, 0.14478307828521e-19],
  [29, -38, 0.26335781662795e-22],
  [30, -39, -0.11947622640071e-22],
  [31, -40, 0.18228094581404e-23],
  [32, -41, -0.93537087292458e-25],
];

/** Specific volume (m^3/kg) of liquid water at T (K) and p (Pa), IF97 region 1. */
export function waterSpecificVolume(T: number, p: number): number {
  const pi = p / P_STAR;
  const tau = T_STAR / T;
  let gammaPi = 0;
  for (const [I, J, n] of TERMS) gammaPi -= n * I * Math.pow(7.1 - pi, I - 1) * Math.pow(tau - 1.222, J);
  return (pi * gammaPi * R_WATER * T) / p;
}

export function waterDensity(T: number, p: number): number {
  return 1 / waterSpecificVolume(T, p);
}
