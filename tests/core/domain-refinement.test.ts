import { describe, expect, it } from 'vitest';
import { si } from '../../server/core/index.js';
import { checkLevel, levelSize, levelsFor, refinement } from '../../server/core/domain/refinement.js';
import { asRecord, call, siField } from './domain-helpers.js';

// Octree halving (the definition of octree cell splitting): level n has edge h0 / 2^n,
// and the target h is reached after ceil(log2(h0 / h)) halvings.
describe('octree refinement levels', () => {
  it('1 m to 40 mm: 25 = 2^4.64, so five halvings, down to 31.25 mm', () => {
    const r = refinement(1, 0.04);
    expect(r.levels).toBe(5);
    expect(r.sizes).toEqual([1, 0.5, 0.25, 0.125, 0.0625, 0.03125]);
    // Four halvings leave 62.5 mm, coarser than the target.
    expect(levelSize(1, 4)).toBeGreaterThan(0.04);
  });

  it('an exact power of two takes exactly that many halvings, also when the ratio carries rounding noise', () => {
    expect(levelsFor(1, 0.125)).toBe(3);
    // A base computed on the sheet as 3 × 0.1 m is 0.30000000000000004 m, a hair over 8 × 37.5 mm;
    // 37.5 mm is still reached at level 3.
    expect((3 * 0.1) / 0.0375).toBeGreaterThan(8);
    expect(levelsFor(3 * 0.1, 0.0375)).toBe(3);
    expect(levelsFor(0.3, 0.0374)).toBe(4);
  });

  it('no halving when the target is not finer than the base', () => {
    expect(refinement(0.5, 0.5)).toEqual({ levels: 0, sizes: [0.5] });
    expect(refinement(0.5, 2).levels).toBe(0);
  });

  it('refuses sizes that are not positive and levels that are not whole', () => {
    expect(() => levelsFor(0, 0.1)).toThrow(/base must be a positive cell size/);
    expect(() => levelsFor(1, -0.1)).toThrow(/target must be a positive cell size/);
    expect(() => levelsFor(1, 1e-12)).toThrow(/more than the 30/);
    expect(() => checkLevel(2.5)).toThrow(/whole number/);
    expect(() => checkLevel(-1)).toThrow(/whole number/);
    expect(checkLevel(3)).toBe(3);
  });

  it('the entry returns levels, sizes and the finest size with a remark on the target', () => {
    const r = asRecord(call('refinement', { base: si(2, 'm'), target: si(0.3, 'm') }));
    // log2(2 / 0.3) = 2.74 → 3 levels: 2, 1, 0.5, 0.25 m.
    expect(siField(r, 'levels')).toBe(3);
    expect(siField(r, 'finest')).toBe(0.25);
    const sizes = r.fields.get('sizes')!.value;
    expect(sizes.kind === 'list' && sizes.items.map((i) => (i.kind === 'quantity' ? i.si : NaN))).toEqual([2, 1, 0.5, 0.25]);
    expect(r.remarks.join('\n')).toMatch(/Level 3 gives 250 mm, 83.3 % of the target/);
    expect(asRecord(call('refinement', { base: si(1, 'm'), target: si(2, 'm') })).remarks.join('\n')).toMatch(/no refinement is needed/);
  });
});

describe('octree levels at the edges', () => {
  it('thirty halvings are the most a sheet may ask for, exactly reached', () => {
    // 2^-30 is exact in binary: log2(1 / 2^-30) = 30 halvings (octree halving h0 / 2^n).
    expect(levelsFor(1, 2 ** -30)).toBe(30);
    expect(checkLevel(30)).toBe(30);
    expect(() => checkLevel(31)).toThrow('level 31 is more than the 30 halvings a sheet may ask for');
    expect(checkLevel(0)).toBe(0);
  });

  it('refuses a zero target and names the argument', () => {
    expect(() => levelsFor(1, 0)).toThrow('target must be a positive cell size, not 0 m');
    expect(() => checkLevel(2.5)).toThrow('level must be a whole number of halvings, 0 or more, not 2.5');
    expect(() => checkLevel(-1, 'zones[2].level')).toThrow(/^zones\[2\]\.level must be a whole number/);
  });

  it('the entry lists the sizes in one unit that suits the finest, and states the rule', () => {
    const sizesOf = (base: number, target: number) => {
      const r = asRecord(call('refinement', { base: si(base, 'm'), target: si(target, 'm') }));
      const v = r.fields.get('sizes')!.value;
      if (v.kind !== 'list') throw new Error('sizes is not a list');
      return { r, items: v.items.map((i) => (i.kind === 'quantity' ? [i.si, i.unit?.text, i.pinned] : [])) };
    };
    // 8 m to 1 m: whole metres; 1 m exactly stays in m.
    expect(sizesOf(8, 1).items).toEqual([[8, 'm', true], [4, 'm', true], [2, 'm', true], [1, 'm', true]]);
    // 2 mm exactly stays in mm; below 1 mm the list is in µm.
    expect(sizesOf(0.004, 0.001).items.map((i) => i[1])).toEqual(['mm', 'mm', 'mm']);
    expect(sizesOf(0.002, 0.0005).items.map((i) => i[1])).toEqual(['um', 'um', 'um']);
    const { r } = sizesOf(2, 0.3);
    expect(r.tag).toBe('refinement');
    expect(r.remarks[0]).toBe('levels = ceil(log2(h0 / h)) = ceil(log2(2 / 0.3)); the cell size at level n is h0 / 2^n.');
    // Level 3 gives 250 mm; one level fewer would give 2 × 250 mm = 500 mm.
    expect(r.remarks[1]).toMatch(/one level fewer would give 500 mm, coarser than the target\.$/);
    const finest = r.fields.get('finest')!.value;
    expect(finest.kind === 'quantity' && finest.dims).toEqual(si(1, 'm').dims);
  });
});
