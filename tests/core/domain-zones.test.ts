import { describe, expect, it } from 'vitest';
import { bool, si, str } from '../../server/core/index.js';
import { boxArea, boxVolume, shellVolume, thinShellLoss } from '../../server/core/domain/zones.js';
import { asRecord, call, metres, relErr, siField, textField } from './domain-helpers.js';

/**
 * Volume within distance d of a box [0,L]×[0,W]×[0,H], outside it, by the
 * midpoint rule on a grid of spacing h: an outside check on Steiner's formula.
 * With `ground` only z ≥ 0 counts (the floor cuts the shell).
 */
function shellByCounting(L: number, W: number, H: number, d: number, ground: boolean, h: number): number {
  let inside = 0;
  const z0 = ground ? 0 : -d;
  for (let x = -d + h / 2; x < L + d; x += h) {
    const dx = Math.max(-x, 0, x - L);
    for (let y = -d + h / 2; y < W + d; y += h) {
      const dy = Math.max(-y, 0, y - W);
      for (let z = z0 + h / 2; z < H + d; z += h) {
        const dz = Math.max(-z, 0, z - H);
        const r2 = dx * dx + dy * dy + dz * dz;
        if (r2 > 0 && r2 <= d * d) inside++;
      }
    }
  }
  return inside * h ** 3;
}

describe('zone volumes', () => {
  it('a box zone is l·w·h, less the solid it holds', () => {
    expect(boxVolume([12, 4, 3])).toBe(144);
    expect(boxVolume([12, 4, 3], 20)).toBe(124);
    expect(() => boxVolume([12, 4])).toThrow(/three lengths/);
    expect(() => boxVolume([12, 4, 3], 150)).toThrow(/fills the box/);
  });

  it("a shell round a box body in free stream: Steiner's formula against counting grid cells", () => {
    // Steiner (1840), parallel body of a convex body: V = A d + M d² + (4/3)π d³, with M = π(L + W + H) for a box.
    const [L, W, H, d] = [2, 1, 1, 0.4];
    const steiner = 2 * (L * W + L * H + W * H) * d + Math.PI * (L + W + H) * d * d + (4 / 3) * Math.PI * d ** 3;
    const s = shellVolume(d, undefined, [L, W, H], false);
    expect(relErr(s.volume, steiner)).toBeLessThan(1e-12);
    expect(relErr(s.volume, shellByCounting(L, W, H, d, false, 0.01))).toBeLessThan(1e-3);
    expect(s.area).toBe(10);
  });

  it('a shell round a box body on the floor: the floor face is not wetted and the floor cuts the shell', () => {
    const [L, W, H, d] = [2, 1, 1, 0.4];
    const s = shellVolume(d, undefined, [L, W, H], true);
    expect(s.area).toBe(L * W + 2 * (L * H + W * H));
    expect(relErr(s.volume, shellByCounting(L, W, H, d, true, 0.01))).toBeLessThan(1e-3);
  });

  it("a given area replaces the box's in the first term only", () => {
    const withBox = shellVolume(0.2, undefined, [2, 1, 1], false);
    const withArea = shellVolume(0.2, 8, [2, 1, 1], false);
    expect(relErr(withBox.volume - withArea.volume, (10 - 8) * 0.2)).toBeLessThan(1e-12);
  });

  it('a thin shell without a body is area × distance, with a warning when that leaves out much', () => {
    // Cube of the same area, a = √(A/6): A d leaves out πd/(2a) + (2π/9)(d/a)² of A d (Steiner).
    const thin = shellVolume(0.01, 24, undefined, true);
    expect(thin.volume).toBe(0.24);
    expect(thin.warnings).toEqual([]);
    const thick = shellVolume(0.3, 24, undefined, true);
    expect(thick.volume).toBeCloseTo(7.2, 12);
    const x = (Math.PI * 0.3) / 4 + ((2 * Math.PI) / 9) * (0.3 / 2) ** 2;
    expect(relErr(thinShellLoss(0.3, 24), x / (1 + x))).toBeLessThan(1e-12);
    expect(thick.warnings.join('\n')).toMatch(/leaves out about 20 % of its volume.*give body: \[L, W, H\]/);
    // And for the cube itself the estimate is Steiner's exact share.
    const cube = shellVolume(0.3, undefined, [2, 2, 2], false).volume;
    expect(relErr(thinShellLoss(0.3, 24), (cube - 24 * 0.3) / cube)).toBeLessThan(1e-12);
  });

  it('box wetted area: six faces in free stream, five on the ground', () => {
    expect(boxArea(5, 2, 2.5, false)).toBe(2 * (10 + 12.5 + 5));
    expect(boxArea(5, 2, 2.5, true)).toBe(10 + 2 * (12.5 + 5));
  });
});

describe('zone entry', () => {
  it('makes box, volume, shell and surface zones', () => {
    const box = asRecord(call('zone', { box: metres(12, 4, 3), level: si(2), label: str('near') }));
    expect(textField(box, 'kind')).toBe('box');
    expect(siField(box, 'volume')).toBe(144);
    expect(siField(box, 'level')).toBe(2);
    expect(textField(box, 'label')).toBe('near');
    expect(box.tag).toBe('zone');
    const vol = asRecord(call('zone', { volume: si(500, 'm^3'), level: si(1), solid: si(30, 'm^3') }));
    expect(siField(vol, 'volume')).toBe(470);
    const shell = asRecord(call('zone', { shell: si(0.4, 'm'), body: metres(2, 1, 1), ground: bool(false), level: si(5) }));
    expect(textField(shell, 'kind')).toBe('shell');
    expect(siField(shell, 'distance')).toBe(0.4);
    expect(siField(shell, 'area')).toBe(10);
    const surface = asRecord(call('zone', { area: si(38, 'm^2'), level: si(6) }));
    expect(textField(surface, 'kind')).toBe('surface');
    expect(siField(surface, 'area')).toBe(38);
    expect(surface.fields.has('volume')).toBe(false);
    // From a box body on the floor: its five wetted faces, 5·2 + 2(5·2.5 + 2·2.5) = 45 m².
    expect(siField(asRecord(call('zone', { body: metres(5, 2, 2.5), level: si(6) })), 'area')).toBe(45);
  });

  it('refuses two shapes at once, a solid in a shell, and a level that is not whole', () => {
    expect(() => call('zone', { box: metres(1, 1, 1), volume: si(1, 'm^3'), level: si(1) })).toThrow(/one of box, shell and volume/);
    expect(() => call('zone', { shell: si(0.2, 'm'), area: si(10, 'm^2'), solid: si(1, 'm^3'), level: si(1) })).toThrow(/solid belongs to a box/);
    expect(() => call('zone', { box: metres(1, 1, 1), level: si(1.5) })).toThrow(/whole number/);
    expect(() => call('zone', { level: si(3) })).toThrow(/give box, shell or volume/);
    expect(() => call('zone', { shell: si(0.2, 'm'), level: si(3) })).toThrow(/needs the surface it wraps/);
  });
});
