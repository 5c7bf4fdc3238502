import { describe, expect, it } from 'vitest';
import { createRegistry } from '../../server/core/index.js';
import { wallEntries } from '../../server/core/wall/entries.js';

describe('near-wall registry entries', () => {
  it('lists the functions of issue 5, each once, in the shared registry', () => {
    const names = wallEntries.map((f) => f.name);
    expect(names).toEqual(['skin_friction', 'boundary_layer', 'first_cell', 'yplus', 'law_of_wall', 'friction_velocity', 'layer_stack', 'yplus_report']);
    const registry = createRegistry();
    for (const n of names) expect(registry.has(n)).toBe(true);
  });

  it('every entry has a doc, a source, an example calling itself, and documented parameters', () => {
    for (const f of wallEntries) {
      expect(f.doc.length).toBeGreaterThan(10);
      expect(f.source.length).toBeGreaterThan(10);
      expect(f.example.startsWith(`${f.name}(`)).toBe(true);
      for (const p of f.params) {
        expect(p.doc.length).toBeGreaterThan(3);
        if (p.choices && p.default) expect(p.choices).toContain(JSON.parse(p.default));
      }
    }
  });

  it('keeps the defaults issue 5 states', () => {
    const def = (fn: string, p: string) => wallEntries.find((f) => f.name === fn)!.params.find((q) => q.name === p)!.default;
    expect(def('skin_friction', 'method')).toBe('"schlichting"');
    expect(def('first_cell', 'yplus')).toBe('1');
    expect(def('first_cell', 'placement')).toBe('"centroid"');
    expect(def('yplus_report', 'column')).toBe('"yplus"');
    expect(def('yplus_report', 'weight')).toBe('"area"');
    expect(def('yplus_report', 'band')).toBe('[0.5, 5]');
  });
});
