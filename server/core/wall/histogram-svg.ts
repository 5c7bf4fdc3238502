// Histogram of wall y+ (share of the wall per bin), with the target band
// shaded and the target marked. Bins are logarithmic when y+ spans a decade
// or more, since a run's y+ usually spreads over decades near stagnation points.
import { niceStep, px, svgDocument, text, verticalText } from '../shared/svg.js';
import { numberText } from '../shared/words.js';

export interface HistogramInput {
  values: readonly number[];
  weights: readonly number[];
  weighted: boolean;
  band: readonly [number, number];
  target: number;
}

const W = 440;
const H = 250;
const X0 = 56;
const X1 = 420;
const Y0 = 200;
const Y1 = 28;

/** About √n bins (a common choice), at least ten so that a small export still shows its shape. */
export function binCount(n: number): number {
  return Math.min(30, Math.max(10, Math.ceil(Math.sqrt(n))));
}

export function histogramSvg(h: HistogramInput): string {
  const min = Math.min(...h.values);
  const max = Math.max(...h.values);
  const log = min > 0 && max / min >= 10;
  const [lo, hi] = range(min, max, log);
  const n = binCount(h.values.length);
  const fwd = (v: number) => (log ? Math.log10(v) : v);
  const a = fwd(lo);
  const b = fwd(hi);
  const shares = new Array<number>(n).fill(0);
  const wsum = h.weights.reduce((s, w) => s + w, 0);
  h.values.forEach((v, i) => {
    const k = Math.min(n - 1, Math.max(0, Math.floor(((fwd(v) - a) / (b - a)) * n)));
    shares[k]! += h.weights[i]! / wsum;
  });
  const top = Math.max(...shares);
  const yStep = niceStep(top * 100, 4);
  const yTop = Math.ceil((top * 100) / yStep) * yStep;
  const xAt = (v: number) => X0 + ((fwd(Math.max(v, lo)) - a) / (b - a)) * (X1 - X0);
  const yAt = (pct: number) => Y0 - (pct / yTop) * (Y0 - Y1);
  const body: string[] = [];

  const bandL = Math.max(X0, Math.min(X1, xAt(h.band[0])));
  const bandR = Math.max(X0, Math.min(X1, xAt(Math.min(h.band[1], hi))));
  if (bandR > bandL) {
    body.push(`<rect x="${px(bandL)}" y="${px(Y1)}" width="${px(bandR - bandL)}" height="${px(Y0 - Y1)}" fill="#dcefd6"/>`);
    body.push(text((bandL + bandR) / 2, Y1 - 4, `band ${numberText(h.band[0])}–${numberText(h.band[1])}`, 'text-anchor="middle" fill="#2f6b2a" font-size="9"'));
  }
  for (let t = 0; t <= yTop * (1 + 1e-9); t += yStep) {
    body.push(`<path d="M${px(X0 - 4)} ${px(yAt(t))}H${px(X0)}" stroke="#555555" stroke-width="0.8"/>`);
    body.push(text(X0 - 6, yAt(t) + 3, `${numberText(t)} %`, 'text-anchor="end" font-size="9"'));
  }
  const bw = (X1 - X0) / n;
  shares.forEach((s, k) => {
    if (s === 0) return;
    const y = yAt(s * 100);
    body.push(`<rect x="${px(X0 + k * bw)}" y="${px(y)}" width="${px(bw)}" height="${px(Y0 - y)}" fill="#8fabd0" stroke="#34507a" stroke-width="0.6"/>`);
  });
  if (h.target >= lo && h.target <= hi) {
    const xt = xAt(h.target);
    body.push(`<path d="M${px(xt)} ${px(Y1)}V${px(Y0)}" stroke="#a33b20" stroke-width="1.2" stroke-dasharray="5 3" fill="none"/>`);
    body.push(text(xt + 3, Y1 + 10, `target ${numberText(h.target)}`, 'fill="#a33b20" font-size="9"'));
  }
  for (const t of xTicks(lo, hi, log)) {
    const x = xAt(t);
    body.push(`<path d="M${px(x)} ${px(Y0)}V${px(Y0 + 4)}" stroke="#555555" stroke-width="0.8"/>`);
    body.push(text(x, Y0 + 15, numberText(t), 'text-anchor="middle" font-size="9"'));
  }
  body.push(`<path d="M${px(X0)} ${px(Y1)}V${px(Y0)}H${px(X1)}" stroke="#555555" stroke-width="0.8" fill="none"/>`);
  body.push(text((X0 + X1) / 2, Y0 + 32, log ? 'y+ (log scale)' : 'y+', 'text-anchor="middle"'));
  const share = h.weighted ? 'share of wall area' : 'share of faces';
  body.push(verticalText(14, (Y0 + Y1) / 2, share, 'font-size="9"'));
  body.push(text(8, 16, `y+ over ${h.values.length} wall faces`, 'font-weight="bold"'));
  return svgDocument(W, H, `Histogram of y+ (${share})`, body);
}

/** Axis range: whole decades on a log axis, a little margin on a linear one. */
function range(min: number, max: number, log: boolean): [number, number] {
  if (log) return [Math.pow(10, Math.floor(Math.log10(min))), Math.pow(10, Math.ceil(Math.log10(max)))];
  if (max === min) return max === 0 ? [0, 1] : [min * 0.9, max * 1.1];
  const step = niceStep(max - min);
  return [Math.max(0, Math.floor(min / step) * step), Math.ceil(max / step) * step];
}

function xTicks(lo: number, hi: number, log: boolean): number[] {
  const out: number[] = [];
  if (log) {
    for (let k = Math.round(Math.log10(lo)); k <= Math.round(Math.log10(hi)); k++) out.push(Math.pow(10, k));
    return out;
  }
  const step = niceStep(hi - lo);
  for (let t = Math.ceil(lo / step) * step; t <= hi * (1 + 1e-9); t += step) out.push(Number(t.toPrecision(12)));
  return out;
}
