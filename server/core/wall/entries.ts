// The near-wall family's worksheet entries: skin friction, boundary layer,
// first-cell height and y+, the law of the wall, wall-layer stacks and the y+
// report of a run. The maths lives in the sibling files as functions of SI
// numbers; here arguments are read and results are given units and words.
import { choiceArg, fluidArg, optionalSi, siArg, siListArg, stringArg, type FluidProps } from '../shared/args.js';
import { compressibilityWarnings } from '../shared/flow.js';
import { fieldRecord } from '../shared/records.js';
import type { Args, FieldSpec, TradeFunction } from '../shared/registry.js';
import { TradeError } from '../shared/trade-error.js';
import { figure, list, num, shown, si, str } from '../shared/values.js';
import { lengthText, numberText } from '../shared/words.js';
import { boundaryLayer } from './boundary-layer.js';
import { bandOf, firstCell, PLACEMENTS, wallTreatment, yplusOf, type Placement } from './first-cell.js';
import { histogramSvg } from './histogram-svg.js';
import { B, frictionVelocity, KAPPA, spaldingUplus } from './law-of-wall.js';
import { layersInside, solveStack, STACK_LIMITS, type Stack } from './layer-stack.js';
import { readWallSamples } from './samples.js';
import { skinFriction, SKIN_FRICTION_KINDS, SKIN_FRICTION_METHODS, type SkinFrictionMethod } from './skin-friction.js';
import { stackSvg, type StackScale } from './stack-svg.js';
import { correctedFirst, yplusStats } from './yplus-report.js';

function methodArg(args: Args): SkinFrictionMethod {
  return choiceArg(args, 'method', SKIN_FRICTION_METHODS);
}

function placementArg(args: Args): Placement {
  return choiceArg(args, 'placement', PLACEMENTS);
}

const METHOD_PARAM = {
  name: 'method',
  type: 'string',
  default: '"schlichting"',
  choices: SKIN_FRICTION_METHODS,
  doc: 'skin-friction correlation: blasius, schlichting, power, ittc1957 or white',
} as const;

const PLACEMENT_PARAM = {
  name: 'placement',
  type: 'string',
  default: '"centroid"',
  choices: PLACEMENTS,
  doc: 'where y+ is measured: at the first cell centre (cell-centred solvers) or at its top',
} as const;

const FLUID = { name: 'fluid', type: 'fluid', doc: 'a fluid record with rho and mu (or nu), e.g. air(T: 20 degC)' } as const;
const LOG_LAYER_TOP = 300;

/** The flat-plate formulas are incompressible: say so when the fluid's speed of sound puts the flow above Ma 0.3. */
function incompressibleOnly(U: number, fluid: FluidProps, what: string): string[] {
  if (fluid.a === undefined) return [];
  return compressibilityWarnings(U / fluid.a).map((w) => `${w}; the flat-plate formulas here are for incompressible flow, so ${what} is only a rough estimate.`);
}

const skin_friction: TradeFunction = {
  name: 'skin_friction',
  params: [
    { name: 'Re_x', type: 'quantity', unit: '1', doc: 'Reynolds number: on the distance from the leading edge (local), or on the plate length (mean)' },
    METHOD_PARAM,
    { name: 'kind', type: 'string', default: '"local"', choices: SKIN_FRICTION_KINDS, doc: 'local coefficient c_f at Re_x, or the mean C_F over a plate of that Reynolds number (ittc1957 has only the mean)' },
  ],
  returns: { symbol: 'c_{f}', unit: '1', doc: 'the skin-friction coefficient, local or mean as kind says' },
  doc: 'skin-friction coefficient of a smooth flat plate: local c_f (the default) or the mean C_F over the length',
  source:
    'Blasius (1908) laminar, 0.664/1.328; Schlichting, Boundary-Layer Theory 7th ed., Eq. 21.16 and its footnote, and Eq. 21.12 (one-seventh power law, mean 0.074 after Prandtl); ITTC 1957 line (mean only); White, Viscous Fluid Flow 3rd ed. ch. 6',
  example: 'skin_friction(1e6, method: "schlichting")',
  compute(args, ctx) {
    const r = skinFriction(siArg(args, 'Re_x'), methodArg(args), choiceArg(args, 'kind', SKIN_FRICTION_KINDS));
    r.warnings.forEach((w) => ctx.warn(w));
    return num(r.cf);
  },
};

const BOUNDARY_LAYER_FIELDS: readonly FieldSpec[] = [
  { name: 'Re_x', symbol: '\\mathrm{Re}_{x}', unit: '1', doc: 'Reynolds number at x' },
  { name: 'delta', symbol: '\\delta', unit: 'm', doc: 'boundary-layer thickness' },
  { name: 'delta_star', symbol: '\\delta^{*}', unit: 'm', doc: 'displacement thickness' },
  { name: 'theta', symbol: '\\theta', unit: 'm', doc: 'momentum thickness' },
  { name: 'regime', symbol: '', unit: 'text', doc: 'laminar below Re_x = 5e5' },
];

const boundary_layer: TradeFunction = {
  name: 'boundary_layer',
  params: [
    { name: 'U', type: 'quantity', unit: 'm/s', doc: 'free-stream speed' },
    { name: 'x', type: 'quantity', unit: 'm', doc: 'distance from the leading edge' },
    FLUID,
  ],
  fields: BOUNDARY_LAYER_FIELDS,
  doc: 'flat-plate boundary layer at x: Re_x, thickness delta, displacement delta_star, momentum theta, regime',
  source: 'Blasius (1908) laminar similarity solution (δ99 = 4.91 x/√Re_x); Prandtl one-seventh power law, Schlichting Eq. 21.8 (δ = 0.37 x Re_x^-1/5)',
  example: 'boundary_layer(30 m/s, 4 m, air(T: 20 degC))',
  compute(args) {
    const fluid = fluidArg(args);
    const U = siArg(args, 'U', 'm/s');
    const bl = boundaryLayer(U, siArg(args, 'x', 'm'), fluid.nu);
    const remark =
      bl.regime === 'laminar'
        ? 'Laminar (Re_x below 5e5): Blasius, δ99 = 4.91 x/√Re_x, δ* = 1.721 x/√Re_x, θ = 0.664 x/√Re_x.'
        : 'Turbulent from the leading edge (Re_x at or above 5e5): one-seventh power law, δ = 0.37 x Re_x^-1/5, δ* = δ/8, θ = 7δ/72.';
    return fieldRecord(
      BOUNDARY_LAYER_FIELDS,
      { Re_x: num(bl.Re_x), delta: si(bl.delta, 'm'), delta_star: si(bl.delta_star, 'm'), theta: si(bl.theta, 'm'), regime: str(bl.regime) },
      { warnings: [...bl.warnings, ...incompressibleOnly(U, fluid, 'δ')], remarks: [remark, 'Smooth flat plate at zero pressure gradient: on a body, an estimate of the wall layer, not its local value.'], tag: 'boundary layer' },
    );
  },
};

const FIRST_CELL_FIELDS: readonly FieldSpec[] = [
  { name: 'Re', symbol: '\\mathrm{Re}_{L}', unit: '1', doc: 'Reynolds number on L' },
  { name: 'cf', symbol: 'c_{f}', unit: '1', doc: 'skin-friction coefficient' },
  { name: 'tau_w', symbol: '\\tau_{w}', unit: 'Pa', doc: 'wall shear stress' },
  { name: 'u_tau', symbol: 'u_{\\tau}', unit: 'm/s', doc: 'friction velocity' },
  { name: 'l_visc', symbol: '\\ell_{\\nu}', unit: 'm', doc: 'viscous length ν/u_τ' },
  { name: 'height', symbol: '\\Delta y_{1}', unit: 'm', doc: 'first-cell height' },
  { name: 'centroid', symbol: 'y_{p}', unit: 'm', doc: 'first-cell centre above the wall' },
  { name: 'band', symbol: '', unit: 'text', doc: 'near-wall region targeted' },
];

const first_cell: TradeFunction = {
  name: 'first_cell',
  params: [
    { name: 'U', type: 'quantity', unit: 'm/s', doc: 'free-stream speed' },
    { name: 'L', type: 'quantity', unit: 'm', doc: 'reference length (body length) for the Reynolds number' },
    FLUID,
    { name: 'yplus', type: 'quantity', unit: '1', default: '1', doc: 'target y+' },
    METHOD_PARAM,
    PLACEMENT_PARAM,
  ],
  fields: FIRST_CELL_FIELDS,
  doc: 'first-cell height for a target y+: Re, cf, tau_w, u_tau, l_visc, height, centroid, band',
  source: 'τ_w = ½ρU²c_f, u_τ = √(τ_w/ρ), l_visc = ν/u_τ (Pope, Turbulent Flows, 2000, §7.1); c_f from skin_friction at Re_L',
  example: 'first_cell(30 m/s, 4 m, air(T: 20 degC), yplus: 1)',
  compute(args) {
    const fluid = fluidArg(args);
    const method = methodArg(args);
    const placement = placementArg(args);
    const target = siArg(args, 'yplus');
    const U = siArg(args, 'U', 'm/s');
    const c = firstCell(U, siArg(args, 'L', 'm'), fluid.rho, fluid.nu, target, method, placement);
    const warnings = [...c.warnings, ...bandWarnings(target), ...incompressibleOnly(U, fluid, 'the wall shear and so the first-cell height')];
    const remarks = [
      `Targets the ${c.band}. ${wallTreatment(c.band)}`,
      placement === 'centroid'
        ? 'Target y+ met at the first cell centre (cell-centred solvers): height = 2 × y+ × l_visc.'
        : 'Target y+ met at the first cell top: height = y+ × l_visc.',
      `c_f by ${method} (${c.source}) at Re built on L, the lowest along the body; near the nose τ_w is higher and so is y+, so check the run with yplus_report.`,
    ];
    return fieldRecord(
      FIRST_CELL_FIELDS,
      {
        Re: num(c.Re),
        cf: num(c.cf),
        tau_w: si(c.tau_w, 'Pa'),
        u_tau: si(c.u_tau, 'm/s'),
        l_visc: si(c.l_visc, 'm'),
        height: si(c.height, 'm'),
        centroid: si(c.centroid, 'm'),
        band: str(c.band),
      },
      { warnings, remarks, tag: 'first cell' },
    );
  },
};

/** Flags for a target y+ outside the two bands wall treatments are built for (common practice). */
function bandWarnings(yplus: number): string[] {
  const band = bandOf(yplus);
  if (band === 'buffer layer') {
    return [`y+ ${numberText(yplus)} lies in the buffer layer (5–30, common practice), where neither wall functions nor wall resolution is sound.`];
  }
  if (band === 'outer layer') {
    return [`y+ ${numberText(yplus)} lies beyond the log layer (above about ${LOG_LAYER_TOP}, common practice); wall functions lose their basis there.`];
  }
  return [];
}

const yplus: TradeFunction = {
  name: 'yplus',
  params: [
    { name: 'height', type: 'quantity', unit: 'm', doc: 'first-cell height' },
    { name: 'U', type: 'quantity', unit: 'm/s', doc: 'free-stream speed' },
    { name: 'L', type: 'quantity', unit: 'm', doc: 'reference length for the Reynolds number' },
    FLUID,
    PLACEMENT_PARAM,
    METHOD_PARAM,
  ],
  returns: { symbol: 'y^{+}', unit: '1', doc: 'the y+ of the first cell, at its centre or top as placement says' },
  doc: 'the y+ a first-cell height reaches (the inverse of first_cell)',
  source: 'y+ = y u_τ/ν with u_τ from τ_w = ½ρU²c_f (Pope, Turbulent Flows, 2000, §7.1); c_f from skin_friction at Re_L',
  example: 'yplus(40 um, 30 m/s, 4 m, air(T: 20 degC))',
  compute(args, ctx) {
    const fluid = fluidArg(args);
    const U = siArg(args, 'U', 'm/s');
    const r = yplusOf(siArg(args, 'height', 'm'), U, siArg(args, 'L', 'm'), fluid.rho, fluid.nu, methodArg(args), placementArg(args));
    [...r.warnings, ...bandWarnings(r.yplus), ...incompressibleOnly(U, fluid, 'y+')].forEach((w) => ctx.warn(w));
    return num(r.yplus);
  },
};

const law_of_wall: TradeFunction = {
  name: 'law_of_wall',
  params: [{ name: 'yplus', type: 'quantity', unit: '1', doc: 'wall distance in wall units' }],
  returns: { symbol: 'u^{+}', unit: '1', doc: 'the mean velocity in wall units' },
  doc: `u+ at a given y+ by Spalding's single formula (κ = ${KAPPA}, B = ${B})`,
  source: `Spalding (1961), "A single formula for the law of the wall", J. Appl. Mech. 28(3); κ = ${KAPPA}, B = ${B} (Coles & Hirst 1968)`,
  example: 'law_of_wall(30)',
  compute(args, ctx) {
    const y = siArg(args, 'yplus');
    if (y > LOG_LAYER_TOP) ctx.warn(`y+ ${numberText(y)} is beyond the log layer (about ${LOG_LAYER_TOP}, common practice); the outer (wake) region departs from the law of the wall.`);
    return num(spaldingUplus(y));
  },
};

const friction_velocity: TradeFunction = {
  name: 'friction_velocity',
  params: [
    { name: 'U_p', type: 'quantity', unit: 'm/s', doc: 'velocity sampled parallel to the wall' },
    { name: 'y_p', type: 'quantity', unit: 'm', doc: 'distance of the sample from the wall' },
    FLUID,
  ],
  returns: { symbol: 'u_{\\tau}', unit: 'm/s', doc: 'the friction velocity' },
  doc: "friction velocity u_τ that puts a velocity sample on Spalding's law of the wall",
  source: `Spalding (1961), "A single formula for the law of the wall", J. Appl. Mech. 28(3), solved for u_τ; κ = ${KAPPA}, B = ${B} (Coles & Hirst 1968)`,
  example: 'friction_velocity(12 m/s, 2 mm, air(T: 20 degC))',
  compute(args, ctx) {
    const { nu } = fluidArg(args);
    const r = frictionVelocity(siArg(args, 'U_p', 'm/s'), siArg(args, 'y_p', 'm'), nu);
    if (r.yplus > LOG_LAYER_TOP) ctx.warn(`the sample sits at y+ ${numberText(r.yplus)}, beyond the log layer (about ${LOG_LAYER_TOP}, common practice); u_τ is an estimate.`);
    return si(r.u_tau, 'm/s');
  },
};


const SCALES: readonly StackScale[] = ['linear', 'log'];

const STACK_FIELDS: readonly FieldSpec[] = [
  { name: 'first', symbol: '\\Delta y_{1}', unit: 'm', doc: 'first-layer height' },
  { name: 'growth', symbol: 'r', unit: '1', doc: 'growth ratio' },
  { name: 'count', symbol: 'N', unit: '1', doc: 'number of layers' },
  { name: 'total', symbol: 'H', unit: 'm', doc: 'stack thickness' },
  { name: 'last', symbol: '\\Delta y_{N}', unit: 'm', doc: 'last (outermost) layer height' },
  { name: 'heights', symbol: '\\Delta y_{i}', unit: 'list', doc: 'layer heights from the wall out' },
  { name: 'jump', symbol: 'J', unit: '1', doc: 'core cell / last layer (with core)' },
  { name: 'inside', symbol: 'N_{\\delta}', unit: '1', doc: 'layers inside the boundary layer (with delta)' },
  { name: 'coverage', symbol: 'H/\\delta', unit: '1', doc: 'stack thickness / δ (with delta)' },
];

const layer_stack: TradeFunction = {
  name: 'layer_stack',
  params: [
    { name: 'first', type: 'quantity', unit: 'm', optional: true, doc: 'first-layer height at the wall' },
    { name: 'growth', type: 'quantity', unit: '1', optional: true, doc: 'growth ratio between neighbouring layers' },
    { name: 'count', type: 'quantity', unit: '1', optional: true, doc: 'number of layers' },
    { name: 'total', type: 'quantity', unit: 'm', optional: true, doc: 'total stack thickness' },
    { name: 'core', type: 'quantity', unit: 'm', optional: true, doc: 'size of the core cell next to the stack' },
    { name: 'delta', type: 'quantity', unit: 'm', optional: true, doc: 'boundary-layer thickness' },
    { name: 'scale', type: 'string', default: '"linear"', choices: SCALES, doc: 'axis of the picture: linear or log' },
  ],
  fields: STACK_FIELDS,
  doc: 'wall-layer stack from any three of first, growth, count, total: first, growth, count, total, last, heights (+ jump, inside, coverage)',
  source: 'geometric series: total = first (growth^count − 1)/(growth − 1), last = first growth^(count−1); growth by bracketed bisection',
  example: 'layer_stack(first: 20 um, growth: 1.2, total: 30 mm, delta: 60 mm)',
  compute(args) {
    const given = {
      first: optionalSi(args, 'first', 'm'),
      growth: optionalSi(args, 'growth'),
      count: optionalSi(args, 'count'),
      total: optionalSi(args, 'total', 'm'),
    };
    const core = optionalSi(args, 'core', 'm');
    const delta = optionalSi(args, 'delta', 'm');
    for (const [k, v] of [['core', core], ['delta', delta]] as const) {
      if (v !== undefined && !(v > 0)) throw new TradeError(`${k} must be a positive length`);
    }
    const scale = choiceArg(args, 'scale', SCALES);
    const s = solveStack(given);
    const layer = delta === undefined ? undefined : { delta, inside: layersInside(s.heights, delta) };
    const values = {
      first: si(s.first, 'm'),
      growth: num(s.growth),
      count: num(s.count),
      total: si(s.total, 'm'),
      last: si(s.last, 'm'),
      heights: list(s.heights.map((h) => si(h, 'm'))),
      jump: core === undefined ? undefined : num(core / s.last),
      inside: layer && num(layer.inside),
      coverage: layer && num(s.total / layer.delta),
    };
    return fieldRecord(
      STACK_FIELDS,
      values,
      {
        warnings: stackWarnings(s, core, layer),
        remarks: stackRemarks(s, delta),
        figure: figure(stackSvg({ heights: s.heights, growth: s.growth, scale, delta, core }), `Wall-layer stack to scale (${scale} axis)`),
        tag: 'layer stack',
      },
      { jump: 'core cell / last layer', inside: 'layers inside the boundary layer', coverage: 'stack thickness / δ' },
    );
  },
};

/** Rules of thumb (common practice): gentle growth, a small jump to the core, ten or more cells across δ. */
function stackWarnings(s: Stack, core: number | undefined, layer: { delta: number; inside: number } | undefined): string[] {
  const w: string[] = [];
  if (s.growth > STACK_LIMITS.growth) w.push(`growth ratio ${numberText(s.growth)} is above about ${STACK_LIMITS.growth} (common practice); neighbouring layers differ too much in size.`);
  if (s.growth < 1) w.push(`growth ratio ${numberText(s.growth)} is below 1: the layers get thinner away from the wall.`);
  if (s.count > STACK_LIMITS.count) {
    w.push(
      `${s.count} layers is far more than a wall-layer stack usually has (up to about ${STACK_LIMITS.count}, common practice); ` +
        `check first, growth and total (${lengthText(s.total)}): a total past the boundary layer belongs to the core mesh.`,
    );
  }
  if (core !== undefined && core / s.last > STACK_LIMITS.jump) {
    w.push(`the core cell is ${numberText(core / s.last)} × the last layer, above about ${STACK_LIMITS.jump} (common practice); add layers or shrink the core cells near the wall.`);
  }
  if (layer) {
    const { delta, inside } = layer;
    // Core cells above the stack also lie across δ when the stack is thinner than δ.
    const across = inside + (core !== undefined && s.total < delta ? (delta - s.total) / core : 0);
    if (across < STACK_LIMITS.cellsAcross) {
      w.push(`only about ${Math.floor(across)} cells lie across the boundary layer (δ = ${lengthText(delta)}); about ${STACK_LIMITS.cellsAcross} or more are usual (common practice).`);
    }
  }
  return w;
}

function stackRemarks(s: Stack, delta: number | undefined): string[] {
  const r = [`Solved for ${s.solved}.`];
  // askedTotal is set only when the count was solved; the rounding is worth a word only where it shows.
  if (s.askedTotal !== undefined && lengthText(s.total) !== lengthText(s.askedTotal)) {
    r.push(`The count is rounded up to whole layers, so the stack is ${lengthText(s.total)} thick rather than the ${lengthText(s.askedTotal)} asked for.`);
  }
  if (delta !== undefined) {
    r.push(
      s.total < delta
        ? `The stack covers ${numberText((100 * s.total) / delta)} % of δ; the rest of the boundary layer lies in the core mesh.`
        : `The stack reaches the boundary-layer edge${s.total > delta ? ' and past it' : ''} (${numberText((100 * s.total) / delta)} % of δ).`,
    );
  }
  return r;
}

const REPORT_FIELDS: readonly FieldSpec[] = [
  { name: 'count', symbol: 'N', unit: '1', doc: 'wall faces' },
  { name: 'min', symbol: 'y^{+}_{\\min}', unit: '1', doc: 'lowest y+' },
  { name: 'max', symbol: 'y^{+}_{\\max}', unit: '1', doc: 'highest y+' },
  { name: 'mean', symbol: '\\bar{y}^{+}', unit: '1', doc: 'mean over faces' },
  { name: 'weighted_mean', symbol: '\\bar{y}^{+}_{w}', unit: '1', doc: 'mean weighted by the weight column (the plain mean without one)' },
  { name: 'p05', symbol: 'y^{+}_{5}', unit: '1', doc: '5th percentile' },
  { name: 'p50', symbol: 'y^{+}_{50}', unit: '1', doc: 'median' },
  { name: 'p95', symbol: 'y^{+}_{95}', unit: '1', doc: '95th percentile' },
  { name: 'in_band', symbol: 'f_{\\text{band}}', unit: '1', doc: 'share within the band' },
  { name: 'corrected_first', symbol: '\\Delta y_{1}', unit: 'm', doc: 'next first-layer height (with first)' },
];

/** Share of the wall a run should have inside its band (common practice: most of it). */
const IN_BAND_AIM = 0.9;

const yplus_report: TradeFunction = {
  name: 'yplus_report',
  params: [
    { name: 'path', type: 'string', doc: 'CSV of wall samples, relative to the project folder (header row; comma, semicolon or tab)' },
    { name: 'column', type: 'string', default: '"yplus"', doc: 'column holding y+' },
    { name: 'weight', type: 'string', default: '"area"', doc: 'column of face weights (area); used when present, "none" for equal weights' },
    { name: 'target', type: 'quantity', unit: '1', default: '1', doc: 'the y+ the mesh aims at' },
    { name: 'band', type: 'list', unit: '1', default: '[0.5, 5]', doc: 'accepted y+ range [low, high]' },
    { name: 'first', type: 'quantity', unit: 'm', optional: true, doc: 'first-layer height of the run, for corrected_first' },
  ],
  fields: REPORT_FIELDS,
  doc: 'y+ statistics of a run: count, min, max, mean, weighted_mean, p05, p50, p95, in_band, corrected_first',
  source: 'area-weighted mean and share; percentiles by Hyndman & Fan (1996) definition 7; corrected_first = first × target / weighted mean',
  example: 'yplus_report("../data/van-yplus.csv", first: 40 um)',
  compute(args, ctx) {
    const path = stringArg(args, 'path');
    const column = stringArg(args, 'column');
    const weightName = stringArg(args, 'weight');
    const target = siArg(args, 'target');
    const bandList = siListArg(args, 'band');
    if (bandList.length !== 2 || !(bandList[0]! < bandList[1]!)) throw new TradeError('band must be a list of two numbers, low then high, e.g. [0.5, 5]');
    if (!(target > 0)) throw new TradeError('target must be a positive y+');
    const band: [number, number] = [bandList[0]!, bandList[1]!];
    const first = optionalSi(args, 'first', 'm');
    if (first !== undefined && !(first > 0)) throw new TradeError('first must be a positive length');

    const weight = weightName === '' || weightName.toLowerCase() === 'none' ? undefined : weightName;
    const samples = readWallSamples(ctx.readData(path), column, weight);
    const st = yplusStats(samples.values, samples.weights, band);
    const values = {
      count: num(st.count),
      min: num(st.min),
      max: num(st.max),
      mean: num(st.mean),
      weighted_mean: num(st.weighted_mean),
      p05: num(st.p05),
      p50: num(st.p50),
      p95: num(st.p95),
      in_band: shown(st.in_band * 100, '%'),
      corrected_first: first === undefined ? undefined : si(correctedFirst(first, target, st.weighted_mean), 'm'),
    };
    const notes = {
      weighted_mean: samples.weighted ? `mean weighted by ${weight}` : 'no weight column: same as mean',
      in_band: `share within ${numberText(band[0])}–${numberText(band[1])}`,
      corrected_first: 'next first-layer height',
    };

    const share = samples.weighted ? 'of the wall area' : 'of the faces';
    const warnings: string[] = [];
    if (st.in_band < IN_BAND_AIM) {
      warnings.push(`only ${numberText(st.in_band * 100)} % ${share} has y+ inside ${numberText(band[0])}–${numberText(band[1])}; most of the wall, about ${IN_BAND_AIM * 100} % or more, is usual (common practice).`);
    }
    const aim = bandOf(target);
    const seen = bandOf(st.weighted_mean);
    if (seen !== aim) warnings.push(`the mean y+ ${numberText(st.weighted_mean)} lies in the ${seen}, not in the ${aim} the target ${numberText(target)} aims at.`);

    const remarks = [
      `Target y+ ${numberText(target)}: ${aim}. ${wallTreatment(aim)}`,
      `p05, p50 and p95 count faces (Hyndman & Fan 1996, definition 7); weighted_mean and in_band weigh each face${samples.weighted ? ` by ${weight}` : ''}.`,
    ];
    if (weight && !samples.weighted) remarks.push(`The file has no column ${weight}, so every face counts equally.`);
    remarks.push(
      first === undefined
        ? 'Pass first: (the first-layer height of this run) to get corrected_first.'
        : 'corrected_first = first × target / weighted_mean; meeting a y+ target is iterative, so re-run and report again.',
    );
    return fieldRecord(
      REPORT_FIELDS,
      values,
      {
        warnings,
        remarks,
        figure: figure(histogramSvg({ values: samples.values, weights: samples.weights, weighted: samples.weighted, band, target }), `y+ histogram from ${path}`),
        tag: 'y+ report',
      },
      notes,
    );
  },
};

export const wallEntries: TradeFunction[] = [skin_friction, boundary_layer, first_cell, yplus, law_of_wall, friction_velocity, layer_stack, yplus_report];
