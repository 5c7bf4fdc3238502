// Viscosity of water, IAPWS R12-08 (2008) "Release on the IAPWS Formulation
// 2008 for the Viscosity of Ordinary Water Substance", Eqs. 10-12 with the
// critical enhancement mu2 = 1, as the release allows outside the near-critical
// region (all of the liquid range used here).

const T_REF = 647.096; // K
const RHO_REF = 322.0; // kg/m^3
const MU_REF = 1.0e-6; // Pa s

// Dilute-gas part, Table 1.
const H0 = [1.67752, 2.20462, 0.6366564, -0.241605] as const;

// Residual part, Table 2: [i, j, H_ij]; the other H_ij are zero.
const H1: ReadonlyArray<readonly [number, number, number]> = [
  [0, 0, 5.20094e-1],
  [1, 0, 8.50895e-2],
  [2, 0, -1.08374],
  [3, 0, -2.89555e-1],
  [0, 1, 2.22531e-1],
  [1, 1, 9.99115e-1],
  [2, 1, 1.88797],
  [3, 1, 1.26613],
  [5, 1, 1.20573e-1],
  [0, 2, -2.81378e-1],
  [1, 2, -9.06851e-1],
  [2, 2, -7.72479e-1],
  [3, 2, -4.89837e-1],
  [4, 2, -2.5704e-1],
  [0, 3, 1.61913e-1],
  [1, 3, 2.57399e-1],
  [0, 4, -3.25372e-2],
  [3, 4, 6.98452e-2],
  [4, 5, 8.72102e-3],
  [3, 6, -4.35673e-3],
  [5, 6, -5.93264e-4],
];

/** Dynamic viscosity (Pa s) of water at temperature T (K) and density rho (kg/m^3). */
export function waterViscosity(T: number, rho: number): number {
  const t = T / T_REF;
  const d = rho / RHO_REF;
  let sum0 = 0;
  H0.forEach((h, i) => (sum0 += h / Math.pow(t, i)));
  const mu0 = (100 * Math.sqrt(t)) / sum0;
  let sum1 = 0;
  for (const [i, j, h] of H1) sum1 += h * Math.pow(1 / t - 1, i) * Math.pow(d - 1, j);
  const mu1 = Math.exp(d * sum1);
  return mu0 * mu1 * MU_REF;
}
