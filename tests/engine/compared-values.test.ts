// The values a failed check compared, in plain words: the project's own
// wording rule (no published source), checked as stated.
import { describe, expect, it } from 'vitest';
import { renderSheet } from '../../server/pipeline/index.js';

const text = (lines: string[]) => renderSheet('```basis\n' + lines.join('\n') + '\n```\n', { render: false });

describe('a failed check', () => {
  it('carries the names and fields it read with their values, once each, records and lists left out', async () => {
    const r = await text([
      'U = 28 m/s',
      'U_max = 25 m/s',
      'a = air(T: 15 degC)',
      'L = [1, 2] m',
      'check U <= U_max "within the rating"',
      'check a.rho * U^2 / 2 < 300 Pa and U < U_max',
      'check a.nu > 1 m^2/s',
      'check L[1] > 3 m',
      'check U > 20 m/s',
    ]);
    expect(r.checks.map((c) => [c.line, c.passed, c.compared])).toEqual([
      [6, false, 'U = 28 m/s, U_max = 25 m/s'],
      [7, false, 'a.rho = 1.225 kg/m³, U = 28 m/s, U_max = 25 m/s'],
      [8, false, 'a.nu = 1.461×10⁻⁵ m²/s'],
      [9, false, undefined],
      [10, true, undefined],
    ]);
  });
});

describe('the summary above the sheet', () => {
  it('lists a failed check with the values it compared', async () => {
    const r = await renderSheet('```basis\nU = 28 m/s\ncheck U <= 25 m/s "within the rating"\n```\n');
    expect(r.html).toContain('check failed: within the rating (U = 28 m/s)');
  });
});
