import { describe, expect, it } from 'vitest';
import { createRegistry } from '../../server/core/index.js';
import { boundaryEntries } from '../../server/core/boundaries/entries.js';
import { run } from './boundaries-helpers.js';

describe('boundary-family registry entries', () => {
  it('lists the functions of issue 13 and the patch functions, each once, in the shared registry', () => {
    const names = boundaryEntries.map((f) => f.name);
    expect(names).toEqual([
      'inlet_turbulence', 'duct_length_scale', 'terrain', 'abl',
      'wall', 'moving_wall', 'rotating_wall', 'slip', 'symmetry', 'velocity_inlet', 'pressure_inlet', 'pressure_outlet', 'flow_rate_outlet', 'opening',
      'boundaries', 'time_step', 'flow_through', 'shedding', 'force_coefficients',
    ]);
    const registry = createRegistry();
    for (const n of names) expect(registry.get(n)).toBe(boundaryEntries.find((f) => f.name === n));
  });

  it('keeps the record field names the issue fixes', () => {
    const fields = (fn: string) => boundaryEntries.find((f) => f.name === fn)!.fields!.map((f) => f.name);
    expect(fields('inlet_turbulence')).toEqual(expect.arrayContaining(['k', 'epsilon', 'omega', 'nut', 'nut_ratio', 'length']));
    expect(fields('abl')).toEqual(expect.arrayContaining(['u_star', 'table']));
    expect(fields('terrain')).toEqual(expect.arrayContaining(['z0', 'z_min']));
    expect(fields('shedding')).toEqual(expect.arrayContaining(['frequency', 'period', 'steps']));
    expect(fields('force_coefficients')).toEqual(expect.arrayContaining(['Cd', 'Cl', 'Cs', 'Cm']));
    expect(fields('boundaries')).toEqual(['table']);
  });

  it('declares a field list with symbols for every record result, and the record keeps to it', () => {
    for (const f of boundaryEntries) {
      if (['duct_length_scale', 'time_step', 'flow_through'].includes(f.name)) continue;
      expect(f.fields, `${f.name} declares its fields`).toBeDefined();
      for (const spec of f.fields!) {
        expect(spec.doc.length, `${f.name}.${spec.name} doc`).toBeGreaterThan(3);
        if (!['text', 'list', 'table'].includes(spec.unit)) expect(spec.symbol, `${f.name}.${spec.name} symbol`).not.toBe('');
      }
      const v = run(f.example).value;
      expect(v.kind).toBe('record');
      if (v.kind === 'record') for (const name of v.fields.keys()) expect(f.fields!.map((s) => s.name)).toContain(name);
    }
  });

  it('keeps the defaults the issue and the lead state', () => {
    const def = (fn: string, p: string) => boundaryEntries.find((f) => f.name === fn)!.params.find((q) => q.name === p)!.default;
    expect(def('time_step', 'courant')).toBe('1');
    expect(def('shedding', 'St')).toBe('0.2');
    expect(def('abl', 'kappa')).toBe('0.41');
    expect(def('abl', 'C_mu')).toBe('0.09');
    expect(def('inlet_turbulence', 'C_mu')).toBe('0.09');
    expect(def('boundaries', 'compressible')).toBe('false');
  });
});
