// Every registered trade function has a doc, a source, a declared dimension on
// every quantity parameter, and an example that evaluates.
import { describe, expect, it } from 'vitest';
import { ANY_DIMENSION, createRegistry } from '../../server/core/index.js';
import { parseUnit } from '../../server/units/quantity.js';
import { renderSheet } from '../../server/pipeline/index.js';

const registry = createRegistry();

describe('trade-function registry', () => {
  for (const fn of registry.list()) {
    it(`${fn.name}: documented, sourced, and its example evaluates`, async () => {
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
      // Examples may read the bundled demo data: the worksheets folder is their project.
      const r = await renderSheet('```basis\nexample = ' + fn.example + '\n```\n', { root: 'worksheets', path: 'worksheets/example.md' });
      expect(r.errors, `${fn.example}`).toEqual([]);
      expect(r.values.example).toBeDefined();
    });
  }

  it('refuses an unknown parameter and a missing one in plain words', async () => {
    const r = await renderSheet('```basis\nx = sqrt(y: 4)\nz = linspace(1)\n```\n');
    expect(r.errors.map((e) => e.message)).toEqual(['sqrt() has no parameter "y" (did you mean x?); it takes x', 'linspace() needs stop: last value (same unit as start)']);
  });
});
