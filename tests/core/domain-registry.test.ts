import { describe, expect, it } from 'vitest';
import { createRegistry } from '../../server/core/index.js';
import { domainEntries } from '../../server/core/domain/entries.js';

describe('domain-family registry entries', () => {
  it('lists the functions of issue 12, each once, in the shared registry', () => {
    const names = domainEntries.map((f) => f.name);
    expect(names).toEqual(['domain', 'domain_study', 'refinement', 'zone', 'cell_budget']);
    const registry = createRegistry();
    for (const n of names) expect(registry.get(n)).toBe(domainEntries.find((f) => f.name === n));
  });

  it('declares the record fields the issue fixes, each with a symbol for quantities', () => {
    const fields = (fn: string) => domainEntries.find((f) => f.name === fn)!.fields!.map((f) => f.name);
    expect(fields('domain')).toEqual(['upstream', 'downstream', 'lateral', 'top', 'length', 'width', 'height', 'volume', 'frontal', 'blockage', 'rule']);
    expect(fields('domain_study')).toEqual(['change', 'verdict']);
    expect(fields('refinement').slice(0, 2)).toEqual(['levels', 'sizes']);
    expect(fields('cell_budget').slice(0, 3)).toEqual(['cells', 'zones', 'layer_cells']);
    for (const f of domainEntries) {
      for (const spec of f.fields ?? []) {
        if (!['text', 'table'].includes(spec.unit)) expect(spec.symbol, `${f.name}.${spec.name}`).not.toBe('');
        expect(spec.doc.length).toBeGreaterThan(3);
      }
    }
  });

  it('keeps the defaults the issue and the tests state', () => {
    const def = (fn: string, p: string) => domainEntries.find((f) => f.name === fn)!.params.find((q) => q.name === p)!.default;
    expect(def('domain', 'ground')).toBe('true');
    expect(def('domain', 'rule')).toBe('"three-lengths"');
    expect(def('domain_study', 'tol')).toBe('1 %');
    expect(def('zone', 'ground')).toBe('true');
    // The values tests/core/domain-helpers.ts fills in for these.
    expect(def('cell_budget', 'volumes')).toBe('"nested"');
    expect(def('cell_budget', 'tet_per_hex')).toBe('5.5');
    expect(def('cell_budget', 'tet_per_poly')).toBe('4.5');
    expect(def('cell_budget', 'memory_per_million')).toBe('2');
    expect(def('cell_budget', 'cpu_per_million')).toBe('2 h');
    expect(def('cell_budget', 'iterations')).toBe('1000');
    // A list of lengths is a list parameter in metres.
    const body = domainEntries.find((f) => f.name === 'domain')!.params.find((q) => q.name === 'body')!;
    expect([body.type, body.unit]).toEqual(['list', 'm']);
  });
});
