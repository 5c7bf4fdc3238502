// The figures as drawn, pinned: layout, labels, ticks and decoration. Each was
// looked at in a browser when pinned; the geometry that carries numbers (to scale,
// where a value lands) is checked against its rule in shared-plot and wall-figures.
// A deliberate change of a picture: look at it, then `npx vitest run tests/core -u`.
import { describe, expect, it } from 'vitest';
import { linePlot } from '../../server/core/shared/plot.js';
import { histogramSvg } from '../../server/core/wall/histogram-svg.js';
import { stackSvg } from '../../server/core/wall/stack-svg.js';
import { domainBox, type DomainInput } from '../../server/core/domain/box.js';
import { domainSvg } from '../../server/core/domain/domain-svg.js';
import { richardsHoxey } from '../../server/core/boundaries/abl-profile.js';
import { profileSvg } from '../../server/core/boundaries/profile-plot.js';
import { monitorPlot, residualPlot } from '../../server/core/convergence/history-plots.js';

function domainFigure(input: DomainInput): string {
  const d = domainBox(input);
  return domainSvg({ body: input.body, ...d, ground: input.ground, rule: input.rule, blockage: d.blockage });
}

/** Iterations 1 … n and a column from a formula, as a history file holds them. */
function run(n: number, f: (i: number) => number): [Float64Array, Float64Array] {
  const it = Float64Array.from({ length: n }, (_, k) => k + 1);
  return [it, it.map(f)];
}

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
  // A building block by COST 732 with a wide slab's blockage warning, and a vehicle-sized body clear of the floor.
  'domain-ground': () => domainFigure({ body: [20, 10, 10], rule: 'cost732', given: {}, ground: true }),
  'domain-floating': () => domainFigure({ body: [4, 2, 1], rule: 'three-lengths', given: { downstream: 30 }, ground: false }),
  'domain-narrow': () => domainFigure({ body: [10, 40, 10], rule: 'aij', given: { upstream: 2 }, ground: true }),
  'abl-profile': () => profileSvg({ profile: richardsHoxey(10, 10, 0.3), heights: [2, 5, 10, 20, 50, 100], z_ref: 10, z_min: 5 }),
  'abl-profile-plain': () => profileSvg({ profile: richardsHoxey(25, 60, 0.01), heights: [10], z_ref: 60 }),
  residuals: () => {
    const [it, p] = run(400, (i) => Math.pow(0.98, i));
    const [, u] = run(400, (i) => 0.5 * Math.pow(0.99, i) * (1 + 0.3 * Math.sin(i / 5)));
    return residualPlot(it, [{ name: 'p', values: p, upTo: 400 }, { name: 'Ux', values: u, upTo: 250 }], 300);
  },
  monitor: () => {
    const [it, cd] = run(900, (i) => 0.31 + 0.05 * Math.exp(-i / 150) + 0.002 * Math.sin(i / 7));
    return monitorPlot(it, 'Cd', cd, 200, 701, 0.3102, 0.3102 * 0.01, 0.01);
  },
  'monitor-scale': () => {
    const [it, cl] = run(300, (i) => 0.004 * Math.sin(i / 9));
    return monitorPlot(it, 'Cl', cl, 100, 201, 0.0001, 0.3 * 0.02, 0.02, ' of scale');
  },
};

describe('figures as drawn', () => {
  for (const [name, draw] of Object.entries(figures)) {
    it(name, async () => {
      await expect(draw()).toMatchFileSnapshot(`../fixtures/figures/${name}.svg`);
    });
  }
});
