import { describe, expect, it } from 'vitest';
import { bool, si, str, TradeError } from '../../server/core/index.js';
import { domainBox } from '../../server/core/domain/box.js';
import { DOMAIN_RULES } from '../../server/core/domain/rules.js';
import { asRecord, call, metres, relErr, siField, textField } from './domain-helpers.js';

// A building-like block: 20 m along the wind, 10 m wide, 10 m tall.
const BLOCK = [20, 10, 10] as const;

describe('domain box: distances, box and blockage by hand', () => {
  it('COST 732 on the ground: 5H up, 15H down, 5H each side and above', () => {
    const d = domainBox({ body: BLOCK, rule: 'cost732', given: {}, ground: true });
    // By hand with H = 10 m: length 50 + 20 + 150, width 10 + 2·50, height 10 + 50.
    expect([d.upstream, d.downstream, d.lateral, d.top, d.below]).toEqual([50, 150, 50, 50, 0]);
    expect([d.length, d.width, d.height]).toEqual([220, 110, 60]);
    expect(d.volume).toBe(220 * 110 * 60);
    expect(d.frontal).toBe(100);
    expect(relErr(d.blockage, 100 / (110 * 60))).toBeLessThan(1e-12);
    expect(d.warnings).toEqual([]);
  });

  it('off the ground the top clearance is given below the body as well', () => {
    const d = domainBox({ body: [4, 2, 1], rule: 'three-lengths', given: {}, ground: false });
    // L_max = 4 m: 12 m on every side; height 12 + 1 + 12, width 12 + 2 + 12.
    expect(d.below).toBe(12);
    expect([d.length, d.width, d.height]).toEqual([28, 26, 25]);
    expect(relErr(d.blockage, 2 / (26 * 25))).toBeLessThan(1e-12);
    expect(d.warnings).toEqual([]);
  });

  it('explicit distances override the rule, and a frontal area replaces W × H', () => {
    const d = domainBox({ body: BLOCK, rule: 'cost732', given: { upstream: 80, top: 60 }, ground: true, frontal: 90 });
    expect(d.upstream).toBe(80);
    expect(d.top).toBe(60);
    expect(d.downstream).toBe(150);
    expect(d.overridden).toEqual(['upstream', 'top']);
    expect(d.length).toBe(80 + 20 + 150);
    expect(d.height).toBe(70);
    expect(relErr(d.blockage, 90 / (110 * 70))).toBeLessThan(1e-12);
  });
});

describe('each rule against its guideline', () => {
  const H = 10;
  const body = [30, 15, H] as const;

  it('cost732: COST Action 732 best practice guideline (Franke et al. 2007)', () => {
    const d = domainBox({ body, rule: 'cost732', given: {}, ground: true });
    // Franke et al. (2007), "Extension of the domain in flow direction": 5H upstream, at least 15H behind the building.
    expect(d.upstream).toBe(5 * H);
    expect(d.downstream).toBe(15 * H);
    // Franke et al. (2007): 5H above the building (summary with Tominaga et al. 2008); 5H to each side (from memory).
    expect(d.top).toBe(5 * H);
    expect(d.lateral).toBe(5 * H);
    // Franke et al. (2007): blockage below 3 % (from memory).
    expect(DOMAIN_RULES.cost732.blockage.limit).toBe(0.03);
  });

  it('aij: AIJ guidelines (Tominaga et al. 2008, J. Wind Eng. Ind. Aerodyn. 96)', () => {
    const d = domainBox({ body, rule: 'aij', given: {}, ground: true });
    // Tominaga et al. (2008): 5H or more to each side and above the target building.
    expect(d.lateral).toBe(5 * H);
    expect(d.top).toBe(5 * H);
    // Tominaga et al. (2008): at least 10H behind the building (from memory).
    expect(d.downstream).toBe(10 * H);
    // Inflow: left to the modelled surroundings; 5H as in COST 732 unless given (from memory).
    expect(d.upstream).toBe(5 * H);
    // Tominaga et al. (2008): blockage below 3 % (from memory).
    expect(DOMAIN_RULES.aij.blockage.limit).toBe(0.03);
  });

  it('three-lengths: three of the largest body dimension on every side (common practice)', () => {
    const d = domainBox({ body: [5.9, 2.05, 2.6], rule: 'three-lengths', given: {}, ground: true });
    for (const k of ['upstream', 'downstream', 'lateral', 'top'] as const) expect(relErr(d[k], 3 * 5.9)).toBeLessThan(1e-12);
    // The largest dimension, not the height: a tall, short body takes its height.
    expect(domainBox({ body: [1, 1, 4], rule: 'three-lengths', given: {}, ground: true }).upstream).toBe(12);
  });
});

describe('domain warnings', () => {
  it('blockage above the rule limit, with the lateral distance that mends it', () => {
    // A wide slab, 40 m across the wind: width 40 + 2·50 = 140, height 60, blockage 400/8400 = 4.76 %.
    const d = domainBox({ body: [10, 40, 10], rule: 'cost732', given: {}, ground: true });
    expect(relErr(d.blockage, 400 / 8400)).toBeLessThan(1e-12);
    expect(d.warnings).toHaveLength(1);
    expect(d.warnings[0]).toMatch(/blockage 4.76 % is above the 3 % the cost732 rule allows/);
    // 3 % at height 60 m needs width 400/(0.03·60) = 222.2 m: lateral (222.2 − 40)/2 = 91.1 m.
    expect(d.warnings[0]).toMatch(/lateral 91.1 m or more/);
    // A top of 400/(0.03·140) − 10 = 85.2 m would do it too.
    expect(d.warnings[0]).toMatch(/raise top to 85.2 m or more/);
    const mended = domainBox({ body: [10, 40, 10], rule: 'cost732', given: { lateral: (400 / (0.03 * 60) - 40) / 2 }, ground: true });
    expect(relErr(mended.blockage, 0.03)).toBeLessThan(1e-12);
    expect(mended.warnings).toEqual([]);
  });

  it('a distance shorter than the rule asks', () => {
    const d = domainBox({ body: BLOCK, rule: 'cost732', given: { downstream: 100 }, ground: true });
    expect(d.warnings).toHaveLength(1);
    expect(d.warnings[0]).toMatch(/downstream 100 m is shorter than the 15H = 150 m the cost732 rule asks/);
    expect(d.warnings[0]).toMatch(/domain_study/);
    // Longer than the rule asks is fine.
    expect(domainBox({ body: BLOCK, rule: 'cost732', given: { downstream: 200 }, ground: true }).warnings).toEqual([]);
  });

  it('a building rule with the body lifted off the ground', () => {
    const d = domainBox({ body: BLOCK, rule: 'aij', given: {}, ground: false });
    expect(d.warnings.join('\n')).toMatch(/written for buildings standing on the ground, but ground: false floats the body with 50 m clearance/);
    expect(domainBox({ body: BLOCK, rule: 'three-lengths', given: {}, ground: false }).warnings).toEqual([]);
  });

  it('refuses a body that is not three positive lengths, and a frontal area larger than W × H', () => {
    expect(() => domainBox({ body: [20, 0, 10], rule: 'cost732', given: {}, ground: true })).toThrow(/width must be a positive length/);
    expect(() => domainBox({ body: BLOCK, rule: 'cost732', given: { top: -5 }, ground: true })).toThrow(/top must be a positive distance/);
    expect(() => domainBox({ body: BLOCK, rule: 'cost732', given: {}, ground: true, frontal: 120 })).toThrow(TradeError);
    expect(() => call('domain', { body: metres(20, 10) })).toThrow(/three lengths/);
  });
});

describe('domain entry', () => {
  it('returns the issue\'s fields in order, with the distances\' rule in the notes', () => {
    const r = asRecord(call('domain', { body: metres(...BLOCK), rule: str('cost732'), upstream: si(60, 'm') }));
    expect([...r.fields.keys()]).toEqual(['upstream', 'downstream', 'lateral', 'top', 'length', 'width', 'height', 'volume', 'frontal', 'blockage', 'rule']);
    expect(siField(r, 'length')).toBe(60 + 20 + 150);
    expect(relErr(siField(r, 'blockage'), 100 / 6600)).toBeLessThan(1e-12);
    expect(textField(r, 'rule')).toBe('cost732');
    expect(r.fields.get('upstream')!.note).toMatch(/given \(the cost732 rule asks 5H = 50 m\)/);
    expect(r.fields.get('downstream')!.note).toMatch(/15H = 150 m/);
    expect(r.fields.get('upstream')!.symbol).toBe('d_{\\mathrm{up}}');
    // The sources of the rule's numbers are on the sheet.
    expect(r.remarks.join('\n')).toMatch(/Franke et al. 2007/);
    expect(r.remarks.join('\n')).toMatch(/from memory/);
  });

  it('draws plan and elevation with every distance dimensioned, legibly', () => {
    const r = asRecord(call('domain', { body: metres(5.9, 2.05, 2.6), frontal: si(5.1, 'm^2') }));
    const svg = r.figure!.svg;
    expect(svg).toMatch(/^<svg[^>]*viewBox="0 0 600 \d+"/);
    expect(svg).toMatch(/plan \(seen from above\)/);
    expect(svg).toMatch(/side elevation/);
    // 3 × 5.9 m = 17.7 m on every side; the box 41.3 × 37.5 × 20.3 m.
    for (const label of ['upstream 17.7 m', 'downstream 17.7 m', 'lateral 17.7 m', 'top 17.7 m', 'domain length 41.3 m', 'width 37.5 m', 'height 20.3 m', 'body W 2.05 m', 'body H 2.6 m']) {
      expect(svg).toContain(label);
    }
    expect(svg).toMatch(/5\.9 m/);
    expect(svg).toMatch(/floor \(ground\)/);
    const sizes = [...svg.matchAll(/font-size="([\d.]+)"/g)].map((m) => Number(m[1]));
    expect(Math.min(...sizes)).toBeGreaterThanOrEqual(10);
    expect(svg).not.toMatch(/<script|on\w+=/i);
  });

  it('the body is drawn to the same scale as the domain', () => {
    const r = asRecord(call('domain', { body: metres(...BLOCK), rule: str('cost732') }));
    const rects = [...r.figure!.svg.matchAll(/<rect x="([\d.]+)" y="([\d.]+)" width="([\d.]+)" height="([\d.]+)"/g)].map((m) => m.slice(1).map(Number));
    // The white page, the plan, the body in plan, the elevation, the body in elevation.
    const [, plan, bodyPlan, elev, bodyElev] = rects as number[][];
    expect(Math.abs(bodyPlan![2]! / plan![2]! - 20 / 220)).toBeLessThan(0.002);
    expect(Math.abs(bodyPlan![3]! / plan![3]! - 10 / 110)).toBeLessThan(0.002);
    expect(Math.abs(bodyElev![3]! / elev![3]! - 10 / 60)).toBeLessThan(0.003);
  });

  it('off the ground the elevation dimensions the clearance below and draws no floor', () => {
    const r = asRecord(call('domain', { body: metres(4, 2, 1), ground: bool(false) }));
    expect(r.figure!.svg).toContain('below 12 m');
    expect(r.figure!.svg).not.toMatch(/floor \(ground\)/);
    expect(r.fields.get('top')!.note).toMatch(/also floor to body/);
  });
});

describe('domain box: edges of the rules and of the input', () => {
  it('a distance given exactly as the rule asks does not warn (COST 732: 15H behind the building, Franke et al. 2007)', () => {
    expect(domainBox({ body: BLOCK, rule: 'cost732', given: { downstream: 15 * 10 }, ground: true }).warnings).toEqual([]);
  });

  it('refuses a zero distance and a frontal area that is not positive, in plain words', () => {
    expect(() => domainBox({ body: BLOCK, rule: 'cost732', given: { lateral: 0 }, ground: true })).toThrow('lateral must be a positive distance, not 0 m');
    expect(() => domainBox({ body: BLOCK, rule: 'cost732', given: {}, ground: true, frontal: 0 })).toThrow('frontal must be a positive area, not 0 m²');
    expect(() => domainBox({ body: BLOCK, rule: 'cost732', given: {}, ground: true, frontal: -5 })).toThrow('frontal must be a positive area, not −5 m²');
    expect(() => domainBox({ body: [20, 10, 5], rule: 'cost732', given: {}, ground: true, frontal: 60 })).toThrow(
      "frontal 60 m² is larger than width × height = 50 m²; the body's outline seen from upstream lies within its width and height",
    );
  });

  it('off the ground the blockage warning raises the top on both sides: 2 × top + H (blockage = A_f / (W_D H_D), Franke et al. 2007)', () => {
    // A slab 40 m wide, 10 m tall, 5 m clearance all round: width 50 m, height 5 + 10 + 5 = 20 m, blockage 400/1000 = 40 %.
    const d = domainBox({ body: [10, 40, 10], rule: 'cost732', given: { lateral: 5, top: 5 }, ground: false });
    // 3 % needs height 400/(0.03 × 50) = 266.7 m, so top (266.7 − 10)/2 = 128.3 m; or width 400/(0.03 × 20) = 666.7 m, lateral 313.3 m.
    const warning = d.warnings.find((w) => w.startsWith('blockage'))!;
    expect(warning).toMatch(/widen the domain to lateral 313 m or more, or raise top to 128 m or more\./);
    const topNeeded = (400 / (0.03 * 50) - 10) / 2;
    const mended = domainBox({ body: [10, 40, 10], rule: 'cost732', given: { lateral: 5, top: topNeeded }, ground: false });
    expect(relErr(mended.blockage, 0.03)).toBeLessThan(1e-12);
  });

  it('the floating-body warning says what to do instead', () => {
    const d = domainBox({ body: BLOCK, rule: 'cost732', given: {}, ground: false });
    expect(d.warnings.join('\n')).toContain('set ground: true for a body on the ground, or use rule: "three-lengths" for a body clear of any wall.');
  });
});

describe('domain entry: units, notes and remarks', () => {
  const dims = (r: ReturnType<typeof asRecord>, name: string) => {
    const v = r.fields.get(name)!.value;
    return v.kind === 'quantity' ? v.dims : undefined;
  };

  it('gives lengths in m, the volume in m³ and the frontal area in m²', () => {
    const r = asRecord(call('domain', { body: metres(...BLOCK), rule: str('cost732') }));
    for (const k of ['upstream', 'downstream', 'lateral', 'top', 'length', 'width', 'height']) expect(dims(r, k), k).toEqual(si(1, 'm').dims);
    expect(dims(r, 'volume')).toEqual(si(1, 'm^3').dims);
    expect(dims(r, 'frontal')).toEqual(si(1, 'm^2').dims);
    expect(r.tag).toBe('domain');
    expect(r.figure!.caption).toBe('Domain to scale, plan and side elevation (cost732 rule)');
  });

  it('passes lateral and frontal from the sheet to the box', () => {
    const r = asRecord(call('domain', { body: metres(...BLOCK), rule: str('cost732'), lateral: si(70, 'm'), frontal: si(80, 'm^2') }));
    expect(siField(r, 'width')).toBe(10 + 2 * 70);
    expect(siField(r, 'frontal')).toBe(80);
    expect(relErr(siField(r, 'blockage'), 80 / (150 * 60))).toBeLessThan(1e-12);
    expect(r.fields.get('lateral')!.note).toBe('body side to each side boundary: given (the cost732 rule asks 5H = 50 m)');
    expect(r.fields.get('top')!.note).toBe('body top to the top boundary: 5H = 50 m');
  });

  it('states the rule, its sources and the formulas (COST 732, Franke et al. 2007)', () => {
    const r = asRecord(call('domain', { body: metres(...BLOCK), rule: str('cost732') }));
    const cost = 'COST Action 732 best practice guideline (Franke et al. 2007)';
    expect(r.remarks).toEqual([
      `Rule: ${cost}, single building; distances in multiples of H = 10 m, the body height. Distances given on the sheet override the rule's.`,
      `upstream 5H: ${cost}, "Extension of the domain in flow direction": 5H when the approach-flow profiles are well known.`,
      `downstream 15H: ${cost}, same section: at least 15H behind the building.`,
      `lateral 5H: ${cost}: 5H to each side (from memory).`,
      `top 5H: ${cost}: 5H above the building (as summarised with Tominaga et al. 2008).`,
      `Blockage below 3 %: ${cost}: blockage below 3 % (from memory).`,
      "length = upstream + L + downstream; width = W + 2 × lateral; height = H + top (the body on the floor); blockage = frontal / (width × height), frontal = W × H (the body's outline as a box; give frontal: for the real projected area).",
    ]);
  });

  it('for three-lengths and a floating body, with a frontal area given', () => {
    const r = asRecord(call('domain', { body: metres(4, 2, 1), ground: bool(false), frontal: si(1.5, 'm^2') }));
    expect(r.remarks[0]).toBe("Rule: three body lengths on every side (common practice); distances in multiples of L_max = 4 m, the body's largest dimension. Distances given on the sheet override the rule's.");
    expect(r.remarks.at(-1)).toBe('length = upstream + L + downstream; width = W + 2 × lateral; height = 2 × top + H (top clearance below and above); blockage = frontal / (width × height).');
    expect(r.fields.get('upstream')!.note).toBe('inlet to the body front: 3L_max = 12 m');
  });
});
