// More edges of the trade library's rules, each in its exact words.
import { describe, expect, it } from 'vitest';
import { list, num, shown, si, str, type Value } from '../../server/core/index.js';
import { fluidEntries } from '../../server/core/fluids/entries.js';
import { saturationPressure } from '../../server/core/fluids/saturation.js';
import { readDelimited, detectDelimiter, numberCell } from '../../server/core/shared/csv.js';
import { histogramSvg } from '../../server/core/wall/histogram-svg.js';
import { stackSvg } from '../../server/core/wall/stack-svg.js';
import { asRecord, call, isaAir, stubContext } from './wall-helpers.js';
import { record } from '../../server/core/index.js';

const fluid = (name: string, args: Record<string, Value>) => fluidEntries.find((f) => f.name === name)!.compute(args, { readData: () => '', warn: () => {} });

describe('fluid words', () => {
  it('a refused temperature difference is worded to four figures', () => {
    // 36.12 °F of interval is 20.0667 K (NIST SP 811 (2008) B.8; from memory).
    expect(() => fluid('air', { T: shown(36.12, 'delta_degF'), p: si(101325, 'Pa'), RH: shown(0, '%') })).toThrow('T is a temperature difference (20.07 K), not a temperature');
  });

  it('humid air says its vapour pressure to four figures', () => {
    // At 40 % the vapour pressure, 935.7 Pa, reads differently at three figures and at four.
    const r = fluid('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: shown(40, '%') });
    const pv = 0.4 * saturationPressure(293.15);
    expect(r.kind === 'record' && r.remarks[1]).toContain(`p_v = RH · p_sat(T) = ${Number(pv.toPrecision(4))} Pa with p_sat`);
  });

  it('fluid() refuses a viscosity of zero', () => {
    expect(() => fluid('fluid', { rho: si(1, 'kg/m^3'), mu: si(0, 'Pa s') })).toThrow('mu = 0 Pa s: the viscosity must be above zero');
  });

  it('each fluid function names its published source', () => {
    expect(fluidEntries.map((f) => f.source)).toEqual([
      'Ideal gas with R = R*/M0 = 287.05 J/(kg K) and Sutherland viscosity (beta = 1.458e-6 kg/(m s K^0.5), S = 110.4 K), both from the U.S. Standard Atmosphere 1976; a = sqrt(1.4 R T); water-vapour saturation pressure by IAPWS-IF97 (IAPWS R7-97(2012)), Eq. 30',
      "ISO 2533:1975 International Standard Atmosphere (identical to the U.S. Standard Atmosphere 1976 up to 20 km); H = r0 Z/(r0 + Z), r0 = 6 356 766 m (USSA-1976); viscosity by Sutherland's law with its constants",
      'Density by IAPWS-IF97 region 1 (IAPWS R7-97(2012)); viscosity by IAPWS R12-08 (2008), without the critical enhancement',
      'Sharqawy, Lienhard and Zubair (2010), Thermophysical properties of seawater, Desalination and Water Treatment 16, 354-380: density Eq. 8, viscosity Eqs. 22-23',
      'definition of kinematic viscosity, nu = mu/rho',
      'definition (Reynolds 1883)',
      'definition; compressibility flag above Ma 0.3 is common practice',
      'definition (Bernoulli)',
      'Re, Ma and q by definition; transition near Re_x = 5e5 on a smooth flat plate and compressibility above Ma 0.3 are common practice',
    ]);
    const atm = fluidEntries.find((f) => f.name === 'atmosphere')!;
    expect(atm.params.map((p) => p.doc)).toEqual([
      'geopotential altitude H, 0 to 20 km (what a bare first argument is)',
      'geometric altitude Z above sea level, 0 to 20.063 km, as handbook tables and aircraft data give it',
    ]);
  });
});

describe('delimited text', () => {
  it('finds the delimiter in the first line of a file with LF line ends', () => {
    expect(detectDelimiter('a;b\n1,2,3,4,5\n')).toBe(';');
  });

  it('reads decimals after the point and exponents of several digits', () => {
    const t = readDelimited('a\n.55\n1e10\n2.5E-12\n');
    expect(t.rows.map((r) => numberCell(t, r, 0))).toEqual([0.55, 1e10, 2.5e-12]);
  });
});

describe('near-wall words', () => {
  it('first_cell at a compressible speed says the wall shear and cell height are rough', () => {
    const air = record([['rho', si(1.225, 'kg/m^3')], ['mu', si(1.7894e-5, 'Pa s')], ['a', si(340.294, 'm/s')]]);
    const r = asRecord(call('first_cell', { U: si(150, 'm/s'), L: si(4, 'm'), fluid: air, yplus: num(1), method: str('schlichting'), placement: str('centroid') }));
    expect(r.warnings).toEqual([
      'Ma = 0.441 is above 0.3: density changes exceed about 5 %, so use a compressible solver set-up; the flat-plate formulas here are for incompressible flow, so the wall shear and so the first-cell height is only a rough estimate.',
    ]);
  });

  it('layer_stack: no flags without δ, the count warning in full, a count rounded only when it was', () => {
    const s = (a: Record<string, Value>) => asRecord(call('layer_stack', { scale: str('linear'), ...a }));
    expect(s({ first: si(1e-3, 'm'), growth: num(1), count: num(5) }).warnings).toEqual([]);
    expect(s({ first: si(1e-6, 'm'), growth: num(1.01), total: si(1e3, 'm') }).warnings).toEqual([
      '1620 layers is far more than a wall-layer stack usually has (up to about 100, common practice); check first, growth and total (1000 m): a total past the boundary layer belongs to the core mesh.',
    ]);
    // 1 + 2 + 4 = 7 first layers: the count is exact, so there is nothing rounded to say.
    expect(s({ first: si(1e-3, 'm'), growth: num(2), total: si(7e-3, 'm') }).remarks).toEqual(['Solved for count.']);
    // Asked for a hair less than 7 mm: rounded up to the same three layers, and 7 mm either way as shown.
    expect(s({ first: si(1e-3, 'm'), growth: num(2), total: si(6.9999e-3, 'm') }).remarks).toEqual(['Solved for count.']);
    expect(s({ first: si(1e-3, 'm'), growth: num(2), total: si(6.9e-3, 'm') }).remarks).toEqual(['Solved for count.', 'The count is rounded up to whole layers, so the stack is 7 mm thick rather than the 6.9 mm asked for.']);
    // Exactly δ: it reaches the edge, no further.
    expect(s({ first: si(1e-3, 'm'), growth: num(1), count: num(5), delta: si(5e-3, 'm') }).remarks[1]).toBe('The stack reaches the boundary-layer edge (100 % of δ).');
    expect(() => s({ first: si(1e-3, 'm'), count: num(5), growth: si(1, 'm') })).toThrow('growth must be a plain number, not a quantity in m');
  });

  it('yplus_report: a band of three numbers is refused; "none" leaves no remark about a missing column; the weighted share worded', () => {
    const csv = 'face,yplus,area\na,1,1\nb,20,3\n';
    const rep = (extra: Record<string, Value>) =>
      asRecord(call('yplus_report', { path: str('r.csv'), column: str('yplus'), weight: str('area'), target: num(1), band: list([num(0.5), num(5)]), ...extra }, stubContext({ 'r.csv': csv })));
    expect(() => rep({ band: list([num(0.5), num(5), num(9)]) })).toThrow('band must be a list of two numbers, low then high, e.g. [0.5, 5]');
    expect(rep({ weight: str('none') }).remarks).toEqual([
      'Target y+ 1: viscous sublayer. Resolve the wall (a low-Reynolds-number model integrated to the wall, no wall functions); aim for y+ near 1.',
      'p05, p50 and p95 count faces (Hyndman & Fan 1996, definition 7); weighted_mean and in_band weigh each face.',
      'Pass first: (the first-layer height of this run) to get corrected_first.',
    ]);
    expect(rep({ weight: str('mass') }).remarks[2]).toBe('The file has no column mass, so every face counts equally.');
    expect(rep({}).warnings[0]).toBe('only 25 % of the wall area has y+ inside 0.5–5; most of the wall, about 90 % or more, is usual (common practice).');
  });
});

describe('figure rules', () => {
  it('a histogram axis on steps of 0.1 starts and ends on them', () => {
    const svg = histogramSvg({ values: [1.2, 1.8], weights: [1, 1], weighted: false, band: [0.5, 5], target: 1 });
    const ticks = [...svg.matchAll(/y="215.0" text-anchor="middle" font-size="11">([^<]+)</g)].map((m) => m[1]);
    // 1.2/0.1 is 11.999… in floating point, so the axis starts a step lower, at 1.1.
    expect(ticks).toEqual(['1.1', '1.2', '1.3', '1.4', '1.5', '1.6', '1.7', '1.8']);
  });

  it('a single layer draws no layer lines', () => {
    expect(stackSvg({ heights: [1e-3], growth: 1, scale: 'linear' })).not.toContain('stroke-width="0.5"');
  });

  it('labels crowding the top are pushed down below it, 12 px apart', () => {
    // Log axis 10 µm to 10 mm: δ at the top decade, the total a hair below it.
    const svg = stackSvg({ heights: [1e-5, 9.79e-3], growth: 979, delta: 1e-2, scale: 'log' });
    const ys = [...svg.matchAll(/<text x="256.0" y="([\d.]+)"/g)].map((m) => Number(m[1])).sort((a, b) => a - b);
    expect(ys[0]).toBeCloseTo(22, 9);
    for (let k = 1; k < ys.length; k++) expect(ys[k]! - ys[k - 1]!).toBeGreaterThanOrEqual(12 - 1e-9);
  });
});
