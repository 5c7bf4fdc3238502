// Patches as worksheet records and back: each kind of patch declares its
// fields, patchRecord writes a Patch into them, and patchOf reads one back for
// boundaries(). One field list per kind drives both directions.
import { convert, parseUnit } from '../../units/quantity.js';
import { fieldSi, siOf } from '../shared/args.js';
import type { FieldSpec } from '../shared/registry.js';
import { TradeError } from '../shared/trade-error.js';
import { fieldRecord } from '../shared/records.js';
import { list, num, shown, si, str, type Quantity, type RecordValue, type Value } from '../shared/values.js';
import { CONDITIONS, norm, PATCH_KINDS, type Patch, type PatchKind, type Vec3 } from './patches.js';

const F = {
  patch: { name: 'patch', symbol: '', unit: 'text', doc: 'patch name' },
  condition: { name: 'condition', symbol: '', unit: 'text', doc: 'boundary condition' },
  roughness: { name: 'roughness', symbol: 'k_s', unit: 'm', doc: 'equivalent sand-grain roughness height' },
  U: { name: 'U', symbol: 'U', unit: 'm/s', doc: 'speed' },
  velocity: { name: 'velocity', symbol: '', unit: 'list', doc: 'velocity [Ux, Uy, Uz]; x downstream, z up' },
  spin: { name: 'omega', symbol: '\\Omega', unit: '1/s', doc: 'angular velocity about the axis (right-hand rule)' },
  axis: { name: 'axis', symbol: '', unit: 'list', doc: 'unit vector of the rotation axis' },
  origin: { name: 'origin', symbol: '', unit: 'list', doc: 'a point on the axis' },
  radius: { name: 'radius', symbol: 'r', unit: 'm', doc: 'rim radius' },
  rim: { name: 'rim', symbol: 'U_{\\text{rim}}', unit: 'm/s', doc: 'rim speed Ω r' },
  p: { name: 'p', symbol: 'p', unit: 'Pa', doc: 'static pressure (gauge)' },
  p0: { name: 'p0', symbol: 'p_0', unit: 'Pa', doc: 'total pressure (gauge)' },
  direction: { name: 'direction', symbol: '', unit: 'list', doc: 'unit vector of the inflow direction' },
  Q: { name: 'Q', symbol: 'Q', unit: 'm^3/s', doc: 'volume flow leaving' },
  k: { name: 'k', symbol: 'k', unit: 'm^2/s^2', doc: 'turbulent kinetic energy' },
  epsilon: { name: 'epsilon', symbol: '\\varepsilon', unit: 'm^2/s^3', doc: 'dissipation rate' },
  omega: { name: 'omega', symbol: '\\omega', unit: '1/s', doc: 'specific dissipation rate' },
  nut: { name: 'nut', symbol: '\\nu_t', unit: 'm^2/s', doc: 'eddy viscosity' },
  u_star: { name: 'u_star', symbol: 'u_*', unit: 'm/s', doc: 'friction velocity of the profile' },
  z0: { name: 'z0', symbol: 'z_0', unit: 'm', doc: 'roughness length of the profile' },
  z_ref: { name: 'z_ref', symbol: 'z_{\\text{ref}}', unit: 'm', doc: 'reference height of the profile' },
  kappa: { name: 'kappa', symbol: '\\kappa', unit: '1', doc: 'von Kármán constant of the profile' },
  C_mu: { name: 'C_mu', symbol: 'C_{\\mu}', unit: '1', doc: 'model constant of the profile' },
  distance: { name: 'distance', symbol: 'd', unit: 'm', doc: 'distance from the body' },
} satisfies Record<string, FieldSpec>;

const TURB = [F.k, F.epsilon, F.omega, F.nut];
export const PATCH_FIELDS: Readonly<Record<PatchKind, readonly FieldSpec[]>> = {
  wall: [F.patch, F.condition, F.roughness],
  moving_wall: [F.patch, F.condition, F.U, F.velocity],
  rotating_wall: [F.patch, F.condition, F.spin, F.axis, F.origin, F.radius, F.rim],
  slip: [F.patch, F.condition],
  symmetry: [F.patch, F.condition],
  velocity_inlet: [F.patch, F.condition, F.U, F.velocity, ...TURB, F.u_star, F.z0, F.z_ref, F.kappa, F.C_mu, F.distance],
  pressure_inlet: [F.patch, F.condition, F.p0, F.direction, ...TURB, F.distance],
  pressure_outlet: [F.patch, F.condition, F.p, F.distance],
  flow_rate_outlet: [F.patch, F.condition, F.Q, F.distance],
  opening: [F.patch, F.condition, F.p, ...TURB, F.distance],
};

const PATCH_TAG = 'patch';

/** A vector shown in one unit, [1.2, 0.8, 0.33] m, rather than item by item with prefixes. */
function vectorValue(v: Vec3, unit: string): Value {
  return list(v.map((x) => (unit === '1' ? num(x) : convert(si(x, unit), parseUnit(unit)))));
}

function maybe(x: number | undefined, unit: string): Quantity | undefined {
  return x === undefined ? undefined : si(x, unit);
}

/** A patch as a record: the fields its kind declares, the condition's meaning as a remark. */
export function patchRecord(p: Patch, warnings: string[] = []): RecordValue {
  const t = p.turbulence;
  const a = p.profile;
  const s = p.spin;
  const values: Record<string, Value | undefined> = {
    patch: str(p.name),
    condition: str(CONDITIONS[p.kind].label),
    roughness: maybe(p.roughness, 'm'),
    U: a ? si(a.U_ref, 'm/s') : p.velocity ? si(norm(p.velocity), 'm/s') : undefined,
    velocity: p.velocity ? vectorValue(p.velocity, 'm/s') : undefined,
    omega: s ? shown(s.omega, 'rad/s') : maybe(t?.omega, '1/s'),
    axis: s ? vectorValue(s.axis, '1') : undefined,
    origin: s ? vectorValue(s.origin, 'm') : undefined,
    radius: maybe(s?.radius, 'm'),
    rim: s?.radius === undefined ? undefined : si(Math.abs(s.omega) * s.radius, 'm/s'),
    p: p.kind === 'pressure_inlet' ? undefined : maybe(p.p, 'Pa'),
    p0: p.kind === 'pressure_inlet' ? maybe(p.p, 'Pa') : undefined,
    direction: p.direction ? vectorValue(p.direction, '1') : undefined,
    Q: maybe(p.Q, 'm^3/s'),
    k: maybe(a?.k ?? t?.k, 'm^2/s^2'),
    epsilon: maybe(t?.epsilon, 'm^2/s^3'),
    nut: maybe(t?.nut, 'm^2/s'),
    u_star: maybe(a?.u_star, 'm/s'),
    z0: maybe(a?.z0, 'm'),
    z_ref: maybe(a?.z_ref, 'm'),
    kappa: a ? num(a.kappa) : undefined,
    C_mu: a ? num(a.C_mu) : undefined,
    distance: maybe(p.distance, 'm'),
  };
  const notes: Record<string, string> = a ? { U: 'mean wind speed at z_ref', k: 'k = u*²/√Cμ at every height' } : {};
  return fieldRecord(PATCH_FIELDS[p.kind], values, { warnings, remarks: [CONDITIONS[p.kind].meaning], tag: PATCH_TAG }, notes);
}

/** Reads back a record made by patchRecord (the patch functions), for boundaries(). */
export function patchOf(r: RecordValue, where: string): Patch {
  const notPatch = new TradeError(`${where} is not a patch: build each one with wall(), moving_wall(), rotating_wall(), slip(), symmetry(), velocity_inlet(), pressure_inlet(), pressure_outlet(), flow_rate_outlet() or opening()`);
  const name = r.fields.get('patch')?.value;
  const label = r.fields.get('condition')?.value;
  if (r.tag !== PATCH_TAG || name?.kind !== 'string' || label?.kind !== 'string') throw notPatch;
  const kind = PATCH_KINDS.find((k) => CONDITIONS[k].label === label.value);
  if (!kind) throw notPatch;
  const n = (field: string, unit: string) => fieldSi(r, field, unit);
  const p: Patch = { name: name.value, kind };
  p.velocity = vectorField(r, 'velocity', 'm/s');
  p.roughness = n('roughness', 'm');
  p.distance = n('distance', 'm');
  p.p = n(kind === 'pressure_inlet' ? 'p0' : 'p', 'Pa');
  p.direction = vectorField(r, 'direction', '1');
  p.Q = n('Q', 'm^3/s');
  if (kind === 'rotating_wall') {
    p.spin = { omega: n('omega', '1/s')!, axis: vectorField(r, 'axis', '1')!, origin: vectorField(r, 'origin', 'm')!, radius: n('radius', 'm') };
  } else if (r.fields.has('u_star')) {
    p.profile = { U_ref: n('U', 'm/s')!, z_ref: n('z_ref', 'm')!, u_star: n('u_star', 'm/s')!, z0: n('z0', 'm')!, kappa: n('kappa', '1')!, C_mu: n('C_mu', '1')!, k: n('k', 'm^2/s^2')! };
  } else if (r.fields.has('k')) {
    p.turbulence = { k: n('k', 'm^2/s^2')!, epsilon: n('epsilon', 'm^2/s^3'), omega: n('omega', '1/s'), nut: n('nut', 'm^2/s') };
  }
  return p;
}

function vectorField(r: RecordValue, field: string, unit: string): Vec3 | undefined {
  const f = r.fields.get(field);
  if (!f) return undefined;
  if (f.value.kind !== 'list' || f.value.items.length !== 3) throw new TradeError(`${field} of a patch must list three components`);
  const [x, y, z] = f.value.items.map((item, i) => siOf(item, unit, `${field}[${i + 1}]`));
  return [x!, y!, z!];
}
