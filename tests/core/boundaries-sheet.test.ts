// The family on a rendered sheet: the planning caution for the wind inflow,
// tables inside records on full-width rows, and values readable by name.
import { describe, expect, it } from 'vitest';
import { renderSheet } from '../../server/pipeline/index.js';

function sheet(lines: string[]) {
  return renderSheet(`\`\`\`basis\n${lines.join('\n')}\n\`\`\`\n`);
}

describe('boundary family on a sheet', () => {
  it('a terrain or abl record brings the planning caution onto the page (project rules: wind loads)', async () => {
    const wind = await sheet(['site = terrain("III")', 'wind = abl(12 m/s, 10 m, site, heights: [5, 10, 50] m)']);
    expect(wind.errors).toEqual([]);
    expect(wind.caution).toBe(true);
    expect(wind.html).toMatch(/class="ws-caution"/);
    const plain = await sheet(['dt = time_step(30 m/s, 5 mm)', 'bc = boundaries([velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet")])']);
    expect(plain.errors).toEqual([]);
    expect(plain.caution).toBe(false);
  });

  it('brings the caution for a wind record that is only shown, not named', async () => {
    const bare = await sheet(['terrain("III")']);
    expect(bare.errors).toEqual([]);
    expect(bare.caution).toBe(true);
    expect(bare.html).toMatch(/class="ws-caution"/);
  });

  it('shows a table field at the full width of the record, under its name and note', async () => {
    const r = await sheet(['bc = boundaries([velocity_inlet("inlet", 30 m/s), pressure_outlet("outlet"), wall("body")])']);
    expect(r.html).toMatch(/<div class="ws-subtable"><div class="ws-subtable-head"><span class="ws-field">(?:<span class="ws-sym">.*?<\/span>)?<code class="ws-field-name">table<\/code><\/span> <span class="ws-note">each patch, its condition and its values<\/span><\/div><div class="ws-table-wrap"><table class="ws-table" data-name="bc.table">/);
    expect(r.html).toMatch(/>static-pressure outlet<\/span><\/td><td><span class="ws-value"[^>]*>static pressure 0 Pa \(gauge\)<\/span><\/td>/);
  });

  it('reads record fields by name in a sheet: the inflow at z_ref equals U_ref (Richards & Hoxey 1993)', async () => {
    const r = await sheet(['wind = abl(12 m/s, 10 m, 0.05 m, heights: [10] m)', 'U_back = wind.u_star / wind.kappa * ln((10 m + wind.z0) / wind.z0)', 'check abs(U_back - 12 m/s) < 1e-9 m/s "profile passes through U_ref"']);
    expect(r.errors).toEqual([]);
    expect(r.checks.map((c) => c.passed)).toEqual([true]);
  });
});
