import { describe, expect, it } from 'vitest';
import { TradeError, shown, si } from '../../server/core/index.js';
import { saturationPressure } from '../../server/core/fluids/saturation.js';
import { waterDensity, waterSpecificVolume } from '../../server/core/fluids/water-density.js';
import { waterViscosity } from '../../server/core/fluids/water-viscosity.js';
import { waterProperties } from '../../server/core/fluids/water.js';
import { asRecord, call, field, near, nearRel } from './fluids-helpers.js';

describe('IAPWS R12-08 viscosity, computer-program check values', () => {
  // IAPWS R12-08 (2008), Table 4 (p. 8): mu(T, rho) with the critical enhancement set to 1.
  // Quoted identically by the CoolProp and Python IAPWS library test files. Printed to 1e-6 µPa s.
  const table4: Array<[number, number, number]> = [
    [298.15, 998, 889.7351],
    [298.15, 1200, 1437.649467],
    [373.15, 1000, 307.883622],
    [433.15, 1, 14.538324],
    [433.15, 1000, 217.685358],
    [873.15, 1, 32.619287],
    [873.15, 100, 35.802262],
    [873.15, 600, 77.430195],
    [1173.15, 1, 44.217245],
    [1173.15, 100, 47.640433],
    [1173.15, 400, 64.154608],
  ];
  for (const [T, rho, muMicro] of table4) {
    it(`T = ${T} K, rho = ${rho} kg/m^3: ${muMicro} µPa s`, () => {
      near(waterViscosity(T, rho) * 1e6, muMicro, 0.0000005);
    });
  }
});

describe('IAPWS-IF97 region 1 and saturation line, check values', () => {
  // IAPWS-IF97 (R7-97(2012)) Table 5, region 1 specific volumes (from memory), printed to
  // 9 figures; the last column is half a unit of the last printed digit.
  const table5: Array<[number, number, number, number]> = [
    [300, 3e6, 0.100215168e-2, 0.5e-11],
    [300, 80e6, 0.971180894e-3, 0.5e-12],
    [500, 3e6, 0.1202418e-2, 0.5e-11],
  ];
  for (const [T, p, v, halfUnit] of table5) {
    it(`v(${T} K, ${p / 1e6} MPa) = ${v} m^3/kg`, () => near(waterSpecificVolume(T, p), v, halfUnit));
  }

  // IAPWS-IF97 Table 35, saturation pressure by Eq. 30 (from memory), printed to 9 figures in MPa.
  const table35: Array<[number, number]> = [
    [300, 0.353658941e-2],
    [500, 0.263889776e1],
    [600, 0.123443146e2],
  ];
  for (const [T, pMPa] of table35) {
    // Nine figures: half a unit of the ninth is at most 0.5e-8 of the value's leading digit.
    it(`p_sat(${T} K) = ${pMPa} MPa`, () => near(saturationPressure(T) / 1e6, pMPa, 0.5e-8 * 10 ** Math.floor(Math.log10(pMPa))));
  }

  it('puts the triple point at 611.657 Pa', () => {
    // Triple point of water, 273.16 K and 611.657 Pa (IAPWS; from memory).
    near(saturationPressure(273.16), 611.657, 0.0005);
  });
});

describe('density of liquid water at 0.101325 MPa', () => {
  // CRC Handbook table (Kell-type fit), reproduced in the wfrjr.com water data sheet.
  // IF97 is a different formulation, so agreement within ±0.005 kg/m^3 is asked for, the
  // spread between the CRC, IAPWS-95 and Tanaka et al. (2001) values.
  const crc: Array<[number, number]> = [
    [0, 999.8395],
    [4, 999.972],
    [10, 999.7026],
    [15, 999.1026],
    [20, 998.2071],
    [22, 997.7735],
    [25, 997.0479],
    [30, 995.6502],
  ];
  for (const [t, rho] of crc) {
    it(`${t} °C: ${rho} kg/m^3`, () => near(waterDensity(t + 273.15, 101325), rho, 0.005));
  }
});

describe('water() as a worksheet function', () => {
  it('matches the ITTC fresh-water values at 15 °C', () => {
    // ITTC Recommended Procedure 7.5-02-01-03, "Fresh Water and Seawater Properties" (Rev. 03):
    // fresh water at 15 °C, rho = 999.1026 kg/m^3, nu = 1.13858e-6 m^2/s.
    const { value } = call('water', { T: shown(15, 'degC'), p: si(101325, 'Pa') });
    near(field(value, 'rho'), 999.1026, 0.005);
    nearRel(field(value, 'nu'), 1.13858e-6, 1e-4);
    expect(asRecord(value).tag).toBe('fluid');
    expect([...asRecord(value).fields.keys()]).toEqual(['rho', 'mu', 'nu', 'T']);
  });

  it('accepts 100 °C at one standard atmosphere, the end of its stated range: 958.35 kg/m^3', () => {
    // Density of liquid water at 100 °C, 958.35 kg/m^3 (CRC Handbook; IAPWS-95 saturated liquid; from memory).
    near(waterProperties(373.15, 101325).rho, 958.35, 0.005);
  });

  it('calls water steam only below its saturation pressure, with 0.1 % slack for 100 °C at 1 atm', () => {
    // p_sat(100 °C) by IF97 Eq. 30 (checked above against Table 35) is 101 418 Pa: one standard
    // atmosphere lies 0.09 % below it (100 °C is 0.03 K above the normal boiling point). The slack
    // of 0.1 % that keeps it liquid is our rule; past it the water is steam.
    const pSat = saturationPressure(373.15);
    near(pSat, 101418, 0.5);
    expect(waterProperties(373.15, pSat * 0.9991).rho).toBeCloseTo(958.35, 1);
    expect(() => waterProperties(373.15, pSat * 0.9989)).toThrow(/steam/);
    expect(() => waterProperties(323.15, 12000)).toThrow('at 50 °C water boils below 12350 Pa; got p = 12000 Pa, so this is steam, not liquid water');
  });

  it('covers pressures up to 100 MPa, the top of IF97 region 1, and says what it got', () => {
    // Region 1 of IAPWS-IF97 spans pressures up to 100 MPa (R7-97(2012), Fig. 1).
    near(waterProperties(300, 80e6).rho, 1 / 0.971180894e-3, 1e-6);
    expect(() => waterProperties(300, 100.0001e6)).toThrow('water() covers pressures above 0 and up to 100 MPa; got p = 1.000001e8 Pa');
    expect(() => waterProperties(300, 0)).toThrow(/got p = 0 Pa/);
  });

  it('refuses 120 °C in plain words, and 100.001 °C as what it is', () => {
    expect(() => call('water', { T: shown(120, 'degC'), p: si(101325, 'Pa') })).toThrow('water() covers liquid water from 0 to 100 °C; got 120 °C');
    expect(() => call('water', { T: shown(100.001, 'degC'), p: si(101325, 'Pa') })).toThrow('water() covers liquid water from 0 to 100 °C; got 100.001 °C');
    expect(() => call('water', { T: shown(-0.001, 'degC'), p: si(101325, 'Pa') })).toThrow('got −0.001 °C');
  });

  it('refuses ice temperatures and temperatures below absolute zero', () => {
    expect(() => waterProperties(268.15, 101325)).toThrow(TradeError);
    expect(() => call('water', { T: shown(-280, 'degC'), p: si(101325, 'Pa') })).toThrow(/below absolute zero/);
  });

  it('refuses a pressure at which the water would boil', () => {
    expect(() => call('water', { T: shown(50, 'degC'), p: si(5000, 'Pa') })).toThrow(/steam/);
  });

  it('refuses a velocity where a temperature belongs', () => {
    expect(() => call('water', { T: si(3, 'm/s'), p: si(101325, 'Pa') })).toThrow(TradeError);
  });
});
