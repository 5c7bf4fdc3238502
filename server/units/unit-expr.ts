// Unit expressions: names joined by spaces (products), "/" and "^".
// Juxtaposition binds tighter than "/", so "J/kg K" reads J/(kg K), as
// engineers write it. The same grammar serves sheets and function specs.
import { type Dims, DIMENSIONLESS, dimsMul, dimsPow } from './dims.js';
import { lookupUnit, refusedUnit, type UnitDef } from './catalogue.js';

export interface UnitFactor {
  name: string;
  power: number;
}

/** A resolved unit: SI = (v + offset) * factor. */
export interface Unit extends UnitDef {
  /** Canonical text, e.g. "km/h", "J/(kg K)". */
  text: string;
}

export class UnitError extends Error {}

/** Combine resolved factors; the second list divides. */
export function combineUnit(num: UnitFactor[], den: UnitFactor[], text: string): Unit {
  let factor = 1;
  let dims: Dims = DIMENSIONLESS;
  let offset = 0;
  const all = [...num.map((f) => ({ ...f, sign: 1 })), ...den.map((f) => ({ ...f, sign: -1 }))];
  let interval = false;
  for (const f of all) {
    const refused = refusedUnit(f.name);
    if (refused) throw new UnitError(refused);
    const def = lookupUnit(f.name);
    if (!def) throw new UnitError(`unknown unit "${f.name}"`);
    // Only a temperature interval on its own marks its values as differences (5 delta_degC/m is just K/m).
    if (def.interval && all.length === 1 && f.power === 1 && f.sign === 1) interval = true;
    if (def.offset !== 0) {
      if (all.length !== 1 || f.power !== 1 || f.sign !== 1) {
        throw new UnitError(`${f.name} has an offset and cannot be combined with other units; use K inside compound units`);
      }
      offset = def.offset;
    }
    factor *= Math.pow(def.factor, f.power * f.sign);
    dims = dimsMul(dims, dimsPow(def.dims, f.power), f.sign);
  }
  return interval ? { factor, offset, dims, text, interval } : { factor, offset, dims, text };
}

const cache = new Map<string, Unit>();

/** Parse unit text such as "kg/m^3", "Pa s", "J/(kg K)" or "1" (dimensionless). */
export function parseUnit(text: string): Unit {
  const hit = cache.get(text);
  if (hit) return hit;
  const src = text.trim();
  if (src === '' || src === '1') return { factor: 1, offset: 0, dims: DIMENSIONLESS, text: '' };
  const num: UnitFactor[] = [];
  const den: UnitFactor[] = [];
  let pos = 0;
  let target = num;
  const skip = () => {
    while (pos < src.length && /[\s·*]/.test(src[pos]!)) pos++;
  };
  const factor = (): UnitFactor => {
    const m = /^(%|[A-Za-zµμ][A-Za-z0-9_]*)(\^(-?\d+(?:\.\d+)?))?/.exec(src.slice(pos));
    if (!m) throw new UnitError(`cannot read the unit "${src}" at "${src.slice(pos)}"`);
    pos += m[0].length;
    return { name: m[1]!, power: m[3] ? Number(m[3]) : 1 };
  };
  const group = (into: UnitFactor[]) => {
    skip();
    if (src[pos] === '(') {
      pos++;
      skip();
      while (pos < src.length && src[pos] !== ')') {
        into.push(factor());
        skip();
      }
      if (src[pos] !== ')') throw new UnitError(`missing ")" in the unit "${src}"`);
      pos++;
      return;
    }
    if (src[pos] === '1' && target === num) {
      pos++;
      return;
    }
    into.push(factor());
    skip();
    while (pos < src.length && src[pos] !== '/') {
      into.push(factor());
      skip();
    }
  };
  group(num);
  while (pos < src.length) {
    skip();
    if (src[pos] !== '/') throw new UnitError(`cannot read the unit "${src}"`);
    pos++;
    target = den;
    group(den);
  }
  const unit = combineUnit(num, den, src);
  cache.set(text, unit);
  return unit;
}

/** A unit name, or a name refused as a unit (so that it is read as one and refused in words). */
export function isUnitName(name: string): boolean {
  return lookupUnit(name) !== null || refusedUnit(name) !== undefined;
}
