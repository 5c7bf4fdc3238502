// Smooth flat-plate skin-friction correlations at zero pressure gradient: the
// local coefficient c_f at Re_x and, where the source gives it, the mean C_F
// over a plate of Re_L. Each method carries the Reynolds-number range it was
// fitted for; outside it the value is still returned, with a warning in plain
// words, except where no flat-plate formula means anything (Re below 1e3).
import { isLaminar, RE_TRANSITION } from '../shared/flow.js';
import { TradeError } from '../shared/trade-error.js';
import { exactText, lengthText, numberText } from '../shared/words.js';

export const SKIN_FRICTION_METHODS = ['blasius', 'schlichting', 'power', 'ittc1957', 'white'] as const;
export type SkinFrictionMethod = (typeof SKIN_FRICTION_METHODS)[number];
export const SKIN_FRICTION_KINDS = ['local', 'mean'] as const;
export type SkinFrictionKind = (typeof SKIN_FRICTION_KINDS)[number];

/**
 * Below this Reynolds number a boundary layer is not thin: Blasius δ99/x = 4.91/√Re_x
 * passes 0.15 (derived from Blasius; the thin-layer premise δ ≪ x of boundary-layer
 * theory, common practice), and no flat-plate formula applies.
 */
export const THIN_LAYER_MIN_RE = 1e3;

/** Every formula has a value from Re = 17 up (White's ln(0.06 Re) > 0); the thin-layer floor of 1e3 is above all of them. */
interface Formula {
  readonly f: (re: number) => number;
  readonly source: string;
}

interface MethodSpec {
  readonly local?: Formula;
  readonly mean?: Formula;
  readonly regime: 'laminar' | 'turbulent';
  readonly max?: { re: number; why: string };
}

const METHODS: Record<SkinFrictionMethod, MethodSpec> = {
  blasius: {
    // Blasius (1908): c_f = 0.664 Re_x^-1/2, C_F = 1.328 Re_L^-1/2 (White, Viscous Fluid Flow §4-3; from memory).
    local: { f: (re) => 0.664 / Math.sqrt(re), source: 'Blasius (1908) laminar flat plate, c_f = 0.664 Re_x^-1/2' },
    mean: { f: (re) => 1.328 / Math.sqrt(re), source: 'Blasius (1908) laminar flat plate, C_F = 1.328 Re_L^-1/2' },
    regime: 'laminar',
  },
  schlichting: {
    // Schlichting, Boundary-Layer Theory 7th ed.: local fit in the footnote to Eq. (21.16), valid for Re_x < 1e9;
    // the mean coefficient is Eq. (21.16) itself, the Prandtl–Schlichting formula (from memory).
    local: {
      f: (re) => Math.pow(2 * Math.log10(re) - 0.65, -2.3),
      source: 'Schlichting, Boundary-Layer Theory (7th ed.), footnote to Eq. (21.16): c_f = (2 log10 Re_x - 0.65)^-2.3',
    },
    mean: {
      f: (re) => 0.455 / Math.pow(Math.log10(re), 2.58),
      source: 'Prandtl–Schlichting, Schlichting, Boundary-Layer Theory (7th ed.), Eq. (21.16): C_F = 0.455 (log10 Re_L)^-2.58',
    },
    regime: 'turbulent',
    max: { re: 1e9, why: 'the Schlichting fit is stated for Re_x < 1e9 (Schlichting, Boundary-Layer Theory, footnote to Eq. 21.16)' },
  },
  power: {
    // One-seventh power law: local 0.0592 Re_x^-1/5 with experimental calibration, Schlichting Eq. (21.12),
    // 5e5 < Re_x < 1e7; its mean over a turbulent plate, C_F = 0.074 Re_L^-1/5 (Prandtl; quoted by Wegener 1991).
    local: { f: (re) => 0.0592 * Math.pow(re, -0.2), source: 'one-seventh power law, Schlichting, Boundary-Layer Theory, Eq. (21.12): c_f = 0.0592 Re_x^-1/5' },
    mean: { f: (re) => 0.074 * Math.pow(re, -0.2), source: 'one-seventh power law, mean over the plate (Prandtl): C_F = 0.074 Re_L^-1/5' },
    regime: 'turbulent',
    max: { re: 1e7, why: 'the one-seventh power law holds for 5e5 < Re_x < 1e7 (Schlichting, Boundary-Layer Theory, Eq. 21.12)' },
  },
  ittc1957: {
    // 8th ITTC (1957) model-ship correlation line: a mean coefficient over the length; the source gives no local one.
    mean: {
      f: (re) => 0.075 / Math.pow(Math.log10(re) - 2, 2),
      source: 'ITTC 1957 model-ship correlation line, C_F = 0.075/(log10 Re - 2)^2 (8th ITTC, Madrid 1957; tables in Morrall, NPL Ship Report 142, 1970)',
    },
    regime: 'turbulent',
    max: { re: 1e10, why: 'the line was drawn for model and ship scales up to about 1e10 (from memory)' },
  },
  white: {
    // White, Viscous Fluid Flow (3rd ed., 2006), ch. 6: local 0.455/ln²(0.06 Re_x) and mean 0.523/ln²(0.06 Re_L) (from memory).
    local: { f: (re) => 0.455 / Math.pow(Math.log(0.06 * re), 2), source: 'White, Viscous Fluid Flow (3rd ed., 2006), ch. 6: c_f = 0.455/ln^2(0.06 Re_x)' },
    mean: { f: (re) => 0.523 / Math.pow(Math.log(0.06 * re), 2), source: 'White, Viscous Fluid Flow (3rd ed., 2006), ch. 6: C_F = 0.523/ln^2(0.06 Re_L)' },
    regime: 'turbulent',
    max: { re: 1e10, why: 'White fitted it to flat-plate data up to about 1e10 (from memory)' },
  },
};

export interface SkinFrictionResult {
  cf: number;
  kind: SkinFrictionKind;
  /** The formula used and where it is published. */
  source: string;
  regime: 'laminar' | 'turbulent';
  warnings: string[];
}

/** Whether the method's source gives this kind of coefficient (ittc1957 has only a mean one). */
export function hasKind(method: SkinFrictionMethod, kind: SkinFrictionKind): boolean {
  return METHODS[method][kind] !== undefined;
}

/** Refuses a Reynolds number where the boundary layer would not be thin; says how thick it would be (at x, when given). */
export function checkThinLayer(re: number, x?: number): void {
  if (re < THIN_LAYER_MIN_RE) {
    const ratio = 4.91 / Math.sqrt(re);
    const thick = x === undefined ? '' : ` = ${lengthText(ratio * x)} at x = ${lengthText(x)}`;
    throw new TradeError(
      `Re = ${numberText(re)} is below ${numberText(THIN_LAYER_MIN_RE, { notation: 'sci' })}: the boundary layer would not be thin ` +
        `(Blasius δ99 = ${numberText(ratio, { digits: 2 })} x${thick}), so flat-plate boundary-layer formulas do not apply; the flow is dominated by viscosity. ` +
        'Check the speed, the length and the fluid, or model the body itself',
    );
  }
}

/** Skin-friction coefficient by the chosen correlation; throws TradeError where it has no meaning. */
export function skinFriction(re: number, method: SkinFrictionMethod, kind: SkinFrictionKind = 'local'): SkinFrictionResult {
  const m = METHODS[method];
  if (!(Number.isFinite(re) && re > 0)) throw new TradeError(`the Reynolds number must be a positive number; got ${exactText(re)}`);
  const formula = m[kind];
  if (!formula) throw new TradeError(`${method} gives only the mean coefficient over the length (the source has no local one); write kind: "mean"`);
  checkThinLayer(re);
  const cf = formula.f(re);
  const warnings: string[] = [];
  const at = numberText(re, { notation: 'sci' });
  const transition = numberText(RE_TRANSITION, { notation: 'sci' });
  if (m.regime === 'turbulent' && isLaminar(re)) {
    const laminar = METHODS.blasius[kind]!.f(re);
    warnings.push(
      `Re = ${at} is below ${transition}, where a smooth flat plate is laminar (common practice): the ${method} fit is for turbulent layers and gives ` +
        `${numberText(cf)}, ${numberText(cf / laminar, { digits: 2 })} × the laminar (Blasius) ${numberText(laminar)}; use method: "blasius", unless the boundary layer is tripped.`,
    );
  }
  if (m.regime === 'laminar' && !isLaminar(re)) {
    warnings.push(`Re = ${at} is at or above ${transition}, where the boundary layer is usually turbulent (common practice); use a turbulent method such as "schlichting".`);
  }
  if (m.max && re > m.max.re) warnings.push(`Re = ${at} is above ${numberText(m.max.re)} for the ${method} formula: ${m.max.why}.`);
  return { cf, kind, source: formula.source, regime: m.regime, warnings };
}
