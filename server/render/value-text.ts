// A value as plain text and as machine-readable data-* attributes: the
// display text is what the page, the JSON and the command line all show.
import type { Value } from '../core/index.js';
import { unitLabel } from '../units/labels.js';
import { attrs } from './html.js';
import { showQuantity, shownPlain, unitPlain } from './numbers.js';

export function displayText(v: Value, sig: number): string {
  switch (v.kind) {
    case 'quantity':
      return shownPlain(showQuantity(v, sig));
    case 'bool':
      return v.value ? 'true' : 'false';
    case 'string':
      return v.value;
    case 'list':
      return listText(v.items, sig);
    case 'record':
      return `record (${[...v.fields.keys()].join(', ')})`;
    case 'table':
      return `table (${v.rows.length} rows)`;
    case 'figure':
      return v.caption ?? 'figure';
  }
}

/** Lists longer than this show their first and last items only. */
const PREVIEW = 12;
/** Lists longer than this carry no data-si array in the HTML (it would dwarf the page). */
const DATA_ITEMS_MAX = 1000;

function listText(all: readonly Value[], sig: number): string {
  const long = all.length > PREVIEW;
  const items = long ? [...all.slice(0, 3), ...all.slice(-2)] : all;
  // [5, 10, 20] m/s when the items share one unit.
  const shown = items.map((i) => (i.kind === 'quantity' ? showQuantity(i, sig) : null));
  const unit = shown[0]?.unit;
  const shared = !!unit && shown.every((s) => s && s.unit === unit && s.exponent === 0);
  const texts = shared ? shown.map((s) => s!.mantissa) : items.map((i) => displayText(i, sig));
  const body = long ? [...texts.slice(0, 3), '…', ...texts.slice(3)] : texts;
  const suffix = shared ? ` ${unit === '%' ? '%' : unitPlain(unit!)}` : '';
  return `[${body.join(', ')}]${suffix}${long ? ` (${all.length} values)` : ''}`;
}

/** data-* attributes for a value, read back by tests and the browser. */
export function dataAttrs(name: string, v: Value): string {
  if (v.kind === 'quantity') return attrs({ 'data-name': name, 'data-si': v.si, 'data-unit': unitLabel(v.dims) });
  if (v.kind === 'list' && v.items.length <= DATA_ITEMS_MAX && v.items.every((i) => i.kind === 'quantity')) {
    return attrs({ 'data-name': name, 'data-si': JSON.stringify(v.items.map((i) => (i.kind === 'quantity' ? i.si : null))), 'data-unit': v.items[0] && v.items[0].kind === 'quantity' ? unitLabel(v.items[0].dims) : '' });
  }
  if (v.kind === 'string' || v.kind === 'bool') return attrs({ 'data-name': name, 'data-value': v.kind === 'string' ? v.value : String(v.value) });
  return attrs({ 'data-name': name });
}

