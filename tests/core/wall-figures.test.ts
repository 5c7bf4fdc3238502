// The near-wall pictures are drawn to scale: a layer's line, the stack's top, the core
// cell and the boundary-layer edge sit where the axis puts their heights; histogram bars
// are the share of the wall in each bin (about √n bins, a common choice), the band and
// the target where the axis puts them.
import { describe, expect, it } from 'vitest';
import { binCount, histogramSvg } from '../../server/core/wall/histogram-svg.js';
import { stackSvg } from '../../server/core/wall/stack-svg.js';
import { px } from '../../server/core/shared/svg.js';

// The geometry checked below is the picture's own (to scale by construction), not a published value.
// Stack picture frame: the wall at y = 280, the top of the axis at y = 28; the stack from x = 84 to 250.
const WALL = 280;
const TOP = 28;

function rects(svg: string) {
  return [...svg.matchAll(/<rect x="([\d.-]+)" y="([\d.-]+)" width="([\d.-]+)" height="([\d.-]+)"([^>]*)\/>/g)].map((m) => ({ x: +m[1]!, y: +m[2]!, w: +m[3]!, h: +m[4]!, rest: m[5]! }));
}
function texts(svg: string) {
  return [...svg.matchAll(/<text x="([\d.-]+)" y="([\d.-]+)"[^>]*>([^<]*)<\/text>/g)].map((m) => ({ x: +m[1]!, y: +m[2]!, t: m[3]! }));
}

describe('wall-layer stack picture', () => {
  // Ten layers of 1 mm: a total of 10 mm; on a linear axis of 0 to 12 mm (step 2 mm, 2 % headroom).
  const heights = Array.from({ length: 10 }, () => 1e-3);
  const at = (y: number) => WALL - (y / 12e-3) * (WALL - TOP);

  it('draws the stack to scale on a linear axis, with every layer line', () => {
    const svg = stackSvg({ heights, growth: 1, scale: 'linear' });
    const stack = rects(svg).find((r) => r.rest.includes('#e3ebf4'))!;
    expect(stack).toMatchObject({ x: 84, y: +px(at(10e-3)), w: 166, h: +px(WALL - at(10e-3)) });
    const lines = /<path d="((?:M84\.0 [\d.]+H250\.0)+)" stroke="#33475b" stroke-width="0.5"/.exec(svg)![1]!;
    expect(lines).toBe(Array.from({ length: 9 }, (_, i) => `M84.0 ${px(at((i + 1) * 1e-3))}H250.0`).join(''));
    const ticks = texts(svg).filter((t) => t.x === 66).map((t) => t.t);
    expect(ticks).toEqual(['0', '2 mm', '4 mm', '6 mm', '8 mm', '10 mm', '12 mm']);
    expect(svg).toContain('<title>Wall-layer stack: 10 layers, growth 1 (linear scale)</title>');
    expect(svg).toContain('distance from wall</text>');
    expect(svg).not.toContain('not drawn separately');
    expect(svg).toContain('wall (no-slip)');
  });

  it('draws the core cell above the stack and the boundary-layer edge where they are', () => {
    const svg = stackSvg({ heights, growth: 1, core: 2e-3, delta: 11e-3, scale: 'linear' });
    // Up to 12 mm with 2 % headroom: the axis now runs to 14 mm.
    const at = (y: number) => WALL - (y / 14e-3) * (WALL - TOP);
    const core = rects(svg).find((r) => r.rest.includes('stroke-dasharray="4 3"'))!;
    expect(core).toMatchObject({ x: 84, y: +px(at(12e-3)), w: 166 });
    expect(core.h).toBeCloseTo(at(10e-3) - at(12e-3), 0);
    expect(svg).toContain(`<path d="M76.0 ${px(at(11e-3))}H428.0" stroke="#a33b20"`);
    const labels = texts(svg).filter((t) => t.x === 256).map((t) => t.t);
    expect(labels).toEqual(expect.arrayContaining(['total 10 mm', 'first 1 mm', 'core cell 2 mm', 'boundary-layer edge δ = 11 mm']));
    // Labels beside the stack are kept at least 12 px apart and below the heading.
    const ys = texts(svg).filter((t) => t.x === 256).map((t) => t.y).sort((a, b) => a - b);
    for (let k = 1; k < ys.length; k++) expect(ys[k]! - ys[k - 1]!).toBeGreaterThanOrEqual(12 - 1e-9);
    expect(ys[0]!).toBeGreaterThanOrEqual(TOP - 6 - 1e-9);
  });

  it('on a log axis spans decades from the first layer up, and merges no thin layer', () => {
    // 30 layers from 20 µm growing by 1.2, 24 mm in all: decades 1e-5 to 1e-1 m.
    const h = Array.from({ length: 30 }, (_, i) => 20e-6 * 1.2 ** i);
    const log = stackSvg({ heights: h, growth: 1.2, scale: 'log' });
    const ticks = texts(log).filter((t) => t.x === 66).map((t) => t.t);
    expect(ticks).toEqual(['10 µm', '100 µm', '1 mm', '10 mm', '100 mm']);
    // The first layer's top: log10(20 µm) is 0.301 of a decade above 10 µm, of four decades.
    const lines = /<path d="(M84\.0 [\d.]+H250\.0)/.exec(log)![1]!;
    expect(lines).toBe(`M84.0 ${px(WALL - ((Math.log10(20e-6) + 5) / 4) * (WALL - TOP))}H250.0`);
    expect(log).toContain('>log axis: the wall lies below its lowest tick<');
    expect(log).not.toContain('not drawn separately');
    // The same stack on a linear axis cannot draw its thin layers apart, and says so.
    const lin = stackSvg({ heights: h, growth: 1.2, scale: 'linear' });
    expect(lin).toMatch(/\d+ layer lines thinner than a pixel are not drawn separately/);
  });

  it('stacks its notes at the foot of the picture, the log-axis note above the one on merged lines', () => {
    // 300 layers of 10 µm on a log axis: the upper lines crowd closer than a pixel and are merged.
    const both = stackSvg({ heights: Array.from({ length: 300 }, () => 1e-5), growth: 1, scale: 'log' });
    const feet = texts(both).filter((t) => t.x === 8 && t.y > 280);
    expect(feet.map((t) => [t.y, t.t.replace(/^\d+/, 'N')])).toEqual([
      [298, 'log axis: the wall lies below its lowest tick'],
      [312, 'N layer lines thinner than a pixel are not drawn separately'],
    ]);
    // One merged line is said in the singular: a first layer of exactly a decade has its top on the lowest tick, the wall line.
    const one = stackSvg({ heights: [1e-5, 1e-4], growth: 10, scale: 'log' });
    expect(one).toContain('>1 layer line thinner than a pixel is not drawn separately<');
    // Two layers a decade apart: one line, nothing merged, the log note alone at the foot.
    const alone = stackSvg({ heights: [2e-5, 2e-4], growth: 10, scale: 'log' });
    expect(texts(alone).filter((t) => t.x === 8 && t.y > 280).map((t) => [t.y, t.t])).toEqual([[312, 'log axis: the wall lies below its lowest tick']]);
  });

  it('labels the last layer when there is room, and drops that label rather than crowd the others', () => {
    const roomy = stackSvg({ heights: [1e-3, 4e-3], growth: 4, scale: 'linear' });
    expect(texts(roomy).map((t) => t.t)).toContain('last 4 mm');
    // Ten layers of 1 mm: the last one is 21 px tall, so its label would sit 10.5 px from the total's.
    const tight = stackSvg({ heights, growth: 1, scale: 'linear' });
    expect(texts(tight).map((t) => t.t)).not.toContain('last 1 mm');
    expect(texts(tight).map((t) => t.t)).toContain('total 10 mm');
    const single = stackSvg({ heights: [1e-3], growth: 1, scale: 'linear' });
    expect(texts(single).map((t) => t.t).filter((t) => t.startsWith('last'))).toEqual([]);
  });
});

describe('y+ histogram', () => {
  it('uses about √n bins, at least 10 and at most 30', () => {
    // The square-root choice of bin count (common practice); the bounds 10 and 30 are ours, for a picture that reads.
    expect(binCount(1)).toBe(10);
    expect(binCount(100)).toBe(10);
    expect(binCount(101)).toBe(11);
    expect(binCount(400)).toBe(20);
    expect(binCount(900)).toBe(30);
    expect(binCount(10000)).toBe(30);
  });

  // Frame: x from 56 to 420, bars up from y = 200 to y = 28 at the top tick.
  it('draws each bin\'s share of the wall as a bar, on a linear axis', () => {
    // Values 0.5..5 (less than a decade): a linear axis 0 to 5 (step 1), ten bins of 0.5.
    const values = [0.6, 0.7, 1.2, 2.2, 4.9];
    const weights = [1, 1, 2, 4, 2];
    const svg = histogramSvg({ values, weights, weighted: true, band: [0.5, 5], target: 1 });
    const bars = rects(svg).filter((r) => r.rest.includes('#8fabd0'));
    // Shares: bin 1 (0.5–1) 2/10, bin 2 (1–1.5) 2/10, bin 4 (2–2.5) 4/10, bin 9 (4.5–5) 2/10; the top tick is 40 %.
    const bw = (420 - 56) / 10;
    expect(bars.map((b) => [b.x, b.h])).toEqual([
      [+px(56 + 1 * bw), +px(172 * 0.5)],
      [+px(56 + 2 * bw), +px(172 * 0.5)],
      [+px(56 + 4 * bw), +px(172)],
      [+px(56 + 9 * bw), +px(172 * 0.5)],
    ]);
    expect(texts(svg).filter((t) => t.t.endsWith(' %')).map((t) => t.t)).toEqual(['0 %', '10 %', '20 %', '30 %', '40 %']);
    expect(svg).toContain(`<path d="M${px(56 + (1 / 5) * 364)} 28.0V200.0" stroke="#a33b20"`);
    expect(svg).toContain('>target 1</text>');
    const band = rects(svg).find((r) => r.rest.includes('#dcefd6'))!;
    expect(band).toMatchObject({ x: +px(56 + 0.1 * 364), w: +px(0.9 * 364) });
    expect(svg).toContain('>band 0.5–5</text>');
    expect(svg).toContain('share of wall area');
    expect(svg).toContain('>y+</text>');
    expect(svg).toContain('>y+ over 5 wall faces</text>');
  });

  it('bins by decades when y+ spans ten times or more, and counts faces when unweighted', () => {
    const svg = histogramSvg({ values: [0.2, 2, 20, 200], weights: [1, 1, 1, 1], weighted: false, band: [30, 300], target: 50 });
    expect(texts(svg).filter((t) => t.y === 215).map((t) => t.t)).toEqual(['0.1', '1', '10', '100', '1000']);
    expect(svg).toContain('y+ (log scale)');
    expect(svg).toContain('share of faces');
    // Each value in its own decade: four bars of 25 %, ten bins over four decades.
    const bars = rects(svg).filter((r) => r.rest.includes('#8fabd0'));
    expect(bars).toHaveLength(4);
    expect(new Set(bars.map((b) => b.h)).size).toBe(1);
    // The target 50 at log10(50) − (−1) = 2.70 decades of four.
    expect(svg).toContain(`<path d="M${px(56 + ((Math.log10(50) + 1) / 4) * 364)} 28.0V200.0"`);
  });

  it('leaves out a target or band outside the axis, and copes with all-equal values', () => {
    const svg = histogramSvg({ values: [3, 3, 3], weights: [1, 1, 1], weighted: false, band: [50, 100], target: 40 });
    expect(svg).not.toContain('target 40');
    expect(svg).not.toContain('#dcefd6');
    // All at 3: the axis runs from 2.7 to 3.3 and the one bar holds everything.
    expect(rects(svg).filter((r) => r.rest.includes('#8fabd0'))).toHaveLength(1);
    const zeros = histogramSvg({ values: [0, 0], weights: [1, 1], weighted: false, band: [0.5, 5], target: 1 });
    expect(texts(zeros).filter((t) => t.y === 215).map((t) => t.t)).toEqual(['0', '0.2', '0.4', '0.6', '0.8', '1']);
  });
});
