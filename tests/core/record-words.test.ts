// What each record says beside its numbers: the note of every field, the remarks
// on method and neglect, and the tag. This is wording, not results (the numbers are
// checked against their sources in the other files); it is pinned so that a note
// cannot go missing or change unseen.
import { describe, expect, it } from 'vitest';
import { list, num, shown, si, str, type Args, type RecordValue, type Value } from '../../server/core/index.js';
import { unitLabel } from '../../server/units/labels.js';
import { fluidEntries } from '../../server/core/fluids/entries.js';
import { wallEntries } from '../../server/core/wall/entries.js';
import { mathsEntries } from '../../server/core/maths/entries.js';

const entries = [...fluidEntries, ...wallEntries];
const csv = 'face,yplus,area\na,1,1\nb,3,1\n';
function call(name: string, args: Args): RecordValue {
  const v = entries.find((e) => e.name === name)!.compute(args, { readData: () => csv, warn: () => {} });
  if (v.kind !== 'record') throw new Error(`${name} gave ${v.kind}`);
  return v;
}
const notes = (r: RecordValue) => [...r.fields].map(([k, f]) => [k, f.note]);
/** Each field's dimension as SI unit text ("" for plain numbers), or its kind when it is no quantity. */
const units = (r: RecordValue) => Object.fromEntries([...r.fields].map(([k, f]) => [k, unitOf(f.value)]));
function unitOf(v: Value): string {
  if (v.kind === 'list') return `list of ${v.items.length ? unitOf(v.items[0]!) : 'nothing'}`;
  return v.kind === 'quantity' ? unitLabel(v.dims) : v.kind;
}
const air = call('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: shown(0, '%') });
const FLUID_NOTES = [['rho', 'density'], ['mu', 'dynamic viscosity'], ['nu', 'kinematic viscosity']];

describe('fluid records', () => {
  it('air', () => {
    const r = call('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: shown(50, '%') });
    expect(notes(r)).toEqual([...FLUID_NOTES, ['a', 'speed of sound'], ['T', 'temperature'], ['p', 'pressure']]);
    expect(r.tag).toBe('fluid');
    expect(r.remarks[0]).toBe("Ideal gas, R = 287.05 J/(kg K); Sutherland's law with the U.S. Standard Atmosphere 1976 constants; a = √(γRT), γ = 1.4.");
    expect(r.remarks[1]).toMatch(/^Humid air: density from the partial pressures of dry air and vapour, p_v = RH · p_sat\(T\) = \d+ Pa with p_sat from IAPWS-IF97\. Neglected: the enhancement factor and non-ideal behaviour \(each well under 0\.1 % in density near room conditions\), and the effect of the vapour on viscosity and on the speed of sound \(both taken as for dry air\)\.$/);
    // Dry air (RH 0) carries no humid-air remark; made inside the test so that a mutant of the
    // RH test is switched on when it runs (the module-level `air` is made before).
    const dry = call('air', { T: shown(20, 'degC'), p: si(101325, 'Pa'), RH: shown(0, '%') });
    expect(dry.remarks).toHaveLength(1);
    expect(dry.warnings).toEqual([]);
  });

  it('atmosphere', () => {
    const r = call('atmosphere', { geopotential: si(1000, 'm') });
    expect(notes(r)).toEqual([['T', 'temperature'], ['p', 'pressure'], ...FLUID_NOTES, ['a', 'speed of sound'], ['H', 'geopotential altitude'], ['Z', 'geometric altitude']]);
    expect(r.tag).toBe('fluid');
    expect(r.remarks).toEqual(['International Standard Atmosphere (ISO 2533:1975), dry air, at geopotential altitude H = 1000 m (geometric Z = 1000.16 m).']);
  });

  it('water and seawater', () => {
    const w = call('water', { T: shown(15, 'degC'), p: si(101325, 'Pa') });
    expect(notes(w)).toEqual([...FLUID_NOTES, ['T', 'temperature']]);
    expect(w.remarks).toEqual(['Pure liquid water: density by IAPWS-IF97 (region 1), viscosity by the IAPWS 2008 formulation (R12-08). Dissolved air and impurities are neglected.']);
    expect(w.tag).toBe('fluid');
    const s = call('seawater', { T: shown(15, 'degC'), S: shown(35, 'g/kg') });
    expect(notes(s)).toEqual([...FLUID_NOTES, ['T', 'temperature'], ['S', 'salinity']]);
    expect(s.remarks).toEqual(['Seawater at atmospheric pressure by the correlations of Sharqawy, Lienhard and Zubair (2010); stated accuracy about 0.1 % in density and 1.5 % in viscosity.']);
    expect(s.tag).toBe('fluid');
  });

  it('fluid', () => {
    const r = call('fluid', { rho: si(870, 'kg/m^3'), mu: si(0.03, 'Pa s'), a: si(1300, 'm/s') });
    expect(notes(r)).toEqual([...FLUID_NOTES, ['a', 'speed of sound']]);
    expect(r.remarks).toEqual(['Fluid properties given by the sheet.']);
    expect(r.tag).toBe('fluid');
  });

  it('flow_regime', () => {
    const r = call('flow_regime', { U: si(10, 'm/s'), L: si(1, 'm'), fluid: air });
    expect(notes(r)).toEqual([['Re', 'Reynolds number on L'], ['Ma', 'Mach number'], ['q', 'dynamic pressure'], ['regime', 'flat-plate boundary layer at L']]);
    expect(r.remarks).toEqual([
      'Re = 6.64e5: transition expected about 75 % of the length from the leading edge, so a large laminar part remains (flat-plate transition near Re_x = 5×10⁵, common practice; roughness or a disturbed stream bring it earlier).',
    ]);
    const water = call('water', { T: shown(15, 'degC'), p: si(101325, 'Pa') });
    expect(call('flow_regime', { U: si(1, 'm/s'), L: si(0.1, 'm'), fluid: water }).remarks[1]).toBe(
      'The fluid record has no speed of sound a, so no Mach number is given (in water a is near 1500 m/s).',
    );
  });
});

describe('near-wall records', () => {
  it('boundary_layer, turbulent and laminar', () => {
    const r = call('boundary_layer', { U: si(10, 'm/s'), x: si(1, 'm'), fluid: air });
    expect(notes(r)).toEqual([['Re_x', 'Reynolds number at x'], ['delta', 'boundary-layer thickness'], ['delta_star', 'displacement thickness'], ['theta', 'momentum thickness'], ['regime', 'laminar below Re_x = 5e5']]);
    expect(r.tag).toBe('boundary layer');
    const smooth = 'Smooth flat plate at zero pressure gradient: on a body, an estimate of the wall layer, not its local value.';
    expect(r.remarks).toEqual(['Turbulent from the leading edge (Re_x at or above 5e5): one-seventh power law, δ = 0.37 x Re_x^-1/5, δ* = δ/8, θ = 7δ/72.', smooth]);
    expect(call('boundary_layer', { U: si(1, 'm/s'), x: si(1, 'm'), fluid: air }).remarks).toEqual([
      'Laminar (Re_x below 5e5): Blasius, δ99 = 4.91 x/√Re_x, δ* = 1.721 x/√Re_x, θ = 0.664 x/√Re_x.',
      smooth,
    ]);
  });

  it('first_cell, both placements', () => {
    const base = { U: si(10, 'm/s'), L: si(1, 'm'), fluid: air, yplus: num(1), method: str('schlichting') };
    const r = call('first_cell', { ...base, placement: str('height') });
    expect(notes(r)).toEqual([
      ['Re', 'Reynolds number on L'], ['cf', 'skin-friction coefficient'], ['tau_w', 'wall shear stress'], ['u_tau', 'friction velocity'],
      ['l_visc', 'viscous length ν/u_τ'], ['height', 'first-cell height'], ['centroid', 'first-cell centre above the wall'], ['band', 'near-wall region targeted'],
    ]);
    expect(r.tag).toBe('first cell');
    expect(r.remarks.slice(0, 2)).toEqual([
      'Targets the viscous sublayer. Resolve the wall (a low-Reynolds-number model integrated to the wall, no wall functions); aim for y+ near 1.',
      'Target y+ met at the first cell top: height = y+ × l_visc.',
    ]);
    expect(r.remarks[2]).toMatch(/ at Re built on L, the lowest along the body; near the nose τ_w is higher and so is y\+, so check the run with yplus_report\.$/);
    expect(call('first_cell', { ...base, placement: str('centroid') }).remarks[1]).toBe('Target y+ met at the first cell centre (cell-centred solvers): height = 2 × y+ × l_visc.');
  });

  it('layer_stack', () => {
    const r = call('layer_stack', { first: si(1e-5, 'm'), growth: num(1.2), count: num(10), core: si(1e-4, 'm'), delta: si(1e-3, 'm'), scale: str('linear') });
    expect(notes(r)).toEqual([
      ['first', 'first-layer height'], ['growth', 'growth ratio'], ['count', 'number of layers'], ['total', 'stack thickness'], ['last', 'last (outermost) layer height'],
      ['heights', 'layer heights from the wall out'], ['jump', 'core cell / last layer'], ['inside', 'layers inside the boundary layer'], ['coverage', 'stack thickness / δ'],
    ]);
    expect(r.tag).toBe('layer stack');
    expect(r.remarks).toEqual(['Solved for total.', 'The stack covers 26 % of δ; the rest of the boundary layer lies in the core mesh.']);
    const past = call('layer_stack', { first: si(1e-5, 'm'), growth: num(1.2), count: num(10), delta: si(1e-4, 'm'), scale: str('linear') });
    expect(past.remarks[1]).toBe('The stack reaches the boundary-layer edge and past it (260 % of δ).');
    const rounded = call('layer_stack', { first: si(1e-5, 'm'), growth: num(1.2), total: si(3e-4, 'm'), scale: str('linear') });
    // Eleven layers, the first count whose sum passes 300 µm: 10 µm (1.2^11 − 1)/0.2 (geometric series), at three figures.
    const eleven = Number(((10 * (1.2 ** 11 - 1)) / 0.2).toPrecision(3));
    expect(rounded.remarks).toEqual(['Solved for count.', `The count is rounded up to whole layers, so the stack is ${eleven} µm thick rather than the 300 µm asked for.`]);
  });

  it('yplus_report', () => {
    const args = { path: str('x.csv'), column: str('yplus'), weight: str('area'), target: num(1), band: list([num(0.5), num(5)]) };
    const r = call('yplus_report', { ...args, first: si(1e-5, 'm') });
    expect(notes(r)).toEqual([
      ['count', 'wall faces'], ['min', 'lowest y+'], ['max', 'highest y+'], ['mean', 'mean over faces'], ['weighted_mean', 'mean weighted by area'],
      ['p05', '5th percentile'], ['p50', 'median'], ['p95', '95th percentile'], ['in_band', 'share within 0.5–5'], ['corrected_first', 'next first-layer height'],
    ]);
    expect(r.tag).toBe('y+ report');
    expect(r.remarks).toEqual([
      'Target y+ 1: viscous sublayer. Resolve the wall (a low-Reynolds-number model integrated to the wall, no wall functions); aim for y+ near 1.',
      'p05, p50 and p95 count faces (Hyndman & Fan 1996, definition 7); weighted_mean and in_band weigh each face by area.',
      'corrected_first = first × target / weighted_mean; meeting a y+ target is iterative, so re-run and report again.',
    ]);
  });
});

describe('the dimension of every field', () => {
  const FLUID = { rho: 'kg/m^3', mu: 'Pa s', nu: 'm^2/s' };
  it('fluids', () => {
    expect(units(air)).toEqual({ ...FLUID, a: 'm/s', T: 'K', p: 'Pa' });
    expect(units(call('atmosphere', { geometric: si(3, 'km') }))).toEqual({ T: 'K', p: 'Pa', ...FLUID, a: 'm/s', H: 'm', Z: 'm' });
    expect(units(call('water', { T: shown(15, 'degC'), p: si(101325, 'Pa') }))).toEqual({ ...FLUID, T: 'K' });
    expect(units(call('seawater', { T: shown(15, 'degC'), S: shown(35, 'g/kg') }))).toEqual({ ...FLUID, T: 'K', S: '' });
    expect(units(call('fluid', { rho: si(870, 'kg/m^3'), mu: si(0.03, 'Pa s'), a: si(1300, 'm/s') }))).toEqual({ ...FLUID, a: 'm/s' });
    expect(units(call('fluid', { rho: si(870, 'kg/m^3'), mu: si(0.03, 'Pa s') }))).toEqual(FLUID);
    expect(units(call('flow_regime', { U: si(10, 'm/s'), L: si(1, 'm'), fluid: air }))).toEqual({ Re: '', Ma: '', q: 'Pa', regime: 'string' });
  });

  it('near-wall records', () => {
    expect(units(call('boundary_layer', { U: si(10, 'm/s'), x: si(1, 'm'), fluid: air }))).toEqual({ Re_x: '', delta: 'm', delta_star: 'm', theta: 'm', regime: 'string' });
    const cell = call('first_cell', { U: si(10, 'm/s'), L: si(1, 'm'), fluid: air, yplus: num(1), method: str('schlichting'), placement: str('height') });
    expect(units(cell)).toEqual({ Re: '', cf: '', tau_w: 'Pa', u_tau: 'm/s', l_visc: 'm', height: 'm', centroid: 'm', band: 'string' });
    const stack = call('layer_stack', { first: si(1e-5, 'm'), growth: num(1.2), count: num(10), core: si(1e-4, 'm'), delta: si(1e-3, 'm'), scale: str('linear') });
    expect(units(stack)).toEqual({ first: 'm', growth: '', count: '', total: 'm', last: 'm', heights: 'list of m', jump: '', inside: '', coverage: '' });
    const args = { path: str('x.csv'), column: str('yplus'), weight: str('area'), target: num(1), band: list([num(0.5), num(5)]), first: si(1e-5, 'm') };
    const report = call('yplus_report', args);
    expect(units(report)).toEqual({ count: '', min: '', max: '', mean: '', weighted_mean: '', p05: '', p50: '', p95: '', in_band: '', corrected_first: 'm' });
    expect(report.fields.get('in_band')!.value).toMatchObject({ unit: { text: '%' } });
  });
});

describe('every entry is documented', () => {
  for (const f of [...mathsEntries, ...entries]) {
    it(`${f.name}: doc, source, example and a doc for each parameter`, () => {
      expect(f.doc.length).toBeGreaterThan(10);
      expect(f.source.length).toBeGreaterThanOrEqual(10);
      expect(f.example.startsWith(`${f.name}(`)).toBe(true);
      for (const p of f.params) {
        expect(p.doc.length, `${f.name}.${p.name}`).toBeGreaterThan(3);
        if (p.type === 'quantity') expect(p.unit, `${f.name}.${p.name}`).toBeTruthy();
        if (p.choices && p.default) expect(p.choices).toContain(JSON.parse(p.default));
      }
    });
  }
});

describe('what the basic maths say of themselves', () => {
  it('min and max name which end they pick; each function its source', () => {
    const doc = (n: string) => mathsEntries.find((f) => f.name === n)!;
    expect(doc('min').doc).toBe('the smallest of a list (units must agree)');
    expect(doc('max').doc).toBe('the largest of a list (units must agree)');
    expect(doc('min').example).toBe('min([3, 1, 2] m)');
    expect(doc('exp').source).toBe('ECMAScript Math (IEEE 754 double precision)');
    expect(mathsEntries.filter((f) => f.source === 'definition').map((f) => f.name)).toEqual(['sqrt', 'abs', 'min', 'max', 'linspace', 'sum', 'mean']);
    expect(mathsEntries.map((f) => f.doc)).toEqual([
      'square root (units take the half power)', 'absolute value (keeps the unit)', 'e to the power x', 'natural logarithm', 'base-10 logarithm',
      'sine of an angle in radians (30 deg converts)', 'cosine of an angle in radians', 'tangent of an angle in radians',
      'the smallest of a list (units must agree)', 'the largest of a list (units must agree)', 'evenly spaced values from start to stop, for sweeps',
      'the sum of a list', 'the arithmetic mean of a list',
    ]);
    expect(mathsEntries.map((f) => f.example)).toEqual(['sqrt(4 m^2)', 'abs(-3 m/s)', 'exp(1)', 'ln(10)', 'log10(1e6)', 'sin(30 deg)', 'cos(pi/3)', 'tan(45 deg)', 'min([3, 1, 2] m)', 'max([3, 1, 2] m)', 'linspace(10 m/s, 40 m/s, 4)', 'sum([1, 2, 3] m)', 'mean([1, 2, 3] m)']);
    expect(mathsEntries.flatMap((f) => f.params.map((p) => p.doc))).toEqual([
      'argument, in any unit', 'argument, in any unit',
      'the argument, without a unit', 'the argument, without a unit', 'the argument, without a unit',
      'an angle in radians, or in deg', 'an angle in radians, or in deg', 'an angle in radians, or in deg',
      'a list, or several arguments', 'a list, or several arguments', 'first value', 'last value (same unit as start)', 'number of values, 2 to 100000',
      'a list of numbers or quantities of one unit', 'a list of numbers or quantities of one unit',
    ]);
  });
});
