import { describe, expect, it } from 'vitest';
import { record, si, str, type RecordValue, type Value } from '../../server/core/index.js';
import { listField, relErr, run, runRecord, siField, tableColumns, tableRows, textField } from './boundaries-helpers.js';

/** A record shaped like the domain family's (upstream, downstream, …, rule), built here by hand. */
function domainRecord(upstream: number, downstream: number): RecordValue {
  return record([
    ['upstream', si(upstream, 'm')],
    ['downstream', si(downstream, 'm')],
    ['lateral', si(50, 'm')],
    ['top', si(60, 'm')],
    ['rule', str('COST 732: 5H upstream, 15H downstream')],
  ]);
}

function table(text: string, names: Record<string, Value> = {}): { rows: string[][]; r: RecordValue } {
  const r = runRecord(text, names);
  return { r, rows: tableRows(r) as string[][] };
}

describe('patch functions', () => {
  it('each names its patch and its condition', () => {
    const cases: Array<[string, string]> = [
      ['wall("body")', 'no-slip wall'],
      ['moving_wall("road", 30 m/s)', 'no-slip wall, moving'],
      ['rotating_wall("wheel", 900 rpm)', 'no-slip wall, rotating'],
      ['slip("top")', 'slip wall'],
      ['symmetry("mid")', 'symmetry plane'],
      ['velocity_inlet("inlet", 30 m/s)', 'velocity inlet'],
      ['pressure_inlet("inlet", 200 Pa)', 'total-pressure inlet'],
      ['pressure_outlet("outlet")', 'static-pressure outlet'],
      ['flow_rate_outlet("exhaust", 2 m^3/s)', 'flow-rate outlet'],
      ['opening("far")', 'opening'],
    ];
    for (const [call, condition] of cases) {
      const r = runRecord(call);
      expect(textField(r, 'condition')).toBe(condition);
      expect(r.tag).toBe('patch');
      expect(r.remarks.length).toBe(1);
    }
  });

  it('a moving wall takes a speed along +x or a full vector', () => {
    expect(listField(runRecord('moving_wall("road", 30 m/s)'), 'velocity')).toEqual([30, 0, 0]);
    const r = runRecord('moving_wall("belt", [3, 4, 0] m/s)');
    expect(listField(r, 'velocity')).toEqual([3, 4, 0]);
    expect(relErr(siField(r, 'U'), 5)).toBeLessThan(1e-12);
    expect(() => run('moving_wall("belt", [3, 4] m/s)')).toThrow(/speed \(taken along \+x, downstream\) or three components/);
  });

  it('a rotating wall turns at ω = rim / radius, and 900 rpm is 94.25 rad/s (NIST SP 811: 1 r/min = 2π/60 rad/s)', () => {
    const wheel = runRecord('rotating_wall("wheel", rim: 30 m/s, radius: 0.3 m)');
    expect(relErr(siField(wheel, 'omega'), 100)).toBeLessThan(1e-12);
    expect(relErr(siField(wheel, 'rim'), 30)).toBeLessThan(1e-12);
    expect(listField(wheel, 'axis')).toEqual([0, -1, 0]);
    expect(relErr(siField(runRecord('rotating_wall("fan", 900 rpm)'), 'omega'), (900 * 2 * Math.PI) / 60)).toBeLessThan(1e-12);
    expect(listField(runRecord('rotating_wall("fan", 1 rad/s, axis: [0, 0, 2])'), 'axis')).toEqual([0, 0, 1]);
    expect(() => run('rotating_wall("w", rim: 30 m/s)')).toThrow(/rim speed needs the radius/);
    expect(() => run('rotating_wall("w", 10 rad/s, rim: 30 m/s, radius: 0.3 m)')).toThrow(/not both/);
    expect(() => run('rotating_wall("w")')).toThrow(/give the angular velocity/);
    expect(() => run('rotating_wall("w", 1 rad/s, axis: [0, 0, 0])')).toThrow(/axis must not be the zero vector/);
  });

  it('a velocity inlet carries its turbulence, and its speed from the turbulence record when U is left out', () => {
    const ti = runRecord('inlet_turbulence(30 m/s, intensity: 1 %, viscosity_ratio: 10, fluid: isa)');
    const r = runRecord('velocity_inlet("inlet", turbulence: ti)', { ti });
    expect(listField(r, 'velocity')).toEqual([30, 0, 0]);
    expect(siField(r, 'k')).toBe(siField(ti, 'k'));
    expect(siField(r, 'epsilon')).toBe(siField(ti, 'epsilon'));
    expect(siField(r, 'omega')).toBe(siField(ti, 'omega'));
    expect(r.warnings).toEqual([]);
    const off = runRecord('velocity_inlet("inlet", 20 m/s, turbulence: ti)', { ti });
    expect(off.warnings.join(' ')).toMatch(/worked out for U = 30 m\/s, not the 20 m\/s/);
    expect(() => run('velocity_inlet("inlet")')).toThrow(/give the inlet velocity U/);
  });

  it('a velocity inlet takes an abl profile and then refuses a U of its own', () => {
    const wind = runRecord('abl(12 m/s, 10 m, 0.05 m, heights: [10] m)');
    const r = runRecord('velocity_inlet("inlet", turbulence: wind)', { wind });
    expect(siField(r, 'u_star')).toBe(siField(wind, 'u_star'));
    expect(siField(r, 'U')).toBe(12);
    expect(() => run('velocity_inlet("inlet", 12 m/s, turbulence: wind)', { wind })).toThrow(/leave U out/);
    expect(() => run('pressure_inlet("inlet", turbulence: wind)', { wind })).toThrow(/goes on a velocity_inlet/);
    expect(() => run('velocity_inlet("inlet", 5 m/s, turbulence: isa)')).toThrow(/turbulence must be a record from inlet_turbulence/);
  });

  it('a total-pressure inlet keeps a unit flow direction', () => {
    const r = runRecord('pressure_inlet("inlet", 300 Pa, direction: [3, 0, 4])');
    expect(siField(r, 'p0')).toBe(300);
    const d = listField(r, 'direction');
    expect(relErr(d[0]!, 0.6)).toBeLessThan(1e-12);
    expect(relErr(d[2]!, 0.8)).toBeLessThan(1e-12);
  });

  it('refuses an unnamed patch and a negative flow rate', () => {
    expect(() => run('wall(" ")')).toThrow(/needs a name/);
    expect(() => run('flow_rate_outlet("out", -1 m^3/s)')).toThrow(/must be above zero/);
  });
});

describe('the boundary table', () => {
  const well = '[velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet"), wall("body"), slip("sides")]';

  it('lists each patch with its condition and values', () => {
    const { r, rows } = table(`boundaries(${well})`);
    expect(tableColumns(r)).toEqual(['patch', 'condition', 'values']);
    expect(rows.map((row) => row.slice(0, 2))).toEqual([
      ['inlet', 'velocity inlet'],
      ['outlet', 'static-pressure outlet'],
      ['body', 'no-slip wall'],
      ['sides', 'slip wall'],
    ]);
    expect(rows[0]![2]).toMatch(/U = \(30, 0, 0\) m\/s; turbulence not given/);
    expect(rows[1]![2]).toMatch(/static pressure 0 Pa \(gauge\)/);
    // A well-posed set (common practice: velocity in, static pressure out) raises no warning.
    expect(r.warnings).toEqual([]);
    expect(r.remarks.join(' ')).toMatch(/pressure level is fixed at "outlet"/);
  });

  it('warns when an incompressible case fixes no pressure level, and when velocity is fixed at every open boundary (Ferziger & Perić 2002, from memory)', () => {
    const { r } = table('boundaries([velocity_inlet("inlet", 30 m/s), flow_rate_outlet("out", 90 m^3/s), wall("body")])');
    expect(r.warnings).toHaveLength(2);
    expect(r.warnings[0]).toMatch(/no patch fixes the pressure level/);
    expect(r.warnings[1]).toMatch(/velocity is fixed at every open boundary \("inlet", "out"\)/);
    // Compressible: the density fixes the pressure level, but the mass balance is still left to the data.
    const c = runRecord('boundaries([velocity_inlet("inlet", 30 m/s), flow_rate_outlet("out", 90 m^3/s)], compressible: true)');
    expect(c.warnings).toHaveLength(1);
    expect(c.warnings[0]).toMatch(/velocity is fixed at every open boundary/);
  });

  it('an opening or a total-pressure inlet fixes the pressure level', () => {
    expect(runRecord('boundaries([velocity_inlet("inlet", 30 m/s), opening("far")])').warnings).toEqual([]);
    expect(runRecord('boundaries([pressure_inlet("inlet", 100 Pa), flow_rate_outlet("out", 2 m^3/s)])').warnings).toEqual([]);
  });

  it('warns when nothing lets flow in or out', () => {
    expect(runRecord('boundaries([wall("box"), symmetry("mid")])').warnings.join(' ')).toMatch(/no patch lets flow in or out/);
  });

  it('checks outlet and inlet distances against a domain record only when one is given (COST 732: 15H downstream, 5H upstream)', () => {
    const domain = domainRecord(5 * 12, 15 * 12);
    const near = 'boundaries([velocity_inlet("inlet", 20 m/s, distance: 60 m), pressure_outlet("outlet", distance: 120 m), wall("building")]';
    expect(runRecord(`${near})`).warnings).toEqual([]);
    const r = runRecord(`${near}, domain: d)`, { d: domain });
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]).toMatch(/the outlet "outlet" is 120 m from the body, closer than the 180 m downstream the domain rule asks \(COST 732/);
    const far = runRecord('boundaries([velocity_inlet("inlet", 20 m/s, distance: 40 m), pressure_outlet("outlet", distance: 180 m)], domain: d)', { d: domain });
    expect(far.warnings).toHaveLength(1);
    expect(far.warnings[0]).toMatch(/the inlet "inlet" is 40 m from the body, closer than the 60 m upstream/);
    // An opening at the top, nearer than the downstream length, is not an outlet held to it.
    const top = runRecord('boundaries([velocity_inlet("inlet", 20 m/s, distance: 60 m), pressure_outlet("outlet", distance: 180 m), opening("top", distance: 60 m)], domain: d)', { d: domain });
    expect(top.warnings).toEqual([]);
    const unplaced = runRecord('boundaries([velocity_inlet("inlet", 20 m/s), pressure_outlet("outlet")], domain: d)', { d: domain });
    expect(unplaced.warnings).toEqual([]);
    expect(unplaced.remarks.join(' ')).toMatch(/"outlet": no distance given, so not checked against the 180 m downstream/);
    expect(() => run('boundaries([wall("w")], domain: isa)')).toThrow(/domain must be a domain record/);
  });

  it('checks that a wheel on a moving ground rolls: ω × (−r ẑ) equals the ground velocity (rigid-body kinematics)', () => {
    const road = 'moving_wall("road", 30 m/s)';
    const good = runRecord(`boundaries([velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet"), ${road}, rotating_wall("wheel", rim: 30 m/s, radius: 0.33 m)])`);
    expect(good.warnings).toEqual([]);
    const bad = runRecord(`boundaries([velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet"), ${road}, rotating_wall("wheel", rim: 30 m/s, radius: 0.33 m, axis: [0, 1, 0])])`);
    expect(bad.warnings).toHaveLength(1);
    expect(bad.warnings[0]).toMatch(/lowest point of "wheel" moves at \(−30, 0, 0\) m\/s, the ground "road" at \(30, 0, 0\) m\/s: the wheel slips/);
    // A fan turning about the vertical is no wheel: not checked against the road.
    const fan = runRecord(`boundaries([velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet"), ${road}, rotating_wall("fan", 900 rpm, axis: [0, 0, 1], radius: 0.2 m)])`);
    expect(fan.warnings).toEqual([]);
    const slow = runRecord(`boundaries([velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet"), ${road}, rotating_wall("wheel", rim: 29 m/s, radius: 0.33 m)])`);
    expect(slow.warnings.join(' ')).toMatch(/slips/);
  });

  it('remarks on inlets without turbulence and on an atmospheric inflow over a smooth ground (Blocken et al. 2007, from memory)', () => {
    const wind = runRecord('abl(12 m/s, 10 m, 0.05 m, heights: [10] m)');
    const smooth = runRecord('boundaries([velocity_inlet("inlet", turbulence: wind), pressure_outlet("outlet"), wall("ground")])', { wind });
    expect(smooth.remarks.join(' ')).toMatch(/no wall has a roughness/);
    const rough = runRecord('boundaries([velocity_inlet("inlet", turbulence: wind), pressure_outlet("outlet"), wall("ground", roughness: 1 m)])', { wind });
    expect(rough.remarks.join(' ')).not.toMatch(/roughness/);
    expect((tableRows(rough) as string[][])[0]![2]).toMatch(/^Richards–Hoxey profile: U = 12 m\/s at 10 m/);
    expect(runRecord(`boundaries(${well})`).remarks.join(' ')).toMatch(/No turbulence values at "inlet"/);
  });

  it('refuses a repeated patch name and an item that is not a patch', () => {
    expect(() => run('boundaries([wall("body"), wall("body")])')).toThrow(/"body" appears twice/);
    expect(() => run('boundaries([wall("body"), isa])')).toThrow(/item 2 of patches is not a patch/);
    expect(() => run('boundaries([wall("body"), 3 m])')).toThrow(/item 2 of patches is not a patch record/);
  });
});
