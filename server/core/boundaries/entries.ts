// The boundary family's worksheet entries: inlet turbulence, the atmospheric
// inflow and its terrain, the patches of a domain and their table, the time
// scales of a transient run, and force coefficients. The maths lives in the
// sibling files as functions of SI numbers; here arguments are read and
// results are given units and words.
import { boolArg, choiceArg, fieldSi, fluidArg, optionalRecord, optionalSi, passThrough, siArg, siListArg, siOf, stringArg } from '../shared/args.js';
import type { Args, FieldSpec, ParamSpec, TradeFunction } from '../shared/registry.js';
import { TradeError } from '../shared/trade-error.js';
import { fieldRecord } from '../shared/records.js';
import { figure, num, shown, si, str, table, type RecordValue, type Value } from '../shared/values.js';
import { lengthText, numberText, percentText, quotedList } from '../shared/words.js';
import { KAPPA, richardsHoxey } from './abl-profile.js';
import { forceCoefficients } from './force-coefficients.js';
import { C_MU, ductLengthScale, inletTurbulence } from './inlet-turbulence.js';
import { checkBoundaries, CONDITIONS, describePatch, norm, type DomainRule, type InflowProfile, type Patch, type PatchKind, type UniformTurbulence, type Vec3 } from './patches.js';
import { PATCH_FIELDS, patchOf, patchRecord } from './patch-records.js';
import { profileSvg } from './profile-plot.js';
import { terrainCategory, TERRAIN_CATEGORIES } from './terrain.js';
import { courantStep, flowThroughTime, shedding as sheddingOf } from './time-step.js';

const FLUID: ParamSpec = { name: 'fluid', type: 'fluid', doc: 'a fluid record with rho and mu (or nu), e.g. air(T: 20 degC)' };
const C_MU_PARAM: ParamSpec = { name: 'C_mu', type: 'quantity', unit: '1', default: String(C_MU), doc: 'model constant Cμ of the k-ε family' };

// ---------------------------------------------------------------- inlet turbulence

const TURBULENCE_FIELDS: readonly FieldSpec[] = [
  { name: 'k', symbol: 'k', unit: 'm^2/s^2', doc: 'k = 3/2 (U I)² (CFD-Wiki, Turbulence free-stream boundary conditions)' },
  { name: 'epsilon', symbol: '\\varepsilon', unit: 'm^2/s^3', doc: 'ε = Cμ^(3/4) k^(3/2) / ℓ (same page)' },
  { name: 'omega', symbol: '\\omega', unit: '1/s', doc: 'ω = k^(1/2) / (Cμ^(1/4) ℓ) = ε / (Cμ k) (from memory)' },
  { name: 'nut', symbol: '\\nu_t', unit: 'm^2/s', doc: 'eddy viscosity ν_t = k / ω' },
  { name: 'nut_ratio', symbol: '\\nu_t/\\nu', unit: '1', doc: 'eddy-viscosity ratio ν_t / ν' },
  { name: 'length', symbol: '\\ell', unit: 'm', doc: 'length scale ℓ of the ε formula above' },
  { name: 'intensity', symbol: 'I', unit: '1', doc: 'turbulence intensity u′/U, as given' },
  { name: 'U', symbol: 'U', unit: 'm/s', doc: 'inlet speed, as given' },
  { name: 'C_mu', symbol: 'C_{\\mu}', unit: '1', doc: 'model constant' },
];

/** Above this intensity an inflow is unusually turbulent (common practice: 5–20 % counts as high). */
const HIGH_INTENSITY = 0.2;

const inlet_turbulence: TradeFunction = {
  name: 'inlet_turbulence',
  params: [
    { name: 'U', type: 'quantity', unit: 'm/s', doc: 'inlet speed' },
    { name: 'intensity', type: 'quantity', unit: '1', doc: 'turbulence intensity u′/U, e.g. 1 %' },
    { name: 'length', type: 'quantity', unit: 'm', optional: true, doc: 'turbulence length scale ℓ (or give viscosity_ratio)' },
    FLUID,
    { name: 'viscosity_ratio', type: 'quantity', unit: '1', optional: true, doc: 'eddy-viscosity ratio ν_t/ν, instead of length' },
    C_MU_PARAM,
  ],
  fields: TURBULENCE_FIELDS,
  doc: 'k, ε, ω and ν_t at an inlet from an intensity and a length scale (or an eddy-viscosity ratio)',
  source:
    'k = 3/2 (U I)², ε = Cμ^(3/4) k^(3/2)/ℓ: CFD-Wiki, "Turbulence free-stream boundary conditions"; ω = k^(1/2)/(Cμ^(1/4) ℓ) = ε/(Cμ k) and ν_t = k/ω (from memory); Cμ = 0.09',
  example: 'inlet_turbulence(10 m/s, intensity: 5 %, length: 0.07 m, fluid: air(T: 20 degC))',
  compute(args) {
    const { nu } = fluidArg(args);
    const length = optionalSi(args, 'length', 'm');
    const ratio = optionalSi(args, 'viscosity_ratio');
    if (length !== undefined && ratio !== undefined) throw new TradeError('give length: or viscosity_ratio:, not both; the other follows from ν_t = k/ω');
    if (length === undefined && ratio === undefined) throw new TradeError('give a length scale, length: (e.g. duct_length_scale(D_h)), or an eddy-viscosity ratio, viscosity_ratio:');
    const U = siArg(args, 'U', 'm/s');
    const I = siArg(args, 'intensity');
    const Cmu = siArg(args, 'C_mu');
    const t = inletTurbulence(U, I, length !== undefined ? { length } : { ratio: ratio! }, nu, Cmu);
    const warnings: string[] = [];
    if (I > HIGH_INTENSITY) warnings.push(`an intensity of ${percentText(I)} is above about ${percentText(HIGH_INTENSITY)}, high even for a turbulent inflow (common practice); check the value and its source.`);
    const remarks = [
      t.given === 'length'
        ? `Length scale given; the eddy-viscosity ratio ν_t/ν = ${numberText(t.nut_ratio)} follows from ν_t = k/ω.`
        : `Eddy-viscosity ratio given; the length scale ℓ = ${lengthText(t.length)} follows from ν_t = ratio · ν = k/ω.`,
      `ℓ is the length in ε = Cμ^(3/4) k^(3/2)/ℓ. Tools that define ℓ = Cμ k^(3/2)/ε instead need ${numberText(Cmu ** 0.25)} × this ℓ (Cμ^(1/4)).`,
      'Turbulence decays between the inlet and the body; a free-stream ratio ν_t/ν of about 1–10 is usual for a quiet inflow (common practice).',
    ];
    return fieldRecord(
      TURBULENCE_FIELDS,
      {
        k: si(t.k, 'm^2/s^2'),
        epsilon: si(t.epsilon, 'm^2/s^3'),
        omega: si(t.omega, '1/s'),
        nut: si(t.nut, 'm^2/s'),
        nut_ratio: num(t.nut_ratio),
        length: si(t.length, 'm'),
        intensity: passThrough(args, 'intensity'),
        U: passThrough(args, 'U'),
        C_mu: num(Cmu),
      },
      { warnings, remarks, tag: 'inlet turbulence' },
      { length: t.given === 'length' ? 'length scale ℓ, as given' : 'length scale ℓ, derived from the viscosity ratio', nut_ratio: t.given === 'ratio' ? 'eddy-viscosity ratio ν_t/ν, as given' : 'eddy-viscosity ratio ν_t/ν, derived' },
    );
  },
};

const duct_length_scale: TradeFunction = {
  name: 'duct_length_scale',
  params: [{ name: 'D_h', type: 'quantity', unit: 'm', doc: 'hydraulic diameter of the duct or pipe feeding the inlet' }],
  returns: { symbol: '\\ell', unit: 'm', doc: 'the turbulence length scale' },
  doc: 'turbulence length scale of fully developed duct flow, ℓ = 0.07 D_h',
  source: 'ℓ = 0.07 D_h ("7 % of the hydraulic diameter"): CFD-Wiki, "Turbulence length scale"',
  example: 'duct_length_scale(0.5 m)',
  compute(args) {
    return si(ductLengthScale(siArg(args, 'D_h', 'm')), 'm');
  },
};

// ---------------------------------------------------------------- terrain and atmospheric inflow

const TERRAIN_FIELDS: readonly FieldSpec[] = [
  { name: 'category', symbol: '', unit: 'text', doc: 'terrain category of EN 1991-1-4, Table 4.1' },
  { name: 'description', symbol: '', unit: 'text', doc: 'the terrain the category stands for' },
  { name: 'z0', symbol: 'z_0', unit: 'm', doc: 'roughness length (Table 4.1)' },
  { name: 'z_min', symbol: 'z_{\\text{min}}', unit: 'm', doc: 'minimum height (Table 4.1); below it the code keeps the profile constant' },
  { name: 'z_max', symbol: 'z_{\\text{max}}', unit: 'm', doc: 'upper limit of the profile, 200 m (§4.3.2)' },
  { name: 'k_r', symbol: 'k_r', unit: '1', doc: 'terrain factor k_r = 0.19 (z0/0.05 m)^0.07 (Eq. 4.5, from memory)' },
];

const CODE_CAUTION = 'Planning values for a CFD inflow only: design wind loads follow EN 1991-1-4 with its national annex, the local code, and licensed engineering review.';

const terrain: TradeFunction = {
  name: 'terrain',
  params: [{ name: 'category', type: 'string', choices: TERRAIN_CATEGORIES, doc: `terrain category: ${quotedList(TERRAIN_CATEGORIES)}` }],
  fields: TERRAIN_FIELDS,
  doc: 'roughness length z0 and minimum height z_min of an EN 1991-1-4 terrain category',
  source: 'EN 1991-1-4:2005, Table 4.1 (z0, z_min) and §4.3.2 (z_max = 200 m); k_r by Eq. 4.5',
  example: 'terrain("III")',
  compute(args) {
    const t = terrainCategory(choiceArg(args, 'category', TERRAIN_CATEGORIES));
    return fieldRecord(
      TERRAIN_FIELDS,
      { category: str(t.category), description: str(t.description), z0: si(t.z0, 'm'), z_min: si(t.z_min, 'm'), z_max: si(t.z_max, 'm'), k_r: num(t.k_r) },
      {
        remarks: [
          'EN 1991-1-4:2005, Table 4.1, as recommended; national annexes may change it (the French annex, for one, splits category III into IIIa and IIIb).',
          CODE_CAUTION,
        ],
        tag: 'caution',
      },
    );
  },
};

const ABL_FIELDS: readonly FieldSpec[] = [
  { name: 'u_star', symbol: 'u_*', unit: 'm/s', doc: 'friction velocity u* = κ U_ref / ln((z_ref + z0)/z0)' },
  { name: 'k', symbol: 'k', unit: 'm^2/s^2', doc: 'k = u*² / √Cμ, the same at every height' },
  { name: 'U_ref', symbol: 'U_{\\text{ref}}', unit: 'm/s', doc: 'mean wind speed at z_ref, as given' },
  { name: 'z_ref', symbol: 'z_{\\text{ref}}', unit: 'm', doc: 'reference height, as given' },
  { name: 'z0', symbol: 'z_0', unit: 'm', doc: 'aerodynamic roughness length' },
  { name: 'kappa', symbol: '\\kappa', unit: '1', doc: 'von Kármán constant' },
  { name: 'C_mu', symbol: 'C_{\\mu}', unit: '1', doc: 'model constant' },
  { name: 'table', symbol: '', unit: 'table', doc: 'U(z) = u*/κ ln((z + z0)/z0), ε(z) = u*³/(κ (z + z0)), ω = ε/(Cμ k)' },
];

/** The turbulence-model constants of standard k-ε (Launder & Spalding 1974), for the equilibrium σ_ε. */
const C_EPS1 = 1.44;
const C_EPS2 = 1.92;

interface RoughnessInput {
  z0: number;
  /** From a terrain record: EN 1991-1-4's limits and the category. */
  terrain?: { z_min?: number; z_max?: number; category?: string };
}

function roughnessArg(args: Args): RoughnessInput {
  const v = args['z0'];
  if (v === undefined) throw new TradeError('missing argument z0');
  if (v.kind === 'quantity') return { z0: siOf(v, 'm', 'z0') };
  if (v.kind === 'record') {
    const z0 = fieldSi(v, 'z0', 'm');
    if (z0 === undefined) throw new TradeError('z0 must be a length or a record with a z0 field, such as terrain("II")');
    const cat = v.fields.get('category')?.value;
    return {
      z0,
      terrain: { z_min: fieldSi(v, 'z_min', 'm'), z_max: fieldSi(v, 'z_max', 'm'), category: cat?.kind === 'string' ? cat.value : undefined },
    };
  }
  throw new TradeError('z0 must be a roughness length such as 0.05 m, or a terrain("II") record');
}

const abl: TradeFunction = {
  name: 'abl',
  params: [
    { name: 'U_ref', type: 'quantity', unit: 'm/s', doc: 'mean wind speed at the reference height' },
    { name: 'z_ref', type: 'quantity', unit: 'm', doc: 'reference height above the ground, often 10 m' },
    { name: 'z0', type: 'any', doc: 'roughness length in m, or a terrain("...") record' },
    { name: 'heights', type: 'list', unit: 'm', doc: 'heights above the ground for the table, e.g. [2, 5, 10, 20, 50] m' },
    { name: 'kappa', type: 'quantity', unit: '1', default: String(KAPPA), doc: 'von Kármán constant κ' },
    C_MU_PARAM,
  ],
  fields: ABL_FIELDS,
  doc: 'atmospheric boundary-layer inflow for k-ε after Richards & Hoxey (1993): u*, k and a table of U, k, ε, ω by height',
  source:
    'Richards & Hoxey (1993), "Appropriate boundary conditions for computational wind engineering models using the k-ε turbulence model", J. Wind Eng. Ind. Aerodyn. 46–47, 145–153; ω = ε/(Cμ k); κ = 0.41, Cμ = 0.09 by default',
  example: 'abl(10 m/s, 10 m, 0.05 m, heights: [2, 10, 50] m)',
  compute(args) {
    const U_ref = siArg(args, 'U_ref', 'm/s');
    const z_ref = siArg(args, 'z_ref', 'm');
    const rough = roughnessArg(args);
    const heights = siListArg(args, 'heights', 'm');
    if (heights.length === 0) throw new TradeError('heights must list at least one height, e.g. [2, 10, 50] m');
    const kappa = siArg(args, 'kappa');
    const Cmu = siArg(args, 'C_mu');
    const profile = richardsHoxey(U_ref, z_ref, rough.z0, kappa, Cmu);
    const rows = heights.map((z) => profile.at(z));
    const lim = rough.terrain;
    const warnings: string[] = [];
    if (lim?.z_min !== undefined) {
      const low = heights.filter((z) => z < lim.z_min!);
      if (low.length) warnings.push(`${heightList(low)} ${low.length > 1 ? 'lie' : 'lies'} below z_min = ${lengthText(lim.z_min)} of terrain category ${lim.category ?? 'given'}: EN 1991-1-4 keeps the profile constant there; the log law below z_min is a CFD inflow model, not the code's profile.`);
      if (z_ref < lim.z_min) warnings.push(`the reference height ${lengthText(z_ref)} is below z_min = ${lengthText(lim.z_min)}; take U_ref at or above z_min.`);
    }
    if (lim?.z_max !== undefined) {
      const high = heights.filter((z) => z > lim.z_max!);
      if (high.length) warnings.push(`${heightList(high)} ${high.length > 1 ? 'lie' : 'lies'} above z_max = ${lengthText(lim.z_max)}, beyond the code's profile.`);
    }
    const sigmaEps = (kappa * kappa) / ((C_EPS2 - C_EPS1) * Math.sqrt(Cmu));
    const remarks = [
      `Richards & Hoxey (1993) with κ = ${numberText(kappa)} and Cμ = ${numberText(Cmu)} (stated; R&H fitted κ = 0.42 and Cμ = 0.013 to their Silsoe measurements, from memory). k is the same at every height and ε (z + z0) is constant.`,
      `The profile stays in equilibrium with standard k-ε (C_ε1 = ${C_EPS1}, C_ε2 = ${C_EPS2}) only with σ_ε = κ²/((C_ε2 − C_ε1)√Cμ) = ${numberText(sigmaEps)}.`,
      'A surface-layer model: the log law holds in roughly the lowest 100–200 m of the atmosphere (common practice).',
      CODE_CAUTION,
    ];
    const values: Record<string, Value> = {
      u_star: si(profile.u_star, 'm/s'),
      k: si(profile.k, 'm^2/s^2'),
      U_ref: passThrough(args, 'U_ref'),
      z_ref: passThrough(args, 'z_ref'),
      z0: si(rough.z0, 'm'),
      kappa: num(kappa),
      C_mu: num(Cmu),
      table: table(
        ['z', 'U', 'k', 'epsilon', 'omega'],
        rows.map((r) => [si(r.z, 'm'), si(r.U, 'm/s'), si(r.k, 'm^2/s^2'), si(r.epsilon, 'm^2/s^3'), si(r.omega, '1/s')]),
      ),
    };
    const svg = profileSvg({ profile, heights, z_ref, ...(lim?.z_min === undefined ? {} : { z_min: lim.z_min }) });
    return fieldRecord(ABL_FIELDS, values, { warnings, remarks, figure: figure(svg, 'Mean wind speed against height'), tag: 'caution' }, lim?.category ? { z0: `roughness length of terrain category ${lim.category}` } : {});
  },
};

function heightList(zs: readonly number[]): string {
  return `${zs.length > 1 ? 'heights' : 'height'} ${zs.map((z) => lengthText(z)).join(', ')}`;
}

// ---------------------------------------------------------------- patches

const PATCH_NAME: ParamSpec = { name: 'patch', type: 'string', doc: 'name of the mesh patch, e.g. "inlet"' };
const DISTANCE: ParamSpec = { name: 'distance', type: 'quantity', unit: 'm', optional: true, doc: 'distance of the patch from the body, checked by boundaries() against a domain record' };
const TURBULENCE: ParamSpec = { name: 'turbulence', type: 'record', optional: true, doc: 'an inlet_turbulence(...) record, or abl(...) for an atmospheric inflow' };

function patchName(args: Args): string {
  const name = stringArg(args, 'patch').trim();
  if (name === '') throw new TradeError('the patch needs a name, e.g. "inlet"');
  return name;
}

/** A velocity: one speed (taken along +x, downstream) or three components. */
function velocityArg(args: Args, name: string): Vec3 {
  const items = siListArg(args, name, 'm/s');
  if (items.length === 1) return [items[0]!, 0, 0];
  if (items.length === 3) return [items[0]!, items[1]!, items[2]!];
  throw new TradeError(`${name} must be a speed (taken along +x, downstream) or three components [Ux, Uy, Uz], not a list of ${items.length}`);
}

function vectorArg(args: Args, name: string, unit: string): Vec3 {
  const items = siListArg(args, name, unit);
  if (items.length !== 3) throw new TradeError(`${name} must list three components [x, y, z], not ${items.length}`);
  return [items[0]!, items[1]!, items[2]!];
}

function unitVectorArg(args: Args, name: string): Vec3 {
  const v = vectorArg(args, name, '1');
  const length = norm(v);
  if (!(length > 0)) throw new TradeError(`${name} must not be the zero vector`);
  return [v[0] / length, v[1] / length, v[2] / length];
}

interface Inflow {
  turbulence?: UniformTurbulence;
  profile?: InflowProfile;
  /** The speed the turbulence values were worked out for, when the record says. */
  U?: number;
}

/** The turbulence: argument: an inlet_turbulence record (k, ε, ω) or an abl record (u*). */
function inflowArg(args: Args): Inflow {
  const r = optionalRecord(args, 'turbulence');
  if (!r) return {};
  const need = (field: string, unit: string) => {
    const v = fieldSi(r, field, unit);
    if (v === undefined) throw new TradeError(`the turbulence record has no ${field}; pass the record abl(...) or inlet_turbulence(...) returns`);
    return v;
  };
  if (r.fields.has('u_star')) {
    return { profile: { U_ref: need('U_ref', 'm/s'), z_ref: need('z_ref', 'm'), u_star: need('u_star', 'm/s'), z0: need('z0', 'm'), kappa: need('kappa', '1'), C_mu: need('C_mu', '1'), k: need('k', 'm^2/s^2') } };
  }
  if (r.fields.has('k')) {
    const out: Inflow = { turbulence: { k: need('k', 'm^2/s^2'), epsilon: fieldSi(r, 'epsilon', 'm^2/s^3'), omega: fieldSi(r, 'omega', '1/s'), nut: fieldSi(r, 'nut', 'm^2/s') } };
    const U = fieldSi(r, 'U', 'm/s');
    if (U !== undefined) out.U = U;
    return out;
  }
  throw new TradeError('turbulence must be a record from inlet_turbulence(...) (with k and ε or ω) or abl(...) (with u_star)');
}

function positiveOptional(args: Args, name: string, unit: string, what: string): number | undefined {
  const v = optionalSi(args, name, unit);
  if (v !== undefined && !(v > 0)) throw new TradeError(`${what} must be above zero`);
  return v;
}

function patchEntry(kind: PatchKind, params: ParamSpec[], doc: string, example: string, build: (args: Args, name: string) => { patch: Patch; warnings?: string[] }): TradeFunction {
  return {
    name: kind,
    params: [PATCH_NAME, ...params],
    fields: PATCH_FIELDS[kind],
    doc,
    source: 'boundary-condition types of incompressible and compressible finite-volume solvers (Ferziger & Perić, Computational Methods for Fluid Dynamics, 3rd ed., 2002, from memory)',
    example,
    compute(args) {
      const { patch, warnings } = build(args, patchName(args));
      return patchRecord(patch, warnings);
    },
  };
}

const wall = patchEntry(
  'wall',
  [{ name: 'roughness', type: 'quantity', unit: 'm', optional: true, doc: 'equivalent sand-grain roughness height k_s, for a rough wall' }],
  'a stationary no-slip wall (a body surface, or a fixed ground), smooth or rough',
  'wall("body")',
  (args, name) => ({ patch: { name, kind: 'wall', roughness: positiveOptional(args, 'roughness', 'm', 'the roughness height') } }),
);

const moving_wall = patchEntry(
  'moving_wall',
  [{ name: 'U', type: 'list', unit: 'm/s', doc: 'wall velocity: a speed along +x (downstream), or [Ux, Uy, Uz]' }],
  'a no-slip wall sliding in its own plane: a moving ground or belt',
  'moving_wall("road", 30 m/s)',
  (args, name) => ({ patch: { name, kind: 'moving_wall', velocity: velocityArg(args, 'U') } }),
);

const rotating_wall = patchEntry(
  'rotating_wall',
  [
    { name: 'omega', type: 'quantity', unit: '1/s', optional: true, doc: 'angular velocity, e.g. 900 rpm (or give rim: and radius:)' },
    { name: 'axis', type: 'list', unit: '1', default: '[0, -1, 0]', doc: 'rotation axis by the right-hand rule; [0, -1, 0] turns a road wheel forward with x downstream and z up' },
    { name: 'origin', type: 'list', unit: 'm', default: '[0, 0, 0] m', doc: 'a point on the axis (the wheel centre)' },
    { name: 'radius', type: 'quantity', unit: 'm', optional: true, doc: 'rim radius (for the rim speed, and the rolling check in boundaries)' },
    { name: 'rim', type: 'quantity', unit: 'm/s', optional: true, doc: 'rim speed, instead of omega: a rolling wheel turns at the ground speed' },
  ],
  'a no-slip wall turning about an axis: a wheel, with ω given or from its rim speed and radius',
  'rotating_wall("wheel_front", rim: 30 m/s, radius: 0.33 m, origin: [1.2, 0.8, 0.33] m)',
  (args, name) => {
    let omega = optionalSi(args, 'omega', '1/s');
    const radius = positiveOptional(args, 'radius', 'm', 'the radius');
    const rim = optionalSi(args, 'rim', 'm/s');
    if (omega !== undefined && rim !== undefined) throw new TradeError('give omega: or rim: (with radius:), not both');
    if (rim !== undefined) {
      if (radius === undefined) throw new TradeError('a rim speed needs the radius: ω = rim / radius');
      omega = rim / radius;
    }
    if (omega === undefined) throw new TradeError('give the angular velocity omega: (e.g. 900 rpm), or rim: with radius:');
    return { patch: { name, kind: 'rotating_wall', spin: { omega, axis: unitVectorArg(args, 'axis'), origin: vectorArg(args, 'origin', 'm'), radius } } };
  },
);

const slip = patchEntry('slip', [], 'a slip wall: no flow through it, no shear on it (a far side or top of the domain)', 'slip("top")', (_args, name) => ({ patch: { name, kind: 'slip' } }));

const symmetry = patchEntry('symmetry', [], 'a symmetry plane: a mirror (the mid-plane of a half model)', 'symmetry("mid_plane")', (_args, name) => ({ patch: { name, kind: 'symmetry' } }));

const velocity_inlet = patchEntry(
  'velocity_inlet',
  [
    { name: 'U', type: 'list', unit: 'm/s', optional: true, doc: 'inlet velocity: a speed along +x, or [Ux, Uy, Uz]; from the turbulence record when left out' },
    TURBULENCE,
    DISTANCE,
  ],
  'a velocity inlet: uniform velocity with its turbulence, or an atmospheric profile from abl()',
  'velocity_inlet("inlet", 30 m/s)',
  (args, name) => {
    const inflow = inflowArg(args);
    const warnings: string[] = [];
    const patch: Patch = { name, kind: 'velocity_inlet', distance: positiveOptional(args, 'distance', 'm', 'the distance') };
    if (inflow.profile) {
      if (args['U'] !== undefined) throw new TradeError('the abl profile sets the inlet velocity; leave U out');
      patch.profile = inflow.profile;
      return { patch };
    }
    if (args['U'] !== undefined) patch.velocity = velocityArg(args, 'U');
    else if (inflow.U !== undefined) patch.velocity = [inflow.U, 0, 0];
    else throw new TradeError('give the inlet velocity U, or a turbulence: record that carries it');
    if (inflow.turbulence) patch.turbulence = inflow.turbulence;
    const speed = norm(patch.velocity);
    if (inflow.U !== undefined && Math.abs(speed - Math.abs(inflow.U)) > 1e-6 * speed) {
      warnings.push(`the turbulence values were worked out for U = ${numberText(inflow.U)} m/s, not the ${numberText(speed)} m/s of this inlet; k grows with U², so give inlet_turbulence the inlet's speed.`);
    }
    return { patch, warnings };
  },
);

const pressure_inlet = patchEntry(
  'pressure_inlet',
  [
    { name: 'p0', type: 'quantity', unit: 'Pa', default: '0 Pa', doc: 'total pressure, gauge (relative to the operating pressure)' },
    { name: 'direction', type: 'list', unit: '1', default: '[1, 0, 0]', doc: 'flow direction into the domain' },
    TURBULENCE,
    DISTANCE,
  ],
  'a total-pressure inlet with a flow direction',
  'pressure_inlet("inlet", 500 Pa, direction: [1, 0, 0])',
  (args, name) => {
    const inflow = inflowArg(args);
    if (inflow.profile) throw new TradeError('an atmospheric profile goes on a velocity_inlet; a pressure inlet takes inlet_turbulence(...) values');
    const patch: Patch = { name, kind: 'pressure_inlet', p: siArg(args, 'p0', 'Pa'), direction: unitVectorArg(args, 'direction'), distance: positiveOptional(args, 'distance', 'm', 'the distance') };
    if (inflow.turbulence) patch.turbulence = inflow.turbulence;
    return { patch };
  },
);

const pressure_outlet = patchEntry(
  'pressure_outlet',
  [{ name: 'p', type: 'quantity', unit: 'Pa', default: '0 Pa', doc: 'static pressure, gauge (relative to the operating pressure)' }, DISTANCE],
  'a static-pressure outlet',
  'pressure_outlet("outlet")',
  (args, name) => ({ patch: { name, kind: 'pressure_outlet', p: siArg(args, 'p', 'Pa'), distance: positiveOptional(args, 'distance', 'm', 'the distance') } }),
);

const flow_rate_outlet = patchEntry(
  'flow_rate_outlet',
  [{ name: 'Q', type: 'quantity', unit: 'm^3/s', doc: 'volume flow leaving through the patch' }, DISTANCE],
  'an outlet that draws a given volume flow',
  'flow_rate_outlet("exhaust", 2 m^3/s)',
  (args, name) => {
    const Q = siArg(args, 'Q', 'm^3/s');
    if (!(Q > 0)) throw new TradeError('the flow rate Q leaving must be above zero; for inflow use a velocity inlet');
    return { patch: { name, kind: 'flow_rate_outlet', Q, distance: positiveOptional(args, 'distance', 'm', 'the distance') } };
  },
);

const opening = patchEntry(
  'opening',
  [{ name: 'p', type: 'quantity', unit: 'Pa', default: '0 Pa', doc: 'pressure, gauge: static where flow leaves, total where it enters' }, TURBULENCE, DISTANCE],
  'an opening: an inlet or an outlet depending on the local flow direction',
  'opening("top", 0 Pa)',
  (args, name) => {
    const inflow = inflowArg(args);
    if (inflow.profile) throw new TradeError('an atmospheric profile goes on a velocity_inlet; an opening takes inlet_turbulence(...) values for its inflow');
    const patch: Patch = { name, kind: 'opening', p: siArg(args, 'p', 'Pa'), distance: positiveOptional(args, 'distance', 'm', 'the distance') };
    if (inflow.turbulence) patch.turbulence = inflow.turbulence;
    return { patch };
  },
);

// ---------------------------------------------------------------- the boundary table

const BOUNDARY_FIELDS: readonly FieldSpec[] = [{ name: 'table', symbol: '', unit: 'table', doc: 'each patch, its condition and its values' }];

function domainRule(r: RecordValue): DomainRule {
  const length = (field: string) => {
    const f = r.fields.get(field);
    if (!f) return undefined;
    if (f.value.kind !== 'quantity') throw new TradeError(`the domain record's ${field} must be a length, not ${f.value.kind}`);
    return siOf(f.value, 'm', `the domain record's ${field}`);
  };
  const rule: DomainRule = { upstream: length('upstream'), downstream: length('downstream') };
  if (rule.upstream === undefined && rule.downstream === undefined) throw new TradeError('domain must be a domain record with upstream and downstream lengths');
  const name = r.fields.get('rule')?.value;
  if (name?.kind === 'string') rule.rule = name.value;
  return rule;
}

const boundaries: TradeFunction = {
  name: 'boundaries',
  params: [
    { name: 'patches', type: 'list', doc: 'the patches, each from wall(), velocity_inlet(), pressure_outlet(), …' },
    { name: 'domain', type: 'record', optional: true, doc: 'a domain record (upstream, downstream); outlet and inlet distances are checked against it' },
    { name: 'compressible', type: 'bool', default: 'false', doc: 'true for a compressible case, where the density fixes the pressure level' },
  ],
  fields: BOUNDARY_FIELDS,
  doc: 'the table of a domain\u2019s patches and what each gets, with checks that the set is well posed',
  source:
    'well-posedness of open boundaries for incompressible flow (pressure level, mass balance): Ferziger & Perić, Computational Methods for Fluid Dynamics, 3rd ed., 2002 (from memory); distances from the domain record',
  example: 'boundaries([velocity_inlet("inlet", 10 m/s), pressure_outlet("outlet"), wall("body"), slip("sides")])',
  compute(args) {
    const given = args['patches'];
    const items = given?.kind === 'list' ? given.items : given ? [given] : [];
    if (items.length === 0) throw new TradeError('patches must list at least one patch');
    const patches = items.map((v, i) => {
      const where = `item ${i + 1} of patches`;
      if (v.kind !== 'record') throw new TradeError(`${where} is not a patch record`);
      return patchOf(v, where);
    });
    const seen = new Set<string>();
    for (const p of patches) {
      if (seen.has(p.name)) throw new TradeError(`the patch name "${p.name}" appears twice; every patch needs its own name`);
      seen.add(p.name);
    }
    const d = optionalRecord(args, 'domain');
    const { warnings, remarks } = checkBoundaries(patches, boolArg(args, 'compressible'), d ? domainRule(d) : undefined);
    const rows = patches.map((p) => [str(p.name), str(CONDITIONS[p.kind].label), str(describePatch(p))]);
    return fieldRecord(BOUNDARY_FIELDS, { table: table(['patch', 'condition', 'values'], rows) }, { warnings, remarks, tag: 'boundaries' });
  },
};

// ---------------------------------------------------------------- time scales

/** Fewer steps per shedding period than this resolve it poorly (common practice: 20–30 or more). */
const MIN_STEPS_PER_PERIOD = 20;
const COMFORTABLE_STEPS = 30;

const time_step: TradeFunction = {
  name: 'time_step',
  params: [
    { name: 'U', type: 'quantity', unit: 'm/s', doc: 'the largest local speed (near a bluff body often 1.5–2 × the free stream)' },
    { name: 'dx', type: 'quantity', unit: 'm', doc: 'the smallest cell size along the flow' },
    { name: 'courant', type: 'quantity', unit: '1', default: '1', doc: 'target Courant number C = U Δt / Δx' },
  ],
  returns: { symbol: '\\Delta t', unit: 's', doc: 'the time step' },
  doc: 'time step for a target Courant number, Δt = C Δx / U',
  source: 'Courant number C = U Δt/Δx: Courant, Friedrichs & Lewy (1928), Math. Ann. 100, 32–74',
  example: 'time_step(40 m/s, 5 mm, courant: 1)',
  compute(args, ctx) {
    const C = siArg(args, 'courant');
    const dt = courantStep(siArg(args, 'U', 'm/s'), siArg(args, 'dx', 'm'), C);
    if (C > 1) ctx.warn(`C = ${numberText(C)} is above 1: explicit schemes need C ≤ 1 (Courant, Friedrichs & Lewy 1928); an implicit solver runs, but resolves less in time.`);
    return si(dt, 's');
  },
};

const flow_through: TradeFunction = {
  name: 'flow_through',
  params: [
    { name: 'length', type: 'quantity', unit: 'm', doc: 'length of the domain (or of the body) along the flow' },
    { name: 'U', type: 'quantity', unit: 'm/s', doc: 'free-stream speed' },
  ],
  returns: { symbol: 't_{\\text{ft}}', unit: 's', doc: 'the flow-through time' },
  doc: 'time for the flow to pass a length once, L / U',
  source: 'flow-through time L/U (definition)',
  example: 'flow_through(60 m, 30 m/s)',
  compute(args) {
    return si(flowThroughTime(siArg(args, 'length', 'm'), siArg(args, 'U', 'm/s')), 's');
  },
};

const SHEDDING_FIELDS: readonly FieldSpec[] = [
  { name: 'frequency', symbol: 'f', unit: 'Hz', doc: 'shedding frequency f = St U / D' },
  { name: 'period', symbol: 'T', unit: 's', doc: 'shedding period T = 1 / f' },
  { name: 'steps', symbol: 'N_T', unit: '1', doc: 'time steps per period, T / Δt' },
  { name: 'St', symbol: 'St', unit: '1', doc: 'Strouhal number, as given' },
];

const shedding: TradeFunction = {
  name: 'shedding',
  params: [
    { name: 'U', type: 'quantity', unit: 'm/s', doc: 'free-stream speed' },
    { name: 'D', type: 'quantity', unit: 'm', doc: 'body size across the flow (diameter, width)' },
    { name: 'St', type: 'quantity', unit: '1', default: '0.2', doc: 'Strouhal number: about 0.2 for a circular cylinder, 0.13 for a square section' },
    { name: 'dt', type: 'quantity', unit: 's', optional: true, doc: 'time step, for the steps per period' },
  ],
  fields: SHEDDING_FIELDS,
  doc: 'vortex-shedding frequency and period from a Strouhal number, and the time steps per period',
  source:
    'St = f D / U; circular cylinder St ≈ 0.2 at subcritical Re (Roshko 1954, NACA Rep. 1191; Williamson 1996, Annu. Rev. Fluid Mech. 28; from memory); square section St ≈ 0.13 (Okajima 1982, J. Fluid Mech. 123; Lyn et al. 1995, 0.132; from memory)',
  example: 'shedding(20 m/s, 0.1 m, St: 0.2, dt: 1e-4 s)',
  compute(args) {
    const St = siArg(args, 'St');
    const dt = optionalSi(args, 'dt', 's');
    const s = sheddingOf(siArg(args, 'U', 'm/s'), siArg(args, 'D', 'm'), St, dt);
    const warnings: string[] = [];
    if (s.steps !== undefined && s.steps < MIN_STEPS_PER_PERIOD) {
      warnings.push(`only ${numberText(s.steps)} steps per shedding period; about ${MIN_STEPS_PER_PERIOD}–${COMFORTABLE_STEPS} or more are usual (common practice): take Δt ≤ T/${COMFORTABLE_STEPS} = ${numberText(s.period / COMFORTABLE_STEPS)} s.`);
    }
    const remarks = [
      'Strouhal numbers: about 0.2 for a circular cylinder at subcritical Re, roughly 300 to 2e5 (Roshko 1954; Williamson 1996; from memory); about 0.13 for a square section (Okajima 1982; Lyn et al. 1995 measured 0.132 at Re = 21 400; from memory); 0.27 for a circular cylinder above Re ≈ 3.5e6 (Roshko 1961).',
    ];
    if (dt === undefined) remarks.push('Pass dt: (the time step) to get the steps per period.');
    return fieldRecord(
      SHEDDING_FIELDS,
      { frequency: shown(s.frequency, 'Hz'), period: si(s.period, 's'), steps: s.steps === undefined ? undefined : num(s.steps), St: num(St) },
      { warnings, remarks, tag: 'shedding' },
    );
  },
};

// ---------------------------------------------------------------- force coefficients

const FORCE_FIELDS: readonly FieldSpec[] = [
  { name: 'Cd', symbol: 'C_D', unit: '1', doc: 'drag coefficient Fx / (q A), x downstream' },
  { name: 'Cl', symbol: 'C_L', unit: '1', doc: 'lift coefficient Fz / (q A), z up' },
  { name: 'Cs', symbol: 'C_S', unit: '1', doc: 'side-force coefficient Fy / (q A), y lateral' },
  { name: 'Cm', symbol: 'C_M', unit: '1', doc: 'moment coefficient M / (q A l_ref)' },
  { name: 'q', symbol: 'q', unit: 'Pa', doc: 'reference dynamic pressure ½ ρ U²' },
  { name: 'U', symbol: 'U', unit: 'm/s', doc: 'reference speed' },
  { name: 'A', symbol: 'A', unit: 'm^2', doc: 'reference area' },
  { name: 'l_ref', symbol: 'l_{\\text{ref}}', unit: 'm', doc: 'reference length' },
];

const force_coefficients: TradeFunction = {
  name: 'force_coefficients',
  params: [
    { name: 'F', type: 'list', unit: 'N', doc: 'force on the body [Fx, Fy, Fz]: x downstream, y lateral, z up' },
    FLUID,
    { name: 'U', type: 'quantity', unit: 'm/s', doc: 'reference (free-stream) speed' },
    { name: 'A', type: 'quantity', unit: 'm^2', doc: 'reference area (frontal area for a vehicle)' },
    { name: 'M', type: 'quantity', unit: 'N m', optional: true, doc: 'a moment on the body (e.g. pitching, about y), for Cm' },
    { name: 'l_ref', type: 'quantity', unit: 'm', optional: true, doc: 'reference length for Cm (e.g. the wheelbase)' },
  ],
  fields: FORCE_FIELDS,
  doc: 'drag, lift, side-force and moment coefficients from the loads of a simulation',
  source: 'C = F/(q A), q = ½ρU², C_M = M/(q A l_ref): definitions of aerodynamic coefficients (e.g. Hucho, Aerodynamics of Road Vehicles, 4th ed., 1998, from memory)',
  example: 'force_coefficients([620, 15, -90] N, air(T: 20 degC), 30 m/s, 2.2 m^2)',
  compute(args) {
    const F = siListArg(args, 'F', 'N');
    if (F.length !== 3) throw new TradeError(`F must list three components [Fx, Fy, Fz], not ${F.length}`);
    const { rho } = fluidArg(args);
    const M = optionalSi(args, 'M', 'N m');
    const l_ref = optionalSi(args, 'l_ref', 'm');
    const c = forceCoefficients([F[0]!, F[1]!, F[2]!], rho, siArg(args, 'U', 'm/s'), siArg(args, 'A', 'm^2'), M, l_ref);
    const warnings: string[] = [];
    if (F[0]! < 0) warnings.push('Fx is negative: the body is pushed upstream. Check the axes: x points downstream, from the inlet to the outlet.');
    const remarks = [
      'Axes: x downstream (drag), y lateral (side force), z up (lift); each coefficient keeps the sign of its force component.',
      'Coefficients of a simulation: they carry its model and mesh errors; compare them across a grid study or with a measurement before relying on them.',
    ];
    if (l_ref !== undefined && M === undefined) remarks.push('l_ref given without a moment M, so no Cm.');
    return fieldRecord(
      FORCE_FIELDS,
      {
        Cd: num(c.Cd),
        Cl: num(c.Cl),
        Cs: num(c.Cs),
        Cm: c.Cm === undefined ? undefined : num(c.Cm),
        q: si(c.q, 'Pa'),
        U: passThrough(args, 'U'),
        A: passThrough(args, 'A'),
        l_ref: l_ref === undefined ? undefined : passThrough(args, 'l_ref'),
      },
      { warnings, remarks, tag: 'force coefficients' },
    );
  },
};

export const boundaryEntries: TradeFunction[] = [
  inlet_turbulence,
  duct_length_scale,
  terrain,
  abl,
  wall,
  moving_wall,
  rotating_wall,
  slip,
  symmetry,
  velocity_inlet,
  pressure_inlet,
  pressure_outlet,
  flow_rate_outlet,
  opening,
  boundaries,
  time_step,
  flow_through,
  shedding,
  force_coefficients,
];
