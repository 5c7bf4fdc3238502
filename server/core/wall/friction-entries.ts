// Registry entries for skin friction, boundary-layer thickness, first-cell
// height and the law of the wall. The maths lives in the sibling files.
import { fluidArg, num, record, si, siArg, str } from '../build.js';
import type { TradeFunction } from '../registry.js';
import { guarded, METHOD_PARAM, methodArg, PLACEMENT_PARAM, placementArg } from './args.js';
import { boundaryLayer } from './boundary-layer.js';
import { bandOf, firstCell, wallTreatment, yplusOf } from './first-cell.js';
import { B, frictionVelocity, KAPPA, spaldingUplus } from './law-of-wall.js';
import { skinFriction } from './skin-friction.js';
import { sig3 } from './svg.js';

const FLUID = { name: 'fluid', type: 'fluid', doc: 'a fluid record with rho and mu (or nu), e.g. air(T: 20 degC)' } as const;
const LOG_LAYER_TOP = 300;

const skin_friction: TradeFunction = {
  name: 'skin_friction',
  params: [{ name: 'Re_x', type: 'quantity', unit: '1', doc: 'Reynolds number built on the distance from the leading edge' }, METHOD_PARAM],
  doc: 'local skin-friction coefficient of a smooth flat plate (ittc1957 gives the mean coefficient)',
  source:
    'Blasius (1908) laminar; Schlichting, Boundary-Layer Theory 7th ed., footnote to Eq. 21.16 and Eq. 21.12 (one-seventh power law); ITTC 1957 line; White, Viscous Fluid Flow 3rd ed. ch. 6',
  example: 'skin_friction(1e6, method: "schlichting")',
  compute: guarded((args, ctx) => {
    const r = skinFriction(siArg(args, 'Re_x'), methodArg(args));
    r.warnings.forEach((w) => ctx.warn(w));
    return num(r.cf);
  }),
};

const boundary_layer: TradeFunction = {
  name: 'boundary_layer',
  params: [
    { name: 'U', type: 'quantity', unit: 'm/s', doc: 'free-stream speed' },
    { name: 'x', type: 'quantity', unit: 'm', doc: 'distance from the leading edge' },
    FLUID,
  ],
  doc: 'flat-plate boundary layer at x: Re_x, thickness delta, displacement delta_star, momentum theta, regime',
  source: 'Blasius (1908) laminar similarity solution (δ99 = 4.91 x/√Re_x); Prandtl one-seventh power law, Schlichting Eq. 21.8 (δ = 0.37 x Re_x^-1/5)',
  example: 'boundary_layer(30 m/s, 4 m, air(T: 20 degC))',
  compute: guarded((args) => {
    const { nu } = fluidArg(args);
    const bl = boundaryLayer(siArg(args, 'U', 'm/s'), siArg(args, 'x', 'm'), nu);
    const remark =
      bl.regime === 'laminar'
        ? 'Laminar (Re_x below 5e5): Blasius, δ99 = 4.91 x/√Re_x, δ* = 1.721 x/√Re_x, θ = 0.664 x/√Re_x.'
        : 'Turbulent from the leading edge (Re_x at or above 5e5): one-seventh power law, δ = 0.37 x Re_x^-1/5, δ* = δ/8, θ = 7δ/72.';
    return record(
      [
        ['Re_x', num(bl.Re_x), 'Reynolds number at x'],
        ['delta', si(bl.delta, 'm'), 'boundary-layer thickness'],
        ['delta_star', si(bl.delta_star, 'm'), 'displacement thickness'],
        ['theta', si(bl.theta, 'm'), 'momentum thickness'],
        ['regime', str(bl.regime), 'laminar below Re_x = 5e5'],
      ],
      { warnings: bl.warnings, remarks: [remark, 'Smooth flat plate at zero pressure gradient: on a body, an estimate of the wall layer, not its local value.'], tag: 'boundary layer' },
    );
  }),
};

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
  doc: 'first-cell height for a target y+: Re, cf, tau_w, u_tau, l_visc, height, centroid, band',
  source: 'τ_w = ½ρU²c_f, u_τ = √(τ_w/ρ), l_visc = ν/u_τ (Pope, Turbulent Flows, 2000, §7.1); c_f from skin_friction at Re_L',
  example: 'first_cell(30 m/s, 4 m, air(T: 20 degC), yplus: 1)',
  compute: guarded((args) => {
    const { rho, nu } = fluidArg(args);
    const method = methodArg(args);
    const placement = placementArg(args);
    const target = siArg(args, 'yplus');
    const c = firstCell(siArg(args, 'U', 'm/s'), siArg(args, 'L', 'm'), rho, nu, target, method, placement);
    const warnings = [...c.warnings, ...bandWarnings(target)];
    const remarks = [
      `Targets the ${c.band}. ${wallTreatment(c.band)}`,
      placement === 'centroid'
        ? 'Target y+ met at the first cell centre (cell-centred solvers): height = 2 × y+ × l_visc.'
        : 'Target y+ met at the first cell top: height = y+ × l_visc.',
      `c_f by ${method} at Re built on L, the lowest along the body; near the nose τ_w is higher and so is y+, so check the run with yplus_report.`,
    ];
    return record(
      [
        ['Re', num(c.Re), 'Reynolds number on L'],
        ['cf', num(c.cf), 'skin-friction coefficient'],
        ['tau_w', si(c.tau_w, 'Pa'), 'wall shear stress'],
        ['u_tau', si(c.u_tau, 'm/s'), 'friction velocity'],
        ['l_visc', si(c.l_visc, 'm'), 'viscous length ν/u_τ'],
        ['height', si(c.height, 'm'), 'first-cell height'],
        ['centroid', si(c.centroid, 'm'), 'first-cell centre above the wall'],
        ['band', str(c.band), 'near-wall region targeted'],
      ],
      { warnings, remarks, tag: 'first cell' },
    );
  }),
};

/** Flags for a target y+ outside the two bands wall treatments are built for (common practice). */
export function bandWarnings(yplus: number): string[] {
  const band = bandOf(yplus);
  if (band === 'buffer layer') {
    return [`y+ ${sig3(yplus)} lies in the buffer layer (5–30, common practice), where neither wall functions nor wall resolution is sound.`];
  }
  if (band === 'outer layer') {
    return [`y+ ${sig3(yplus)} lies beyond the log layer (above about ${LOG_LAYER_TOP}, common practice); wall functions lose their basis there.`];
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
  doc: 'the y+ a first-cell height reaches (the inverse of first_cell)',
  source: 'y+ = y u_τ/ν with u_τ from τ_w = ½ρU²c_f (Pope, Turbulent Flows, 2000, §7.1); c_f from skin_friction at Re_L',
  example: 'yplus(40 um, 30 m/s, 4 m, air(T: 20 degC))',
  compute: guarded((args, ctx) => {
    const { rho, nu } = fluidArg(args);
    const r = yplusOf(siArg(args, 'height', 'm'), siArg(args, 'U', 'm/s'), siArg(args, 'L', 'm'), rho, nu, methodArg(args), placementArg(args));
    [...r.warnings, ...bandWarnings(r.yplus)].forEach((w) => ctx.warn(w));
    return num(r.yplus);
  }),
};

const law_of_wall: TradeFunction = {
  name: 'law_of_wall',
  params: [{ name: 'yplus', type: 'quantity', unit: '1', doc: 'wall distance in wall units' }],
  doc: `u+ at a given y+ by Spalding's single formula (κ = ${KAPPA}, B = ${B})`,
  source: `Spalding (1961), "A single formula for the law of the wall", J. Appl. Mech. 28(3); κ = ${KAPPA}, B = ${B} (Coles & Hirst 1968)`,
  example: 'law_of_wall(30)',
  compute: guarded((args, ctx) => {
    const y = siArg(args, 'yplus');
    if (y > LOG_LAYER_TOP) ctx.warn(`y+ ${sig3(y)} is beyond the log layer (about ${LOG_LAYER_TOP}, common practice); the outer (wake) region departs from the law of the wall.`);
    return num(spaldingUplus(y));
  }),
};

const friction_velocity: TradeFunction = {
  name: 'friction_velocity',
  params: [
    { name: 'U_p', type: 'quantity', unit: 'm/s', doc: 'velocity sampled parallel to the wall' },
    { name: 'y_p', type: 'quantity', unit: 'm', doc: 'distance of the sample from the wall' },
    FLUID,
  ],
  doc: "friction velocity u_τ that puts a velocity sample on Spalding's law of the wall",
  source: `Spalding (1961), "A single formula for the law of the wall", J. Appl. Mech. 28(3), solved for u_τ; κ = ${KAPPA}, B = ${B} (Coles & Hirst 1968)`,
  example: 'friction_velocity(12 m/s, 2 mm, air(T: 20 degC))',
  compute: guarded((args, ctx) => {
    const { nu } = fluidArg(args);
    const r = frictionVelocity(siArg(args, 'U_p', 'm/s'), siArg(args, 'y_p', 'm'), nu);
    if (r.yplus > LOG_LAYER_TOP) ctx.warn(`the sample sits at y+ ${sig3(r.yplus)}, beyond the log layer (about ${LOG_LAYER_TOP}, common practice); u_τ is an estimate.`);
    return si(r.u_tau, 'm/s');
  }),
};

export const frictionFunctions: TradeFunction[] = [skin_friction, boundary_layer, first_cell, yplus, law_of_wall, friction_velocity];
