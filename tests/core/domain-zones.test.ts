import { describe, expect, it } from 'vitest';
import { bool, si, str } from '../../server/core/index.js';
import { bodyDims, boxArea, boxVolume, shellVolume, surfaceArea, thinShellLoss } from '../../server/core/domain/zones.js';
import { asRecord, call, metres, relErr, siField, textField } from './domain-helpers.js';

/**
 * Volume within distance d of a box [0,L]×[0,W]×[0,H], outside it, by the
 * midpoint rule on a grid of spacing h: an outside check on Steiner's formula
 * (J. Steiner, "Über parallele Flächen", Monatsbericht der Akademie der
 * Wissenschaften zu Berlin, 1840; the citation from memory). The box volumes
 * and face areas below are plain solid geometry (common practice).
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

describe('zone volumes: a body that is not a cube, and what is refused', () => {
  it("a shell round a taller box on the floor: the edges along the height count twice (Steiner's formula for the body mirrored in the floor)", () => {
    // Steiner (1840) for the mirrored body [L, W, 2H], halved: A d + (π/2)(L + W + 2H) d² + (2/3)π d³.
    const [L, W, H, d] = [2, 1, 1.5, 0.4];
    const s = shellVolume(d, undefined, [L, W, H], true);
    const A = L * W + 2 * (L * H + W * H);
    expect(relErr(s.volume, A * d + (Math.PI / 2) * (L + W + 2 * H) * d * d + ((2 * Math.PI) / 3) * d ** 3)).toBeLessThan(1e-12);
    expect(relErr(s.volume, shellByCounting(L, W, H, d, true, 0.01))).toBeLessThan(1e-3);
    expect(s.warnings).toEqual([]);
  });

  it('a thin shell at exactly the 5 % loss does not warn yet', () => {
    // The share x/(1 + x) is 5 % at x = 1/19; for A = 24 m² (a = 2 m) solve πd/4 + (2π/9)(d/2)² = 1/19 for d.
    const a = 2;
    const d = ((-Math.PI / 2 + Math.sqrt((Math.PI / 2) ** 2 + (4 * (2 * Math.PI)) / (9 * 19))) / ((2 * (2 * Math.PI)) / 9)) * a;
    expect(thinShellLoss(d, 24)).toBeCloseTo(0.05, 12);
    expect(shellVolume(d * 0.999, 24, undefined, true).warnings).toEqual([]);
    expect(shellVolume(d * 1.001, 24, undefined, true).warnings).toHaveLength(1);
  });

  it('refuses lengths, areas and solids that cannot be, naming which', () => {
    expect(() => boxVolume([0, 4, 3])).toThrow('box[1] must be positive, not 0 m');
    expect(() => boxVolume([12, -4, 3])).toThrow('box[2] must be positive, not −4 m');
    expect(() => boxVolume([12, 4, Number.NaN])).toThrow(/^box\[3\] must be positive/);
    expect(() => boxVolume([12, 4, 3], -1)).toThrow('solid must be a volume of 0 or more, not −1 m³');
    expect(() => boxVolume([12, 4, 3], Number.NaN)).toThrow(/^solid must be a volume of 0 or more/);
    expect(() => boxVolume([12, 4, 3], 144)).toThrow("solid 144 m³ fills the box of 144 m³; the solid is the body's own volume inside it, which must be smaller");
    expect(boxVolume([12, 4, 3], 0)).toBe(144);
    expect(() => bodyDims([2, 1])).toThrow('body must be a list of three lengths [L, W, H], not 2');
    expect(() => bodyDims([2, 1, 0])).toThrow('body[3] must be positive, not 0 m');
    expect(() => surfaceArea(0, undefined, true)).toThrow('area must be positive, not 0 m²');
    expect(() => surfaceArea(undefined, undefined, true)).toThrow("give the surface's area: (or the body: [L, W, H] of a box-shaped body)");
    expect(surfaceArea(undefined, [5, 2, 2.5], false)).toBe(2 * (10 + 12.5 + 5));
    expect(() => shellVolume(0, 10, undefined, true)).toThrow('shell must be positive, not 0 m');
    expect(() => shellVolume(0.1, -3, [2, 1, 1], false)).toThrow('area must be positive, not −3 m²');
  });
});

describe('zone entry: remarks and refusals', () => {
  it('says how each volume was found', () => {
    const box = asRecord(call('zone', { box: metres(12, 4, 3), level: si(2) }));
    expect([box.remarks, box.warnings]).toEqual([['Box volume l × w × h.'], []]);
    expect(asRecord(call('zone', { box: metres(12, 4, 3), level: si(2), solid: si(20, 'm^3') })).remarks).toEqual(['Box volume l × w × h less the solid it holds.']);
    const vol = asRecord(call('zone', { volume: si(500, 'm^3'), level: si(1) }));
    expect([siField(vol, 'volume'), vol.remarks, vol.warnings]).toEqual([500, [], []]);
    expect(asRecord(call('zone', { shell: si(0.01, 'm'), area: si(24, 'm^2'), level: si(5) })).remarks).toEqual([
      'Shell volume = area × distance (thin-shell limit; edges and corners of the body are left out).',
    ]);
    expect(asRecord(call('zone', { shell: si(0.4, 'm'), body: metres(2, 1, 1), level: si(5) })).remarks).toEqual([
      "Shell around a box body on the floor: A d + (π/2)(L + W + 2H) d² + (2/3)π d³ (Steiner's formula for the body mirrored in the floor, halved).",
    ]);
    const both = asRecord(call('zone', { shell: si(0.4, 'm'), body: metres(2, 1, 1), area: si(8, 'm^2'), ground: bool(false), level: si(5) }));
    expect(both.remarks).toEqual([
      "Shell around a box body: A d + π(L + W + H) d² + (4/3)π d³ (Steiner's formula: face slabs, edge quarter-cylinders, corner eighth-spheres).",
      "The given area replaces the box's own in the first term; edges and corners are the box's.",
    ]);
    expect(both.warnings).toEqual([]);
    for (const [name, unit] of [['volume', 'm^3'], ['area', 'm^2'], ['distance', 'm']] as const) {
      const v = both.fields.get(name)!.value;
      expect(v.kind === 'quantity' && v.dims, name).toEqual(si(1, unit).dims);
    }
    const band = asRecord(call('zone', { area: si(38, 'm^2'), level: si(6) }));
    expect(band.remarks).toEqual(['The surface band: one cell layer at this level over the area.']);
    expect(band.warnings).toEqual([]);
    expect(asRecord(call('zone', { body: metres(5, 2, 2.5), level: si(6) })).remarks).toEqual([
      "The surface band: one cell layer at this level over the box body's wetted area.",
    ]);
  });

  it('refuses a zone volume that is not positive, a solid that fills it, two shapes named, and a solid in a surface band', () => {
    expect(() => call('zone', { volume: si(0, 'm^3'), level: si(1) })).toThrow('volume must be positive, not 0 m³');
    expect(() => call('zone', { volume: si(50, 'm^3'), solid: si(50, 'm^3'), level: si(1) })).toThrow(/fills the zone of 50 m³/);
    expect(() => call('zone', { box: metres(1, 1, 1), shell: si(1, 'm'), level: si(1) })).toThrow('give one of box, shell and volume, not box and shell');
    expect(() => call('zone', { area: si(10, 'm^2'), solid: si(1, 'm^3'), level: si(1) })).toThrow('solid belongs to a box or volume zone that holds the body; a surface lies outside the body');
  });
});
