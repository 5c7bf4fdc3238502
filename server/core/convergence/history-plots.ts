// Figures of a run's histories: every residual on a log axis, and a monitored
// quantity with its settling band. Series of 100,000 iterations are thinned
// (plot.ts's rule) before their points are built.
import { linePlot, thinnedIndices, type ReferenceLine, type Series } from '../shared/plot.js';
import { numberText, percentText } from '../shared/words.js';

export interface PlottedColumn {
  name: string;
  values: Float64Array;
  /** Rows to draw: 0 up to this (a blown-up field stops early). */
  upTo: number;
}

/** Points of one column (positive values only on a log axis), thinned to what a chart can show. */
export function historyPoints(iterations: Float64Array, values: Float64Array, upTo: number, positiveOnly: boolean): Array<[number, number]> {
  // A value a log axis cannot show reads as NaN, which no bucket picks as its lowest or highest.
  const yAt = positiveOnly ? (k: number) => (values[k]! > 0 ? values[k]! : NaN) : (k: number) => values[k]!;
  const out: Array<[number, number]> = [];
  for (const k of thinnedIndices(upTo, yAt)) if (!Number.isNaN(yAt(k))) out.push([iterations[k]!, values[k]!]);
  return out;
}

export function residualPlot(iterations: Float64Array, columns: readonly PlottedColumn[], windowStart: number): string {
  const series: Series[] = columns.map((c) => ({ name: c.name, points: historyPoints(iterations, c.values, c.upTo, true) }));
  return linePlot({
    title: 'Residuals',
    x: { label: 'iteration' },
    y: { label: 'residual', scale: 'log' },
    series,
    references: [{ axis: 'x', at: windowStart, label: 'fit window' }],
  });
}

/** The monitor figure shows this many windows back from the end, so the settling band stays readable. */
export const MONITOR_SPAN_WINDOWS = 3;

/** `band` is tol × the reference; `of` names the reference when it is not the mean ("of the scale"). */
export function monitorPlot(iterations: Float64Array, column: string, values: Float64Array, window: number, windowStart: number, mean: number, band: number, tol: number, of = ''): string {
  const last = iterations[iterations.length - 1]!;
  let from = iterations.length - 1;
  while (from > 0 && iterations[from - 1]! > last - MONITOR_SPAN_WINDOWS * window) from--;
  const references: ReferenceLine[] = [
    { axis: 'x', at: windowStart, label: 'window' },
    { axis: 'y', at: mean + band, label: `mean ± ${percentText(tol)}${of}`, colour: '#2e7d32' },
    { axis: 'y', at: mean - band, label: '', colour: '#2e7d32' },
  ];
  return linePlot({
    title: `${column} over the run (window mean ${numberText(mean, { digits: 4 })})`,
    x: { label: 'iteration' },
    y: { label: column },
    series: [{ name: column, points: historyPoints(iterations.subarray(from), values.subarray(from), values.length - from, false) }],
    references,
  });
}
