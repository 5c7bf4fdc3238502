// The near-wall entries' own rules (common practice, as each warning says): when a
// stack's growth, jump to the core or cells across δ are flagged, and how the y+
// report reads its options. Values these rest on are checked in the other files.
import { describe, expect, it } from 'vitest';
import { list, num, record, si, str, type Value } from '../../server/core/index.js';
import { asQuantity, asRecord, call, ISA_MU, ISA_RHO, isaAir, stubContext } from './wall-helpers.js';

const stack = (args: Record<string, Value>) => asRecord(call('layer_stack', { scale: str('linear'), ...args }));

describe('layer_stack flags (common practice)', () => {
  it('growth above 1.3 and below 1, not at 1.3 or 1', () => {
    expect(stack({ first: si(1e-5, 'm'), growth: num(1.3), count: num(5) }).warnings).toEqual([]);
    expect(stack({ first: si(1e-5, 'm'), growth: num(1), count: num(5) }).warnings).toEqual([]);
    expect(stack({ first: si(1e-5, 'm'), growth: num(0.9), count: num(5) }).warnings).toEqual(['growth ratio 0.9 is below 1: the layers get thinner away from the wall.']);
    expect(stack({ first: si(1e-5, 'm'), growth: num(1.31), count: num(5) }).warnings).toEqual([
      'growth ratio 1.31 is above about 1.3 (common practice); neighbouring layers differ too much in size.',
    ]);
  });

  it('a core cell more than twice the last layer, not exactly twice', () => {
    // Uniform layers of 10 µm: the last is 10 µm.
    const base = { first: si(1e-5, 'm'), growth: num(1), count: num(5) };
    expect(stack({ ...base, core: si(2e-5, 'm') }).warnings).toEqual([]);
    expect(stack({ ...base, core: si(2.5e-5, 'm') }).warnings).toEqual([
      'the core cell is 2.5 × the last layer, above about 2 (common practice); add layers or shrink the core cells near the wall.',
    ]);
  });

  it('counts the core cells above a stack thinner than δ among the cells across it', () => {
    // Five layers of 1 mm under δ = 10 mm: five inside, and (10 − 5)/core more above.
    const base = { first: si(1e-3, 'm'), growth: num(1), count: num(5), delta: si(10e-3, 'm') };
    expect(stack({ ...base, core: si(1e-3, 'm') }).warnings).toEqual([]); // 5 + 5 = 10
    expect(stack({ ...base, core: si(1.25e-3, 'm') }).warnings).toEqual([
      'only about 9 cells lie across the boundary layer (δ = 10 mm); about 10 or more are usual (common practice).', // 5 + 4
    ]);
    expect(stack(base).warnings).toEqual(['only about 5 cells lie across the boundary layer (δ = 10 mm); about 10 or more are usual (common practice).']);
    // A stack past δ: only the layers inside count, whatever the core.
    const past = stack({ first: si(1e-3, 'm'), growth: num(1), count: num(12), delta: si(8e-3, 'm'), core: si(1e-4, 'm') });
    expect(past.warnings).toEqual(['only about 8 cells lie across the boundary layer (δ = 8 mm); about 10 or more are usual (common practice).']);
  });

  it('refuses a core or δ that is not a positive length, and draws each only when given', () => {
    const base = { first: si(1e-3, 'm'), growth: num(1.1), count: num(5) };
    expect(() => stack({ ...base, core: si(0, 'm') })).toThrow('core must be a positive length');
    expect(() => stack({ ...base, delta: si(-1, 'm') })).toThrow('delta must be a positive length');
    const plain = stack(base);
    expect([...plain.fields.keys()]).toEqual(['first', 'growth', 'count', 'total', 'last', 'heights']);
    expect(plain.figure!.svg).not.toMatch(/core cell|boundary-layer edge/);
    expect(plain.figure!.caption).toBe('Wall-layer stack to scale (linear axis)');
    const withCore = stack({ ...base, core: si(2e-3, 'm') });
    expect(withCore.figure!.svg).toContain('core cell 2 mm');
    expect(withCore.figure!.svg).not.toContain('boundary-layer edge');
    expect([...withCore.fields.keys()]).toContain('jump');
    const withDelta = stack({ ...base, delta: si(20e-3, 'm') });
    expect(withDelta.figure!.svg).toContain('boundary-layer edge δ = 20 mm');
    expect(withDelta.figure!.svg).not.toContain('core cell');
    expect(asRecord(call('layer_stack', { ...base, scale: str('log') })).figure!.caption).toBe('Wall-layer stack to scale (log axis)');
  });
});

describe('yplus_report options', () => {
  const csv = 'face,yplus,Area\na,1,1\nb,2,1\nc,3,2\nd,40,0\n';
  const report = (extra: Record<string, Value> = {}) =>
    asRecord(call('yplus_report', { path: str('r.csv'), column: str('yplus'), weight: str('area'), target: num(1), band: list([num(0.5), num(5)]), ...extra }, stubContext({ 'r.csv': csv })));

  it('weighs by the named column (any case), or not at all for "none" or ""', () => {
    const w = report();
    expect(w.fields.get('weighted_mean')!.note).toBe('mean weighted by area');
    expect(asQuantity(w.fields.get('weighted_mean')!.value).si).toBe((1 + 2 + 6) / 4);
    for (const none of ['none', 'NONE', '']) {
      const r = report({ weight: str(none) });
      expect(r.fields.get('weighted_mean')!.note).toBe('no weight column: same as mean');
      expect(r.remarks[1]).toBe('p05, p50 and p95 count faces (Hyndman & Fan 1996, definition 7); weighted_mean and in_band weigh each face.');
    }
  });

  it('flags less than 90 % of the wall in band, of the area or of the faces; not 90 % itself', () => {
    expect(report().warnings).toEqual([]); // all the area is in band
    const faces = report({ weight: str('none') }); // 3 of 4 faces
    expect(faces.warnings).toContain('only 75 % of the faces has y+ inside 0.5–5; most of the wall, about 90 % or more, is usual (common practice).');
    // 90 % of the area in band, and a weighted mean of 4.9 in the viscous sublayer the target aims at: nothing to flag.
    const ninety = asRecord(call('yplus_report', { path: str('r.csv'), column: str('yplus'), weight: str('area'), target: num(1), band: list([num(0.5), num(5)]) }, stubContext({ 'r.csv': 'yplus,area\n1,9\n40,1\n' })));
    expect(ninety.warnings).toEqual([]);
  });

  it('says when the mean y+ lies in another band than the target aims at', () => {
    const r = report({ target: num(30), band: list([num(30), num(100)]) });
    expect(r.warnings).toContain('the mean y+ 2.25 lies in the viscous sublayer, not in the log layer the target 30 aims at.');
  });

  it('refuses a band that is not two numbers, low then high, a target or first that is not positive', () => {
    expect(() => report({ band: list([num(5), num(5)]) })).toThrow('band must be a list of two numbers, low then high, e.g. [0.5, 5]');
    expect(() => report({ band: list([num(1)]) })).toThrow(/band must be a list of two numbers/);
    expect(() => report({ target: num(0) })).toThrow('target must be a positive y+');
    expect(() => report({ first: si(0, 'm') })).toThrow('first must be a positive length');
    expect(report({ first: si(1e-5, 'm') }).fields.has('corrected_first')).toBe(true);
  });

  it('names the file in the figure caption', () => {
    expect(report().figure!.caption).toBe('y+ histogram from r.csv');
  });
});

describe('first_cell, law_of_wall and friction_velocity words', () => {
  const defaults = { method: str('schlichting'), placement: str('centroid') };
  it('a target beyond the log layer is flagged, with its treatment', () => {
    const r = asRecord(call('first_cell', { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(500), ...defaults }));
    expect(r.warnings).toEqual(['y+ 500 lies beyond the log layer (above about 300, common practice); wall functions lose their basis there.']);
    expect(r.remarks[0]).toBe('Targets the outer layer. The first cell is beyond the log layer, where wall functions lose their basis; refine the wall mesh.');
    const buffer = asRecord(call('first_cell', { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(12), ...defaults }));
    expect(buffer.warnings).toEqual(['y+ 12 lies in the buffer layer (5–30, common practice), where neither wall functions nor wall resolution is sound.']);
    expect(buffer.remarks[0]).toBe(
      'Targets the buffer layer. Neither wall functions nor wall resolution is sound here; move the first cell down to y+ ≈ 1 or up to y+ ≥ 30, or use a y+-insensitive blended wall treatment.',
    );
    const log = asRecord(call('first_cell', { U: si(30, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(50), ...defaults }));
    expect(log.remarks[0]).toBe('Targets the log layer. Wall functions (the log law bridges the first cell to the wall); keep the first cell centre above y+ ≈ 30.');
  });

  it('law_of_wall warns past y+ 300, not at it; friction_velocity when its sample lies past it', () => {
    const at = stubContext();
    call('law_of_wall', { yplus: num(300) }, at);
    expect(at.warnings).toEqual([]);
    const past = stubContext();
    call('law_of_wall', { yplus: num(301) }, past);
    expect(past.warnings).toEqual(['y+ 301 is beyond the log layer (about 300, common practice); the outer (wake) region departs from the law of the wall.']);
    const nu = ISA_MU / ISA_RHO;
    const near = stubContext();
    call('friction_velocity', { U_p: si(1, 'm/s'), y_p: si(1e-4, 'm'), fluid: isaAir }, near);
    expect(near.warnings).toEqual([]);
    const far = stubContext();
    const u = asQuantity(call('friction_velocity', { U_p: si(30, 'm/s'), y_p: si(0.1, 'm'), fluid: isaAir }, far));
    expect(far.warnings).toHaveLength(1);
    expect(far.warnings[0]).toMatch(new RegExp(`^the sample sits at y\\+ ${Number(((0.1 * u.si) / nu).toPrecision(3))}, beyond the log layer \\(about 300, common practice\\); u_τ is an estimate\\.$`));
  });

  it('a fluid without a speed of sound raises no Mach warning at any speed', () => {
    expect(asRecord(call('first_cell', { U: si(1000, 'm/s'), L: si(4, 'm'), fluid: isaAir, yplus: num(1), ...defaults })).warnings).toEqual([]);
    const withA = record([['rho', si(ISA_RHO, 'kg/m^3')], ['mu', si(ISA_MU, 'Pa s')], ['a', si(340.294, 'm/s')]]);
    expect(asRecord(call('first_cell', { U: si(1000, 'm/s'), L: si(4, 'm'), fluid: withA, yplus: num(1), ...defaults })).warnings).toHaveLength(1);
  });
});
