// The records the boundary entries read and build: the roughness of abl() as a length or
// a record, hand-built turbulence and domain records, the patch builders' refusals, and
// the units of the scalar results. Each value is checked against the formula it rests on:
// Richards & Hoxey (1993), J. Wind Eng. Ind. Aerodyn. 46–47, Eq. 5, u* = κ U_ref / ln((z_ref + z0)/z0);
// ℓ = 0.07 D_h (CFD-Wiki, "Turbulence length scale"); Δt = C Δx / U (Courant, Friedrichs &
// Lewy 1928); t = L / U (definition). Refusal texts are project wording.
import { describe, expect, it } from 'vitest';
import { record, si, str, type RecordValue, type Value } from '../../server/core/index.js';
import { asQuantity, relErr, run, runRecord, siField, tableRows } from './boundaries-helpers.js';

const dimsOf = (v: Value) => asQuantity(v).dims;
const dimsOfUnit = (unit: string) => si(1, unit).dims;
const KAPPA = 0.41;
const C_MU = 0.09;

/** u* of the log law, Richards & Hoxey (1993), Eq. 5. */
const uStar = (U: number, zRef: number, z0: number) => (KAPPA * U) / Math.log((zRef + z0) / z0);

describe('the units of the scalar results', () => {
  it('duct_length_scale is a length, 0.07 D_h (CFD-Wiki)', () => {
    const v = run('duct_length_scale(0.5 m)').value;
    expect(dimsOf(v)).toEqual(dimsOfUnit('m'));
    expect(relErr(asQuantity(v).si, 0.07 * 0.5)).toBeLessThan(1e-12);
  });

  it('time_step is a time, C Δx / U (Courant, Friedrichs & Lewy 1928)', () => {
    const v = run('time_step(40 m/s, 5 mm, courant: 0.8)').value;
    expect(dimsOf(v)).toEqual(dimsOfUnit('s'));
    expect(relErr(asQuantity(v).si, (0.8 * 0.005) / 40)).toBeLessThan(1e-12);
  });

  it('flow_through is a time, L / U (definition)', () => {
    const v = run('flow_through(60 m, 30 m/s)').value;
    expect(dimsOf(v)).toEqual(dimsOfUnit('s'));
    expect(relErr(asQuantity(v).si, 2)).toBeLessThan(1e-12);
  });
});

describe('terrain remarks', () => {
  it('the category table is said to be the recommended one, which national annexes may change', () => {
    const r = runRecord('terrain("II")');
    expect(r.remarks.join('\n')).toContain('EN 1991-1-4:2005, Table 4.1, as recommended; national annexes may change it');
    expect(r.remarks.join('\n')).toContain('licensed engineering review');
  });
});

describe('the roughness of abl(): a length or a record with z0', () => {
  it('a time where the roughness length goes is refused, naming z0', () => {
    expect(() => run('abl(10 m/s, 10 m, 5 s, heights: [10] m)')).toThrow('abl(): z0 must be in m, not a quantity in s');
  });

  it('a record without z0 is refused, pointing to terrain(...)', () => {
    expect(() => run('abl(10 m/s, 10 m, isa, heights: [10] m)')).toThrow('z0 must be a length or a record with a z0 field, such as terrain("II")');
  });

  it('a hand-built record holding only z0 gives the log-law u* of that z0', () => {
    const rough = record([['z0', si(0.05, 'm')]]);
    const r = runRecord('abl(10 m/s, 10 m, rough, heights: [2, 10] m)', { rough });
    expect(relErr(siField(r, 'u_star'), uStar(10, 10, 0.05))).toBeLessThan(1e-12);
    expect(r.warnings).toEqual([]);
  });

  it('a record with z_min but no category names the category "given" in its warning', () => {
    const rough = record([['z0', si(0.3, 'm')], ['z_min', si(5, 'm')]]);
    const r = runRecord('abl(10 m/s, 10 m, rough, heights: [2, 10] m)', { rough });
    expect(r.warnings.join('\n')).toContain('height 2 m lies below z_min = 5 m of terrain category given');
  });

  it('a record whose category is not text is read without a category', () => {
    const rough = record([['z0', si(0.3, 'm')], ['z_min', si(5, 'm')], ['category', si(3, '1')]]);
    expect(runRecord('abl(10 m/s, 10 m, rough, heights: [2] m)', { rough }).warnings.join('\n')).toContain('of terrain category given');
  });
});

describe('rotating_wall origin and positive lengths', () => {
  it('an origin with two components is refused, saying how many it has', () => {
    expect(() => run('rotating_wall("wheel", 10 rad/s, origin: [1, 2] m)')).toThrow('origin must list three components [x, y, z], not 2');
  });

  it('a zero radius is refused, naming the radius', () => {
    expect(() => run('rotating_wall("wheel", rim: 30 m/s, radius: 0 m)')).toThrow('the radius must be above zero');
  });

  it('a zero roughness height is refused; a wall without one is smooth', () => {
    expect(() => run('wall("body", roughness: 0 m)')).toThrow('the roughness height must be above zero');
    expect(runRecord('wall("body")').fields.has('roughness')).toBe(false);
  });

  it('each patch with a distance refuses a zero distance and keeps a given one', () => {
    const calls = [
      'velocity_inlet("in", 10 m/s, distance: D)',
      'pressure_inlet("in", 500 Pa, distance: D)',
      'pressure_outlet("out", distance: D)',
      'flow_rate_outlet("out", 2 m^3/s, distance: D)',
      'opening("top", 0 Pa, distance: D)',
    ];
    for (const c of calls) {
      expect(() => run(c, { D: si(0, 'm') }), c).toThrow('the distance must be above zero');
      expect(siField(runRecord(c, { D: si(60, 'm') }), 'distance'), c).toBe(60);
    }
  });

  it('a flow rate of zero is refused, pointing to a velocity inlet for inflow', () => {
    expect(() => run('flow_rate_outlet("out", 0 m^3/s)')).toThrow('the flow rate Q leaving must be above zero; for inflow use a velocity inlet');
  });
});

describe('turbulence records on inlets and openings', () => {
  // k = 3/2 (U I)² (CFD-Wiki, "Turbulence free-stream boundary conditions"): 10 m/s at 5 % is 0.375 m²/s².
  const turb = () => runRecord('inlet_turbulence(10 m/s, intensity: 5 %, length: 0.07 m, fluid: isa)');
  const K = 1.5 * (10 * 0.05) ** 2;

  it('pressure_inlet and opening keep the k of an inlet_turbulence record', () => {
    const t = turb();
    for (const c of ['pressure_inlet("in", 500 Pa, turbulence: t)', 'opening("top", 0 Pa, turbulence: t)']) {
      expect(relErr(siField(runRecord(c, { t }), 'k'), K), c).toBeLessThan(1e-12);
    }
  });

  it('an abl profile is refused on an opening and a pressure inlet, pointing to velocity_inlet', () => {
    const a = runRecord('abl(10 m/s, 10 m, 0.05 m, heights: [10] m)');
    expect(() => run('opening("top", 0 Pa, turbulence: a)', { a })).toThrow('an atmospheric profile goes on a velocity_inlet');
    expect(() => run('pressure_inlet("in", 0 Pa, turbulence: a)', { a })).toThrow('an atmospheric profile goes on a velocity_inlet');
  });

  it('a record speed within round-off of the inlet speed raises no mismatch; 1e-5 apart (relative) does', () => {
    // k ∝ U²: a record for another speed gives the wrong k. A relative mismatch of 1e-7 is round-off
    // of a converted unit, not another speed (common practice).
    const near = record([['k', si(K, 'm^2/s^2')], ['U', si(10 * (1 + 1e-7), 'm/s')]]);
    expect(runRecord('velocity_inlet("in", 10 m/s, turbulence: t)', { t: near }).warnings).toEqual([]);
    const off = record([['k', si(K, 'm^2/s^2')], ['U', si(10 * (1 + 1e-5), 'm/s')]]);
    expect(runRecord('velocity_inlet("in", 10 m/s, turbulence: t)', { t: off }).warnings.join(' ')).toContain('k grows with U²');
  });

  it('a hand-built profile record missing U_ref is refused, naming the field', () => {
    const partial = record([['u_star', si(0.5, 'm/s')], ['z_ref', si(10, 'm')]]);
    expect(() => run('velocity_inlet("in", turbulence: t)', { t: partial })).toThrow('the turbulence record has no U_ref');
  });

  it('a hand-built profile record with κ or Cμ in metres is refused: they are plain numbers', () => {
    const a = runRecord('abl(10 m/s, 10 m, 0.05 m, heights: [10] m)');
    for (const f of ['kappa', 'C_mu']) {
      const fields: Array<[string, Value]> = [...a.fields].map(([n, v]) => [n, n === f ? si(0.4, 'm') : v.value]);
      expect(() => run('velocity_inlet("in", turbulence: t)', { t: record(fields) }), f).toThrow(`${f} must be a plain number`);
    }
  });

  it('an abl record on a velocity inlet carries its u*, z0 and the model constants', () => {
    const a = runRecord('abl(10 m/s, 10 m, 0.05 m, heights: [10] m)');
    const p = runRecord('velocity_inlet("in", turbulence: a)', { a });
    expect(relErr(siField(p, 'u_star'), uStar(10, 10, 0.05))).toBeLessThan(1e-12);
    expect(siField(p, 'kappa')).toBe(KAPPA);
    expect(siField(p, 'C_mu')).toBe(C_MU);
    expect(relErr(siField(p, 'k'), uStar(10, 10, 0.05) ** 2 / Math.sqrt(C_MU))).toBeLessThan(1e-12);
  });
});

describe('the domain record of boundaries()', () => {
  const patches = '[velocity_inlet("in", 10 m/s, distance: 20 m), pressure_outlet("out", distance: 60 m)]';
  const domain = (fields: Array<[string, Value]>): RecordValue => record(fields);

  it('an upstream length given as text is refused, saying what it is', () => {
    const d = domain([['upstream', str('far')], ['downstream', si(60, 'm')]]);
    expect(() => run(`boundaries(${patches}, domain: d)`, { d })).toThrow("the domain record's upstream must be a length, not string");
  });

  it('an upstream length in seconds is refused, naming the unit', () => {
    const d = domain([['upstream', si(20, 's')], ['downstream', si(60, 'm')]]);
    expect(() => run(`boundaries(${patches}, domain: d)`, { d })).toThrow("the domain record's upstream must be in m");
  });

  it('a domain record with only a downstream length is checked against it', () => {
    const d = domain([['downstream', si(100, 'm')]]);
    const r = runRecord(`boundaries(${patches}, domain: d)`, { d });
    expect(r.warnings).toEqual([
      'the outlet "out" is 60 m from the body, closer than the 100 m downstream the domain rule asks; move it out, or the outlet condition disturbs the flow near the body.',
    ]);
  });

  it('a domain record with neither length is refused', () => {
    const d = domain([['rule', str('none')]]);
    expect(() => run(`boundaries(${patches}, domain: d)`, { d })).toThrow('domain must be a domain record with upstream and downstream lengths');
  });
});

describe('the boundary table itself', () => {
  it('an empty list of patches is refused', () => {
    expect(() => run('boundaries([])')).toThrow('patches must list at least one patch');
  });

  it('the table is tagged as a boundary table and lists each patch once', () => {
    const r = runRecord('boundaries([velocity_inlet("in", 10 m/s), pressure_outlet("out"), wall("body")])');
    expect(r.tag).toBe('boundaries');
    expect(tableRows(r).map((row) => row[0])).toEqual(['in', 'out', 'body']);
  });
});
