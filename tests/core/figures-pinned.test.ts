// The figures as drawn, pinned: layout, labels, ticks and decoration. Each was
// looked at in a browser when pinned; the geometry that carries numbers (to scale,
// where a value lands) is checked against its rule in shared-plot and wall-figures.
// A deliberate change of a picture: look at it, then `npx vitest run tests/core -u`.
import { describe, expect, it } from 'vitest';
import { linePlot } from '../../server/core/shared/plot.js';
import { histogramSvg } from '../../server/core/wall/histogram-svg.js';
import { stackSvg } from '../../server/core/wall/stack-svg.js';

const figures: Record<string, () => string> = {
  'stack-linear': () => stackSvg({ heights: Array.from({ length: 12 }, (_, i) => 0.5e-3 * 1.15 ** i), growth: 1.15, core: 2e-3, delta: 14e-3, scale: 'linear' }),
  'stack-log': () => stackSvg({ heights: Array.from({ length: 30 }, (_, i) => 20e-6 * 1.2 ** i), growth: 1.2, core: 8e-3, delta: 60e-3, scale: 'log' }),
  'stack-crowded': () => stackSvg({ heights: Array.from({ length: 60 }, (_, i) => 1e-6 * 1.15 ** i), growth: 1.15, scale: 'linear' }),
  'histogram-linear': () =>
    histogramSvg({ values: [0.6, 0.7, 1.2, 2.2, 4.9, 3.1, 0.9, 1.1], weights: [1, 1, 2, 4, 2, 1, 3, 1], weighted: true, band: [0.5, 5], target: 1 }),
  'histogram-log': () => histogramSvg({ values: [0.2, 0.8, 2, 5, 20, 45, 200, 350], weights: [1, 1, 1, 1, 1, 1, 1, 1], weighted: false, band: [30, 300], target: 50 }),
  'line-plot': () =>
    linePlot({
      title: 'Skin friction against Re',
      x: { label: 'Re_x', scale: 'log' },
      y: { label: 'c_f' },
      series: [
        { name: 'schlichting', points: [[1e5, 0.0061], [1e6, 0.0037], [1e7, 0.0026], [1e8, 0.0018]] },
        { name: 'power', points: [[1e5, 0.0059], [1e6, 0.0037], [1e7, 0.0024]], dashed: true, dots: true },
      ],
      references: [
        { axis: 'x', at: 5e5, label: 'transition' },
        { axis: 'y', at: 0.005, label: 'limit' },
      ],
    }),
};

describe('figures as drawn', () => {
  for (const [name, draw] of Object.entries(figures)) {
    it(name, async () => {
      await expect(draw()).toMatchFileSnapshot(`../fixtures/figures/${name}.svg`);
    });
  }
});
