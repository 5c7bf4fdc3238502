// Unit names resolved through mathjs (the units backend), plus the engineering
// units mathjs lacks. Each added unit is written as its exact definition.
import { createRequire } from 'node:module';
import { type Dims, DIMENSIONLESS } from './dims.js';

export interface UnitDef {
  /** SI value of one of this unit (for offset units, the size of one degree). */
  factor: number;
  /** Added before scaling, for degC and degF: SI = (v + offset) * factor. */
  offset: number;
  dims: Dims;
}

// The single-file bundle loads in about 80 ms; the ESM tree takes 700+ ms.
type MathJs = {
  unit(v: number, name: string): { dimensions: number[]; units: { unit: { offset: number } }[]; toSI(): { toNumber(): number } };
  createUnit(name: string, def: { definition: string; aliases?: string[] }, opts?: { override?: boolean }): unknown;
};
let math: MathJs | undefined;

function backend(): MathJs {
  if (math) return math;
  const require = createRequire(import.meta.url);
  math = require('mathjs/lib/browser/math.js') as MathJs;
  // Exact definitions: NIST SP 811 (2008) Appendix B.
  math.createUnit('knot', { definition: '1852 m/h', aliases: ['knots', 'kn'] });
  math.createUnit('mph', { definition: '1609.344 m/h' });
  math.createUnit('kph', { definition: '1 km/h' });
  math.createUnit('nmi', { definition: '1852 m' });
  math.createUnit('rpm', { definition: '6.283185307179586 rad/min' });
  math.createUnit('cP', { definition: '0.001 Pa s' });
  math.createUnit('cSt', { definition: '1e-6 m^2/s' });
  math.createUnit('ha', { definition: '10000 m^2' });
  return math;
}

const cache = new Map<string, UnitDef | null>();

// Micro written as µ (U+00B5) or μ (U+03BC) is accepted as mathjs's "u".
function normaliseName(name: string): string {
  return name.replace(/^[µμ]/, 'u');
}

/** Look up one unit name (with any SI prefix); null when it is not a unit. */
export function lookupUnit(name: string): UnitDef | null {
  const hit = cache.get(name);
  if (hit !== undefined) return hit;
  let def: UnitDef | null = null;
  if (name === '%') def = { factor: 0.01, offset: 0, dims: DIMENSIONLESS };
  else if (/^[A-Za-zµμ][A-Za-z0-9_]*$/.test(name)) {
    try {
      const n = normaliseName(name);
      const one = backend().unit(1, n);
      const dims = one.dimensions.slice(0, 7) as unknown as Dims;
      const si1 = one.toSI().toNumber();
      if (one.units[0]?.unit.offset) {
        const si0 = backend().unit(0, n).toSI().toNumber();
        def = { factor: si1 - si0, offset: si0 / (si1 - si0), dims };
      } else {
        def = { factor: si1, offset: 0, dims };
      }
    } catch {
      def = null;
    }
  }
  cache.set(name, def);
  return def;
}
