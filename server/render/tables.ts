// Tables of values: a table a trade function returned, and a list of records
// (a sweep) shown as one table, a row per item, labelled by what was swept.
// Every column of quantities is shown in one unit, named in its header.
import type { ListValue, Quantity, RecordValue, TableValue, Value } from '../core/index.js';
import { parseUnit } from '../units/quantity.js';
import { attrs, escapeHtml, noteList } from './html.js';
import { mathHtml } from './katex.js';
import { formatNumber, showQuantity, unitPlain } from './numbers.js';
import { symbolLatex } from './symbols.js';
import { dataAttrs, displayText } from './value-text.js';

interface Column {
  label: string;
  /** LaTeX symbol, shown instead of the label. */
  symbol?: string;
  /** Show the label (a field's name as sheets write it) under the symbol. */
  named?: boolean;
  note?: string;
}

/** The unit a column of quantities is shown in: the one its largest value would be shown in. */
function columnUnit(cells: readonly Value[], sig: number): string | null {
  let biggest: Quantity | undefined;
  for (const c of cells) {
    if (c.kind !== 'quantity') return null;
    if (biggest && (c.dims.some((d, i) => d !== biggest!.dims[i]) || c.absolute !== biggest.absolute)) return null;
    if (!biggest || Math.abs(c.si) > Math.abs(biggest.si)) biggest = c;
  }
  return biggest ? showQuantity(biggest, sig).unit : null;
}

function quantityIn(q: Quantity, unit: string, sig: number): string {
  const u = parseUnit(unit.replace(/^µ/, 'u'));
  const v = unit === '%' ? q.si * 100 : q.si / u.factor - u.offset;
  const { mantissa, exponent } = formatNumber(v, sig);
  return exponent === 0 ? mantissa : `${mantissa}×10${superscriptDigits(exponent)}`;
}

function superscriptDigits(n: number): string {
  const map: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };
  return [...String(n)].map((c) => map[c] ?? c).join('');
}

function gridHtml(name: string, columns: readonly Column[], rows: readonly (readonly (Value | undefined)[])[], sig: number, rowName: (i: number) => string, cellName: (i: number, c: number) => string): string {
  const units = columns.map((_, c) => columnUnit(rows.map((r) => r[c]).filter((v): v is Value => v !== undefined), sig));
  const head = columns
    .map((col, c) => {
      const title = col.symbol ? mathHtml(col.symbol) : escapeHtml(col.label);
      const unit = units[c] ? `<span class="ws-col-unit">${escapeHtml(units[c] === '%' ? '%' : unitPlain(units[c]!))}</span>` : '';
      const field = col.symbol && col.named ? `<span class="ws-col-field">${escapeHtml(col.label)}</span>` : '';
      return `<th${attrs({ title: col.note })}>${title}${field}${unit}</th>`;
    })
    .join('');
  const body = rows
    .map((row, i) => {
      const cells = columns.map((_, c) => {
        const v = row[c];
        if (v === undefined) return '<td></td>';
        const text = v.kind === 'quantity' && units[c] ? quantityIn(v, units[c]!, sig) : displayText(v, sig);
        const numeric = v.kind === 'quantity';
        return `<td${numeric ? ' class="ws-num"' : ''}><span class="ws-value"${dataAttrs(cellName(i, c), v)}>${escapeHtml(text)}</span></td>`;
      });
      return `<tr${attrs({ 'data-name': rowName(i) })}>${cells.join('')}</tr>`;
    })
    .join('');
  return `<div class="ws-table-wrap"><table class="ws-table"${attrs({ 'data-name': name })}><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table></div>`;
}

/** A table a trade function or a sweep returned, with what it says of its rows and its plots. */
export function tableHtml(name: string, t: TableValue, sig: number): string {
  const grid = gridHtml(name, t.columns.map((label) => ({ label })), t.rows, sig, (i) => `${name}[${i + 1}]`, (i, c) => `${name}[${i + 1}].${t.columns[c]}`);
  if (!t.warnings?.length && !t.remarks?.length && !t.figures?.length) return grid;
  const figures = (t.figures ?? []).map((f, i) => `<figure class="ws-figure"${attrs({ 'data-name': `${name}.figure${i + 1}` })}>${f.svg}${f.caption ? `<figcaption>${escapeHtml(f.caption)}</figcaption>` : ''}</figure>`).join('');
  return `<div class="ws-record ws-sweep"${attrs({ 'data-name': name })}>${grid}${noteList('ws-warnings', t.warnings)}${figures}${noteList('ws-remarks', t.remarks)}</div>`;
}

/** Records in a list, in the order of the first record's fields (later fields appended). */
function fieldColumns(records: readonly RecordValue[]): Array<Column & { field: string }> {
  const out = new Map<string, Column & { field: string }>();
  for (const r of records) {
    for (const [field, f] of r.fields) {
      if (out.has(field) || f.value.kind === 'figure') continue;
      out.set(field, { field, label: field, ...(f.symbol ? { symbol: f.symbol, named: true } : {}), ...(f.note ? { note: f.note } : {}) });
    }
  }
  return [...out.values()];
}

/** The words a row is known by in a message: "U = 10 m/s". */
function rowLabel(list: ListValue, i: number, sig: number): string {
  if (!list.sweep?.length) return `item ${i + 1}`;
  return list.sweep.map((s) => `${s.name} = ${displayText(s.values[i]!, sig)}`).join(', ');
}

/**
 * A list of records as one table: the swept inputs first, then a column per
 * field; each distinct warning and remark once, with the rows it belongs to
 * when it is not all of them.
 */
export function recordListHtml(name: string, list: ListValue, sig: number): string {
  const records = list.items as readonly RecordValue[];
  const inputs: Column[] = list.sweep?.map((s) => ({ label: s.name, symbol: symbolLatex(s.name) })) ?? [{ label: '#' }];
  const fields = fieldColumns(records);
  const rows = records.map((r, i) => [
    ...(list.sweep ? list.sweep.map((s) => s.values[i]) : [{ kind: 'quantity', si: i + 1, dims: [0, 0, 0, 0, 0, 0, 0] } as Quantity]),
    ...fields.map((f) => r.fields.get(f.field)?.value),
  ]);
  const table = gridHtml(name, [...inputs, ...fields], rows, sig, (i) => `${name}[${i + 1}]`, (i, c) =>
    c < inputs.length ? `${name}[${i + 1}].${inputs[c]!.label}` : `${name}[${i + 1}].${fields[c - inputs.length]!.field}`,
  );
  const warnings = distinct(records.map((r) => r.warnings), list, sig);
  const remarks = distinct(records.map((r) => r.remarks), list, sig);
  if (records.some((r) => r.figure)) remarks.push(`Each row has a figure of its own: pick a row to see it, e.g. ${name}[1]${list.sweep?.length ? ` or ${name}[${list.sweep[0]!.name}: ${displayText(list.sweep[0]!.values[0]!, sig)}]` : ''}.`);
  return `<div class="ws-record ws-sweep"${dataAttrs(name, list)}${attrs({ 'data-tag': records[0]?.tag })}>${table}${noteList('ws-warnings', warnings)}${noteList('ws-remarks', remarks)}</div>`;
}

function distinct(perRow: readonly (readonly string[])[], list: ListValue, sig: number): string[] {
  const rows = new Map<string, number[]>();
  perRow.forEach((texts, i) => {
    for (const t of texts) {
      const at = rows.get(t);
      if (at) {
        if (at[at.length - 1] !== i) at.push(i);
      } else rows.set(t, [i]);
    }
  });
  return [...rows].map(([text, at]) => (at.length === perRow.length ? text : `${at.map((i) => rowLabel(list, i, sig)).join('; ')}: ${text}`));
}
