// The values each kind of patch shows in the boundary table, and the records
// read back by boundaries(): each figure is checked against the kinematics or
// unit fact it rests on, computed here from the inputs.
import { describe, expect, it } from 'vitest';
import { record, si, str, type RecordValue } from '../../server/core/index.js';
import { cross, describePatch, vectorText } from '../../server/core/boundaries/patches.js';
import { numberText } from '../../server/core/shared/words.js';
import { asQuantity, listField, relErr, run, runRecord, siField, tableRows } from './boundaries-helpers.js';

/** The "values" cell of each row of a boundaries() table. */
function valuesOf(r: RecordValue): string[] {
  return (tableRows(r) as string[][]).map((row) => row[2]!);
}

function domainRecord(upstream: number, downstream: number, rule?: string): RecordValue {
  const fields: Array<[string, ReturnType<typeof si> | ReturnType<typeof str>]> = [
    ['upstream', si(upstream, 'm')],
    ['downstream', si(downstream, 'm')],
  ];
  if (rule) fields.push(['rule', str(rule)]);
  return record(fields);
}

describe('what each patch shows in the boundary table', () => {
  it('a wall is stationary, smooth or with its sand-grain roughness', () => {
    const r = runRecord('boundaries([wall("smooth"), wall("rough", roughness: 2 mm)])');
    expect(valuesOf(r)).toEqual(['stationary, smooth', 'stationary, sand-grain roughness k_s = 2 mm']);
  });

  it('a moving ground moves at the free stream (common practice for road vehicles), shown as a vector', () => {
    const r = runRecord('boundaries([moving_wall("road", 30 m/s)])');
    expect(valuesOf(r)[0]).toBe('moves at (30, 0, 0) m/s');
  });

  it('a rotating wall shows its rim speed |Ω| r (rigid-body kinematics), 900 rpm at r = 0.2 m is 18.8 m/s (NIST SP 811: 1 r/min = 2π/60 rad/s)', () => {
    const omega = (900 * 2 * Math.PI) / 60;
    const r = runRecord('boundaries([rotating_wall("fan", 900 rpm, axis: [0, 0, 1], origin: [1, 2, 0.5] m, radius: 0.2 m)])');
    const cell = valuesOf(r)[0]!;
    expect(cell).toBe(`turns at ${Number(omega.toPrecision(3))} rad/s about (0, 0, 1) through (1, 2, 0.5) m; rim speed ${Number((omega * 0.2).toPrecision(3))} m/s at r = 200 mm`);
    // Turning the other way keeps the rim speed positive.
    const back = valuesOf(runRecord('boundaries([rotating_wall("fan", -900 rpm, axis: [0, 0, 1], radius: 0.2 m)])'))[0]!;
    expect(back).toMatch(/^turns at −94\.2 rad\/s .*; rim speed 18\.8 m\/s at r = 200 mm$/);
    // Without a radius there is no rim speed to show.
    expect(valuesOf(runRecord('boundaries([rotating_wall("fan", 1 rad/s)])'))[0]).toBe('turns at 1 rad/s about (0, −1, 0) through (0, 0, 0) m');
  });

  it('slip and symmetry patches say what they hold', () => {
    expect(valuesOf(runRecord('boundaries([slip("top"), symmetry("mid")])'))).toEqual(['no flow through, no shear', 'mirror plane']);
  });

  it('a velocity inlet lists its velocity and its k, ε and ω, and the distance from the body', () => {
    const ti = runRecord('inlet_turbulence(30 m/s, intensity: 1 %, viscosity_ratio: 10, fluid: isa)');
    const k = siField(ti, 'k');
    // k = 3/2 (U I)² (CFD-Wiki, Turbulence free-stream boundary conditions): 3/2 (0.3 m/s)² = 0.135 m²/s².
    expect(relErr(k, 1.5 * 0.3 ** 2)).toBeLessThan(1e-12);
    const cell = valuesOf(runRecord('boundaries([velocity_inlet("inlet", turbulence: ti, distance: 60 m)])', { ti }))[0]!;
    const n = (x: number) => String(Number(x.toPrecision(3))).replace('-', '−');
    expect(cell).toBe(`U = (30, 0, 0) m/s; k = ${n(k)} m²/s², ε = ${n(siField(ti, 'epsilon'))} m²/s³, ω = ${n(siField(ti, 'omega'))} 1/s; 60 m from the body`);
  });

  it('an atmospheric inlet shows its Richards–Hoxey profile and a k that does not change with height', () => {
    const wind = runRecord('abl(12 m/s, 10 m, 0.05 m, heights: [10] m)');
    // u* = κ U_ref / ln((z_ref + z0)/z0) (Richards & Hoxey 1993, J. Wind Eng. Ind. Aerodyn. 46–47, from memory).
    const uStar = (0.41 * 12) / Math.log(10.05 / 0.05);
    expect(relErr(siField(wind, 'u_star'), uStar)).toBeLessThan(1e-3);
    const cell = valuesOf(runRecord('boundaries([velocity_inlet("inlet", turbulence: wind)])', { wind }))[0]!;
    expect(cell).toMatch(/^Richards–Hoxey profile: U = 12 m\/s at 10 m, u\* = 0\.928 m\/s, z0 = 50 mm, κ = 0\.41, Cμ = 0\.09; k = \d\.\d+ m²\/s² at every height; ε and ω fall with height$/);
    // k = u*²/√Cμ.
    const k = Number(/k = (\d\.\d+) m²/.exec(cell)![1]);
    expect(relErr(k, siField(wind, 'u_star') ** 2 / Math.sqrt(0.09))).toBeLessThan(5e-3);
  });

  it('pressure patches show their gauge pressure; an outlet held to a flow rate shows it', () => {
    const r = runRecord('boundaries([pressure_inlet("in", 250 Pa, direction: [0, 1, 0]), pressure_outlet("out", -20 Pa), flow_rate_outlet("exhaust", 2 m^3/s), opening("far", 5 Pa)])');
    expect(valuesOf(r)).toEqual([
      'total pressure 250 Pa (gauge), flow along (0, 1, 0); turbulence not given',
      'static pressure −20 Pa (gauge)',
      'Q = 2 m³/s leaves',
      'pressure 5 Pa (gauge); inflow: turbulence not given',
    ]);
  });

  it('a component a rounding error away from zero shows as 0, a small one that is not stays', () => {
    // Axis [1, 1, 0] normalised: cos 45° = 0.7071…; the z component is exactly 0.
    const r = runRecord('boundaries([rotating_wall("w", 1 rad/s, axis: [1, 1, 0])])');
    expect(valuesOf(r)[0]).toBe('turns at 1 rad/s about (0.707, 0.707, 0) through (0, 0, 0) m');
    const belt = runRecord('boundaries([moving_wall("belt", [30, 0.001, 0] m/s)])');
    expect(valuesOf(belt)[0]).toBe('moves at (30, 0.001, 0) m/s');
  });
});

describe('patch records read back by boundaries()', () => {
  it('a total-pressure inlet keeps its total pressure apart from a static one', () => {
    const r = runRecord('pressure_inlet("in", 250 Pa)');
    expect(siField(r, 'p0')).toBe(250);
    expect(r.fields.has('p')).toBe(false);
    const o = runRecord('opening("far", 7 Pa)');
    expect(siField(o, 'p')).toBe(7);
    expect(o.fields.has('p0')).toBe(false);
  });

  it('a rotating wall keeps its spin, axis, origin and rim speed Ω r', () => {
    const r = runRecord('rotating_wall("wheel", 100 rad/s, origin: [1, 0, 0.33] m, radius: 0.33 m)');
    expect(siField(r, 'omega')).toBe(100);
    expect(listField(r, 'axis')).toEqual([0, -1, 0]);
    expect(listField(r, 'origin')).toEqual([1, 0, 0.33]);
    expect(relErr(siField(r, 'rim'), 33)).toBeLessThan(1e-12);
    expect(relErr(siField(runRecord('rotating_wall("w", -100 rad/s, radius: 0.33 m)'), 'rim'), 33)).toBeLessThan(1e-12);
    expect(r.fields.has('rim')).toBe(true);
    expect(runRecord('rotating_wall("w", 100 rad/s)').fields.has('rim')).toBe(false);
  });

  it('a velocity inlet keeps ν_t of its turbulence record, ν_t = k/ω', () => {
    const ti = runRecord('inlet_turbulence(30 m/s, intensity: 1 %, viscosity_ratio: 10, fluid: isa)');
    const r = runRecord('velocity_inlet("inlet", turbulence: ti)', { ti });
    expect(relErr(siField(r, 'nut'), siField(r, 'k') / siField(r, 'omega'))).toBeLessThan(1e-12);
  });

  it('an atmospheric inlet keeps the profile, with its notes on U and k', () => {
    const wind = runRecord('abl(12 m/s, 10 m, 0.05 m, heights: [10] m)');
    const r = runRecord('velocity_inlet("inlet", turbulence: wind)', { wind });
    expect(siField(r, 'z0')).toBe(0.05);
    expect(siField(r, 'z_ref')).toBe(10);
    expect(siField(r, 'kappa')).toBe(0.41);
    expect(siField(r, 'C_mu')).toBe(0.09);
    expect(relErr(siField(r, 'k'), siField(r, 'u_star') ** 2 / Math.sqrt(0.09))).toBeLessThan(1e-9);
    expect(r.fields.get('U')!.note).toMatch(/mean wind speed at z_ref/);
    expect(r.fields.get('k')!.note).toMatch(/at every height/);
    expect(runRecord('velocity_inlet("inlet", 5 m/s)').fields.get('U')!.note).not.toMatch(/wind/);
  });

  it('refuses a patch record whose vector does not have three components, or whose condition is unknown', () => {
    const bad = runRecord('moving_wall("road", 30 m/s)');
    const fields = new Map(bad.fields);
    fields.set('velocity', { ...fields.get('velocity')!, value: { kind: 'list', items: [si(1, 'm/s'), si(2, 'm/s')] } as never });
    expect(() => run('boundaries([g])', { g: { ...bad, fields } })).toThrow(/velocity of a patch must list three components/);
    const renamed = new Map(bad.fields);
    renamed.set('condition', { ...renamed.get('condition')!, value: str('porous jump') });
    expect(() => run('boundaries([g])', { g: { ...bad, fields: renamed } })).toThrow(/item 1 of patches is not a patch: build each one with wall\(\)/);
    expect(() => run('boundaries([g])', { g: { ...bad, tag: 'other' } })).toThrow(/is not a patch/);
  });
});

describe('the checks of a set of patches, at their edges', () => {
  it('a compressible case says where its pressure level comes from', () => {
    const c = runRecord('boundaries([velocity_inlet("inlet", 30 m/s), flow_rate_outlet("out", 90 m^3/s)], compressible: true)');
    expect(c.remarks.join(' ')).toMatch(/Compressible case: the pressure level follows from the density and temperature/);
    const fixed = runRecord('boundaries([velocity_inlet("inlet", 30 m/s), pressure_outlet("out")], compressible: true)');
    expect(fixed.remarks.join(' ')).not.toMatch(/Compressible case/);
    expect(fixed.remarks.join(' ')).toMatch(/fixed at "out"/);
  });

  it('no remark on pressure or turbulence when nothing flows in or out', () => {
    const r = runRecord('boundaries([wall("box")])');
    expect(r.warnings).toHaveLength(1);
    expect(r.remarks).toEqual([]);
  });

  it('an inlet exactly at the asked distance passes, one a millimetre short does not (COST 732: 5H upstream, common practice)', () => {
    const d = domainRecord(60, 180);
    expect(runRecord('boundaries([velocity_inlet("inlet", 20 m/s, distance: 60 m), pressure_outlet("outlet", distance: 180 m)], domain: d)', { d }).warnings).toEqual([]);
    const short = runRecord('boundaries([velocity_inlet("inlet", 20 m/s, distance: 59.999 m), pressure_outlet("outlet", distance: 179.999 m)], domain: d)', { d });
    expect(short.warnings).toHaveLength(2);
    // Without a rule text the warning carries no brackets.
    expect(short.warnings[0]).toMatch(/downstream the domain rule asks; move it out/);
    // A total-pressure inlet and a flow-rate outlet are held to the same lengths; turbulence-bearing inlets only to upstream.
    const other = runRecord('boundaries([pressure_inlet("in", 10 Pa, distance: 30 m), flow_rate_outlet("out", 2 m^3/s, distance: 90 m)], domain: d)', { d });
    expect(other.warnings.map((w) => /the (\w+) "(\w+)"/.exec(w)!.slice(1))).toEqual([['outlet', 'out'], ['inlet', 'in']]);
  });

  it('a domain with only one of its lengths checks only that side', () => {
    const d = record([['upstream', si(60, 'm')]]);
    const r = runRecord('boundaries([velocity_inlet("inlet", 20 m/s, distance: 70 m), pressure_outlet("outlet", distance: 1 m)], domain: d)', { d });
    expect(r.warnings).toEqual([]);
    expect(r.remarks.join(' ')).not.toMatch(/no distance given/);
  });

  it('names every inlet without turbulence, an opening too, but not one with it', () => {
    const ti = runRecord('inlet_turbulence(30 m/s, intensity: 1 %, viscosity_ratio: 10, fluid: isa)');
    const r = runRecord('boundaries([velocity_inlet("a", turbulence: ti), pressure_inlet("b", 10 Pa), opening("c"), pressure_outlet("d")])', { ti });
    expect(r.remarks.join(' ')).toMatch(/No turbulence values at "b", "c": a RANS or hybrid run needs them/);
    const all = runRecord('boundaries([velocity_inlet("a", turbulence: ti), pressure_outlet("d")])', { ti });
    expect(all.remarks.join(' ')).not.toMatch(/No turbulence values/);
  });

  it('a rough wall only counts for the atmospheric profile when it is a wall with a roughness', () => {
    const wind = runRecord('abl(12 m/s, 10 m, 0.05 m, heights: [10] m)');
    const r = runRecord('boundaries([velocity_inlet("inlet", turbulence: wind), pressure_outlet("outlet"), wall("ground")])', { wind });
    expect(r.remarks.join(' ')).toMatch(/An atmospheric profile enters, but no wall has a roughness: .* \(Blocken, Stathopoulos & Carmeliet 2007/);
    expect(runRecord('boundaries([velocity_inlet("inlet", 5 m/s), pressure_outlet("outlet"), wall("ground")])').remarks.join(' ')).not.toMatch(/atmospheric/);
  });

  it('a wheel rolling on any of several grounds passes; within 1 % of the ground speed counts as rolling (common practice)', () => {
    const open = 'velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet")';
    // Rolling without slip: Ω × (−r ẑ) = U_ground, so ω = U/r about −y for a ground moving along +x (rigid-body kinematics).
    const two = runRecord(`boundaries([${open}, moving_wall("belt", 20 m/s), moving_wall("road", 30 m/s), rotating_wall("wheel", rim: 30 m/s, radius: 0.3 m)])`);
    expect(two.warnings).toEqual([]);
    const near = runRecord(`boundaries([${open}, moving_wall("road", 30 m/s), rotating_wall("wheel", rim: 29.8 m/s, radius: 0.3 m)])`);
    expect(near.warnings).toEqual([]);
    const off = runRecord(`boundaries([${open}, moving_wall("road", 30 m/s), rotating_wall("wheel", rim: 29.6 m/s, radius: 0.3 m)])`);
    expect(off.warnings).toHaveLength(1);
    expect(off.warnings[0]).toMatch(/lowest point of "wheel" moves at \(29\.6, 0, 0\) m\/s, the ground "road" at \(30, 0, 0\) m\/s: the wheel slips\. For rolling without slip give ω = U\/r .* axis: \[0, -1, 0\]/);
    // A wheel with no radius, or no ground, is not checked.
    expect(runRecord(`boundaries([${open}, moving_wall("road", 30 m/s), rotating_wall("wheel", 1 rad/s)])`).warnings).toEqual([]);
    expect(runRecord(`boundaries([${open}, rotating_wall("wheel", rim: 5 m/s, radius: 0.3 m)])`).warnings).toEqual([]);
    // A slightly tilted axis still counts as horizontal only within 1e-6; a steering axis tilted 10° is no wheel on the road.
    const tilted = runRecord(`boundaries([${open}, moving_wall("road", 30 m/s), rotating_wall("wheel", 10 rad/s, axis: [0, -0.985, 0.174], radius: 0.3 m)])`);
    expect(tilted.warnings).toEqual([]);
  });

  it('a wheel at rest on a ground at rest does not slip (rigid-body kinematics: Ω = 0 gives a contact point at rest)', () => {
    const r = runRecord('boundaries([velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet"), moving_wall("floor", [0, 0, 0] m/s), rotating_wall("wheel", 0 rad/s, radius: 0.3 m)])');
    expect(r.warnings).toEqual([]);
  });

  it('a ground at rest with a wheel turning in place is a slipping wheel', () => {
    const r = runRecord('boundaries([velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet"), moving_wall("floor", [0, 0, 0] m/s), rotating_wall("wheel", 10 rad/s, radius: 0.3 m)])');
    expect(r.warnings.join(' ')).toMatch(/moves at \(3, 0, 0\) m\/s, the ground "floor" at \(0, 0, 0\) m\/s: the wheel slips/);
  });
});

describe('the vector pieces of the patch checks', () => {
  it('cross is the right-handed vector product: x̂ × ŷ = ẑ, (1, 2, 3) × (4, 5, 6) = (−3, 6, −3) (any vector-algebra text)', () => {
    expect(cross([1, 0, 0], [0, 1, 0])).toEqual([0, 0, 1]);
    expect(cross([1, 2, 3], [4, 5, 6])).toEqual([-3, 6, -3]);
    expect(cross([4, 5, 6], [1, 2, 3])).toEqual([3, -6, 3]);
  });

  it('a component below 1e-12 of the vector\'s length shows as 0, relative to that length', () => {
    expect(vectorText([30, 1e-13, 0], 'm/s')).toBe('(30, 0, 0) m/s');
    expect(vectorText([1e6, 1e-7, 0])).toBe(`(${numberText(1e6)}, 0, 0)`);
    expect(vectorText([1e-3, 1e-10, 0])).toBe(`(0.001, ${numberText(1e-10)}, 0)`);
    expect(vectorText([0, 0, 0], 'm')).toBe('(0, 0, 0) m');
  });

  it('an inlet\'s turbulence lists only the values it has', () => {
    const text = describePatch({ name: 'in', kind: 'velocity_inlet', velocity: [10, 0, 0], turbulence: { k: 0.1, omega: 5 } });
    expect(text).toBe('U = (10, 0, 0) m/s; k = 0.1 m²/s², ω = 5 1/s');
    expect(describePatch({ name: 'in', kind: 'opening', p: 0, turbulence: { k: 0.1, epsilon: 0.02 } })).toBe('pressure 0 Pa (gauge); inflow: k = 0.1 m²/s², ε = 0.02 m²/s³');
  });

  it('an incompressible case with no pressure level gets the warning, not the compressible remark', () => {
    const r = runRecord('boundaries([velocity_inlet("inlet", 30 m/s), flow_rate_outlet("out", 90 m^3/s)])');
    expect(r.remarks.join(' ')).not.toMatch(/Compressible case/);
    expect(r.remarks.join(' ')).not.toMatch(/pressure level is fixed/);
  });

  it('a domain without a downstream length leaves an unplaced outlet unremarked', () => {
    const d = record([['upstream', si(60, 'm')]]);
    const r = runRecord('boundaries([velocity_inlet("inlet", 20 m/s, distance: 70 m), pressure_outlet("outlet")], domain: d)', { d });
    expect(r.remarks.join(' ')).not.toMatch(/no distance given/);
  });

  it('a wheel on an axis along x rolls on a ground moving along y: Ω × (−r ẑ) with Ω = ω x̂ is ω r ŷ (rigid-body kinematics)', () => {
    const open = 'velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet")';
    expect(runRecord(`boundaries([${open}, moving_wall("belt", [0, 3, 0] m/s), rotating_wall("roller", 10 rad/s, axis: [1, 0, 0], radius: 0.3 m)])`).warnings).toEqual([]);
    const wrong = runRecord(`boundaries([${open}, moving_wall("belt", [0, -3, 0] m/s), rotating_wall("roller", 10 rad/s, axis: [1, 0, 0], radius: 0.3 m)])`);
    expect(wrong.warnings.join(' ')).toMatch(/"roller" moves at \(0, 3, 0\) m\/s, the ground "belt" at \(0, −3, 0\) m\/s/);
  });

  it('speeds in a patch record carry the dimension of a speed', () => {
    const ms = si(1, 'm/s').dims;
    expect(asQuantity(runRecord('moving_wall("road", 30 m/s)').fields.get('U')!.value).dims).toEqual(ms);
    expect(asQuantity(runRecord('rotating_wall("w", 10 rad/s, radius: 0.3 m)').fields.get('rim')!.value).dims).toEqual(ms);
  });

  it('refuses a patch record with no name, a name that is not text, a velocity that is not a list, or a component in the wrong unit', () => {
    const road = runRecord('moving_wall("road", 30 m/s)');
    const edited = (field: string, value: unknown): RecordValue => {
      const fields = new Map(road.fields);
      if (value === undefined) fields.delete(field);
      else fields.set(field, { ...fields.get(field)!, value: value as never });
      return { ...road, fields };
    };
    expect(() => run('boundaries([g])', { g: edited('patch', undefined) })).toThrow(/item 1 of patches is not a patch: build/);
    expect(() => run('boundaries([g])', { g: edited('patch', si(3, 'm')) })).toThrow(/item 1 of patches is not a patch: build/);
    expect(() => run('boundaries([g])', { g: edited('condition', undefined) })).toThrow(/item 1 of patches is not a patch: build/);
    expect(() => run('boundaries([g])', { g: edited('condition', si(3, 'm')) })).toThrow(/item 1 of patches is not a patch: build/);
    expect(() => run('boundaries([g])', { g: edited('velocity', si(30, 'm/s')) })).toThrow(/velocity of a patch must list three components/);
    expect(() => run('boundaries([g])', { g: edited('velocity', { kind: 'list', items: [si(1, 'm/s'), si(2, 'Pa'), si(0, 'm/s')] }) })).toThrow(/velocity\[2\] must be in/);
  });
});
