// Refinement zones and their fluid volumes: a box (l·w·h), a volume given
// outright, a shell within distance d of the body's surface, or the surface
// band one surface cell thick. A shell around a box-shaped body is its
// parallel body less the body, by Steiner's formula for convex bodies (Steiner
// 1840): V = A d + π (L + W + H) d² + (4/3) π d³ — slabs on the faces, quarter
// cylinders along the 12 edges, eighth spheres at the 8 corners.
import { TradeError } from '../shared/trade-error.js';
import { lengthText, numberText, percentText } from '../shared/words.js';

export const ZONE_KINDS = ['box', 'volume', 'shell', 'surface'] as const;
export type ZoneKind = (typeof ZONE_KINDS)[number];

/** Share of a thin shell's volume that A × d may leave out before the sheet warns. */
export const THIN_SHELL_LOSS = 0.05;

function positive(name: string, v: number, unit: string): void {
  if (!(Number.isFinite(v) && v > 0)) throw new TradeError(`${name} must be positive, not ${numberText(v)} ${unit}`);
}

/** Fluid volume of a box zone: l·w·h less the solid the box holds. */
export function boxVolume(dims: readonly number[], solid = 0): number {
  if (dims.length !== 3) throw new TradeError(`box must be a list of three lengths [l, w, h], not ${dims.length}`);
  dims.forEach((d, i) => positive(`box[${i + 1}]`, d, 'm'));
  const gross = dims[0]! * dims[1]! * dims[2]!;
  return solidOut(gross, solid, 'the box');
}

export function solidOut(gross: number, solid: number, what: string): number {
  if (!(Number.isFinite(solid) && solid >= 0)) throw new TradeError(`solid must be a volume of 0 or more, not ${numberText(solid)} m³`);
  if (solid >= gross) throw new TradeError(`solid ${numberText(solid)} m³ fills ${what} of ${numberText(gross)} m³; the solid is the body's own volume inside it, which must be smaller`);
  return gross - solid;
}

/** A box-shaped body's length, width and height, checked. */
export function bodyDims(body: readonly number[]): [number, number, number] {
  if (body.length !== 3) throw new TradeError(`body must be a list of three lengths [L, W, H], not ${body.length}`);
  body.forEach((b, i) => positive(`body[${i + 1}]`, b, 'm'));
  return [body[0]!, body[1]!, body[2]!];
}

/** The surface a band or shell covers: the given area, or a box body's wetted area. */
export function surfaceArea(area: number | undefined, body: readonly number[] | undefined, ground: boolean): number {
  if (area !== undefined) {
    positive('area', area, 'm²');
    return area;
  }
  if (body === undefined) throw new TradeError("give the surface's area: (or the body: [L, W, H] of a box-shaped body)");
  const [L, W, H] = bodyDims(body);
  return boxArea(L, W, H, ground);
}

/** Wetted area of a box body: all six faces, or five on the ground (the floor face is not wetted). */
export function boxArea(L: number, W: number, H: number, ground: boolean): number {
  return ground ? L * W + 2 * (L * H + W * H) : 2 * (L * W + L * H + W * H);
}

export interface Shell {
  volume: number;
  /** The surface area the shell wraps (given, or the box body's wetted area). */
  area: number;
  warnings: string[];
}

/**
 * Fluid volume within distance d of the surface. With a box body: Steiner's
 * formula (free stream), or half that of the body mirrored in the floor (on
 * the ground): A d + (π/2)(L + W + 2H) d² + (2/3) π d³. A given area replaces
 * the box's in the first term. Without a body: A × d, the thin-shell limit.
 */
export function shellVolume(d: number, area: number | undefined, body: readonly number[] | undefined, ground: boolean): Shell {
  positive('shell', d, 'm');
  if (area !== undefined) positive('area', area, 'm²');
  if (body === undefined) {
    if (area === undefined) throw new TradeError('a shell needs the surface it wraps: give area: (the body\'s surface area), body: [L, W, H], or both');
    return { volume: area * d, area, warnings: thinShellWarnings(d, area) };
  }
  const [L, W, H] = bodyDims(body);
  const A = area ?? boxArea(L, W, H, ground);
  const volume = ground
    ? A * d + (Math.PI / 2) * (L + W + 2 * H) * d * d + ((2 * Math.PI) / 3) * d ** 3
    : A * d + Math.PI * (L + W + H) * d * d + ((4 * Math.PI) / 3) * d ** 3;
  return { volume, area: A, warnings: [] };
}

/**
 * Share of the true shell volume that A × d leaves out, estimated for a cube
 * of the same area (a = √(A/6)): Steiner's edge and corner terms over A d are
 * x = πd/(2a) + (2π/9)(d/a)², so the share is x/(1 + x).
 */
export function thinShellLoss(d: number, area: number): number {
  const a = Math.sqrt(area / 6);
  const x = (Math.PI * d) / (2 * a) + ((2 * Math.PI) / 9) * (d / a) ** 2;
  return x / (1 + x);
}

function thinShellWarnings(d: number, area: number): string[] {
  const loss = thinShellLoss(d, area);
  if (loss <= THIN_SHELL_LOSS) return [];
  return [
    `a shell ${lengthText(d)} thick counted as area × distance leaves out about ${percentText(loss, 2)} of its volume around the body's edges and corners ` +
      `(Steiner's formula, for a compact body of that area); give body: [L, W, H] to count them, or a box zone.`,
  ];
}
