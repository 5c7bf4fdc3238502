// First-cell height for a target y+, and its inverse, from a flat-plate
// skin-friction estimate at the body length (Re built on L).
import { checkSpeed } from '../shared/flow.js';
import { TradeError } from '../shared/trade-error.js';
import { exactText } from '../shared/words.js';
import { hasKind, skinFriction, type SkinFrictionMethod } from './skin-friction.js';

export const PLACEMENTS = ['centroid', 'height'] as const;
export type Placement = (typeof PLACEMENTS)[number];

export type Band = 'viscous sublayer' | 'buffer layer' | 'log layer' | 'outer layer';

/**
 * Near-wall regions by y+ (Pope, Turbulent Flows, 2000, §7.1.4; from memory): viscous
 * sublayer below 5, buffer layer 5–30, log layer 30 to about 300 (common-practice upper end).
 */
export function bandOf(yplus: number): Band {
  if (yplus < 5) return 'viscous sublayer';
  if (yplus < 30) return 'buffer layer';
  if (yplus <= 300) return 'log layer';
  return 'outer layer';
}

/** Which wall treatment suits a band (common practice). */
export function wallTreatment(band: Band): string {
  switch (band) {
    case 'viscous sublayer':
      return 'Resolve the wall (a low-Reynolds-number model integrated to the wall, no wall functions); aim for y+ near 1.';
    case 'buffer layer':
      return 'Neither wall functions nor wall resolution is sound here; move the first cell down to y+ ≈ 1 or up to y+ ≥ 30, or use a y+-insensitive blended wall treatment.';
    case 'log layer':
      return 'Wall functions (the log law bridges the first cell to the wall); keep the first cell centre above y+ ≈ 30.';
    case 'outer layer':
      return 'The first cell is beyond the log layer, where wall functions lose their basis; refine the wall mesh.';
  }
}

export interface WallScales {
  Re: number;
  cf: number;
  /** The skin-friction formula used and its source. */
  source: string;
  tau_w: number;
  u_tau: number;
  l_visc: number;
  warnings: string[];
}

/** τ_w = ½ ρ U² c_f, u_τ = √(τ_w/ρ), l_visc = ν/u_τ (definitions; e.g. Pope 2000, §7.1). */
export function wallScales(U: number, L: number, rho: number, nu: number, method: SkinFrictionMethod): WallScales {
  checkSpeed(U, 'U', true);
  if (!(L > 0)) throw new TradeError(`the reference length L = ${exactText(L)} m must be positive`);
  const Re = (U * L) / nu;
  // The local coefficient at L; a method with only a mean one (ittc1957) gives that, and says so.
  const kind = hasKind(method, 'local') ? 'local' : 'mean';
  const { cf, source, warnings } = skinFriction(Re, method, kind);
  if (kind === 'mean') warnings.push(`${method} gives only the mean coefficient over the length Re is built on, not the local value at L; τ_w and y+ follow from that mean.`);
  const tau_w = 0.5 * rho * U * U * cf;
  const u_tau = Math.sqrt(tau_w / rho);
  return { Re, cf, source, tau_w, u_tau, l_visc: nu / u_tau, warnings };
}

export interface FirstCell extends WallScales {
  height: number;
  centroid: number;
  band: Band;
}

/**
 * Wall distance y = y+ l_visc (definition of y+, Pope 2000, §7.1). With "centroid" the
 * target sits at the cell centre, so the cell is twice as tall (cell-centred solvers).
 */
export function firstCell(
  U: number, L: number, rho: number, nu: number, yplus: number, method: SkinFrictionMethod, placement: Placement,
): FirstCell {
  if (!(yplus > 0)) throw new TradeError(`the target y+ must be positive, not ${exactText(yplus)}`);
  const s = wallScales(U, L, rho, nu, method);
  const atTarget = yplus * s.l_visc;
  const height = placement === 'centroid' ? 2 * atTarget : atTarget;
  return { ...s, height, centroid: height / 2, band: bandOf(yplus) };
}

/** y+ = y u_τ/ν (Pope 2000, §7.1) for a first-cell height, measured where `placement` says. */
export function yplusOf(
  height: number, U: number, L: number, rho: number, nu: number, method: SkinFrictionMethod, placement: Placement,
): { yplus: number; warnings: string[] } {
  if (!(height > 0)) throw new TradeError(`the first-cell height must be positive, not ${exactText(height)} m`);
  const s = wallScales(U, L, rho, nu, method);
  const at = placement === 'centroid' ? height / 2 : height;
  return { yplus: at / s.l_visc, warnings: s.warnings };
}
