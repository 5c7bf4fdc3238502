import { describe, expect, it } from 'vitest';
import { TradeError, shown, si } from '../../server/core/index.js';
import { seawaterProperties } from '../../server/core/fluids/seawater.js';
import { asRecord, call, field, near, nearRel } from './fluids-helpers.js';

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

});

describe('the correlations themselves, against the authors\' own library', () => {
  // Sharqawy, Lienhard and Zubair (2010) print the coefficients of Eq. (8) and Eqs. (22)-(23)
  // to four figures. SeawaterLab v3.1.2 (Nayar, Sharqawy, Banchik and Lienhard, MIT, 2016;
  // read in a public copy of its SW_Density and SW_Viscosity) carries the same fits to ten
  // figures. Over 0-100 °C and 0-150 g/kg the rounding of the printed coefficients moves
  // the density by at most 0.033 kg/m^3 and the viscosity by at most 3e-5 of itself, so those
  // are the tolerances: far inside the correlations' stated accuracy, and enough to catch a
  // wrong coefficient.
  const a = [9.9992293295e2, 2.0341179217e-2, -6.1624591598e-3, 2.2614664708e-5, -4.6570659168e-8];
  const b = [8.0200240891e2, -2.0005183488, 1.6771024982e-2, -3.0600536746e-5, -1.6132224742e-5];
  const v = [1.5700386464e-1, 6.499262005e1, -9.1296496657e1, 4.2844324477e-5, 1.540913604, 1.9981117208e-2, -9.5203865864e-5, 7.9739318223, -7.5614568881e-2, 4.7237011074e-4];
  const rhoLab = (t: number, S: number) =>
    a[0]! + a[1]! * t + a[2]! * t ** 2 + a[3]! * t ** 3 + a[4]! * t ** 4 + b[0]! * S + b[1]! * S * t + b[2]! * S * t ** 2 + b[3]! * S * t ** 3 + b[4]! * S ** 2 * t ** 2;
  const muLab = (t: number, S: number) => {
    const muW = v[3]! + 1 / (v[0]! * (t + v[1]!) ** 2 + v[2]!);
    return muW * (1 + (v[4]! + v[5]! * t + v[6]! * t ** 2) * S + (v[7]! + v[8]! * t + v[9]! * t ** 2) * S ** 2);
  };
  for (const [t, S] of [[0, 0], [15, 0.035], [25, 0.035], [40, 0.07], [80, 0.12], [100, 0.15]] as const) {
    it(`${t} °C, ${S * 1000} g/kg`, () => {
      const s = seawaterProperties(t + 273.15, S);
      near(s.rho, rhoLab(t, S), 0.033);
      nearRel(s.mu, muLab(t, S), 3e-5);
      nearRel(s.nu, muLab(t, S) / rhoLab(t, S), 6e-5);
    });
  }
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
    expect(() => call('seawater', { T: shown(10, 'degC'), S: si(35) })).toThrow('S = 35 has no unit, so it reads as 35000 g/kg; write salinity with its unit, e.g. S: 35 g/kg');
  });

  it('refuses a salinity above 150 g/kg as the value it is', () => {
    expect(() => call('seawater', { T: shown(10, 'degC'), S: shown(1500, 'g/kg') })).toThrow(/^seawater\(\) covers salinities from 0 to 150 g\/kg; got 1500 g\/kg$/);
    expect(() => seawaterProperties(283.15, -0.001)).toThrow('got −1 g/kg');
  });

  it('refuses temperatures outside 0 to 100 °C', () => {
    expect(() => call('seawater', { T: shown(-2, 'degC'), S: shown(35, 'g/kg') })).toThrow('seawater() covers 0 to 100 °C; got −2 °C');
    expect(() => call('seawater', { T: shown(100.5, 'degC'), S: shown(35, 'g/kg') })).toThrow('got 100.5 °C');
    expect(() => call('seawater', { T: shown(-300, 'degC'), S: shown(35, 'g/kg') })).toThrow(/below absolute zero/);
  });

  it('refuses a pressure where a temperature belongs', () => {
    expect(() => call('seawater', { T: si(101325, 'Pa'), S: shown(35, 'g/kg') })).toThrow(TradeError);
  });
});
