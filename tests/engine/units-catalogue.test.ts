// The unit table the engine reads at run time is generated from mathjs (the units library
// names come from) by scripts/units-catalogue.ts; here it is checked against mathjs itself,
// name by name and prefix by prefix, so an upgrade of mathjs or a slip in the generator shows.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { buildCatalogue } from '../../scripts/units-catalogue.js';
import { addedUnitNames, lookupUnit, otherSpellings, refusedUnit } from '../../server/units/catalogue.js';
import { MATHJS_UNITS, MATHJS_VERSION, PREFIX_SETS } from '../../server/units/mathjs-units.js';

interface MathUnit {
  dimensions: number[];
  units: { unit: { offset: number } }[];
  toSI(): { toNumber(): number };
}
const math = createRequire(import.meta.url)('mathjs/lib/browser/math.js') as {
  version: string;
  unit(v: number, name: string): MathUnit;
  Unit: { UNITS: Record<string, { prefixes: Record<string, unknown> }> };
};

/** What mathjs makes of a name: the SI values of 0 and of 1 of it, and the first seven dimensions; or null. */
function fromMathjs(name: string): { si0: number; si1: number; dims: number[] } | null {
  try {
    const one = math.unit(1, name);
    const si1 = one.toSI().toNumber(); // throws for the complex-valued VAR
    return { si0: math.unit(0, name).toSI().toNumber(), si1, dims: one.dimensions.slice(0, 7) };
  } catch {
    return null;
  }
}

describe('the generated unit table', () => {
  it('is what the generator makes from the installed mathjs now', () => {
    const committed = readFileSync(new URL('../../server/units/mathjs-units.ts', import.meta.url), 'utf8');
    expect(MATHJS_VERSION).toBe(math.version);
    expect(committed).toBe(buildCatalogue());
  });

  it('lists every real-valued unit of mathjs, in mathjs order', () => {
    const names = Object.keys(math.Unit.UNITS).filter((n) => fromMathjs(n) !== null);
    expect(MATHJS_UNITS.map((u) => u[0])).toEqual(names);
  });

  it('resolves every name and every prefixed name as mathjs does', () => {
    let checked = 0;
    for (const [name, , , , set] of MATHJS_UNITS) {
      for (const prefix of Object.keys(PREFIX_SETS[set]!)) {
        const written = prefix + name;
        const want = fromMathjs(written);
        const got = lookupUnit(written);
        // Names a sheet cannot write as one word, and the one refused on purpose (kt), are not compared.
        if (want === null || !/^[A-Za-z][A-Za-z0-9_]*$/.test(written) || refusedUnit(written)) continue;
        expect(got, written).not.toBeNull();
        // SI = (v + offset) factor, at v = 0 and v = 1.
        for (const [v, si] of [[0, want.si0], [1, want.si1]] as const) {
          expect(Math.abs((v + got!.offset) * got!.factor - si), `${v} ${written}`).toBeLessThanOrEqual(1e-12 * Math.max(Math.abs(si), 1e-300));
        }
        expect([...got!.dims], written).toEqual(want.dims);
        checked++;
      }
    }
    // A guard that the loop compared what it should: 2747 names with mathjs 15.2.0.
    expect(checked).toBeGreaterThan(2500);
  });

  it('adds only names mathjs does not have, so none of its readings is shadowed', () => {
    for (const name of addedUnitNames()) expect(fromMathjs(name), name).toBeNull();
  });

  it('refuses kt, which mathjs reads as kilotonne', () => {
    expect(fromMathjs('kt')!.si1).toBe(1e6);
    expect(lookupUnit('kt')).toBeNull();
  });

  it('knows the other spellings of a unit, for messages about a symbol a sheet also uses as a name', () => {
    expect(otherSpellings('L')).toEqual(expect.arrayContaining(['litre', 'liter']));
    expect(otherSpellings('mm')).toContain('millimeter');
    expect(otherSpellings('h')).toContain('hour');
    expect(otherSpellings('delta_degC')).toEqual([]);
  });
});
