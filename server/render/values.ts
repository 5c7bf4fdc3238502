// A value as HTML (with machine-readable data-* attributes) and as JSON.
import type { RecordValue, Value } from '../core/index.js';
import { unitLabel } from '../units/labels.js';
import { attrs, escapeHtml } from './html.js';
import { mathHtml } from './katex.js';
import { showQuantity, shownLatex, shownPlain, unitPlain } from './numbers.js';
import { fieldLatex } from './symbols.js';

/** A value as `wakesheet eval --json` and the library hand it on. */
export interface ValueJson {
  /** SI value; null for text, booleans, records, figures. */
  si: number | null;
  /** SI unit text ("m/s", "Pa s", "" for plain numbers). */
  unit: string;
  /** As rendered, e.g. "23 µm". */
  display: string;
  /** Set for a temperature difference: `si` is then an interval in K, not a temperature. */
  interval?: true;
  fields?: Record<string, ValueJson>;
  items?: ValueJson[];
}

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
/** Lists longer than this leave out their items in JSON (the display still tells). */
export const JSON_ITEMS_MAX = 10_000;
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

// Values are immutable and reused across runs, so their JSON is too.
const jsonCache = new WeakMap<Value, { sig: number; json: ValueJson }>();

export function valueJson(v: Value, sig: number): ValueJson {
  const hit = jsonCache.get(v);
  if (hit && hit.sig === sig) return hit.json;
  const json = computeJson(v, sig);
  jsonCache.set(v, { sig, json });
  return json;
}

function computeJson(v: Value, sig: number): ValueJson {
  const display = displayText(v, sig);
  switch (v.kind) {
    case 'quantity':
      return v.interval ? { si: v.si, unit: unitLabel(v.dims), display, interval: true } : { si: v.si, unit: unitLabel(v.dims), display };
    case 'list':
      return v.items.length > JSON_ITEMS_MAX ? { si: null, unit: '', display } : { si: null, unit: '', display, items: v.items.map((i) => valueJson(i, sig)) };
    case 'record': {
      const fields: Record<string, ValueJson> = {};
      for (const [k, f] of v.fields) fields[k] = valueJson(f.value, sig);
      return { si: null, unit: '', display, fields };
    }
    default:
      return { si: null, unit: '', display };
  }
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

/** A value shown in HTML: quantities in KaTeX, records as tables, figures inline. */
export function valueHtml(name: string, v: Value, sig: number): string {
  switch (v.kind) {
    case 'quantity':
      return `<span class="ws-value"${dataAttrs(name, v)}>${mathHtml(shownLatex(showQuantity(v, sig)))}</span>`;
    case 'record':
      return recordHtml(name, v, sig);
    case 'figure':
      return `<figure class="ws-figure"${attrs({ 'data-name': name })}>${v.svg}${v.caption ? `<figcaption>${escapeHtml(v.caption)}</figcaption>` : ''}</figure>`;
    case 'table':
      return tableHtml(name, v, sig);
    case 'list':
      if (v.items.some((i) => i.kind === 'record')) {
        return `<div class="ws-list"${dataAttrs(name, v)}>${v.items.map((item, i) => valueHtml(`${name}[${i + 1}]`, item, sig)).join('')}</div>`;
      }
      return `<span class="ws-value ws-list"${dataAttrs(name, v)}>${escapeHtml(displayText(v, sig))}</span>`;
    default:
      return `<span class="ws-value ws-text"${dataAttrs(name, v)}>${escapeHtml(displayText(v, sig))}</span>`;
  }
}

function recordHtml(name: string, r: RecordValue, sig: number): string {
  const owner = name.replace(/\[\d+\]$/, '');
  const rows = [...r.fields].map(([field, f]) => {
    const v = f.value;
    const sym = v.kind === 'quantity' ? mathHtml(f.symbol ?? fieldLatex(owner, field)) : '';
    let value: string;
    let unit = '';
    if (v.kind === 'quantity') {
      const s = showQuantity(v, sig);
      value = `<span class="ws-value"${dataAttrs(`${name}.${field}`, v)}>${escapeHtml(shownPlain({ ...s, unit: '' }))}</span>`;
      unit = s.unit === '%' ? '%' : escapeHtml(unitPlain(s.unit));
    } else if (v.kind === 'figure' || v.kind === 'record' || v.kind === 'table') {
      value = valueHtml(`${name}.${field}`, v, sig);
    } else {
      value = `<span class="ws-value"${dataAttrs(`${name}.${field}`, v)}>${escapeHtml(displayText(v, sig))}</span>`;
    }
    return `<tr><td class="ws-field">${escapeHtml(field)}</td><td class="ws-sym">${sym}</td><td class="ws-num">${value}</td><td class="ws-unit">${unit}</td><td class="ws-note">${escapeHtml(f.note ?? '')}</td></tr>`;
  });
  const warnings = r.warnings.length ? `<ul class="ws-warnings">${r.warnings.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul>` : '';
  const remarks = r.remarks.length ? `<ul class="ws-remarks">${r.remarks.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul>` : '';
  const fig = r.figure ? valueHtml(`${name}.figure`, r.figure, sig) : '';
  return `<div class="ws-record"${attrs({ 'data-name': name, 'data-tag': r.tag })}><table class="ws-fields"><thead><tr><th>field</th><th>symbol</th><th>value</th><th>unit</th><th>note</th></tr></thead><tbody>${rows.join('')}</tbody></table>${warnings}${fig}${remarks}</div>`;
}

function tableHtml(name: string, t: Extract<Value, { kind: 'table' }>, sig: number): string {
  const head = t.columns.map((c) => `<th>${escapeHtml(c)}</th>`).join('');
  const body = t.rows.map((row) => `<tr>${row.map((cell) => `<td>${escapeHtml(displayText(cell, sig))}</td>`).join('')}</tr>`).join('');
  return `<table class="ws-table"${attrs({ 'data-name': name })}><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>`;
}
