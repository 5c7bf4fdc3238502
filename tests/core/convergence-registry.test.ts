import { describe, expect, it } from 'vitest';
import { createRegistry } from '../../server/core/index.js';
import { convergenceEntries } from '../../server/core/convergence/entries.js';

describe('convergence registry entries', () => {
  it('lists the functions of issue 14, each once, in the shared registry', () => {
    const names = convergenceEntries.map((f) => f.name);
    expect(names).toEqual(['residuals', 'monitor', 'relaxation', 'gci']);
    const registry = createRegistry();
    for (const n of names) expect(registry.has(n)).toBe(true);
  });

  it('declares the record fields the issue fixes, each with a LaTeX symbol', () => {
    const fieldsOf = (n: string) => convergenceEntries.find((f) => f.name === n)!.fields!;
    const names = (n: string) => fieldsOf(n).map((f) => f.name);
    expect(names('residuals')).toEqual(expect.arrayContaining(['table', 'verdict']));
    expect(names('monitor')).toEqual(['mean', 'std', 'drift', 'verdict']);
    expect(names('relaxation').slice(0, 3)).toEqual(['alpha_u', 'alpha_p', 'note']);
    expect(names('gci')).toEqual(expect.arrayContaining(['r21', 'r32', 'p', 'phi_ext', 'e_a', 'e_ext', 'gci_fine', 'asymptotic', 'oscillatory']));
    for (const f of convergenceEntries) for (const spec of f.fields!) expect(spec.symbol, `${f.name}.${spec.name}`).toMatch(/\S/);
  });

  it('keeps the defaults the issue states', () => {
    const def = (fn: string, p: string) => convergenceEntries.find((f) => f.name === fn)!.params.find((q) => q.name === p)!.default;
    expect(def('residuals', 'target_drop')).toBe('4');
    expect(def('residuals', 'window')).toBe('200');
    expect(def('monitor', 'window')).toBe('500');
    expect(def('monitor', 'tol')).toBe('0.5 %');
    expect(def('relaxation', 'scheme')).toBe('"SIMPLE"');
    expect(def('relaxation', 'alpha_u')).toBe('0.7');
  });
});
