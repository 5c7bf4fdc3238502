// Small SVG writing helpers shared by the wall figures: fixed digits so the
// markup is stable, escaped text, and lengths labelled in a readable unit.

/** Coordinates with one decimal: stable markup and small files. */
export function px(x: number): string {
  const s = x.toFixed(1);
  return s === '-0.0' ? '0.0' : s;
}

export function esc(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

/** Three significant digits without trailing zeros noise: 0.0400 → "0.04". */
export function sig3(x: number): string {
  if (x === 0) return '0';
  return String(Number(x.toPrecision(3)));
}

/** A length in m shown in µm, mm or m by its size. */
export function lengthLabel(m: number): string {
  const a = Math.abs(m);
  if (a >= 1) return `${sig3(m)} m`;
  if (a >= 1e-3) return `${sig3(m * 1e3)} mm`;
  return `${sig3(m * 1e6)} µm`;
}

/** A step of 1, 2 or 5 × 10^k near range/target: tidy axis ticks. */
export function niceStep(range: number, target = 5): number {
  const raw = range / target;
  const mag = Math.pow(10, Math.floor(Math.log10(raw)));
  const r = raw / mag;
  return (r < 1.5 ? 1 : r < 3.5 ? 2 : r < 7.5 ? 5 : 10) * mag;
}

export function text(x: number, y: number, content: string, attrs = ''): string {
  return `<text x="${px(x)}" y="${px(y)}"${attrs ? ' ' + attrs : ''}>${esc(content)}</text>`;
}

export function svgDocument(width: number, height: number, title: string, body: string[]): string {
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" font-family="sans-serif" font-size="11">`,
    `<title>${esc(title)}</title>`,
    `<rect x="0" y="0" width="${width}" height="${height}" fill="#ffffff"/>`,
    ...body,
    '</svg>',
  ].join('\n');
}
