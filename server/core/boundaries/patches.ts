// Boundary patches of an external-flow domain and the checks on a set of
// them. The well-posedness rules are those of incompressible flow (Ferziger &
// Perić, Computational Methods for Fluid Dynamics, 3rd ed., 2002, from memory):
// pressure is known only up to a constant unless some boundary holds it, and
// velocity fixed on every open boundary leaves the mass balance to the data.
// Distances asked for come from a domain record.
import { lengthText, numberText } from '../shared/words.js';

export type Vec3 = readonly [number, number, number];

export const PATCH_KINDS = [
  'wall', 'moving_wall', 'rotating_wall', 'slip', 'symmetry',
  'velocity_inlet', 'pressure_inlet', 'pressure_outlet', 'flow_rate_outlet', 'opening',
] as const;
export type PatchKind = (typeof PATCH_KINDS)[number];

export interface Condition {
  /** The condition as the table names it. */
  label: string;
  /** Which way the flow crosses the patch: none for walls and mirror planes. */
  flow: 'none' | 'in' | 'out' | 'either';
  fixesVelocity: boolean;
  fixesPressure: boolean;
  /** What the solver does there, in one sentence. */
  meaning: string;
}

export const CONDITIONS: Readonly<Record<PatchKind, Condition>> = {
  wall: { label: 'no-slip wall', flow: 'none', fixesVelocity: true, fixesPressure: false, meaning: 'The fluid sticks to the wall: velocity zero at the surface.' },
  moving_wall: { label: 'no-slip wall, moving', flow: 'none', fixesVelocity: true, fixesPressure: false, meaning: 'The fluid moves with the wall, which slides in its own plane (a moving ground or belt).' },
  rotating_wall: { label: 'no-slip wall, rotating', flow: 'none', fixesVelocity: true, fixesPressure: false, meaning: 'The fluid moves with the surface of a body turning about a fixed axis (a wheel), velocity Ω × r; the mesh itself stays put.' },
  slip: { label: 'slip wall', flow: 'none', fixesVelocity: false, fixesPressure: false, meaning: 'No flow through the patch and no shear on it: the flow slides along.' },
  symmetry: { label: 'symmetry plane', flow: 'none', fixesVelocity: false, fixesPressure: false, meaning: 'A mirror plane: no flow through it and zero normal gradient of every other quantity.' },
  velocity_inlet: { label: 'velocity inlet', flow: 'in', fixesVelocity: true, fixesPressure: false, meaning: 'Velocity and turbulence are held; the pressure follows from the interior.' },
  pressure_inlet: { label: 'total-pressure inlet', flow: 'in', fixesVelocity: false, fixesPressure: true, meaning: 'Total pressure and flow direction are held; the speed follows from the pressure drop into the domain.' },
  pressure_outlet: { label: 'static-pressure outlet', flow: 'out', fixesVelocity: false, fixesPressure: true, meaning: 'Static pressure is held; velocity and turbulence are carried out from the interior.' },
  flow_rate_outlet: { label: 'flow-rate outlet', flow: 'out', fixesVelocity: true, fixesPressure: false, meaning: 'The volume flow leaving is held, spread over the patch; the pressure follows from the interior.' },
  opening: { label: 'opening', flow: 'either', fixesVelocity: false, fixesPressure: true, meaning: 'Inlet or outlet by the local flow direction: where flow leaves, the static pressure is held; where it enters, the total pressure, with the turbulence given.' },
};

/** Uniform turbulence at an inlet (from inlet_turbulence). */
export interface UniformTurbulence {
  k: number;
  epsilon?: number;
  omega?: number;
  nut?: number;
}

/** A Richards–Hoxey inflow profile (from abl). */
export interface InflowProfile {
  U_ref: number;
  z_ref: number;
  u_star: number;
  z0: number;
  kappa: number;
  C_mu: number;
  k: number;
}

export interface Spin {
  omega: number;
  axis: Vec3;
  origin: Vec3;
  radius?: number;
}

export interface Patch {
  name: string;
  kind: PatchKind;
  velocity?: Vec3;
  spin?: Spin;
  /** Static (outlet, opening) or total (inlet) gauge pressure. */
  p?: number;
  direction?: Vec3;
  Q?: number;
  turbulence?: UniformTurbulence;
  profile?: InflowProfile;
  roughness?: number;
  /** Distance of the patch from the body, when the sheet gives it. */
  distance?: number;
}

export function norm(v: Vec3): number {
  return Math.hypot(v[0], v[1], v[2]);
}

export function cross(a: Vec3, b: Vec3): Vec3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

export function vectorText(v: Vec3, unit = ''): string {
  return `(${v.map((x) => numberText(Math.abs(x) < 1e-12 * (norm(v) || 1) ? 0 : x)).join(', ')})${unit ? ` ${unit}` : ''}`;
}

function turbulenceText(t: UniformTurbulence | undefined): string {
  if (!t) return 'turbulence not given';
  const parts = [`k = ${numberText(t.k)} m²/s²`];
  if (t.epsilon !== undefined) parts.push(`ε = ${numberText(t.epsilon)} m²/s³`);
  if (t.omega !== undefined) parts.push(`ω = ${numberText(t.omega)} 1/s`);
  return parts.join(', ');
}

/** The values a patch gets, in words, for the boundary table. */
export function describePatch(p: Patch): string {
  const parts: string[] = [];
  switch (p.kind) {
    case 'wall':
      parts.push(p.roughness === undefined ? 'stationary, smooth' : `stationary, sand-grain roughness k_s = ${lengthText(p.roughness)}`);
      break;
    case 'moving_wall':
      parts.push(`moves at ${vectorText(p.velocity!, 'm/s')}`);
      break;
    case 'rotating_wall': {
      const s = p.spin!;
      parts.push(`turns at ${numberText(s.omega)} rad/s about ${vectorText(s.axis)} through ${vectorText(s.origin, 'm')}`);
      if (s.radius !== undefined) parts.push(`rim speed ${numberText(Math.abs(s.omega) * s.radius)} m/s at r = ${lengthText(s.radius)}`);
      break;
    }
    case 'slip':
      parts.push('no flow through, no shear');
      break;
    case 'symmetry':
      parts.push('mirror plane');
      break;
    case 'velocity_inlet':
      if (p.profile) {
        const a = p.profile;
        parts.push(
          `Richards–Hoxey profile: U = ${numberText(a.U_ref)} m/s at ${lengthText(a.z_ref)}, u* = ${numberText(a.u_star)} m/s, z0 = ${lengthText(a.z0)}, κ = ${numberText(a.kappa)}, Cμ = ${numberText(a.C_mu)}`,
          `k = ${numberText(a.k)} m²/s² at every height; ε and ω fall with height`,
        );
      } else {
        parts.push(`U = ${vectorText(p.velocity!, 'm/s')}`, turbulenceText(p.turbulence));
      }
      break;
    case 'pressure_inlet':
      parts.push(`total pressure ${numberText(p.p!)} Pa (gauge), flow along ${vectorText(p.direction!)}`, turbulenceText(p.turbulence));
      break;
    case 'pressure_outlet':
      parts.push(`static pressure ${numberText(p.p!)} Pa (gauge)`);
      break;
    case 'flow_rate_outlet':
      parts.push(`Q = ${numberText(p.Q!)} m³/s leaves`);
      break;
    case 'opening':
      parts.push(`pressure ${numberText(p.p!)} Pa (gauge)`, `inflow: ${turbulenceText(p.turbulence)}`);
      break;
  }
  if (p.distance !== undefined) parts.push(`${lengthText(p.distance)} from the body`);
  return parts.join('; ');
}

/** The distances a domain rule asks for, read from a domain record. */
export interface DomainRule {
  upstream?: number;
  downstream?: number;
  rule?: string;
}

export interface BoundaryCheck {
  warnings: string[];
  remarks: string[];
}

/** Relative slack when comparing a wheel's contact speed with the ground's. */
const SPEED_MATCH = 0.01;

export function checkBoundaries(patches: readonly Patch[], compressible: boolean, domain?: DomainRule): BoundaryCheck {
  const warnings: string[] = [];
  const remarks: string[] = [];
  const open = patches.filter((p) => CONDITIONS[p.kind].flow !== 'none');

  if (open.length === 0) {
    warnings.push('no patch lets flow in or out: an external-flow domain needs an inlet and an outlet (velocity_inlet, pressure_outlet, opening, …).');
  } else {
    const pressureAt = patches.filter((p) => CONDITIONS[p.kind].fixesPressure);
    if (!compressible && pressureAt.length === 0) {
      warnings.push(
        'no patch fixes the pressure level: in an incompressible case the pressure is then known only up to a constant. Make the outlet a static-pressure outlet (pressure_outlet) or an opening, or fix a reference pressure in one cell.',
      );
    }
    if (open.every((p) => CONDITIONS[p.kind].fixesVelocity)) {
      warnings.push(
        `velocity is fixed at every open boundary (${names(open)}): inflow and outflow must then balance exactly, and nothing lets the flow adjust. Make the outlet a static-pressure outlet (pressure_outlet) instead.`,
      );
    }
    if (pressureAt.length) remarks.push(`The pressure level is fixed at ${names(pressureAt)}.`);
    else if (compressible) remarks.push('Compressible case: the pressure level follows from the density and temperature.');
  }

  if (domain) warnings.push(...distanceWarnings(open, domain, remarks));
  warnings.push(...wheelWarnings(patches));

  const bare = open.filter((p) => (p.kind === 'velocity_inlet' || p.kind === 'pressure_inlet' || p.kind === 'opening') && !p.turbulence && !p.profile);
  if (bare.length) remarks.push(`No turbulence values at ${names(bare)}: a RANS or hybrid run needs them there; pass turbulence: inlet_turbulence(…) or abl(…).`);
  if (patches.some((p) => p.profile) && !patches.some((p) => p.kind === 'wall' && p.roughness !== undefined)) {
    remarks.push(
      'An atmospheric profile enters, but no wall has a roughness: the ground needs a rough-wall treatment matched to z0, or the profile changes on its way to the body (Blocken, Stathopoulos & Carmeliet 2007, Atmos. Environ. 41, from memory).',
    );
  }
  return { warnings, remarks };
}

function distanceWarnings(open: readonly Patch[], domain: DomainRule, remarks: string[]): string[] {
  const warnings: string[] = [];
  const rule = domain.rule ? ` (${domain.rule})` : '';
  const sides: Array<[Patch['kind'][], number | undefined, string, string]> = [
    // An opening may sit at the side or the top, so only outlets proper are held to the downstream length.
    [['pressure_outlet', 'flow_rate_outlet'], domain.downstream, 'outlet', 'downstream'],
    [['velocity_inlet', 'pressure_inlet'], domain.upstream, 'inlet', 'upstream'],
  ];
  for (const [kinds, asked, what, side] of sides) {
    if (asked === undefined) continue;
    const these = open.filter((p) => kinds.includes(p.kind));
    const unplaced = these.filter((p) => p.distance === undefined);
    for (const p of these) {
      if (p.distance !== undefined && p.distance < asked * (1 - 1e-9)) {
        warnings.push(
          `the ${what} "${p.name}" is ${lengthText(p.distance)} from the body, closer than the ${lengthText(asked)} ${side} the domain rule asks${rule}; move it out, or the ${what} condition disturbs the flow near the body.`,
        );
      }
    }
    if (unplaced.length) remarks.push(`${names(unplaced)}: no distance given, so not checked against the ${lengthText(asked)} ${side} of the domain; give distance: to check it.`);
  }
  return warnings;
}

function names(list: readonly Patch[]): string {
  return list.map((p) => `"${p.name}"`).join(', ');
}

/**
 * A wheel touching a moving ground rolls without slip when its lowest point
 * (origin − r ẑ, z up) moves with the ground: Ω × (−r ẑ) = U_ground. Only a
 * rotating wall with a radius and a horizontal axis is taken for a wheel.
 */
function wheelWarnings(patches: readonly Patch[]): string[] {
  const grounds = patches.filter((p) => p.kind === 'moving_wall');
  if (grounds.length === 0) return [];
  const warnings: string[] = [];
  for (const w of patches) {
    if (w.kind !== 'rotating_wall' || w.spin?.radius === undefined || Math.abs(w.spin.axis[2]) > 1e-6) continue;
    const { omega, axis, radius } = w.spin;
    const contact = cross([axis[0] * omega, axis[1] * omega, axis[2] * omega], [0, 0, -radius]);
    const matches = grounds.some((g) => {
      const v = g.velocity!;
      return norm([contact[0] - v[0], contact[1] - v[1], contact[2] - v[2]]) <= SPEED_MATCH * Math.max(norm(v), 1e-9);
    });
    if (!matches) {
      const g = grounds[0]!;
      warnings.push(
        `the lowest point of "${w.name}" moves at ${vectorText(contact, 'm/s')}, the ground "${g.name}" at ${vectorText(g.velocity!, 'm/s')}: the wheel slips. ` +
          'For rolling without slip give ω = U/r about the axis that carries the lowest point along with the ground; with x downstream and z up that is axis: [0, -1, 0].',
      );
    }
  }
  return warnings;
}
