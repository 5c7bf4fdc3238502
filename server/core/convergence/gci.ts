// Grid convergence index from three grids: Celik, Ghia, Roache, Freitas,
// Coleman & Raad (2008), "Procedure for estimation and reporting of
// uncertainty due to discretization in CFD applications", J. Fluids Eng.
// 130(7), 078001, its five-step procedure (from memory): representative cell
// size, observed order p by fixed-point iteration, Richardson extrapolation,
// approximate and extrapolated relative errors, and the fine-grid GCI with
// safety factor 1.25.
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';

/** Safety factor for three or more grids (Roache; Celik et al. 2008). */
export const SAFETY_FACTOR = 1.25;
/** Celik et al. (2008) ask for refinement ratios above 1.3. */
export const MIN_RATIO = 1.3;
/** The asymptotic check GCI32 / (r21^p GCI21) is judged near 1 within this (our threshold). */
export const ASYMPTOTIC_TOLERANCE = 0.1;

export interface GciInput {
  /** Solutions on the fine, medium and coarse grid. */
  phi: readonly [number, number, number];
  /** Representative cell sizes h1 < h2 < h3. */
  h: readonly [number, number, number];
}

export interface GciResult {
  r21: number;
  r32: number;
  p: number;
  /** Extrapolated value from the two finer grids. */
  phi_ext: number;
  e_a: number;
  e_ext: number;
  gci_fine: number;
  /** GCI of the medium grid from grids 2 and 3. */
  gci_medium: number;
  /** GCI32 / (r21^p GCI21): near 1 in the asymptotic range. */
  ratio: number;
  asymptotic: boolean;
  oscillatory: boolean;
  iterations: number;
}

/** h = (1/N)^(1/dim) for a fixed domain (Celik et al. 2008, Eq. 1 with equal total volume). */
export function cellSizes(cells: readonly number[], dim: number): [number, number, number] {
  if (cells.length !== 3) throw new TradeError('cells must list three cell counts, fine to coarse');
  if (!cells.every((n) => n > 0 && Number.isFinite(n))) throw new TradeError('every cell count must be above zero');
  return cells.map((n) => Math.pow(1 / n, 1 / dim)) as [number, number, number];
}

export function gci(input: GciInput): GciResult {
  const [phi1, phi2, phi3] = input.phi;
  const [h1, h2, h3] = input.h;
  if (!(h1 > 0 && h2 > 0 && h3 > 0)) throw new TradeError('cell sizes must be above zero');
  if (!(h1 < h2 && h2 < h3)) throw new TradeError('the grids must go from fine to coarse: h1 < h2 < h3, or cells N1 > N2 > N3');
  const r21 = h2 / h1;
  const r32 = h3 / h2;
  const e21 = phi2 - phi1;
  const e32 = phi3 - phi2;
  if (e21 === 0 || e32 === 0) {
    throw new TradeError(`${e21 === 0 ? 'φ1 and φ2' : 'φ2 and φ3'} are equal, so no order of convergence can be observed; the procedure needs three different values`);
  }
  if (phi1 === 0) throw new TradeError('φ1 is zero, so relative errors against it have no meaning');
  const ratio32 = e32 / e21;
  const s = Math.sign(ratio32);
  const { p, iterations } = observedOrder(r21, r32, ratio32, s);
  if (!(p > 1e-6)) throw new TradeError('the observed order is zero: the two differences between the grids are alike, so no extrapolation is possible');
  const r21p = Math.pow(r21, p);
  const r32p = Math.pow(r32, p);
  const phi_ext = (r21p * phi1 - phi2) / (r21p - 1);
  const e_a = Math.abs((phi1 - phi2) / phi1);
  const e_ext = Math.abs((phi_ext - phi1) / phi_ext);
  const gci_fine = (SAFETY_FACTOR * e_a) / (r21p - 1);
  const e_a32 = Math.abs((phi2 - phi3) / phi2);
  const gci_medium = (SAFETY_FACTOR * e_a32) / (r32p - 1);
  const ratio = gci_medium / (r21p * gci_fine);
  return { r21, r32, p, phi_ext, e_a, e_ext, gci_fine, gci_medium, ratio, asymptotic: Math.abs(ratio - 1) <= ASYMPTOTIC_TOLERANCE, oscillatory: s < 0, iterations };
}

/**
 * p = |ln|ε32/ε21| + q(p)| / ln r21 with q(p) = ln[(r21^p − s)/(r32^p − s)],
 * by fixed-point iteration from q = 0 (Celik et al. 2008, Eqs. 3a–3c, from memory).
 */
export function observedOrder(r21: number, r32: number, ratio32: number, s: number): { p: number; iterations: number } {
  const lnRatio = Math.log(Math.abs(ratio32));
  const lnR21 = Math.log(r21);
  let p = Math.abs(lnRatio) / lnR21;
  for (let k = 1; k <= 500; k++) {
    const num = Math.pow(r21, p) - s;
    const den = Math.pow(r32, p) - s;
    // An order so large that r^p overflows means the iteration ran away: say so,
    // rather than report the quotient Infinity/Infinity as "not positive".
    if (!Number.isFinite(num) || !Number.isFinite(den)) break;
    if (!(num / den > 0)) throw new TradeError(`the observed order cannot be found: (r21^p − s)/(r32^p − s) is not positive at p = ${numberText(p)}`);
    const next = Math.abs(lnRatio + Math.log(num / den)) / lnR21;
    if (!Number.isFinite(next)) break;
    if (Math.abs(next - p) <= 1e-12 * Math.max(1, Math.abs(next))) return { p: next, iterations: k };
    p = next;
  }
  throw new TradeError('the observed order does not settle in the fixed-point iteration; the three solutions may not be converging with the grid');
}
