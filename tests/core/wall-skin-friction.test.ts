import { describe, expect, it } from 'vitest';
import { num, str, TradeError } from '../../server/core/index.js';
import { hasKind, skinFriction, SKIN_FRICTION_METHODS, THIN_LAYER_MIN_RE } from '../../server/core/wall/skin-friction.js';
import { asQuantity, call, relErr, stubContext } from './wall-helpers.js';

const RES = [1e6, 1e7, 1e8];
type Method = (typeof SKIN_FRICTION_METHODS)[number];

// Each expected value is computed here from the formula as published.
const LOCAL: Partial<Record<Method, (re: number) => number>> = {
  // Blasius (1908): c_f = 0.664/√Re_x (White, Viscous Fluid Flow §4-3; from memory).
  blasius: (re) => 0.664 / Math.sqrt(re),
  // Schlichting, Boundary-Layer Theory 7th ed., footnote to Eq. (21.16) (via CFD-Wiki "Skin friction coefficient").
  schlichting: (re) => (2 * Math.log10(re) - 0.65) ** -2.3,
  // Schlichting Eq. (21.12), one-seventh power law calibrated: 0.0592 Re_x^-1/5 (same CFD-Wiki page).
  power: (re) => 0.0592 / re ** 0.2,
  // White, Viscous Fluid Flow (3rd ed., 2006), ch. 6: 0.455/ln²(0.06 Re_x) (from memory).
  white: (re) => 0.455 / Math.log(0.06 * re) ** 2,
};
const MEAN: Record<Method, (re: number) => number> = {
  // Blasius (1908): C_F = 1.328/√Re_L (White, Viscous Fluid Flow §4-3; from memory; Wegener 1991 via the Princeton page: 1.33).
  blasius: (re) => 1.328 / Math.sqrt(re),
  // Prandtl–Schlichting, Schlichting Eq. (21.16): C_F = 0.455/(log10 Re_L)^2.58 (from memory).
  schlichting: (re) => 0.455 / Math.log10(re) ** 2.58,
  // Prandtl, mean of the one-seventh law: C_F = 0.074 Re_L^-1/5 (Wegener 1991, via princeton.edu/~maelabs/hpt/mechanics/mecha_48.htm).
  power: (re) => 0.074 / re ** 0.2,
  // 8th ITTC 1957 line, C_F = 0.075/(log10 Re − 2)² (Morrall, NPL Ship Report 142, 1970).
  ittc1957: (re) => 0.075 / (Math.log10(re) - 2) ** 2,
  // White, Viscous Fluid Flow (3rd ed., 2006), ch. 6: C_F = 0.523/ln²(0.06 Re_L) (from memory).
  white: (re) => 0.523 / Math.log(0.06 * re) ** 2,
};

describe('skin friction correlations', () => {
  for (const method of SKIN_FRICTION_METHODS) {
    for (const re of RES) {
      const local = LOCAL[method];
      if (local) {
        it(`${method} local c_f at Re ${re.toExponential()} follows its published formula`, () => {
          expect(relErr(skinFriction(re, method).cf, local(re))).toBeLessThan(1e-12);
        });
      }
      it(`${method} mean C_F at Re ${re.toExponential()} follows its published formula`, () => {
        expect(relErr(skinFriction(re, method, 'mean').cf, MEAN[method](re))).toBeLessThan(1e-12);
      });
    }
  }

  it('names the formula it used and its source', () => {
    const sources: Array<[Method, 'local' | 'mean', string]> = [
      ['blasius', 'local', 'Blasius (1908) laminar flat plate, c_f = 0.664 Re_x^-1/2'],
      ['blasius', 'mean', 'Blasius (1908) laminar flat plate, C_F = 1.328 Re_L^-1/2'],
      ['schlichting', 'local', 'Schlichting, Boundary-Layer Theory (7th ed.), footnote to Eq. (21.16): c_f = (2 log10 Re_x - 0.65)^-2.3'],
      ['schlichting', 'mean', 'Prandtl–Schlichting, Schlichting, Boundary-Layer Theory (7th ed.), Eq. (21.16): C_F = 0.455 (log10 Re_L)^-2.58'],
      ['power', 'local', 'one-seventh power law, Schlichting, Boundary-Layer Theory, Eq. (21.12): c_f = 0.0592 Re_x^-1/5'],
      ['power', 'mean', 'one-seventh power law, mean over the plate (Prandtl): C_F = 0.074 Re_L^-1/5'],
      ['ittc1957', 'mean', 'ITTC 1957 model-ship correlation line, C_F = 0.075/(log10 Re - 2)^2 (8th ITTC, Madrid 1957; tables in Morrall, NPL Ship Report 142, 1970)'],
      ['white', 'local', 'White, Viscous Fluid Flow (3rd ed., 2006), ch. 6: c_f = 0.455/ln^2(0.06 Re_x)'],
      ['white', 'mean', 'White, Viscous Fluid Flow (3rd ed., 2006), ch. 6: C_F = 0.523/ln^2(0.06 Re_L)'],
    ];
    for (const [method, kind, source] of sources) expect(skinFriction(1e6, method, kind).source).toBe(source);
  });

  it('gives the local coefficient unless asked for the mean', () => {
    expect(skinFriction(1e6, 'power').kind).toBe('local');
    expect(skinFriction(1e6, 'power', 'mean').kind).toBe('mean');
    expect(SKIN_FRICTION_METHODS.filter((m) => !hasKind(m, 'local'))).toEqual(['ittc1957']);
  });

  it('ITTC 1957 line at Re 5.62e6 gives 3.325e-3 (Morrall 1970, NPL Ship Report 142, worked example)', () => {
    // Tolerance: half a unit of the last printed digit of C_F, plus the change of C_F
    // over the rounding of the printed Re (5.615e6 to 5.625e6).
    const reRounding = Math.abs(MEAN.ittc1957(5.615e6) - MEAN.ittc1957(5.625e6)) / 2;
    expect(Math.abs(skinFriction(5.62e6, 'ittc1957', 'mean').cf - 3.325e-3)).toBeLessThanOrEqual(0.0005e-3 + reRounding);
  });

  it('the ITTC line has no local coefficient: asking for one says to write kind: "mean"', () => {
    expect(() => skinFriction(1e7, 'ittc1957')).toThrow('ittc1957 gives only the mean coefficient over the length (the source has no local one); write kind: "mean"');
  });

  it('Blasius: the mean over a laminar plate is twice the local value at its end (1.328 = 2 × 0.664)', () => {
    // Integrating c_f = 0.664 Re_x^-1/2 over the length doubles it (White, Viscous Fluid Flow §4-3; from memory).
    expect(relErr(skinFriction(2e5, 'blasius', 'mean').cf, 2 * skinFriction(2e5, 'blasius').cf)).toBeLessThan(1e-12);
  });

  it('Schlichting and White agree within 1.5 % over 1e6–1e8: two fits to the same flat-plate data', () => {
    // Both are fits to smooth flat-plate measurements (Schlichting footnote to Eq. 21.16; White ch. 6).
    for (const re of RES) expect(relErr(skinFriction(re, 'white').cf, skinFriction(re, 'schlichting').cf)).toBeLessThan(0.015);
  });

  it('warns outside each range: power law above 1e7 (Schlichting Eq. 21.12), Schlichting above 1e9, ITTC and White above 1e10', () => {
    expect(skinFriction(1e8, 'power').warnings.join(' ')).toMatch(/above 1e7/);
    expect(skinFriction(1e7, 'power').warnings).toEqual([]);
    expect(skinFriction(2e9, 'schlichting').warnings.join(' ')).toMatch(/above 1e9/);
    expect(skinFriction(1e9, 'schlichting').warnings).toEqual([]);
    expect(skinFriction(2e10, 'ittc1957', 'mean').warnings.join(' ')).toMatch(/above 1e10/);
    expect(skinFriction(1e10, 'ittc1957', 'mean').warnings).toEqual([]);
    expect(skinFriction(2e10, 'white').warnings.join(' ')).toMatch(/above 1e10/);
    expect(skinFriction(1e10, 'white').warnings).toEqual([]);
  });
});

describe('the transition threshold, Re = 5e5 (common practice; White, Fluid Mechanics §7.4)', () => {
  it('a turbulent fit below it warns and names the laminar method, with both values', () => {
    const w = skinFriction(1e5, 'schlichting').warnings.join(' ');
    expect(w).toMatch(/Re = 1e5 is below 5e5, where a smooth flat plate is laminar/);
    // The two values the warning quotes: the fit, and Blasius 0.664/√Re_x.
    const fit = LOCAL.schlichting!(1e5);
    const laminar = LOCAL.blasius!(1e5);
    expect(w).toContain(`gives ${Number(fit.toPrecision(3))}, ${Number((fit / laminar).toPrecision(2))} × the laminar (Blasius) ${Number(laminar.toPrecision(3))}`);
    expect(w).toMatch(/use method: "blasius"/);
  });

  it('laminar below 5e5, turbulent at and above it: the one comparison', () => {
    expect(skinFriction(499999, 'power').warnings.join(' ')).toMatch(/below 5e5/);
    expect(skinFriction(5e5, 'power').warnings).toEqual([]);
    expect(skinFriction(499999, 'blasius').warnings).toEqual([]);
    expect(skinFriction(5e5, 'blasius').warnings.join(' ')).toMatch(/at or above 5e5, where the boundary layer is usually turbulent/);
  });
});

describe('Reynolds numbers where no flat-plate formula applies', () => {
  it(`refuses Re below ${THIN_LAYER_MIN_RE}, where Blasius δ99 = 4.91 x/√Re_x is no longer thin, and says how thick`, () => {
    // δ99/x = 4.91/√Re_x (Blasius 1908; White, Viscous Fluid Flow §4-3; from memory): 1.9 at Re = 6.8.
    expect(() => skinFriction(6.8, 'schlichting')).toThrow(/Re = 6.8 is below 1e3: the boundary layer would not be thin \(Blasius δ99 = 1.9 x\)/);
    expect(() => skinFriction(999, 'blasius')).toThrow(TradeError);
    expect(relErr(skinFriction(1000, 'blasius').cf, 0.664 / Math.sqrt(1000))).toBeLessThan(1e-12);
  });

  it('refuses Reynolds numbers where a formula has no value, or that are not positive', () => {
    expect(() => skinFriction(-1, 'schlichting')).toThrow(/positive/);
    expect(() => skinFriction(Number.NaN, 'schlichting')).toThrow(/not a number/);
  });
});

describe('skin_friction as a worksheet function', () => {
  it('returns cf, local by default, and passes range warnings to the sheet', () => {
    const ctx = stubContext();
    const cf = asQuantity(call('skin_friction', { Re_x: num(1e8), method: str('power'), kind: str('local') }, ctx));
    expect(relErr(cf.si, LOCAL.power!(1e8))).toBeLessThan(1e-12);
    expect(ctx.warnings).toEqual(['Re = 1e8 is above 1e7 for the power formula: the one-seventh power law holds for 5e5 < Re_x < 1e7 (Schlichting, Boundary-Layer Theory, Eq. 21.12).']);
    const mean = asQuantity(call('skin_friction', { Re_x: num(5.62e6), method: str('ittc1957'), kind: str('mean') }));
    expect(relErr(mean.si, MEAN.ittc1957(5.62e6))).toBeLessThan(1e-12);
  });

  it('turns a wrong method or kind into a sheet error', () => {
    expect(() => call('skin_friction', { Re_x: num(1e6), method: str('prandtl'), kind: str('local') })).toThrow(TradeError);
    expect(() => call('skin_friction', { Re_x: num(1e6), method: str('power'), kind: str('average') })).toThrow(/kind "average" is not one of "local", "mean"/);
    expect(() => call('skin_friction', { Re_x: num(1e6), method: str('ittc1957'), kind: str('local') })).toThrow(/write kind: "mean"/);
  });
});
