// Small SVG writing helpers for every trade family's figures: fixed digits so
// the markup is stable, escaped text, tidy axis steps.
import { escapeHtml } from './escape.js';

/** Coordinates with one decimal: stable markup and small files. */
export function px(x: number): string {
  const s = x.toFixed(1);
  return s === '-0.0' ? '0.0' : s;
}

/** A step of 1, 2 or 5 × 10^k near range/target: tidy axis ticks. */
export function niceStep(range: number, target = 5): number {
  const raw = range / target;
  const mag = Math.pow(10, Math.floor(Math.log10(raw)));
  const r = raw / mag;
  return (r < 1.5 ? 1 : r < 3.5 ? 2 : r < 7.5 ? 5 : 10) * mag;
}

export function text(x: number, y: number, content: string, attrs = ''): string {
  return `<text x="${px(x)}" y="${px(y)}"${attrs ? ' ' + attrs : ''}>${escapeHtml(content)}</text>`;
}

/** Text turned to run up the page, centred on (x, y): vertical axis labels. */
export function verticalText(x: number, y: number, content: string, attrs = ''): string {
  return `<text x="0" y="0" transform="translate(${px(x)} ${px(y)}) rotate(-90)" text-anchor="middle"${attrs ? ' ' + attrs : ''}>${escapeHtml(content)}</text>`;
}

export function svgDocument(width: number, height: number, title: string, body: string[]): string {
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" font-family="sans-serif" font-size="12">`,
    `<title>${escapeHtml(title)}</title>`,
    `<rect x="0" y="0" width="${width}" height="${height}" fill="#ffffff"/>`,
    ...body,
    '</svg>',
  ].join('\n');
}
