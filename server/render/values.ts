// A value as HTML: quantities in KaTeX, records as tables of fields, lists of
// records and tables as tables, figures inline.
import type { RecordValue, Value } from '../core/index.js';
import { attrs, escapeHtml, noteList } from './html.js';
import { mathHtml } from './katex.js';
import { showQuantity, shownLatex, shownPlain, unitPlain } from './numbers.js';
import { recordListHtml, tableHtml } from './tables.js';
import { dataAttrs, displayText } from './value-text.js';
import { showsSpread, uncertaintyHtml } from './uncertainty.js';

/** Standard uncertainties of a record's fields (SI), shown beside their values (a field the inputs do not move shows none). */
export type FieldUncertainties = ReadonlyMap<string, { readonly u: number }>;

export { dataAttrs, displayText };

/** A value shown in HTML: quantities in KaTeX, records as tables, figures inline. */
export function valueHtml(name: string, v: Value, sig: number, fieldsU?: FieldUncertainties): string {
  switch (v.kind) {
    case 'quantity':
      return `<span class="ws-value"${dataAttrs(name, v)}>${mathHtml(shownLatex(showQuantity(v, sig)))}</span>`;
    case 'record':
      return recordHtml(name, v, sig, fieldsU);
    case 'figure':
      return `<figure class="ws-figure"${attrs({ 'data-name': name })}>${v.svg}${v.caption ? `<figcaption>${escapeHtml(v.caption)}</figcaption>` : ''}</figure>`;
    case 'table':
      return tableHtml(name, v, sig);
    case 'list':
      if (v.items.length > 0 && v.items.every((i) => i.kind === 'record')) return recordListHtml(name, v, sig);
      if (v.items.some((i) => i.kind === 'record' || i.kind === 'table' || i.kind === 'figure' || i.kind === 'list')) {
        return `<div class="ws-list"${dataAttrs(name, v)}>${v.items.map((item, i) => valueHtml(`${name}[${i + 1}]`, item, sig)).join('')}</div>`;
      }
      return listValueHtml(name, v, sig);
    default:
      return `<span class="ws-value ws-text"${dataAttrs(name, v)}>${escapeHtml(displayText(v, sig))}</span>`;
  }
}

function recordHtml(name: string, r: RecordValue, sig: number, fieldsU?: FieldUncertainties): string {
  // Tables are too wide for the value column: they follow the fields table at full width, under their name and note.
  const wide = [...r.fields].filter(([, f]) => f.value.kind === 'table');
  const rows = [...r.fields].filter(([, f]) => f.value.kind !== 'table').map(([field, f]) => {
    const v = f.value;
    const label = fieldLabel(field, f.symbol);
    let value: string;
    let unit = '';
    if (v.kind === 'quantity') {
      const s = showQuantity(v, sig);
      const fu = fieldsU?.get(field);
      value = `<span class="ws-value"${dataAttrs(`${name}.${field}`, v)}>${escapeHtml(shownPlain({ ...s, unit: '' }))}</span>${fu && showsSpread(fu.u) ? ` ${uncertaintyHtml(v, fu, sig)}` : ''}`;
      unit = s.unit === '%' ? '%' : escapeHtml(unitPlain(s.unit));
    } else if (v.kind === 'figure' || v.kind === 'record' || v.kind === 'list') {
      value = valueHtml(`${name}.${field}`, v, sig);
    } else {
      value = `<span class="ws-value"${dataAttrs(`${name}.${field}`, v)}>${escapeHtml(displayText(v, sig))}</span>`;
    }
    return `<tr><td class="ws-field">${label}</td><td class="ws-num">${value}</td><td class="ws-unit">${unit}</td><td class="ws-note">${escapeHtml(f.note ?? '')}</td></tr>`;
  });
  const warnings = noteList('ws-warnings', r.warnings);
  const remarks = noteList('ws-remarks', r.remarks);
  const fig = r.figure ? valueHtml(`${name}.figure`, r.figure, sig) : '';
  const tables = wide.map(([field, f]) => `<div class="ws-subtable"><div class="ws-subtable-head"><span class="ws-field">${fieldLabel(field, f.symbol)}</span> <span class="ws-note">${escapeHtml(f.note ?? '')}</span></div>${valueHtml(`${name}.${field}`, f.value, sig)}</div>`);
  return `<div class="ws-record"${attrs({ 'data-name': name, 'data-tag': r.tag })}><table class="ws-fields"><thead><tr><th>field</th><th>value</th><th>unit</th><th>note</th></tr></thead><tbody>${rows.join('')}</tbody></table>${tables.join('')}${warnings}${fig}${remarks}</div>`;
}

/** A field as the record table names it: its declared symbol, and the name a sheet writes it by. */
function fieldLabel(field: string, symbol: string | undefined): string {
  const code = `<code class="ws-field-name">${escapeHtml(field)}</code>`;
  return symbol ? `<span class="ws-sym">${mathHtml(symbol)}</span>${code}` : code;
}

/** Lists longer than this fold: the first and last items in view, all of them a click away. */
export const FOLD_AFTER = 6;

/** A list of plain values: in a line when short, folded into a <details> with every item when long. */
export function listValueHtml(name: string, v: Extract<Value, { kind: 'list' }>, sig: number): string {
  const text = displayText(v, sig);
  if (v.items.length <= FOLD_AFTER) return `<span class="ws-value ws-list"${dataAttrs(name, v)}>${escapeHtml(text)}</span>`;
  return foldHtml(dataAttrs(name, v), v, sig, text);
}

/** Every item of a long list, folded away under "all N values". */
export function allItemsHtml(v: Extract<Value, { kind: 'list' }>, sig: number): string {
  return foldHtml('', v, sig, `all ${v.items.length} values`);
}

function foldHtml(data: string, v: Extract<Value, { kind: 'list' }>, sig: number, summary: string): string {
  const all = v.items.map((item) => displayText(item, sig)).join(', ');
  return `<details class="ws-list ws-fold"${data}><summary>${escapeHtml(summary)}</summary><div class="ws-fold-all">${escapeHtml(all)}</div></details>`;
}
