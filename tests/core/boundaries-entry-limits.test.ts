// The warnings of abl(…) and shedding(…) at the edges of their ranges. EN 1991-1-4:2005
// (Eurocode 1, wind actions), Table 4.1: terrain category III has z0 = 0.3 m and
// z_min = 5 m; §4.3.2: the profile holds up to z_max = 200 m. The edges themselves
// belong to the range ("for z_min ≤ z ≤ z_max"). Warning texts are project wording.
import { describe, expect, it } from 'vitest';
import { si, type Value } from '../../server/core/index.js';
import { asQuantity, run, runRecord } from './boundaries-helpers.js';

/** The dimension of a result, against the unit it must carry (SI dimensions). */
const dimsOf = (v: Value) => asQuantity(v).dims;
const dimsOfUnit = (unit: string) => si(1, unit).dims;

const abl = (heights: string, zRef = '10 m') => runRecord(`abl(10 m/s, ${zRef}, terrain("III"), heights: ${heights})`);

describe('abl heights against the code profile of EN 1991-1-4', () => {
  it('heights at exactly z_min and z_max, and U_ref taken at z_min, raise no warning', () => {
    expect(abl('[5, 200] m', '5 m').warnings).toEqual([]);
  });

  it('one height outside says "height … lies", several say "heights …, … lie"', () => {
    const w = abl('[1, 2, 10, 250, 300] m').warnings.join('\n');
    expect(w).toContain('heights 1 m, 2 m lie below z_min = 5 m of terrain category III');
    expect(w).toContain('heights 250 m, 300 m lie above z_max = 200 m, beyond the code\'s profile');
    const one = abl('[2, 10, 250] m').warnings.join('\n');
    expect(one).toContain('height 2 m lies below z_min = 5 m');
    expect(one).toContain('height 250 m lies above z_max = 200 m');
  });

  it('a reference height below z_min is named', () => {
    expect(abl('[10] m', '4 m').warnings.join('\n')).toContain('the reference height 4 m is below z_min = 5 m; take U_ref at or above z_min.');
  });

  it('the table carries each column in its unit, and the roughness is named by its category', () => {
    const r = abl('[10] m');
    const t = r.fields.get('table')!.value;
    if (t.kind !== 'table') throw new Error('no table');
    expect(t.columns).toEqual(['z', 'U', 'k', 'epsilon', 'omega']);
    expect(t.rows[0]!.map(dimsOf)).toEqual(['m', 'm/s', 'm^2/s^2', 'm^2/s^3', '1/s'].map(dimsOfUnit));
    expect(r.fields.get('z0')!.note).toBe('roughness length of terrain category III');
  });

  it('an empty list of heights is refused, saying what to give', () => {
    expect(() => run('abl(10 m/s, 10 m, 0.3 m, heights: [] m)')).toThrow('heights must list at least one height');
  });

  it('the figure is captioned and the log law is said to be a surface-layer model', () => {
    const r = abl('[10] m');
    expect(r.figure?.caption).toBe('Mean wind speed against height');
    expect(r.remarks.join('\n')).toContain('the log law holds in roughly the lowest 100–200 m of the atmosphere');
  });
});

describe('shedding steps per period', () => {
  // St = f D / U (Strouhal): 0.2 × 20 m/s / 0.1 m = 40 Hz, T = 25 ms; 1.25 ms is 20 steps.
  it('exactly 20 steps per period raise no warning; 1.3 ms (19.2 steps) does', () => {
    expect(runRecord('shedding(20 m/s, 0.1 m, St: 0.2, dt: 1.25 ms)').warnings).toEqual([]);
    expect(runRecord('shedding(20 m/s, 0.1 m, St: 0.2, dt: 1.3 ms)').warnings.join(' ')).toMatch(/only 19\.2 steps per shedding period/);
  });

  it('gives the frequency in Hz and the period in s, tagged as a shedding estimate', () => {
    const r = runRecord('shedding(20 m/s, 0.1 m)');
    expect(dimsOf(r.fields.get('frequency')!.value)).toEqual(dimsOfUnit('Hz'));
    expect(asQuantity(r.fields.get('frequency')!.value).si).toBeCloseTo(40, 12);
    expect(dimsOf(r.fields.get('period')!.value)).toEqual(dimsOfUnit('s'));
    expect(r.tag).toBe('shedding');
  });

  it('asks for dt only when it was not given', () => {
    expect(runRecord('shedding(20 m/s, 0.1 m)').remarks.join(' ')).toContain('Pass dt: (the time step) to get the steps per period.');
    expect(runRecord('shedding(20 m/s, 0.1 m, dt: 1 ms)').remarks.join(' ')).not.toContain('Pass dt:');
  });
});

describe('inlet turbulence remarks and notes', () => {
  // k = 3/2 (U I)², ν_t = k/ω = Cμ^(1/4) √k ℓ (Versteeg & Malalasekera, An Introduction to CFD,
  // 2nd ed., 2007, §9.9 inlet conditions): U 10 m/s, I 5 %, ℓ 0.07 m, Cμ 0.09, ISA air ν = 1.7894e-5 / 1.2250.
  it('with a length given, the derived ν_t/ν is stated to three figures and the notes say which was given', () => {
    const r = runRecord('inlet_turbulence(10 m/s, intensity: 5 %, length: 0.07 m, fluid: isa)');
    const nut = Math.pow(0.09, 0.25) * Math.sqrt(1.5 * 0.5 ** 2) * 0.07;
    const m = /Length scale given; the eddy-viscosity ratio ν_t\/ν = ([\d.,]+) follows from ν_t = k\/ω\./.exec(r.remarks.join('\n'));
    expect(Math.abs(Number(m![1]!.replace(/,/g, '')) / (nut / (1.7894e-5 / 1.225)) - 1)).toBeLessThan(5e-3);
    expect(r.fields.get('length')!.note).toBe('length scale ℓ, as given');
    expect(r.fields.get('nut_ratio')!.note).toBe('eddy-viscosity ratio ν_t/ν, derived');
    expect(r.remarks.join('\n')).toContain('a free-stream ratio ν_t/ν of about 1–10 is usual for a quiet inflow');
    expect(r.tag).toBe('inlet turbulence');
    expect(dimsOf(r.fields.get('length')!.value)).toEqual(dimsOfUnit('m'));
  });

  it('with a ratio given, the notes turn round', () => {
    const r = runRecord('inlet_turbulence(30 m/s, intensity: 1 %, viscosity_ratio: 10, fluid: isa)');
    expect(r.fields.get('length')!.note).toBe('length scale ℓ, derived from the viscosity ratio');
    expect(r.fields.get('nut_ratio')!.note).toBe('eddy-viscosity ratio ν_t/ν, as given');
  });

  it('an intensity of exactly 20 % is not called high (common practice: up to about 20 %)', () => {
    expect(runRecord('inlet_turbulence(10 m/s, intensity: 20 %, length: 1 m, fluid: isa)').warnings).toEqual([]);
  });
});

describe('force coefficients', () => {
  const base = '[620, 15, -90] N, isa, 30 m/s, 2.2 m^2';
  // q = ½ ρ U² (definition): 0.5 × 1.2250 × 30² = 551.25 Pa.
  it('gives q in Pa, tagged, with the grid-study caution', () => {
    const r = runRecord(`force_coefficients(${base})`);
    expect(dimsOf(r.fields.get('q')!.value)).toEqual(dimsOfUnit('Pa'));
    expect(asQuantity(r.fields.get('q')!.value).si).toBeCloseTo(551.25, 9);
    expect(r.tag).toBe('force coefficients');
    expect(r.remarks.join(' ')).toContain('compare them across a grid study or with a measurement');
  });

  it('warns of a negative Fx only, not of Fx = 0', () => {
    expect(runRecord('force_coefficients([0, 15, -90] N, isa, 30 m/s, 2.2 m^2)').warnings).toEqual([]);
    expect(runRecord('force_coefficients([-1, 15, -90] N, isa, 30 m/s, 2.2 m^2)').warnings.join(' ')).toContain('Fx is negative');
  });

  it('says l_ref without M gives no Cm, and nothing when both or neither are given', () => {
    const note = 'l_ref given without a moment M, so no Cm.';
    expect(runRecord(`force_coefficients(${base}, l_ref: 2.7 m)`).remarks).toContain(note);
    expect(runRecord(`force_coefficients(${base}, M: 100 N m, l_ref: 2.7 m)`).remarks).not.toContain(note);
    expect(runRecord(`force_coefficients(${base})`).remarks).not.toContain(note);
  });
});
