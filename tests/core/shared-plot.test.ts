// The line charts and SVG helpers every family's figures use: a value lands where
// the axis puts it (linearly, or by decades on a log axis), ticks are 1, 2 or 5 × 10^k
// (common practice for readable axes), and text is escaped.
import { describe, expect, it } from 'vitest';
import { linePlot, PALETTE, type LinePlot } from '../../server/core/shared/plot.js';
import { niceStep, px, svgDocument, text, verticalText } from '../../server/core/shared/svg.js';

// The plotting frame: 520 × 300 with margins left 64, right 16, top 30, bottom 46.
const X0 = 64;
const X1 = 520 - 16;
const Y0 = 300 - 46;
const Y1 = 30;

function paths(svg: string): string[] {
  return [...svg.matchAll(/<path d="([^"]+)"([^>]*)\/>/g)].map((m) => `${m[1]}|${m[2]}`);
}

const base: LinePlot = {
  title: 'Drag against speed',
  x: { label: 'U (m/s)', min: 0, max: 10 },
  y: { label: 'F (N)', min: 0, max: 100 },
  series: [{ name: 'drag', points: [[0, 0], [5, 50], [10, 100]] }],
};

describe('svg helpers', () => {
  it('writes coordinates with one decimal and never "-0.0"', () => {
    expect(px(1.25)).toBe('1.3');
    expect(px(-0.04)).toBe('0.0');
    expect(px(-2)).toBe('-2.0');
  });

  it('picks tick steps of 1, 2 or 5 × 10^k near range/target', () => {
    expect(niceStep(10)).toBe(2);
    expect(niceStep(7.4, 1)).toBe(5);
    expect(niceStep(7.6, 1)).toBe(10);
    expect(niceStep(1.49, 1)).toBe(1);
    expect(niceStep(1.5, 1)).toBe(2);
    expect(niceStep(3.49, 1)).toBe(2);
    expect(niceStep(3.5, 1)).toBe(5);
    expect(niceStep(0.03, 3)).toBeCloseTo(0.01, 15);
  });

  it('escapes text and builds a titled document', () => {
    expect(text(1, 2, 'a<b')).toBe('<text x="1.0" y="2.0">a&lt;b</text>');
    expect(text(1, 2, 'x', 'fill="red"')).toBe('<text x="1.0" y="2.0" fill="red">x</text>');
    expect(verticalText(3, 4, 'y&z')).toBe('<text x="0" y="0" transform="translate(3.0 4.0) rotate(-90)" text-anchor="middle">y&amp;z</text>');
    expect(verticalText(3, 4, 'y', 'font-size="9"')).toContain('text-anchor="middle" font-size="9">y</text>');
    const doc = svgDocument(100, 50, 'T<1>', ['<g/>']);
    expect(doc.split('\n')).toEqual([
      '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 50" width="100" height="50" role="img" font-family="sans-serif" font-size="12">',
      '<title>T&lt;1&gt;</title>',
      '<rect x="0" y="0" width="100" height="50" fill="#ffffff"/>',
      '<g/>',
      '</svg>',
    ]);
  });
});

describe('line charts', () => {
  it('puts each point where the linear axes say', () => {
    const svg = linePlot(base);
    const line = paths(svg).find((d) => d.includes('stroke-width="1.4"'))!;
    // x: 0..10 over X0..X1; y: 0..100 over Y0..Y1 (upwards).
    expect(line.split('|')[0]).toBe(`M${px(X0)} ${px(Y0)}L${px((X0 + X1) / 2)} ${px((Y0 + Y1) / 2)}L${px(X1)} ${px(Y1)}`);
    expect(line).toContain(`stroke="${PALETTE[0]}"`);
    // The frame: the y axis up the left and the x axis along the bottom.
    expect(paths(svg)).toContain(`M${px(X0)} ${px(Y1)}V${px(Y0)}H${px(X1)}| stroke="#444444" stroke-width="0.9" fill="none"`);
    expect(svg).toContain('<title>Drag against speed</title>');
    expect(svg).toContain(text((X0 + X1) / 2, Y0 + 32, 'U (m/s)', 'text-anchor="middle"'));
    expect(svg).toContain(verticalText(14, (Y1 + Y0) / 2, 'F (N)'));
  });

  it('ticks every 2 from 0 to 10 and every 20 from 0 to 100, with grid lines', () => {
    const svg = linePlot(base);
    const xTicks = [...svg.matchAll(/<text x="([\d.]+)" y="268.0" text-anchor="middle" font-size="10">([^<]+)<\/text>/g)].map((m) => m[2]);
    expect(xTicks).toEqual(['0', '2', '4', '6', '8', '10']);
    const yTicks = [...svg.matchAll(/text-anchor="end" font-size="10">([^<]+)<\/text>/g)].map((m) => m[1]);
    expect(yTicks).toEqual(['0', '20', '40', '60', '80', '100']);
    expect(paths(svg)).toContain(`M${px(X0 + (X1 - X0) * 0.2)} ${px(Y1)}V${px(Y0)}| stroke="#e4e4e4" stroke-width="0.6"`);
    expect(paths(svg)).toContain(`M${px(X0)} ${px(Y0 - (Y0 - Y1) * 0.2)}H${px(X1)}| stroke="#e4e4e4" stroke-width="0.6"`);
  });

  it('without a forced range takes the data\'s, rounded out to whole steps', () => {
    const svg = linePlot({ ...base, x: { label: 'x' }, y: { label: 'y' }, series: [{ name: 's', points: [[1, 3], [9, 7]] }] });
    const line = paths(svg).find((d) => d.includes('stroke-width="1.4"'))!.split('|')[0]!;
    // x 1..9: step 2, axis 0..10; y 3..7: step 1, axis 3..7.
    expect(line).toBe(`M${px(X0 + (X1 - X0) * 0.1)} ${px(Y0)}L${px(X0 + (X1 - X0) * 0.9)} ${px(Y1)}`);
  });

  it('spreads a flat series by 10 % around its value, or by 1 around zero', () => {
    const flat = linePlot({ ...base, y: { label: 'y' }, series: [{ name: 's', points: [[0, 5], [10, 5]] }] });
    const y = Number(/L504.0 ([\d.]+)/.exec(flat)![1]);
    expect(y).toBeCloseTo((Y0 + Y1) / 2, 1);
    const zero = linePlot({ ...base, y: { label: 'y' }, series: [{ name: 's', points: [[0, 0], [10, 0]] }] });
    expect(Number(/L504.0 ([\d.]+)/.exec(zero)![1])).toBeCloseTo((Y0 + Y1) / 2, 1);
  });

  it('on a log axis spaces decades evenly and drops points it cannot draw', () => {
    const svg = linePlot({
      ...base,
      x: { label: 'Re', scale: 'log' },
      series: [{ name: 's', points: [[10, 0], [100, 50], [1000, 100], [0, 10], [Number.NaN, 1], [100, Number.POSITIVE_INFINITY]] }],
    });
    const line = paths(svg).find((d) => d.includes('stroke-width="1.4"'))!.split('|')[0]!;
    expect(line).toBe(`M${px(X0)} ${px(Y0)}L${px((X0 + X1) / 2)} ${px((Y0 + Y1) / 2)}L${px(X1)} ${px(Y1)}`);
    const ticks = [...svg.matchAll(/y="268.0" text-anchor="middle" font-size="10">([^<]+)</g)].map((m) => m[1]);
    expect(ticks).toEqual(['10', '100', '1000']);
    expect(svg).toContain('Re (log scale)');
    // A log y axis drops the point at zero too.
    const logY = linePlot({ ...base, y: { label: 'y', scale: 'log' }, series: [{ name: 's', points: [[0, 0], [5, 1], [10, 10]] }] });
    expect(paths(logY).find((d) => d.includes('stroke-width="1.4"'))!.split('|')[0]).toBe(`M${px((X0 + X1) / 2)} ${px(Y0)}L${px(X1)} ${px(Y1)}`);
  });

  it('on a log axis over many decades ticks at most about eight of them', () => {
    const svg = linePlot({ ...base, x: { label: 'Re', scale: 'log' }, series: [{ name: 's', points: [[1, 1], [1e20, 2]] }] });
    const ticks = [...svg.matchAll(/y="268.0" text-anchor="middle" font-size="10">([^<]+)</g)].map((m) => m[1]);
    expect(ticks).toEqual(['1', '1000', '1e6', '1e9', '1e12', '1e15', '1e18']);
  });

  it('a log axis with one value, or none above zero, still spans a decade', () => {
    const one = linePlot({ ...base, x: { label: 'x', scale: 'log' }, series: [{ name: 's', points: [[100, 1]] }] });
    expect([...one.matchAll(/y="268.0" text-anchor="middle" font-size="10">([^<]+)</g)].map((m) => m[1])).toEqual(['100', '1000']);
    const none = linePlot({ ...base, x: { label: 'x', scale: 'log', min: 0, max: 0 }, series: [{ name: 's', points: [[0, 1]] }] });
    expect([...none.matchAll(/y="268.0" text-anchor="middle" font-size="10">([^<]+)</g)].map((m) => m[1])).toEqual(['1', '10']);
  });

  it('draws a single point as a dot, dots when asked, dashed lines, and a legend for several series', () => {
    const svg = linePlot({
      ...base,
      series: [
        { name: 'one', points: [[5, 50]] },
        { name: 'two', points: [[0, 0], [10, 100]], dashed: true, dots: true, colour: '#123456' },
        { name: 'hidden', points: [[0, 10], [10, 20]], line: false },
      ],
    });
    // The legend takes one row of up to three entries above the plot, which starts 13 px lower.
    const top = Y1 + 13;
    expect(svg).toContain(`<circle cx="${px((X0 + X1) / 2)}" cy="${px((Y0 + top) / 2)}" r="2.6" fill="${PALETTE[0]}"/>`);
    expect(svg).toContain(`<circle cx="${px(X0)}" cy="${px(Y0)}" r="2.6" fill="#123456"/>`);
    expect(paths(svg).filter((d) => d.includes('stroke-width="1.4"'))).toEqual([`M${px(X0)} ${px(Y0)}L${px(X1)} ${px(top)}| stroke="#123456" stroke-width="1.4" fill="none" stroke-dasharray="6 3"`]);
    expect(svg).not.toContain(`fill="${PALETTE[2]}"`);
    expect(svg).toContain(text(X0 + 20, Y1, 'one', 'font-size="10"'));
    expect(svg).toContain(text(X0 + (X1 - X0) / 3 + 20, Y1, 'two', 'font-size="10"'));
    expect(paths(svg)).toContain(`M${px(X0 + (X1 - X0) / 3)} ${px(Y1 - 3.5)}h16| stroke="#123456" stroke-width="2" stroke-dasharray="5 2"`);
    expect(paths(svg)).toContain(`M${px(X0)} ${px(top)}V${px(Y0)}H${px(X1)}| stroke="#444444" stroke-width="0.9" fill="none"`);
    // A fourth series starts a second legend row; one series alone has no legend.
    const four = linePlot({ ...base, series: [1, 2, 3, 4].map((k) => ({ name: `s${k}`, points: [[0, k], [10, k]] as Array<[number, number]> })) });
    expect(four).toContain(text(X0 + 20, Y1 + 13, 's4', 'font-size="10"'));
    expect(four).toContain(`stroke="${PALETTE[3]}"`);
    expect(linePlot(base)).not.toContain('>drag</text>');
  });

  it('draws reference lines, dashed, with their labels, and takes their values into the range', () => {
    const svg = linePlot({
      ...base,
      x: { label: 'x' },
      references: [
        { axis: 'y', at: 100, label: 'limit' },
        { axis: 'x', at: 20, label: 'end', colour: '#ff0000' },
      ],
    });
    expect(paths(svg)).toContain(`M${px(X0)} ${px(Y1)}H${px(X1)}| stroke="#777777" stroke-width="1" stroke-dasharray="5 3" fill="none"`);
    expect(svg).toContain(text(X1 - 4, Y1 - 4, 'limit', 'text-anchor="end" font-size="10" fill="#777777"'));
    // x now runs to 20, where the vertical reference sits at the right end.
    expect(paths(svg)).toContain(`M${px(X1)} ${px(Y1)}V${px(Y0)}| stroke="#ff0000" stroke-width="1" stroke-dasharray="5 3" fill="none"`);
    expect(svg).toContain(text(X1 + 4, Y1 + 11, 'end', 'font-size="10" fill="#ff0000"'));
  });

  it('thins a long series to 1200 points, keeping each bucket\'s lowest and highest', () => {
    const points: Array<[number, number]> = Array.from({ length: 6000 }, (_, i) => [i, i === 3001 ? 1000 : i % 7]);
    const svg = linePlot({ ...base, x: { label: 'x', min: 0, max: 6000 }, y: { label: 'y', min: 0, max: 1000 }, series: [{ name: 's', points }] });
    const d = paths(svg).find((p) => p.includes('stroke-width="1.4"'))!.split('|')[0]!;
    expect(d.match(/[ML]/g)!.length).toBe(1200);
    // The spike at x = 3001 survives the thinning, at the top of the plot.
    expect(d).toContain(`L${px(X0 + (3001 / 6000) * (X1 - X0))} ${px(Y1)}`);
    // Within a bucket the two kept points stay in x order.
    const xs = [...d.matchAll(/[ML]([\d.]+) /g)].map((m) => Number(m[1]));
    expect(xs.every((x, k) => k === 0 || x >= xs[k - 1]!)).toBe(true);
  });

  it('a custom tick format and size, and escaped labels', () => {
    const svg = linePlot({ ...base, title: '<b>', width: 300, height: 200, x: { label: 'x', min: 0, max: 10, format: (v) => `${v} s` } });
    expect(svg).toContain('viewBox="0 0 300 200"');
    expect(svg).toContain('>10 s</text>');
    expect(svg).toContain('<title>&lt;b&gt;</title>');
    expect(svg).not.toContain('<b>');
  });

  it('keeps the eight palette colours in their order and starts again after them', () => {
    expect(PALETTE).toEqual(['#1f5fa8', '#c0392b', '#2e7d32', '#8e44ad', '#d35400', '#00838f', '#6d4c41', '#455a64']);
    const nine = linePlot({ ...base, series: Array.from({ length: 9 }, (_, k) => ({ name: `s${k}`, points: [[0, k], [10, k]] as Array<[number, number]> })) });
    const colours = paths(nine).filter((d) => d.includes('stroke-width="1.4"')).map((d) => /stroke="([^"]+)"/.exec(d)![1]);
    expect(colours).toEqual([...PALETTE, PALETTE[0]]);
  });

  it('a series of exactly 1200 points is drawn whole', () => {
    const points: Array<[number, number]> = Array.from({ length: 1200 }, (_, i) => [i, i % 3]);
    const d = paths(linePlot({ ...base, x: { label: 'x', min: 0, max: 1200 }, y: { label: 'y', min: 0, max: 2 }, series: [{ name: 's', points }] })).find((p) => p.includes('stroke-width="1.4"'))!;
    expect(d.split('|')[0]!.match(/[ML]/g)!.length).toBe(1200);
  });

  it('thinning keeps each bucket\'s first lowest and first highest point, in x order', () => {
    // The rule written out: 600 buckets of points.length/600 points each.
    const points: Array<[number, number]> = Array.from({ length: 3000 }, (_, i) => [i, Math.round(10 * Math.sin(i / 7)) + (i === 1500 ? -40 : 0)]);
    const want: Array<[number, number]> = [];
    const size = points.length / 600;
    for (let b = 0; b < 600; b++) {
      const bucket = points.slice(Math.floor(b * size), Math.floor((b + 1) * size));
      let lo = bucket[0]!;
      let hi = bucket[0]!;
      for (const q of bucket) {
        if (q[1] < lo[1]) lo = q;
        if (q[1] > hi[1]) hi = q;
      }
      want.push(...(lo[0] <= hi[0] ? [lo, hi] : [hi, lo]));
    }
    const x = { label: 'x', min: 0, max: 3000 };
    const y = { label: 'y', min: -50, max: 10 };
    const got = paths(linePlot({ ...base, x, y, series: [{ name: 's', points }] })).find((p) => p.includes('stroke-width="1.4"'))!.split('|')[0];
    const drawn = paths(linePlot({ ...base, x, y, series: [{ name: 's', points: want }] })).find((p) => p.includes('stroke-width="1.4"'))!.split('|')[0];
    expect(got).toBe(drawn);
  });

  it('on a log axis a range forced to start at zero starts a decade below its top, and one ending at zero a decade above its start', () => {
    const ticksOf = (svg: string) => [...svg.matchAll(/y="268.0" text-anchor="middle" font-size="10">([^<]+)</g)].map((m) => m[1]);
    expect(ticksOf(linePlot({ ...base, x: { label: 'x', scale: 'log', min: 0, max: 1000 } }))).toEqual(['100', '1000']);
    expect(ticksOf(linePlot({ ...base, x: { label: 'x', scale: 'log', min: 5, max: 0 } }))).toEqual(['1', '10', '100']);
    // Nine decades from 1e-3: a tick every second decade.
    expect(ticksOf(linePlot({ ...base, x: { label: 'x', scale: 'log', min: 1e-3, max: 1e6 } }))).toEqual(['0.001', '0.1', '10', '1000', '100000']);
  });

  it('spreads a flat series of 5 to 4.5–5.5 and puts its ticks on whole steps of 0.2', () => {
    const flat = linePlot({ ...base, y: { label: 'y' }, series: [{ name: 's', points: [[0, 5], [10, 5]] }] });
    const yTicks = [...flat.matchAll(/text-anchor="end" font-size="10">([^<]+)<\/text>/g)].map((m) => m[1]);
    expect(yTicks).toEqual(['4.4', '4.6', '4.8', '5', '5.2', '5.4', '5.6']);
    expect(flat).toContain(text(X0 - 5, Y0 + 3.5, '4.4', 'text-anchor="end" font-size="10"'));
  });
});
