// The planning caution on a sheet that computes a load: the project's rule
// (a result that can hurt someone carries the caution), checked as stated.
import { describe, expect, it } from 'vitest';
import { sheet } from './helpers.js';

describe('the planning caution', () => {
  it('is shown where a result is a force, a pressure, a force per length or a moment', async () => {
    const base = ['U = 34 m/s', 'a = air(T: 5 degC)', 'A = 0.2 m^2', 'b = 0.5 m'];
    for (const line of ['q = dynamic_pressure(U, a)', 'F = 0.5 * a.rho * U^2 * A', 'w = 0.5 * a.rho * U^2 * b', 'M = 0.5 * a.rho * U^2 * A * b', 'a.rho * U^2 / 2']) {
      const r = await sheet([...base, line]);
      expect([line, r.caution]).toEqual([line, true]);
      expect(r.html).toContain('class="ws-caution"');
    }
  });

  it('is not shown for an ambient pressure typed in, a fluid record, or speeds and lengths', async () => {
    const r = await sheet(['p_amb = 96 kPa', 'a = air(T: 5 degC, p: p_amb)', 'U = 34 m/s', 'Re = U * 0.1 m / a.nu', 'check a.p > 90 kPa']);
    expect(r.caution).toBe(false);
    expect(r.html).not.toContain('class="ws-caution"');
  });
});
