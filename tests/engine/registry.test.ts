// Every registered trade function has a doc, a source, a declared dimension on
// every quantity parameter, a declared result (its record's fields or its one
// value), and an example that evaluates to what the declaration says.
import { describe, expect, it } from 'vitest';
import { ANY_DIMENSION, createRegistry } from '../../server/core/index.js';
import { dimsEqual } from '../../server/units/dims.js';
import { parseUnit } from '../../server/units/quantity.js';
import { renderSheet } from '../../server/pipeline/index.js';
import type { ValueJson } from '../../server/pipeline/index.js';

const registry = createRegistry();

/** Does a value, as eval --json gives it, have the kind and dimension a declaration's unit text names? */
function agrees(v: ValueJson, unit: string): boolean {
  if (unit === ANY_DIMENSION) return true;
  if (unit === 'list') return v.items !== undefined;
  if (unit === 'text') return v.si === null && v.items === undefined && v.fields === undefined;
  if (unit === 'table') return v.table !== undefined;
  return typeof v.si === 'number' && dimsEqual(parseUnit(v.unit || '1').dims, parseUnit(unit).dims);
}

describe('trade-function registry', () => {
  for (const fn of registry.list()) {
    it(`${fn.name}: documented, sourced, and its example evaluates as declared`, async () => {
      expect(fn.doc.length).toBeGreaterThan(5);
      expect(fn.source.length).toBeGreaterThan(5);
      expect(fn.example).toMatch(new RegExp(`^${fn.name}\\(`));
      for (const p of fn.params) {
        expect(p.doc, `${fn.name}.${p.name} has a doc`).toBeTruthy();
        // A quantity parameter says its dimension, or says outright that it takes any.
        if (p.type === 'quantity') {
          expect(p.unit, `${fn.name}.${p.name} declares its dimension`).toBeDefined();
          if (p.unit !== ANY_DIMENSION) expect(() => parseUnit(p.unit!), `${fn.name}.${p.name}: unit ${p.unit}`).not.toThrow();
        }
      }
      expect(fn.fields === undefined, `${fn.name} declares either fields or returns, not both`).toBe(fn.returns !== undefined);
      // Examples may read the bundled demo data: they run where the function guide lives, in the worksheets project.
      const r = await renderSheet('```basis\nexample = ' + fn.example + '\n```\n', { root: 'worksheets', path: 'worksheets/guide/example.md' });
      expect(r.errors, `${fn.example}`).toEqual([]);
      const value = r.values.example!;
      if (fn.returns) {
        expect(value.fields, `${fn.name} returns one value`).toBeUndefined();
        expect(agrees(value, fn.returns.unit), `${fn.name} returns ${fn.returns.unit}, got ${JSON.stringify(value)}`).toBe(true);
      } else {
        const declared = new Map(fn.fields!.map((f) => [f.name, f.unit]));
        expect(value.fields, `${fn.name} returns a record`).toBeDefined();
        for (const [name, v] of Object.entries(value.fields!)) {
          expect(declared.has(name), `${fn.name}.${name} is declared`).toBe(true);
          expect(agrees(v, declared.get(name)!), `${fn.name}.${name} is ${declared.get(name)}, got ${JSON.stringify(v)}`).toBe(true);
        }
      }
    });
  }

  it('refuses an unknown parameter and a missing one in plain words', async () => {
    const r = await renderSheet('```basis\nx = sqrt(y: 4)\nz = linspace(1)\n```\n');
    expect(r.errors.map((e) => e.message)).toEqual(['sqrt() has no parameter "y" (did you mean x?); it takes x', 'linspace() needs stop: last value (same unit as start)']);
  });
});
