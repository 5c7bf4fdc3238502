import { describe, expect, it } from 'vitest';
import { terrainCategory } from '../../server/core/boundaries/terrain.js';
import { run, runRecord, siField, textField } from './boundaries-helpers.js';

// EN 1991-1-4:2005, Table 4.1 (VERIFIED secondary, two reproductions; reference-values §7).
const TABLE_4_1: Array<[string, number, number]> = [
  ['0', 0.003, 1],
  ['I', 0.01, 1],
  ['II', 0.05, 2],
  ['III', 0.3, 5],
  ['IV', 1.0, 10],
];
// Terrain factor k_r = 0.19 (z0/0.05)^0.07, Eq. 4.5 (from memory, high); the note's derived values to 4 places.
const K_R: Record<string, number> = { '0': 0.156, I: 0.1698, II: 0.19, III: 0.2154, IV: 0.2343 };

describe('EN 1991-1-4 terrain categories', () => {
  it('gives z0 and z_min of Table 4.1, and z_max = 200 m (§4.3.2)', () => {
    for (const [cat, z0, zmin] of TABLE_4_1) {
      const r = runRecord(`terrain("${cat}")`);
      expect(textField(r, 'category')).toBe(cat);
      expect(siField(r, 'z0')).toBe(z0);
      expect(siField(r, 'z_min')).toBe(zmin);
      expect(siField(r, 'z_max')).toBe(200);
      expect(Math.abs(siField(r, 'k_r') - K_R[cat]!)).toBeLessThan(5e-5);
      expect(textField(r, 'description').length).toBeGreaterThan(20);
      expect(r.tag).toBe('caution');
    }
  });

  it('describes the categories in the words of the table', () => {
    expect(textField(runRecord('terrain("0")'), 'description')).toMatch(/open sea/);
    expect(textField(runRecord('terrain("IV")'), 'description')).toMatch(/15 %.*15 m/);
  });

  it('shows the planning caution', () => {
    expect(runRecord('terrain("II")').remarks.join(' ')).toMatch(/Planning values .* licensed engineering review/);
  });

  it('refuses an unknown category, listing the valid ones', () => {
    expect(() => run('terrain("V")')).toThrow(/must be one of "0", "I", "II", "III", "IV", not "V"/);
    expect(() => run('terrain(2)')).toThrow(/text in double quotes/);
    // The table itself refuses too, for callers outside the engine (a national annex's IIIa is not in the recommended table).
    expect(() => terrainCategory('IIIa')).toThrow(/"IIIa" is not a terrain category of EN 1991-1-4; the categories are "0", "I", "II", "III", "IV"/);
  });
});
