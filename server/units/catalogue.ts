// Unit names: mathjs's own (the well-kept units library, read from the table
// scripts/units-catalogue.ts generates from it, so that no run loads mathjs),
// plus the engineering units mathjs lacks, each written as its definition.
import { type Dims, DIMENSIONLESS, dimsEqual, TEMPERATURE } from './dims.js';
import { MATHJS_UNITS, PREFIX_SETS, type PrefixSet } from './mathjs-units.js';

export interface UnitDef {
  /** SI value of one of this unit (for offset units, the size of one degree). */
  factor: number;
  /** Added before scaling, for degC and degF: SI = (v + offset) * factor. */
  offset: number;
  dims: Dims;
  /** A unit of temperature difference (delta_degC, delta_degF): its values are never absolute temperatures. */
  interval?: boolean;
}

const LENGTH: Dims = [0, 1, 0, 0, 0, 0, 0];
const MASS: Dims = [1, 0, 0, 0, 0, 0, 0];
const AREA: Dims = [0, 2, 0, 0, 0, 0, 0];
const SPEED: Dims = [0, 1, -1, 0, 0, 0, 0];
const PRESSURE: Dims = [1, -1, -2, 0, 0, 0, 0];
const DYNAMIC_VISCOSITY: Dims = [1, -1, -1, 0, 0, 0, 0];
const KINEMATIC_VISCOSITY: Dims = [0, 2, -1, 0, 0, 0, 0];
const FREQUENCY: Dims = [0, 0, -1, 0, 0, 0, 0];

/** Standard acceleration of gravity, 9.806 65 m/s² exactly (NIST SP 811 (2008), B.8, note). */
const G_N = 9.80665;
const INCH = 0.0254;
/** Pound-force per square inch: 0.453 592 37 kg × g_n / (0.0254 m)² (NIST SP 811 (2008), B.8). */
const PSI = (0.45359237 * G_N) / (INCH * INCH);

const def = (factor: number, dims: Dims, interval?: true): UnitDef => (interval ? { factor, offset: 0, dims, interval } : { factor, offset: 0, dims });

/**
 * Units mathjs lacks, by NIST SP 811 (2008) Appendix B.8/B.9 (factors recalled,
 * no document at hand: from memory). Where SP 811 lists several conventions the
 * conventional one is taken and named in the guide.
 */
const ADDED: ReadonlyMap<string, UnitDef> = new Map([
  // knot = nautical mile per hour, 1852 m/h exactly.
  ...['knot', 'knots', 'kn'].map((n) => [n, def(1852 / 3600, SPEED)] as const),
  ['mph', def(1609.344 / 3600, SPEED)],
  ['kph', def(1000 / 3600, SPEED)],
  ['nmi', def(1852, LENGTH)],
  // rpm: one revolution (2π rad) per minute; angles are dimensionless.
  ['rpm', def((2 * Math.PI) / 60, FREQUENCY)],
  ['ha', def(1e4, AREA)],
  // slug = 1 lbf s²/ft = 14.593 90 kg (B.9, "mass").
  ['slug', def((0.45359237 * G_N) / 0.3048, MASS)],
  // Conventional inch of mercury (13 595.1 kg/m³, g_n) = 3.386 389 E+03 Pa (B.9, "pressure").
  ['inHg', def(INCH * 13595.1 * G_N, PRESSURE)],
  // Conventional inch of water (1000 kg/m³, g_n) = 2.490 889 E+02 Pa (B.9, "pressure").
  ['inH2O', def(INCH * 1000 * G_N, PRESSURE)],
  // ksi = kip per square inch = 1000 psi = 6.894 757 E+06 Pa (B.9).
  ['ksi', def(1000 * PSI, PRESSURE)],
  // poise = 0.1 Pa s and stokes = 1e-4 m²/s exactly (B.9, "viscosity").
  ...['P', 'poise'].map((n) => [n, def(0.1, DYNAMIC_VISCOSITY)] as const),
  ...['cP', 'centipoise'].map((n) => [n, def(1e-3, DYNAMIC_VISCOSITY)] as const),
  ...['St', 'stokes'].map((n) => [n, def(1e-4, KINEMATIC_VISCOSITY)] as const),
  ...['cSt', 'centistokes'].map((n) => [n, def(1e-6, KINEMATIC_VISCOSITY)] as const),
  // Temperature intervals: a kelvin-sized and a Rankine-sized degree, without offset (B.8, note on intervals).
  ['delta_degC', def(1, TEMPERATURE, true)],
  ['delta_degF', def(5 / 9, TEMPERATURE, true)],
]);

/** Names refused because they read two ways in practice, with what to write instead. */
const REFUSED: ReadonlyMap<string, string> = new Map([
  ['kt', '"kt" reads as kilotonne in SI but as knot in aviation; write knot (or kn) for a speed, or kilotonne for a mass'],
]);

const MATH = new Map(MATHJS_UNITS.map(([name, factor, offset, dims, set]) => [name, { factor, offset, dims, set }]));

const cache = new Map<string, UnitDef | null>();

// Micro written as µ (U+00B5) or μ (U+03BC) is accepted as mathjs's "u".
function normaliseName(name: string): string {
  return name.replace(/^[µμ]/, 'u');
}

/** A mathjs unit with a prefix, found as mathjs finds it: the first unit in its order whose prefix set fits. */
function prefixed(name: string): UnitDef | null {
  for (const [unit, factor, offset, dims, set] of MATHJS_UNITS) {
    if (!name.endsWith(unit)) continue;
    const p = (PREFIX_SETS[set] as PrefixSet)[name.slice(0, name.length - unit.length)];
    // mathjs scales a prefixed offset unit as (v p + offset) factor, which is (v + offset/p) (factor p).
    if (p !== undefined) return { factor: factor * p, offset: offset / p, dims };
  }
  return null;
}

function resolve(name: string): UnitDef | null {
  if (name === '%') return { factor: 0.01, offset: 0, dims: DIMENSIONLESS };
  if (!/^[A-Za-zµμ][A-Za-z0-9_]*$/.test(name) || REFUSED.has(name)) return null;
  const n = normaliseName(name);
  const exact = MATH.get(n);
  if (exact) return { factor: exact.factor, offset: exact.offset, dims: exact.dims };
  return ADDED.get(n) ?? prefixed(n);
}

/** Look up one unit name (with any SI prefix); null when it is not a unit. */
export function lookupUnit(name: string): UnitDef | null {
  const hit = cache.get(name);
  if (hit !== undefined) return hit;
  const found = resolve(name);
  cache.set(name, found);
  return found;
}

/** Why a name that looks like a unit is refused, or undefined. */
export function refusedUnit(name: string): string | undefined {
  return REFUSED.get(name);
}

/** The units this file adds to mathjs's, for the test that checks they do not shadow a mathjs name. */
export function addedUnitNames(): string[] {
  return [...ADDED.keys()];
}

function sameDef(a: UnitDef, b: UnitDef): boolean {
  return Math.abs(a.factor / b.factor - 1) < 1e-12 && a.offset === b.offset && dimsEqual(a.dims, b.dims) && !a.interval === !b.interval;
}

/**
 * Other names of the same unit, in the catalogue's order: "litre" and "liter"
 * for L, "millimeter" for mm. Used to say how to write a unit whose symbol a
 * sheet also uses as a name.
 */
export function otherSpellings(name: string): string[] {
  const d = lookupUnit(name);
  if (!d) return [];
  const exact = [...MATH.keys(), ...ADDED.keys()];
  const out = exact.filter((n) => n !== name && sameDef(lookupUnit(n)!, d));
  // A short prefix on a symbol has a long form on the unit's long name: mm → millimeter.
  const long = PREFIX_SETS['LONG'] as PrefixSet;
  for (const [unit, factor, offset, dims, set] of MATHJS_UNITS) {
    if (set !== 'LONG' || offset !== d.offset || !dimsEqual(dims, d.dims) || d.interval) continue;
    for (const [p, value] of Object.entries(long)) {
      const candidate = p + unit;
      if (p !== '' && Math.abs((factor * value) / d.factor - 1) < 1e-12 && candidate !== name && !out.includes(candidate)) {
        const found = lookupUnit(candidate);
        if (found && sameDef(found, d)) out.push(candidate);
      }
    }
  }
  return out;
}
