// Where the convergence figures put their lines, read back from the SVG
// through the axis ticks: the residual plot's fit window starts at the last
// iteration minus the window (the trailing window the factor is fitted over,
// as its remark states), a field that blew up is drawn only up to the row
// before it, and the monitor's settling band lies at mean ± tol × |mean| (or ×
// the scale given). Judging settling by such a band is common practice; the
// monitor's remark texts are project wording.
import { describe, expect, it } from 'vitest';
import { num, str } from '../../server/core/index.js';
import { call, firstSeriesPoints, historyCsv, range } from './convergence-helpers.js';

const PATH = 'data/run.csv';

/** A linear axis read from its first two labelled grid lines (labels further on may be rounded): value at a pixel position. */
function axisFromTicks(svg: string, axis: 'x' | 'y'): (pixel: number) => number {
  const grid =
    axis === 'x'
      ? /<path d="M([\d.]+) [\d.]+V[\d.]+" stroke="#e4e4e4" stroke-width="0.6"\/>\n<text [^>]*>([^<]+)<\/text>/g
      : /<path d="M[\d.]+ ([\d.]+)H[\d.]+" stroke="#e4e4e4" stroke-width="0.6"\/>\n<text [^>]*>([^<]+)<\/text>/g;
  const ticks = [...svg.matchAll(grid)].map((m) => [Number(m[1]), Number(m[2]!.replace('\u2212', '-'))] as const);
  if (ticks.length < 2) throw new Error(`fewer than two ${axis} ticks`);
  const [p0, v0] = ticks[0]!;
  const [p1, v1] = ticks[1]!;
  return (pixel) => v0 + ((pixel - p0) / (p1 - p0)) * (v1 - v0);
}

/** Pixel positions of the dashed reference lines of one colour (x for vertical lines, y for horizontal). */
function referenceLines(svg: string, colour: string): number[] {
  const re = new RegExp(`<path d="M([\\d.]+) ([\\d.]+)([VH])[\\d.]+" stroke="${colour}" stroke-width="1" stroke-dasharray="5 3"`, 'g');
  return [...svg.matchAll(re)].map((m) => Number(m[3] === 'V' ? m[1] : m[2]));
}

describe('the residual plot', () => {
  it('starts the fit window at the last iteration minus the window', () => {
    const text = historyCsv(range(1, 301), { p: (n) => Math.pow(0.99, n) });
    const svg = call('residuals', { path: str(PATH) }, { [PATH]: text }).figure!.svg;
    const at = axisFromTicks(svg, 'x');
    const [line] = referenceLines(svg, '#777777');
    // 301 − 200 = 101; one pixel is about 0.8 iterations on this axis.
    expect(Math.abs(at(line!) - 101)).toBeLessThan(0.5);
  });

  it('starts it at the first iteration when the window is longer than the run', () => {
    const text = historyCsv(range(20, 301), { p: (n) => Math.pow(0.99, n) });
    const svg = call('residuals', { path: str(PATH), window: num(1000) }, { [PATH]: text }).figure!.svg;
    const [line] = referenceLines(svg, '#777777');
    expect(Math.abs(axisFromTicks(svg, 'x')(line!) - 20)).toBeLessThan(0.5);
  });

  it('draws a field that blew up only up to the row before it, even if values follow', () => {
    // nan at iteration 250, then the solver writes numbers again: 249 points are drawn.
    const text = historyCsv(range(1, 300), { p: (n) => (n === 250 ? 'nan' : Math.pow(0.99, n)) });
    const r = call('residuals', { path: str(PATH) }, { [PATH]: text });
    expect(firstSeriesPoints(r.figure!.svg)).toBe(249);
    // A field that did not blow up is drawn whole.
    const whole = call('residuals', { path: str(PATH) }, { [PATH]: historyCsv(range(1, 300), { p: (n) => Math.pow(0.99, n) }) });
    expect(firstSeriesPoints(whole.figure!.svg)).toBe(300);
  });
});

describe('the monitor plot and remarks', () => {
  // Cd = 100 + 0.2 sin n: mean near 100, swings well inside 0.5 % of it.
  const text = historyCsv(range(1, 1000), { Cd: (n) => 100 + 0.2 * Math.sin(n) });

  it('puts the band at mean ± tol × |mean|, labelled with the tolerance', () => {
    const r = call('monitor', { path: str(PATH) }, { [PATH]: text });
    const svg = r.figure!.svg;
    const value = axisFromTicks(svg, 'y');
    const band = referenceLines(svg, '#2e7d32').map(value).sort((a, b) => a - b);
    const mean = (r.fields.get('mean')!.value as { si: number }).si;
    // 0.5 % of about 100 is 0.5; a pixel is about 0.005 on this axis.
    expect(Math.abs(band[0]! - (mean - 0.005 * mean))).toBeLessThan(0.01);
    expect(Math.abs(band[1]! - (mean + 0.005 * mean))).toBeLessThan(0.01);
    expect(svg).toContain('>mean ± 0.5 %</text>');
  });

  it('with a scale, the band is tol × scale and its label says "of scale"', () => {
    const r = call('monitor', { path: str(PATH), scale: num(50) }, { [PATH]: text });
    const svg = r.figure!.svg;
    const value = axisFromTicks(svg, 'y');
    const band = referenceLines(svg, '#2e7d32').map(value).sort((a, b) => a - b);
    expect(Math.abs(band[1]! - band[0]! - 2 * 0.005 * 50)).toBeLessThan(0.01);
    expect(svg).toContain('>mean ± 0.5 % of scale</text>');
  });

  it('states the half means to five digits, and the middle row of an odd window', () => {
    // Cd = 0.3 + 2e-5 n over 1…1000: halves 501–750 and 751–1000 average 0.3 + 2e-5 × 625.5 = 0.31251 and 0.31751.
    const line = historyCsv(range(1, 1000), { Cd: (n) => 0.3 + 2e-5 * n });
    const even = call('monitor', { path: str(PATH) }, { [PATH]: line });
    expect(even.remarks[0]).toBe('Over iterations 501 to 1000 (500 rows): first-half mean 0.31251, second-half mean 0.31751.');
    // A window of 501 holds 500…1000: halves of 250 rows (500–749, 751–1000), iteration 750 in neither.
    const odd = call('monitor', { path: str(PATH), window: num(501) }, { [PATH]: line });
    expect(odd.remarks[0]).toBe('Over iterations 500 to 1000 (501 rows): first-half mean 0.31249, second-half mean 0.31751; the middle row belongs to neither half.');
  });
});
