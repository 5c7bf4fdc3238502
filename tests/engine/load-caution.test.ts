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

describe('the planning caution on a live page', () => {
  it('stays while a broken line leaves the load it computed on the page as a stale value', async () => {
    const { SheetPipeline } = await import('../../server/pipeline/index.js');
    const session = new SheetPipeline();
    const text = (u: string) => '```basis\nU = ' + u + '\nq = dynamic_pressure(U, air(T: 5 degC))\n```\n';
    expect(session.run(text('34 m/s')).caution).toBe(true);
    const broken = session.run(text('34 m/s + 3 Pa'));
    expect(broken.errors).toHaveLength(1);
    expect(broken.parts.map((p) => p.html).join('')).toContain('last good value');
    expect(broken.caution).toBe(true);
    // A one-off run of the broken sheet has no last good value to show, and no load either.
    expect(new SheetPipeline().run(text('34 m/s + 3 Pa')).caution).toBe(false);
  });
});
