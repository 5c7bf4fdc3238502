// Picture of the computational domain: plan (seen from above) over side
// elevation, one scale for both and the body to scale, every boundary
// distance dimensioned with its value. Labels at 10–12 px in the picture's
// own units, so it stays legible at 640 px and in print.
import { px, svgDocument, text, verticalText } from '../shared/svg.js';
import { lengthText, percentText } from '../shared/words.js';

export interface DomainPicture {
  /** Body length, width and height. */
  body: readonly [number, number, number];
  upstream: number;
  downstream: number;
  lateral: number;
  top: number;
  below: number;
  length: number;
  width: number;
  height: number;
  ground: boolean;
  rule: string;
  blockage: number;
}

const W = 600;
const LEFT = 52;
const RIGHT_SPACE = 124;
const DRAW_W = W - LEFT - RIGHT_SPACE;
/** Plan and elevation together are kept within this height. */
const MAX_DRAW_H = 500;
const FONT = 11;
/** Rough width of a character at FONT px in a sans-serif face. */
const CHAR_W = 6.1;
const LABEL_GAP = 13;

const INK = '#33475b';
const DIM = '#444444';
const FAINT = '#9aa8b6';

export function domainSvg(p: DomainPicture): string {
  const [L, Wb, H] = p.body;
  const s = Math.min(DRAW_W / p.length, MAX_DRAW_H / (p.width + p.height));
  const X = (x: number) => LEFT + x * s;
  const x0 = X(0);
  const x1 = X(p.length);
  const bx0 = X(p.upstream);
  const bx1 = X(p.upstream + L);

  const planTop = 66;
  const planBottom = planTop + p.width * s;
  const elevTop = planBottom + 40;
  const elevBottom = elevTop + p.height * s;
  const chainY = elevBottom + (p.ground ? 30 : 26);
  const overallY = chainY + 30;
  const height = overallY + 14;
  const Yp = (y: number) => planTop + y * s;
  const Ze = (z: number) => elevBottom - z * s;

  const out: string[] = [];
  const heading = `Domain by the ${p.rule} rule: ${lengthText(p.length)} × ${lengthText(p.width)} × ${lengthText(p.height)}`;
  out.push(text(8, 18, heading, 'font-weight="bold" font-size="12"'));
  out.push(text(8, 34, `to scale; flow from left to right; blockage ${percentText(p.blockage)}${p.ground ? '; body on the floor' : '; body clear of the floor'}`, 'font-size="10"'));

  // Plan.
  out.push(text(x0, planTop - 8, 'plan (seen from above)', 'font-size="10" font-style="italic"'));
  out.push(rect(x0, planTop, x1 - x0, planBottom - planTop, '#f3f7fb', INK, 1));
  out.push(rect(bx0, Yp(p.lateral), bx1 - bx0, Wb * s, '#6f8296', '#2b3a4a', 0.8));
  out.push(flowArrow(x0, (planTop + planBottom) / 2));
  // Elevation.
  out.push(text(x0, elevTop - 8, 'side elevation', 'font-size="10" font-style="italic"'));
  out.push(rect(x0, elevTop, x1 - x0, elevBottom - elevTop, '#f3f7fb', INK, 1));
  out.push(rect(bx0, Ze(p.below + H), bx1 - bx0, H * s, '#6f8296', '#2b3a4a', 0.8));
  out.push(flowArrow(x0, (elevTop + Ze(p.below + H)) / 2));
  if (p.ground) out.push(...floor(x0, x1, elevBottom));

  // Projection lines from the body's ends down to the streamwise chain.
  out.push(line(`M${px(bx0)} ${px(Yp(p.lateral + Wb))}V${px(chainY + 4)}M${px(bx1)} ${px(Yp(p.lateral + Wb))}V${px(chainY + 4)}`, FAINT, 0.6, '2 3'));
  out.push(line(`M${px(x0)} ${px(elevBottom)}V${px(overallY + 4)}M${px(x1)} ${px(elevBottom)}V${px(overallY + 4)}`, FAINT, 0.6, '2 3'));

  // Streamwise distances, once, under the elevation.
  out.push(...horizontalChain(chainY, [
    { from: 0, to: p.upstream, name: 'upstream' },
    { from: p.upstream, to: p.upstream + L, name: 'body L' },
    { from: p.upstream + L, to: p.length, name: 'downstream' },
  ], X));
  out.push(...horizontalChain(overallY, [{ from: 0, to: p.length, name: 'domain length' }], X));

  // Across the flow: the plan's chain on the right, its overall width on the left.
  const chainX = x1 + 12;
  out.push(line(`M${px(X(p.upstream + L))} ${px(Yp(p.lateral))}H${px(chainX + 4)}M${px(X(p.upstream + L))} ${px(Yp(p.lateral + Wb))}H${px(chainX + 4)}`, FAINT, 0.6, '2 3'));
  out.push(...verticalChain(chainX, [
    { from: Yp(0), to: Yp(p.lateral), name: 'lateral', value: p.lateral },
    { from: Yp(p.lateral), to: Yp(p.lateral + Wb), name: 'body W', value: Wb },
    { from: Yp(p.lateral + Wb), to: Yp(p.width), name: 'lateral', value: p.lateral },
  ]));
  out.push(...overallVertical(x0 - 22, planTop, planBottom, `width ${lengthText(p.width)}`));

  // Heights: the elevation's chain on the right, its overall height on the left.
  const elevSegments: Segment[] = [];
  if (p.below > 0) elevSegments.push({ from: Ze(0), to: Ze(p.below), name: 'below', value: p.below });
  elevSegments.push({ from: Ze(p.below), to: Ze(p.below + H), name: 'body H', value: H });
  elevSegments.push({ from: Ze(p.below + H), to: Ze(p.height), name: 'top', value: p.top });
  out.push(line(`M${px(bx1)} ${px(Ze(p.below + H))}H${px(chainX + 4)}${p.below > 0 ? `M${px(bx1)} ${px(Ze(p.below))}H${px(chainX + 4)}` : ''}`, FAINT, 0.6, '2 3'));
  out.push(...verticalChain(chainX, elevSegments.reverse()));
  out.push(...overallVertical(x0 - 22, elevTop, elevBottom, `height ${lengthText(p.height)}`));

  return svgDocument(W, Math.ceil(height), heading, out);
}

interface Span {
  from: number;
  to: number;
  name: string;
}

interface Segment extends Span {
  value: number;
}

function rect(x: number, y: number, w: number, h: number, fill: string, stroke: string, width: number): string {
  return `<rect x="${px(x)}" y="${px(y)}" width="${px(w)}" height="${px(h)}" fill="${fill}" stroke="${stroke}" stroke-width="${width}"/>`;
}

function line(d: string, colour: string, width: number, dash?: string): string {
  return `<path d="${d}" stroke="${colour}" stroke-width="${width}" fill="none"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`;
}

/** Architectural ticks: a short slash across the line at each end. */
function tick(x: number, y: number): string {
  return `M${px(x - 3)} ${px(y + 3)}L${px(x + 3)} ${px(y - 3)}`;
}

function textWidth(t: string): number {
  return t.length * CHAR_W;
}

/** Dimension line along the flow; a label too long for its segment drops its name, then moves under the line. */
function horizontalChain(y: number, spans: Span[], X: (x: number) => number): string[] {
  const out: string[] = [];
  const d: string[] = [];
  let below = -Infinity;
  for (const sp of spans) {
    const a = X(sp.from);
    const b = X(sp.to);
    d.push(`M${px(a)} ${px(y)}H${px(b)}`, tick(a, y), tick(b, y));
    const full = `${sp.name} ${lengthText(sp.to - sp.from)}`;
    const short = lengthText(sp.to - sp.from);
    const room = b - a - 6;
    const mid = (a + b) / 2;
    if (textWidth(full) <= room) out.push(text(mid, y - 4, full, `text-anchor="middle" font-size="${FONT}"`));
    else if (textWidth(short) <= room) out.push(text(mid, y - 4, short, `text-anchor="middle" font-size="${FONT}"`));
    else {
      // Under the line, clear of the previous label put there.
      const x = Math.max(mid, below + textWidth(full) / 2 + 4);
      out.push(text(x, y + 13, full, `text-anchor="middle" font-size="${FONT}"`));
      below = x + textWidth(full) / 2;
    }
  }
  out.unshift(line(d.join(''), DIM, 0.9));
  return out;
}

/** Dimension line across the flow with its labels to the right, spread so that none overlap. */
function verticalChain(x: number, segments: Segment[]): string[] {
  const d: string[] = [];
  for (const sg of segments) d.push(`M${px(x)} ${px(sg.from)}V${px(sg.to)}`, tick(x, sg.from), tick(x, sg.to));
  const labels = segments.map((sg) => ({ y: (sg.from + sg.to) / 2 + 4, text: `${sg.name} ${lengthText(sg.value)}` }));
  labels.sort((a, b) => a.y - b.y);
  for (let i = 1; i < labels.length; i++) labels[i]!.y = Math.max(labels[i]!.y, labels[i - 1]!.y + LABEL_GAP);
  return [line(d.join(''), DIM, 0.9), ...labels.map((l) => text(x + 7, l.y, l.text, `font-size="${FONT}"`))];
}

function overallVertical(x: number, top: number, bottom: number, label: string): string[] {
  return [
    line(`M${px(x)} ${px(top)}V${px(bottom)}${tick(x, top)}${tick(x, bottom)}`, DIM, 0.9),
    verticalText(x - 5, (top + bottom) / 2, label, `font-size="${FONT}"`),
  ];
}

function flowArrow(x: number, y: number): string {
  const a = x + 6;
  const b = x + 30;
  return `<path d="M${px(a)} ${px(y)}H${px(b)}M${px(b - 5)} ${px(y - 3.5)}L${px(b)} ${px(y)}L${px(b - 5)} ${px(y + 3.5)}" stroke="#1f5fa8" stroke-width="1.4" fill="none"/>`;
}

function floor(x0: number, x1: number, y: number): string[] {
  const hatch: string[] = [];
  for (let x = x0; x < x1; x += 8) hatch.push(`M${px(x)} ${px(y + 7)}L${px(Math.min(x + 7, x1))} ${px(y)}`);
  return [line(`M${px(x0)} ${px(y)}H${px(x1)}`, '#222222', 1.8), line(hatch.join(''), '#222222', 0.6), text(x1 - 4, y - 4, 'floor (ground)', 'text-anchor="end" font-size="10"')];
}
