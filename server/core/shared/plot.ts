// Line charts for trade-function figures: one or more series of points on
// linear or logarithmic axes, with ticks, axis labels, a legend and optional
// horizontal or vertical reference lines. Pure SVG text, no script; every
// label goes through the one escaper (in text()).
import { niceStep, px, svgDocument, text, verticalText } from './svg.js';
import { numberText } from './words.js';

export type AxisScale = 'linear' | 'log';

export interface Axis {
  label: string;
  scale?: AxisScale;
  /** Forced range; by default the data's range (with whole decades on a log axis). */
  min?: number;
  max?: number;
  /** Tick text; by default numberText. */
  format?: (v: number) => string;
}

export interface Series {
  name: string;
  points: ReadonlyArray<readonly [number, number]>;
  colour?: string;
  dashed?: boolean;
  /** Draw a dot at each point instead of (or besides) the line. */
  dots?: boolean;
  line?: boolean;
}

export interface ReferenceLine {
  /** 'x': a vertical line at `at`; 'y': a horizontal one. */
  axis: 'x' | 'y';
  at: number;
  label: string;
  colour?: string;
}

export interface LinePlot {
  title: string;
  x: Axis;
  y: Axis;
  series: readonly Series[];
  references?: readonly ReferenceLine[];
  width?: number;
  height?: number;
}

/** Colours that stay apart in print and for most colour-blind readers. */
export const PALETTE = ['#1f5fa8', '#c0392b', '#2e7d32', '#8e44ad', '#d35400', '#00838f', '#6d4c41', '#455a64'];

const MARGIN = { left: 64, right: 16, top: 30, bottom: 46 };
/** At most this many points per series are drawn; longer series are thinned evenly (min and max of each bucket kept). */
export const MAX_POINTS = 1200;

interface Mapped {
  at(v: number): number;
  ticks: number[];
  lo: number;
  hi: number;
}

export function linePlot(p: LinePlot): string {
  const width = p.width ?? 520;
  const height = p.height ?? 300;
  const x0 = MARGIN.left;
  const x1 = width - MARGIN.right;
  const y0 = height - MARGIN.bottom;
  const y1 = MARGIN.top;
  const legendRows = p.series.length > 1 ? Math.ceil(p.series.length / 3) : 0;
  const top = y1 + legendRows * 13;
  const xs = p.series.flatMap((s) => s.points.map((q) => q[0]));
  const ys = p.series.flatMap((s) => s.points.map((q) => q[1]));
  for (const r of p.references ?? []) (r.axis === 'x' ? xs : ys).push(r.at);
  const xm = mapAxis(p.x, xs, x0, x1);
  const ym = mapAxis(p.y, ys, y0, top);
  const body: string[] = [];
  body.push(text(8, 16, p.title, 'font-weight="bold" font-size="12"'));
  // Grid and ticks.
  for (const t of xm.ticks) {
    const x = xm.at(t);
    body.push(`<path d="M${px(x)} ${px(top)}V${px(y0)}" stroke="#e4e4e4" stroke-width="0.6"/>`);
    body.push(text(x, y0 + 14, (p.x.format ?? defaultFormat)(t), 'text-anchor="middle" font-size="10"'));
  }
  for (const t of ym.ticks) {
    const y = ym.at(t);
    body.push(`<path d="M${px(x0)} ${px(y)}H${px(x1)}" stroke="#e4e4e4" stroke-width="0.6"/>`);
    body.push(text(x0 - 5, y + 3.5, (p.y.format ?? defaultFormat)(t), 'text-anchor="end" font-size="10"'));
  }
  body.push(`<path d="M${px(x0)} ${px(top)}V${px(y0)}H${px(x1)}" stroke="#444444" stroke-width="0.9" fill="none"/>`);
  body.push(text((x0 + x1) / 2, y0 + 32, axisLabel(p.x), 'text-anchor="middle"'));
  body.push(verticalText(14, (top + y0) / 2, axisLabel(p.y)));
  // Reference lines under the data.
  for (const r of p.references ?? []) {
    const colour = r.colour ?? '#777777';
    if (r.axis === 'y') {
      const y = ym.at(r.at);
      body.push(`<path d="M${px(x0)} ${px(y)}H${px(x1)}" stroke="${colour}" stroke-width="1" stroke-dasharray="5 3" fill="none"/>`);
      body.push(text(x1 - 4, y - 4, r.label, `text-anchor="end" font-size="10" fill="${colour}"`));
    } else {
      const x = xm.at(r.at);
      body.push(`<path d="M${px(x)} ${px(top)}V${px(y0)}" stroke="${colour}" stroke-width="1" stroke-dasharray="5 3" fill="none"/>`);
      body.push(text(x + 4, top + 11, r.label, `font-size="10" fill="${colour}"`));
    }
  }
  p.series.forEach((s, i) => {
    const colour = s.colour ?? PALETTE[i % PALETTE.length]!;
    const pts = thin(s.points.filter((q) => drawable(q, p)));
    if (s.line !== false && pts.length > 1) {
      const d = pts.map((q, k) => `${k === 0 ? 'M' : 'L'}${px(xm.at(q[0]))} ${px(ym.at(q[1]))}`).join('');
      body.push(`<path d="${d}" stroke="${colour}" stroke-width="1.4" fill="none"${s.dashed ? ' stroke-dasharray="6 3"' : ''}/>`);
    }
    if (s.dots || pts.length === 1) {
      for (const q of pts) body.push(`<circle cx="${px(xm.at(q[0]))}" cy="${px(ym.at(q[1]))}" r="2.6" fill="${colour}"/>`);
    }
  });
  if (legendRows) {
    p.series.forEach((s, i) => {
      const colour = s.colour ?? PALETTE[i % PALETTE.length]!;
      const lx = x0 + (i % 3) * ((x1 - x0) / 3);
      const ly = y1 + Math.floor(i / 3) * 13;
      body.push(`<path d="M${px(lx)} ${px(ly - 3.5)}h16" stroke="${colour}" stroke-width="2"${s.dashed ? ' stroke-dasharray="5 2"' : ''}/>`);
      body.push(text(lx + 20, ly, s.name, 'font-size="10"'));
    });
  }
  return svgDocument(width, height, p.title, body);
}

function axisLabel(a: Axis): string {
  return a.scale === 'log' ? `${a.label} (log scale)` : a.label;
}

function defaultFormat(v: number): string {
  return numberText(v);
}

/** A point can be drawn: finite, and positive on a log axis. */
function drawable(q: readonly [number, number], p: LinePlot): boolean {
  const [x, y] = q;
  if (!Number.isFinite(x) || !Number.isFinite(y)) return false;
  if (p.x.scale === 'log' && !(x > 0)) return false;
  if (p.y.scale === 'log' && !(y > 0)) return false;
  return true;
}

/** Keeps a long series to MAX_POINTS points, each bucket's lowest and highest kept so spikes stay visible. */
function thin(points: ReadonlyArray<readonly [number, number]>): ReadonlyArray<readonly [number, number]> {
  if (points.length <= MAX_POINTS) return points;
  return thinnedIndices(points.length, (k) => points[k]![1]).map((k) => points[k]!);
}

/**
 * Which of `count` points (in x order, y given by `yAt`) a chart draws: all of
 * them up to MAX_POINTS, else each bucket's lowest and highest in x order. For
 * series too long to build as points first (a 100,000-iteration history). A y
 * of NaN (a point the chart cannot draw) is picked only from a bucket of nothing else.
 */
export function thinnedIndices(count: number, yAt: (k: number) => number): number[] {
  if (count <= MAX_POINTS) return Array.from({ length: count }, (_, k) => k);
  const buckets = MAX_POINTS / 2;
  const size = count / buckets;
  const out: number[] = [];
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor(b * size);
    const to = Math.min(count, Math.floor((b + 1) * size));
    let lo = from;
    let hi = from;
    let yLo = yAt(from);
    let yHi = yLo;
    for (let k = from + 1; k < to; k++) {
      const y = yAt(k);
      if (Number.isNaN(y)) continue;
      if (y < yLo || Number.isNaN(yLo)) {
        lo = k;
        yLo = y;
      }
      if (y > yHi || Number.isNaN(yHi)) {
        hi = k;
        yHi = y;
      }
    }
    if (lo <= hi) out.push(lo, hi);
    else out.push(hi, lo);
  }
  return out;
}

function mapAxis(a: Axis, values: number[], from: number, to: number): Mapped {
  const finite = values.filter((v) => Number.isFinite(v) && (a.scale !== 'log' || v > 0));
  let lo = a.min ?? (finite.length ? Math.min(...finite) : 0);
  let hi = a.max ?? (finite.length ? Math.max(...finite) : 1);
  if (a.scale === 'log') {
    if (!(lo > 0)) lo = hi > 0 ? hi / 10 : 1;
    if (!(hi > 0)) hi = lo * 10;
    const dlo = Math.floor(Math.log10(lo) + 1e-9);
    let dhi = Math.ceil(Math.log10(hi) - 1e-9);
    if (dhi <= dlo) dhi = dlo + 1;
    const every = Math.max(1, Math.ceil((dhi - dlo) / 8));
    const ticks: number[] = [];
    for (let k = dlo; k <= dhi; k += every) ticks.push(Math.pow(10, k));
    const at = (v: number) => from + ((Math.log10(v) - dlo) / (dhi - dlo)) * (to - from);
    return { at, ticks, lo: Math.pow(10, dlo), hi: Math.pow(10, dhi) };
  }
  if (hi === lo) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= pad;
    hi += pad;
  }
  const step = niceStep(hi - lo);
  const tlo = a.min ?? Math.floor(lo / step) * step;
  const thi = a.max ?? Math.ceil(hi / step) * step;
  const ticks: number[] = [];
  for (let t = Math.ceil(tlo / step) * step; t <= thi + step * 1e-9; t += step) ticks.push(Number(t.toPrecision(12)));
  const at = (v: number) => from + ((v - tlo) / (thi - tlo)) * (to - from);
  return { at, ticks, lo: tlo, hi: thi };
}
