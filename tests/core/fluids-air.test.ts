import { describe, expect, it } from 'vitest';
import { TradeError, shown, si } from '../../server/core/index.js';
import { airProperties } from '../../server/core/fluids/air.js';
import { sutherlandViscosity } from '../../server/core/fluids/sutherland.js';
import { asRecord, call, field, near } from './fluids-helpers.js';

// USSA-1976 gas constants (crnslab "Standard Atmosphere" page, citing ICAO Doc 7488/2 and USSA-1976).
const R_STAR = 8314.32; // J/(kmol K)
const M_AIR = 28.9644; // kg/kmol

describe("Sutherland's law with the USSA-1976 constants", () => {
  it('gives the standard sea-level viscosity 1.7894e-5 Pa s at 288.15 K', () => {
    // ML = 1.7894e-5 at TL = 288.15 K: constants of stdatm.m (repo radioflyer28/NexGenAirlifter), quoting USSA-1976.
    near(sutherlandViscosity(288.15), 1.7894e-5, 0.00005e-5);
  });

  it('matches the air table of Incropera and DeWitt at 300 K', () => {
    // Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, Table A.4, 300 K: mu = 184.6e-7 N s/m^2 (from memory).
    near(sutherlandViscosity(300), 184.6e-7, 0.05e-7);
  });
});

describe('dry air density at one atmosphere', () => {
  // Cengel & Cimbala, Fluid Mechanics, Table A-9 "Properties of air at 1 atm pressure" (p. 948).
  // Tolerance: half a unit of the printed last digit. The 10 °C entry (1.246) is left out:
  // the ideal-gas value there is 1.2466, which the table's rounding does not reach.
  const cengelA9 = [
    { t: 0, rho: 1.292 },
    { t: 15, rho: 1.225 },
    { t: 20, rho: 1.204 },
    { t: 25, rho: 1.184 },
    { t: 30, rho: 1.164 },
  ];
  for (const row of cengelA9) {
    it(`${row.t} °C: rho = ${row.rho} kg/m^3 (Cengel Table A-9)`, () => {
      near(airProperties(row.t + 273.15, 101325, 0).rho, row.rho, 0.0005);
    });
  }
});

describe('humid air by partial pressures', () => {
  it('follows Dalton’s law with the IF97 saturation pressure at 300 K', () => {
    // p_sat(300 K) = 3.53658941e-3 MPa: IAPWS-IF97 (R7-97(2012)) Table 35 check value (from memory).
    const pSat = 3536.58941;
    const RH = 0.5;
    const p = 101325;
    const T = 300;
    const pv = RH * pSat;
    const expected = (p - pv) / ((R_STAR / M_AIR) * T) + pv / ((R_STAR / 18.01528) * T);
    near(airProperties(T, p, RH).rho, expected, expected * 1e-8);
  });

  it('saturated air at 300 K by the same partial pressures, with p_sat of IF97 Table 35', () => {
    // p_sat(300 K) = 3.53658941e-3 MPa: IAPWS-IF97 (R7-97(2012)) Table 35 check value (from memory).
    const pv = 3536.58941;
    const expected = (101325 - pv) / ((R_STAR / M_AIR) * 300) + pv / ((R_STAR / 18.01528) * 300);
    near(airProperties(300, 101325, 1).rho, expected, expected * 1e-8);
    near(airProperties(300, 101325, 1).vapourPressure, pv, 0.5e-8 * 1e6);
  });
});

describe('air() as a worksheet function', () => {
  it('returns a fluid record whose fields carry units', () => {
    const { value } = call('air', { T: shown(15, 'degC'), p: si(101325, 'Pa'), RH: shown(0, '%') });
    const r = asRecord(value);
    expect(r.tag).toBe('fluid');
    expect([...r.fields.keys()]).toEqual(['rho', 'mu', 'nu', 'a', 'T', 'p']);
    // Sea-level standard values (USSA-1976; PDAS table): rho 1.2250, a 340.294 (stdatm.m).
    near(field(value, 'rho'), 1.225, 0.00005);
    near(field(value, 'a'), 340.294, 0.0005);
    near(field(value, 'T'), 288.15, 1e-9);
  });

  it('says what humid air neglects', () => {
    const { value } = call('air', { T: shown(28, 'degC'), p: si(101325, 'Pa'), RH: shown(60, '%') });
    expect(asRecord(value).remarks.join(' ')).toMatch(/Neglected/);
  });

  it('refuses a temperature below absolute zero', () => {
    expect(() => call('air', { T: shown(-300, 'degC'), p: si(101325, 'Pa'), RH: shown(0, '%') })).toThrow(/−300 °C is below absolute zero/);
  });

  it('refuses a temperature difference where a temperature belongs', () => {
    // 36 °F of interval is 20 K (NIST SP 811 (2008) B.8; from memory): a difference, not a reading.
    expect(() => call('air', { T: shown(36, 'delta_degF'), p: si(101325, 'Pa'), RH: shown(0, '%') })).toThrow(
      'T is a temperature difference (20 K), not a temperature; give an absolute temperature such as 20 degC or 293.15 K',
    );
    // A value in K without that mark is taken as a temperature.
    near(field(call('air', { T: si(288.15, 'K'), p: si(101325, 'Pa'), RH: shown(0, '%') }).value, 'rho'), 1.225, 0.00005);
  });

  it('refuses a length where a temperature belongs', () => {
    expect(() => call('air', { T: si(5, 'm'), p: si(101325, 'Pa'), RH: shown(0, '%') })).toThrow(TradeError);
  });

  it('refuses a humidity written without its % sign, and says how to write it', () => {
    expect(() => call('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: si(60) })).toThrow('RH = 60 has no unit, so it reads as 6000 %; write it with its unit, e.g. RH: 60 %');
  });

  it('refuses 120 % as the value it is, without a hint meant for bare numbers', () => {
    expect(() => call('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: shown(120, '%') })).toThrow(/^RH = 120 % is outside 0 to 100 %$/);
  });

  it('refuses air below its critical temperature, where it can be liquid: −200 °C', () => {
    // Critical temperature of air 132.5 K (Lemmon et al. 2000, from memory); at 1 atm air condenses near 79 K.
    expect(() => call('air', { T: shown(-200, 'degC'), p: si(101325, 'Pa'), RH: shown(0, '%') })).toThrow(/T = −200 °C is below −140.65 °C \(132.5 K\), the critical temperature of air/);
    expect(() => airProperties(132.4, 101325)).toThrow(TradeError);
    // Just above it the ideal gas still answers, with the Sutherland range warning of the entry.
    near(airProperties(132.5, 101325).rho, 101325 / ((R_STAR / M_AIR) * 132.5), 1e-12);
    const cold = asRecord(call('air', { T: shown(-130, 'degC'), p: si(101325, 'Pa'), RH: shown(0, '%') }).value);
    expect(cold.warnings.join(' ')).toMatch(/T = −130 °C is outside 170 to 1900 K, where Sutherland's law holds within about 2 %/);
  });

  it('refuses humid air below 0 °C, where the saturation formula does not apply', () => {
    expect(() => call('air', { T: shown(-10, 'degC'), p: si(101325, 'Pa'), RH: shown(80, '%') })).toThrow(/0 to 100 °C/);
  });

  it('refuses a pressure of zero, and humid air at a pressure where its water would boil', () => {
    expect(() => airProperties(288.15, 0, 0)).toThrow('p = 0 Pa: the pressure must be above zero');
    // p_sat(300 K) = 3536.6 Pa (IF97 Table 35): below that total pressure saturated air is all vapour.
    expect(() => airProperties(300, 3500, 1)).toThrow(/the vapour pressure 3537 Pa .* reaches the total pressure 3500 Pa: the water would boil/);
  });

  it('names a missing temperature', () => {
    expect(() => call('air', { p: si(101325, 'Pa'), RH: shown(0, '%') })).toThrow(/missing argument T/);
  });
});
