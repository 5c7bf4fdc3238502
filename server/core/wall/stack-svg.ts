// Picture of a wall-layer stack standing on the wall, to scale, with the
// boundary-layer edge drawn. A log axis shows the thin first layers that a
// linear axis squeezes into the wall line.
import { niceStep, px, svgDocument, text, verticalText } from '../shared/svg.js';
import { countText, lengthText, numberText } from '../shared/words.js';

export type StackScale = 'linear' | 'log';

export interface StackPicture {
  heights: readonly number[];
  growth: number;
  delta?: number;
  core?: number;
  scale: StackScale;
}

const W = 440;
const H = 320;
const TOP = 28;
const WALL = 280;
const AXIS_X = 72;
const LEFT = 84;
const RIGHT = 250;
/** Layer lines closer than this to the last one drawn would only blacken the picture. */
const MIN_LINE_GAP = 0.8;

export function stackSvg(p: StackPicture): string {
  const tops: number[] = [];
  let y = 0;
  for (const h of p.heights) tops.push((y += h));
  const total = y;
  const first = p.heights[0]!;
  const upper = Math.max(total + (p.core ?? 0), p.delta ?? 0);
  const map = p.scale === 'log' ? logMap(first, upper) : linearMap(upper);
  const body: string[] = [];

  body.push(...axis(map, p.scale));
  body.push(`<rect x="${px(LEFT)}" y="${px(map.at(total))}" width="${px(RIGHT - LEFT)}" height="${px(WALL - map.at(total))}" fill="#e3ebf4" stroke="#33475b" stroke-width="0.8"/>`);
  let lastLine = WALL;
  let skipped = 0;
  const lines: string[] = [];
  for (const t of tops.slice(0, -1)) {
    const yy = map.at(t);
    if (lastLine - yy < MIN_LINE_GAP) {
      skipped++;
      continue;
    }
    lines.push(`M${px(LEFT)} ${px(yy)}H${px(RIGHT)}`);
    lastLine = yy;
  }
  if (lines.length) body.push(`<path d="${lines.join('')}" stroke="#33475b" stroke-width="0.5" fill="none"/>`);

  const labels: Label[] = [
    { y: map.at(total) + 4, text: `total ${lengthText(total)}` },
    { y: map.at(first) + 4, text: `first ${lengthText(first)}` },
  ];
  if (p.heights.length > 1) {
    const last = p.heights[p.heights.length - 1]!;
    labels.push({ y: (map.at(total) + map.at(total - last)) / 2 + 4, text: `last ${lengthText(last)}`, optional: true });
  }
  if (p.core !== undefined) {
    const yc = map.at(total + p.core);
    body.push(`<rect x="${px(LEFT)}" y="${px(yc)}" width="${px(RIGHT - LEFT)}" height="${px(map.at(total) - yc)}" fill="none" stroke="#33475b" stroke-width="0.8" stroke-dasharray="4 3"/>`);
    labels.push({ y: yc + 4, text: `core cell ${lengthText(p.core)}` });
  }
  body.push(...wallLine());
  if (p.delta !== undefined) {
    const yd = map.at(p.delta);
    body.push(`<path d="M${px(LEFT - 8)} ${px(yd)}H${px(W - 12)}" stroke="#a33b20" stroke-width="1.2" stroke-dasharray="6 3" fill="none"/>`);
    labels.push({ y: yd - 4, text: `boundary-layer edge δ = ${lengthText(p.delta)}`, colour: '#a33b20' });
  }
  for (const l of placeLabels(labels)) body.push(text(RIGHT + 6, l.y, l.text, l.colour ? `fill="${l.colour}"` : ''));
  const heading = `${p.heights.length} layers, growth ${numberText(p.growth)} (${p.scale} scale)`;
  body.push(text(8, 16, heading, 'font-weight="bold"'));
  const notes = [...(p.scale === 'log' ? ['log axis: the wall lies below its lowest tick'] : []), ...(skipped ? [`${countText(skipped, 'layer line')} thinner than a pixel ${skipped === 1 ? 'is' : 'are'} not drawn separately`] : [])];
  notes.forEach((n, i) => body.push(text(8, H - 8 - 14 * (notes.length - 1 - i), n, 'font-size="11"')));
  return svgDocument(W, H, `Wall-layer stack: ${heading}`, body);
}

interface Label {
  y: number;
  text: string;
  /** Dropped rather than moved when it would collide with another label. */
  optional?: boolean;
  colour?: string;
}

const LABEL_GAP = 12;

/**
 * Labels beside the stack, kept apart: optional ones that crowd another are
 * dropped, the rest are pushed up from the wall label, then down from the top.
 */
function placeLabels(labels: Label[]): Label[] {
  const fixed = labels.filter((l) => !l.optional);
  const kept = labels.filter((l) => !l.optional || fixed.every((f) => Math.abs(f.y - l.y) >= LABEL_GAP));
  const placed = [...kept].sort((a, b) => b.y - a.y).map((l) => ({ ...l }));
  let floor = WALL + 6; // the wall's own label
  for (const l of placed) floor = l.y = Math.min(l.y, floor - LABEL_GAP);
  let ceiling = TOP - 6 - LABEL_GAP;
  for (const l of [...placed].reverse()) ceiling = l.y = Math.max(l.y, ceiling + LABEL_GAP);
  return placed;
}

interface AxisMap {
  at(y: number): number;
  ticks: number[];
}

function linearMap(upper: number): AxisMap {
  const step = niceStep(upper);
  const top = Math.ceil((upper * 1.02) / step) * step;
  const ticks: number[] = [];
  for (let t = 0; t <= top * (1 + 1e-9); t += step) ticks.push(t);
  return { at: (y) => WALL - (y / top) * (WALL - TOP), ticks };
}

/** Decades from the one holding the first layer to the one above everything drawn. */
function logMap(first: number, upper: number): AxisMap {
  const lo = Math.floor(Math.log10(first) + 1e-9);
  const hi = Math.max(lo + 1, Math.ceil(Math.log10(upper) - 1e-9));
  const ticks: number[] = [];
  for (let k = lo; k <= hi; k++) ticks.push(Math.pow(10, k));
  return { at: (y) => WALL - ((Math.log10(Math.max(y, ticks[0]!)) - lo) / (hi - lo)) * (WALL - TOP), ticks };
}

function axis(map: AxisMap, scale: StackScale): string[] {
  const out = [`<path d="M${px(AXIS_X)} ${px(TOP)}V${px(WALL)}" stroke="#555555" stroke-width="0.8" fill="none"/>`];
  for (const t of map.ticks) {
    const yy = map.at(t);
    out.push(`<path d="M${px(AXIS_X - 4)} ${px(yy)}H${px(AXIS_X)}" stroke="#555555" stroke-width="0.8"/>`);
    out.push(text(AXIS_X - 6, yy + 4, t === 0 ? '0' : lengthText(t), 'text-anchor="end" font-size="11"'));
  }
  const mid = (TOP + WALL) / 2;
  // The axis label stays short enough to fit beside the axis; the log axis's note goes under the picture.
  out.push(verticalText(12, mid, scale === 'log' ? 'distance from wall (log)' : 'distance from wall', 'font-size="11"'));
  return out;
}

function wallLine(): string[] {
  const hatch: string[] = [];
  for (let x = LEFT - 8; x < RIGHT + 8; x += 8) hatch.push(`M${px(x)} ${px(WALL + 8)}L${px(x + 8)} ${px(WALL)}`);
  return [
    `<path d="M${px(LEFT - 8)} ${px(WALL)}H${px(RIGHT + 8)}" stroke="#222222" stroke-width="2" fill="none"/>`,
    `<path d="${hatch.join('')}" stroke="#222222" stroke-width="0.7" fill="none"/>`,
    text(RIGHT + 14, WALL + 6, 'wall (no-slip)'),
  ];
}
