// Smooth flat-plate skin-friction correlations at zero pressure gradient.
// Each method carries the Reynolds-number range it was fitted for; outside it
// the value is still returned, with a warning in plain words.
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';

export const SKIN_FRICTION_METHODS = ['blasius', 'schlichting', 'power', 'ittc1957', 'white'] as const;
export type SkinFrictionMethod = (typeof SKIN_FRICTION_METHODS)[number];

/** Transition of a smooth flat plate, as White, Fluid Mechanics §7.4 (Eq. 7.49a) takes it. */
export const RE_TRANSITION = 5e5;

interface MethodSpec {
  readonly formula: (re: number) => number;
  /** Lowest Reynolds number where the denominator stays positive. */
  readonly defined: (re: number) => boolean;
  readonly regime: 'laminar' | 'turbulent';
  /** True for a mean (whole-length) coefficient rather than a local one. */
  readonly mean: boolean;
  readonly min?: { re: number; why: string };
  readonly max?: { re: number; why: string };
  readonly source: string;
}

const TURBULENT_FLOOR = {
  re: RE_TRANSITION,
  why: 'below it a smooth-plate boundary layer is usually still laminar (common practice, transition near 5e5)',
};

const METHODS: Record<SkinFrictionMethod, MethodSpec> = {
  blasius: {
    // Blasius (1908): local cf = 0.664 Re_x^-1/2 (White, Viscous Fluid Flow §4-3; from memory).
    formula: (re) => 0.664 / Math.sqrt(re),
    defined: (re) => re > 0,
    regime: 'laminar',
    mean: false,
    max: { re: RE_TRANSITION, why: 'above it the boundary layer is usually turbulent (common practice, transition near 5e5)' },
    source: 'Blasius (1908) laminar flat plate, cf = 0.664 Re_x^-1/2',
  },
  schlichting: {
    // Schlichting, Boundary-Layer Theory 7th ed., footnote to Eq. (21.16): valid for Re_x < 1e9.
    formula: (re) => Math.pow(2 * Math.log10(re) - 0.65, -2.3),
    defined: (re) => 2 * Math.log10(re) - 0.65 > 0,
    regime: 'turbulent',
    mean: false,
    min: TURBULENT_FLOOR,
    max: { re: 1e9, why: 'the Schlichting fit is stated for Re_x < 1e9 (Schlichting, Boundary-Layer Theory, footnote to Eq. 21.16)' },
    source: 'Schlichting, Boundary-Layer Theory (7th ed.), footnote to Eq. (21.16): cf = (2 log10 Re_x - 0.65)^-2.3',
  },
  power: {
    // One-seventh power law with experimental calibration, Schlichting Eq. (21.12), 5e5 < Re_x < 1e7.
    formula: (re) => 0.0592 * Math.pow(re, -0.2),
    defined: (re) => re > 0,
    regime: 'turbulent',
    mean: false,
    min: TURBULENT_FLOOR,
    max: { re: 1e7, why: 'the one-seventh power law holds for 5e5 < Re_x < 1e7 (Schlichting, Boundary-Layer Theory, Eq. 21.12)' },
    source: 'one-seventh power law, Schlichting, Boundary-Layer Theory, Eq. (21.12): cf = 0.0592 Re_x^-1/5',
  },
  ittc1957: {
    // 8th ITTC (1957) model-ship correlation line; a mean coefficient over the length.
    formula: (re) => 0.075 / Math.pow(Math.log10(re) - 2, 2),
    defined: (re) => Math.log10(re) - 2 > 0,
    regime: 'turbulent',
    mean: true,
    min: TURBULENT_FLOOR,
    max: { re: 1e10, why: 'the line was drawn for model and ship scales up to about 1e10 (from memory)' },
    source: 'ITTC 1957 model-ship correlation line, C_F = 0.075/(log10 Re - 2)^2 (8th ITTC, Madrid 1957; tables in Morrall, NPL Ship Report 142, 1970)',
  },
  white: {
    // White, Viscous Fluid Flow (3rd ed., 2006), ch. 6, local turbulent flat-plate fit (from memory).
    formula: (re) => 0.455 / Math.pow(Math.log(0.06 * re), 2),
    defined: (re) => 0.06 * re > 1,
    regime: 'turbulent',
    mean: false,
    min: TURBULENT_FLOOR,
    max: { re: 1e10, why: 'White fitted it to flat-plate data up to about 1e10 (from memory)' },
    source: 'White, Viscous Fluid Flow (3rd ed., 2006), ch. 6: cf = 0.455/ln^2(0.06 Re_x)',
  },
};

export interface SkinFrictionResult {
  cf: number;
  mean: boolean;
  regime: 'laminar' | 'turbulent';
  warnings: string[];
}

export function isSkinFrictionMethod(name: string): name is SkinFrictionMethod {
  return (SKIN_FRICTION_METHODS as readonly string[]).includes(name);
}

export function skinFrictionSource(method: SkinFrictionMethod): string {
  return METHODS[method].source;
}

/** Skin-friction coefficient by the chosen correlation; throws TradeError where the formula has no value. */
export function skinFriction(re: number, method: SkinFrictionMethod): SkinFrictionResult {
  const m = METHODS[method];
  if (!(Number.isFinite(re) && re > 0)) throw new TradeError(`the Reynolds number must be a positive number, not ${re}`);
  if (!m.defined(re)) throw new TradeError(`the ${method} formula has no value at Re = ${numberText(re, { notation: 'sci' })}`);
  const warnings: string[] = [];
  if (m.min && re < m.min.re) warnings.push(`Re = ${numberText(re, { notation: 'sci' })} is below ${numberText(m.min.re, { notation: 'sci' })} for the ${method} formula: ${m.min.why}.`);
  if (m.max && re > m.max.re) warnings.push(`Re = ${numberText(re, { notation: 'sci' })} is above ${numberText(m.max.re, { notation: 'sci' })} for the ${method} formula: ${m.max.why}.`);
  if (m.mean) warnings.push(`${method} gives the mean coefficient over the length Re is built on, not the local value.`);
  return { cf: m.formula(re), mean: m.mean, regime: m.regime, warnings };
}
