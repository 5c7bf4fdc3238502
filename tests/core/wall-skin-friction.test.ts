import { describe, expect, it } from 'vitest';
import { num, str, TradeError } from '../../server/core/index.js';
import { skinFriction, SKIN_FRICTION_METHODS } from '../../server/core/wall/skin-friction.js';
import { asQuantity, call, relErr, stubContext } from './wall-helpers.js';

const RES = [1e6, 1e7, 1e8];

// Each expected value is computed here from the formula as published.
const PUBLISHED: Record<(typeof SKIN_FRICTION_METHODS)[number], (re: number) => number> = {
  // Blasius (1908): cf = 0.664/√Re_x (White, Viscous Fluid Flow §4-3; from memory).
  blasius: (re) => 0.664 / Math.sqrt(re),
  // Schlichting, Boundary-Layer Theory 7th ed., footnote to Eq. (21.16) (via CFD-Wiki "Skin friction coefficient").
  schlichting: (re) => (2 * Math.log10(re) - 0.65) ** -2.3,
  // Schlichting Eq. (21.12), one-seventh power law calibrated: 0.0592 Re_x^-1/5 (same CFD-Wiki page).
  power: (re) => 0.0592 / re ** 0.2,
  // 8th ITTC 1957 line, C_F = 0.075/(log10 Re − 2)² (Morrall, NPL Ship Report 142, 1970).
  ittc1957: (re) => 0.075 / (Math.log10(re) - 2) ** 2,
  // White, Viscous Fluid Flow (3rd ed., 2006), ch. 6: 0.455/ln²(0.06 Re_x) (from memory).
  white: (re) => 0.455 / Math.log(0.06 * re) ** 2,
};

describe('skin friction correlations', () => {
  for (const method of SKIN_FRICTION_METHODS) {
    for (const re of RES) {
      it(`${method} at Re ${re.toExponential()} follows its published formula`, () => {
        expect(relErr(skinFriction(re, method).cf, PUBLISHED[method](re))).toBeLessThan(1e-12);
      });
    }
  }

  it('ITTC 1957 line at Re 5.62e6 gives 3.325e-3 (Morrall 1970, NPL Ship Report 142, worked example)', () => {
    // Tolerance: half a unit of the last printed digit of C_F, plus the change of C_F
    // over the rounding of the printed Re (5.615e6 to 5.625e6).
    const reRounding = Math.abs(PUBLISHED.ittc1957(5.615e6) - PUBLISHED.ittc1957(5.625e6)) / 2;
    expect(Math.abs(skinFriction(5.62e6, 'ittc1957').cf - 3.325e-3)).toBeLessThanOrEqual(0.0005e-3 + reRounding);
  });

  it('Schlichting and White agree within 1.5 % over 1e6–1e8: two fits to the same flat-plate data', () => {
    // Both are fits to smooth flat-plate measurements (Schlichting footnote to Eq. 21.16; White ch. 6).
    for (const re of RES) expect(relErr(skinFriction(re, 'white').cf, skinFriction(re, 'schlichting').cf)).toBeLessThan(0.015);
  });

  it('warns outside each range: power law above 1e7 (Schlichting Eq. 21.12), Blasius past transition 5e5', () => {
    expect(skinFriction(1e8, 'power').warnings.join(' ')).toMatch(/above 1e7/);
    expect(skinFriction(5e6, 'power').warnings).toEqual([]);
    expect(skinFriction(1e6, 'blasius').warnings.join(' ')).toMatch(/above 5e5/);
    expect(skinFriction(1e5, 'blasius').warnings).toEqual([]);
    expect(skinFriction(2e9, 'schlichting').warnings.join(' ')).toMatch(/above 1e9/);
    expect(skinFriction(1e5, 'schlichting').warnings.join(' ')).toMatch(/laminar/);
  });

  it('says that the ITTC line is a mean coefficient', () => {
    expect(skinFriction(1e7, 'ittc1957').mean).toBe(true);
    expect(skinFriction(1e7, 'ittc1957').warnings.join(' ')).toMatch(/mean coefficient/);
  });

  it('refuses Reynolds numbers where a formula has no value', () => {
    expect(() => skinFriction(50, 'ittc1957')).toThrow(TradeError);
    expect(() => skinFriction(-1, 'schlichting')).toThrow(/positive/);
  });

  it('registry entry returns cf and passes range warnings to the sheet', () => {
    const ctx = stubContext();
    const cf = asQuantity(call('skin_friction', { Re_x: num(1e8), method: str('power') }, ctx));
    expect(relErr(cf.si, PUBLISHED.power(1e8))).toBeLessThan(1e-12);
    expect(ctx.warnings).toHaveLength(1);
    expect(() => call('skin_friction', { Re_x: num(1e6), method: str('prandtl') })).toThrow(TradeError);
    expect(() => call('skin_friction', { Re_x: num(10), method: str('ittc1957') })).toThrow(TradeError);
  });
});
