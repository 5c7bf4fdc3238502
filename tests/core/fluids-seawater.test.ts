import { describe, expect, it } from 'vitest';
import { TradeError, shown, si } from '../../server/core/index.js';
import { seawaterProperties } from '../../server/core/fluids/seawater.js';
import { asRecord, call, field, nearRel } from './fluids-helpers.js';

// The correlations of Sharqawy, Lienhard and Zubair (2010) state an accuracy of about
// ±0.1 % in density and ±1.5 % in viscosity (from memory). Tables made with other methods
// are therefore compared within those bounds, not to their last digit.
const RHO_ACCURACY = 0.001;
const MU_ACCURACY = 0.015;

describe('seawater against published tables', () => {
  it('ITTC 7.5-02-01-03 seawater at 15 °C, S_A = 35.16504 g/kg', () => {
    // ITTC Recommended Procedure 7.5-02-01-03 "Fresh Water and Seawater Properties" (Rev. 03), 15 °C, 0.101325 MPa:
    // rho = 1026.021 kg/m^3, nu = 1.18831e-6 m^2/s.
    const s = seawaterProperties(288.15, 0.03516504);
    nearRel(s.rho, 1026.021, RHO_ACCURACY);
    nearRel(s.nu, 1.18831e-6, MU_ACCURACY);
  });

  // Tupper, Introduction to Naval Architecture, Table 5.1, salt water of salinity 3.5 %.
  const tupper51: Array<[number, number, number]> = [
    [0, 1028.0, 1.828e-6],
    [10, 1026.9, 1.354e-6],
    [20, 1024.7, 1.054e-6],
    [30, 1021.7, 0.849e-6],
  ];
  for (const [t, rho, nu] of tupper51) {
    it(`${t} °C, 35 g/kg: rho ${rho} kg/m^3, nu ${nu} m^2/s (Tupper Table 5.1)`, () => {
      const s = seawaterProperties(t + 273.15, 0.035);
      nearRel(s.rho, rho, RHO_ACCURACY);
      nearRel(s.nu, nu, MU_ACCURACY);
    });
  }

  it('is denser and more viscous than fresh water of the same temperature', () => {
    const salt = seawaterProperties(283.15, 0.035);
    const fresh = seawaterProperties(283.15, 0);
    expect(salt.rho).toBeGreaterThan(fresh.rho);
    expect(salt.mu).toBeGreaterThan(fresh.mu);
  });
});

describe('seawater() as a worksheet function', () => {
  it('returns a fluid record with rho, mu, nu, T, S', () => {
    const { value } = call('seawater', { T: shown(10, 'degC'), S: shown(35, 'g/kg') });
    const r = asRecord(value);
    expect(r.tag).toBe('fluid');
    expect([...r.fields.keys()]).toEqual(['rho', 'mu', 'nu', 'T', 'S']);
    // Tupper Table 5.1, 10 °C, 3.5 %: rho = 1026.9 kg/m^3.
    nearRel(field(value, 'rho'), 1026.9, RHO_ACCURACY);
    nearRel(field(value, 'S'), 0.035, 1e-12);
  });

  it('asks for a unit when salinity is a bare number', () => {
    expect(() => call('seawater', { T: shown(10, 'degC'), S: si(35) })).toThrow(/35 g\/kg/);
  });

  it('refuses temperatures outside 0 to 100 °C', () => {
    expect(() => call('seawater', { T: shown(-2, 'degC'), S: shown(35, 'g/kg') })).toThrow(TradeError);
    expect(() => call('seawater', { T: shown(-300, 'degC'), S: shown(35, 'g/kg') })).toThrow(/below absolute zero/);
  });

  it('refuses a pressure where a temperature belongs', () => {
    expect(() => call('seawater', { T: si(101325, 'Pa'), S: shown(35, 'g/kg') })).toThrow(TradeError);
  });
});
