// The edges of each refusal and range in the trade library, and the exact words
// that say so: a value at a stated limit is inside it, a hair past it is not.
import { describe, expect, it } from 'vitest';
import { airProperties } from '../../server/core/fluids/air.js';
import { atmosphereAt } from '../../server/core/fluids/atmosphere.js';
import { dynamicPressure, flatPlateRegime, machNumber, reynoldsNumber } from '../../server/core/fluids/regime.js';
import { saturationPressure } from '../../server/core/fluids/saturation.js';
import { waterProperties } from '../../server/core/fluids/water.js';
import { record, si } from '../../server/core/index.js';
import { niceStep } from '../../server/core/shared/svg.js';
import { boundaryLayer } from '../../server/core/wall/boundary-layer.js';
import { firstCell, yplusOf } from '../../server/core/wall/first-cell.js';
import { histogramSvg } from '../../server/core/wall/histogram-svg.js';
import { skinFriction } from '../../server/core/wall/skin-friction.js';
import { stackSvg } from '../../server/core/wall/stack-svg.js';
import { near } from './fluids-helpers.js';

describe('air', () => {
  it('words its refusals in full', () => {
    expect(() => airProperties(100, 101325)).toThrow(
      'T = −173.15 °C is below −140.65 °C (132.5 K), the critical temperature of air: there air can be liquid (at 1 atm it condenses near −194 °C) and air() as an ideal gas does not hold; for a cryogenic gas give its properties with fluid(rho, mu)',
    );
    expect(() => airProperties(263.15, 101325, 0.5)).toThrow(
      'humid air is covered from 0 to 100 °C (the saturation-pressure formula is for liquid water); got −10 °C. Below 0 °C give RH: 0 %: at sea-level pressure the vapour changes the density by less than 0.3 % there',
    );
    expect(() => airProperties(0, 101325)).toThrow('T = −273.15 °C is at absolute zero');
    expect(() => airProperties(-1, 101325)).toThrow('T = −274.15 °C is below absolute zero');
    expect(() => airProperties(288.15, 101325, -0.1)).toThrow('RH = −10 % is outside 0 to 100 %');
  });

  it('covers humid air from 0 to 100 °C inclusive', () => {
    // p_v = RH p_sat(T) by IF97 Eq. 30; Dalton's law as in fluids-air.
    expect(airProperties(273.15, 101325, 0.5).vapourPressure).toBe(0.5 * saturationPressure(273.15));
    expect(airProperties(373.15, 101325, 0.5).vapourPressure).toBe(0.5 * saturationPressure(373.15));
    expect(() => airProperties(373.16, 101325, 0.5)).toThrow(/got 100.01 °C/);
  });

  it('refuses saturated air at its own vapour pressure, where the water would boil', () => {
    const pv = saturationPressure(300);
    expect(() => airProperties(300, pv, 1)).toThrow(`the vapour pressure ${Number(pv.toPrecision(4))} Pa at 26.85 °C reaches the total pressure ${Number(pv.toPrecision(4))} Pa: the water would boil`);
  });
});

describe('water', () => {
  it('covers 0 °C and 100 MPa, the ends of its range', () => {
    // CRC Handbook (Kell-type fit) at 0 °C: 999.8395 kg/m^3 (see fluids-water).
    near(waterProperties(273.15, 101325).rho, 999.8395, 0.005);
    // IF97 Table 5 (from memory): v(300 K, 80 MPa) = 0.971180894e-3; 100 MPa is inside.
    expect(waterProperties(300, 100e6).rho).toBeGreaterThan(1 / 0.971180894e-3);
  });

  it('refuses a pressure of zero as a pressure, not as steam', () => {
    expect(() => waterProperties(300, 0)).toThrow('water() covers pressures above 0 and up to 100 MPa; got p = 0 Pa');
  });

  it('keeps water liquid down to 0.1 % below its saturation pressure, inclusive', () => {
    const T = 353.15;
    expect(waterProperties(T, saturationPressure(T) * (1 - 0.001)).rho).toBeGreaterThan(900);
  });
});

describe('similarity numbers and the regime', () => {
  it('refuse a viscosity, speed of sound or density of zero', () => {
    expect(() => reynoldsNumber(1, 1, 0)).toThrow('the kinematic viscosity nu = 0 m^2/s must be above zero');
    expect(() => machNumber(1, 0)).toThrow('the speed of sound a = 0 m/s must be above zero');
    expect(() => dynamicPressure(1, 0)).toThrow('the density rho = 0 kg/m^3 must be above zero');
    expect(machNumber(170, 340)).toBe(0.5);
    expect(dynamicPressure(2, 1.2)).toBeCloseTo(2.4, 15);
  });

  it('words each regime, and calls a laminar share of exactly 10 % turbulent', () => {
    expect(flatPlateRegime(4e5).explanation).toBe('Re = 4e5 stays below 5e5: a smooth flat plate of this length stays laminar');
    expect(flatPlateRegime(5e6).regime).toBe('turbulent');
    expect(flatPlateRegime(1e7).explanation).toBe('Re = 1e7: transition expected about 5 % of the length from the leading edge; the boundary layer is turbulent over most of the length');
    expect(flatPlateRegime(1e6).explanation).toBe('Re = 1e6: transition expected about 50 % of the length from the leading edge, so a large laminar part remains');
  });
});

describe('atmosphere', () => {
  it('covers geometric altitude 0', () => {
    near(atmosphereAt({ geometric: 0 }).T, 288.15, 1e-9);
  });
});

describe('skin friction and the boundary layer', () => {
  it('word their range warnings in full', () => {
    expect(skinFriction(2e9, 'schlichting').warnings).toEqual(['Re = 2e9 is above 1e9 for the schlichting formula: the Schlichting fit is stated for Re_x < 1e9 (Schlichting, Boundary-Layer Theory, footnote to Eq. 21.16).']);
    expect(skinFriction(2e10, 'ittc1957', 'mean').warnings).toEqual(['Re = 2e10 is above 1e10 for the ittc1957 formula: the line was drawn for model and ship scales up to about 1e10 (from memory).']);
    expect(skinFriction(2e10, 'white').warnings).toEqual(['Re = 2e10 is above 1e10 for the white formula: White fitted it to flat-plate data up to about 1e10 (from memory).']);
    expect(boundaryLayer(40, 6, 1.5e-5).warnings).toEqual(['Re_x = 1.6e7 is above 1e7, the upper end of the one-seventh power law (Schlichting, Eq. 21.12); δ is an estimate.']);
  });

  it('name ittc1957 and white turbulent fits, and warn on a laminar plate for each', () => {
    expect(skinFriction(1e6, 'white').regime).toBe('turbulent');
    expect(skinFriction(1e6, 'ittc1957', 'mean').regime).toBe('turbulent');
    expect(skinFriction(1e6, 'blasius').regime).toBe('laminar');
    expect(skinFriction(1e5, 'white').warnings.join(' ')).toMatch(/where a smooth flat plate is laminar/);
    expect(skinFriction(1e5, 'ittc1957', 'mean').warnings.join(' ')).toMatch(/where a smooth flat plate is laminar/);
  });

  it('refuse a Reynolds number of zero, and say how thick a thick layer would be at its x', () => {
    expect(() => skinFriction(0, 'blasius')).toThrow('the Reynolds number must be a positive number; got 0');
    // x = 2 m, Re_x = 100: Blasius δ99 = 4.91 x/√Re_x = 0.982 m.
    expect(() => boundaryLayer(100 * 1.5e-5 / 2, 2, 1.5e-5)).toThrow(
      'Re = 100 is below 1e3: the boundary layer would not be thin (Blasius δ99 = 0.49 x = 982 mm at x = 2 m), so flat-plate boundary-layer formulas do not apply; the flow is dominated by viscosity. Check the speed, the length and the fluid, or model the body itself',
    );
  });

  it('first_cell and yplus refuse a length or a height of zero', () => {
    expect(() => firstCell(10, 0, 1.2, 1.5e-5, 1, 'schlichting', 'centroid')).toThrow('the reference length L = 0 m must be positive');
    expect(() => yplusOf(0, 10, 1, 1.2, 1.5e-5, 'schlichting', 'centroid')).toThrow('the first-cell height must be positive, not 0 m');
  });
});

describe('figure rules', () => {
  it('tick steps: 7.5 rounds up to 10', () => {
    expect(niceStep(7.5, 1)).toBe(10);
  });

  const hist = (values: number[], target = 1) => histogramSvg({ values, weights: values.map(() => 1), weighted: false, band: [0.5, 5], target });
  it('a histogram goes to decades from a tenfold spread, not below it, and never from zero', () => {
    expect(hist([1, 10])).toContain('y+ (log scale)');
    expect(hist([1, 9.9])).not.toContain('log scale');
    expect(hist([0, 100])).not.toContain('log scale');
  });

  it('the largest value falls in the last bin, and the bars add up to the whole', () => {
    // Axis 0 to 5 in ten bins; 5 itself belongs to the last, 4.5 to 5.
    const svg = hist([1, 2, 5]);
    const heights = [...svg.matchAll(/<rect x="([\d.]+)" y="[\d.]+" width="[\d.]+" height="([\d.]+)" fill="#8fabd0"/g)].map((m) => [Number(m[1]), Number(m[2])]);
    expect(heights).toHaveLength(3);
    expect(heights[2]![0]).toBeCloseTo(56 + 9 * 36.4, 1);
  });

  it('the target line is drawn at either end of the axis, and ticks start on a step above a non-zero low end', () => {
    // Values 1 to 5: the axis runs from 1 to 5.
    expect(hist([1, 2, 5], 1)).toContain('>target 1</text>');
    expect(hist([1, 2, 5], 0.99)).not.toContain('>target 0.99</text>');
    expect(hist([1, 2, 5], 5)).toContain('>target 5</text>');
    const ticks = [...hist([12, 18]).matchAll(/y="215.0" text-anchor="middle" font-size="11">([^<]+)</g)].map((m) => m[1]);
    expect(ticks).toEqual(['12', '13', '14', '15', '16', '17', '18']);
    const same = [...hist([3, 3, 3]).matchAll(/y="215.0" text-anchor="middle" font-size="11">([^<]+)</g)].map((m) => m[1]);
    expect(same).toEqual(['2.7', '2.8', '2.9', '3', '3.1', '3.2', '3.3']);
  });

  it('a log stack axis starts at the decade of a first layer that is a power of ten, and spans at least one decade', () => {
    const ticks = (svg: string) => [...svg.matchAll(/<text x="66.0" y="[\d.]+" text-anchor="end" font-size="11">([^<]+)</g)].map((m) => m[1]);
    expect(ticks(stackSvg({ heights: Array.from({ length: 10 }, () => 1e-3), growth: 1, scale: 'log' }))).toEqual(['1 mm', '10 mm']);
    expect(ticks(stackSvg({ heights: [1e-3], growth: 1, scale: 'log' }))).toEqual(['1 mm', '10 mm']);
    expect(ticks(stackSvg({ heights: [1e-5, 2e-5], growth: 2, scale: 'log' }))).toEqual(['10 µm', '100 µm']);
  });
});

describe('records', () => {
  it('carry no figure or tag unless given', () => {
    expect(record([])).toStrictEqual({ kind: 'record', fields: new Map(), warnings: [], remarks: [] });
    expect(si(2, 'm')).toStrictEqual(si(2, 'm'));
  });
});
