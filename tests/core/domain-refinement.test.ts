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
