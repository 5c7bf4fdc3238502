// A value as `wakesheet eval --json` and the library hand it on: SI numbers,
// the SI unit, and the display text; records with their fields, lists with
// their items, and tables (and sweeps of records) as columns and rows.
import type { ListValue, RecordValue, Value } from '../core/index.js';
import { unitLabel } from '../units/labels.js';
import { displayKey } from './numbers.js';
import { showsSpread, uncertaintyText } from './uncertainty.js';
import { displayText } from './value-text.js';

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
  /** Tables, and lists of records (a sweep: the swept inputs first), as columns and rows. */
  table?: { columns: string[]; rows: ValueJson[][] };
  /** Rules of thumb broken, ranges left: what a script must not miss. */
  warnings?: string[];
  /** How it was computed, what is neglected. */
  remarks?: string[];
  /** For a name brought in by `use`: the sheet it comes from, as this one names it. */
  from?: string;
  /** Standard uncertainty in SI, for an input given with `±` and every number that depends on one (first order). */
  u?: number;
  /** The standard uncertainty as shown beside the value: "± 2 m/s". */
  uDisplay?: string;
}

/** Standard uncertainties for a value's JSON: the value's own, and its record fields'. */
export interface UncertaintyJson {
  u?: number;
  fields?: ReadonlyMap<string, { u: number }>;
}

/**
 * The JSON with `u` added, and `uDisplay` ("± 2 m/s") in the unit the value
 * is shown in, for text output; the cached JSON itself is never changed.
 */
export function withUncertainty(json: ValueJson, unc: UncertaintyJson | undefined, value: Value, sig: number): ValueJson {
  if (!unc) return json;
  const out: ValueJson = { ...json };
  const spread = (j: ValueJson, v: Value | undefined, u: number): ValueJson =>
    j.si !== null && Number.isFinite(u) ? { ...j, u, ...(v?.kind === 'quantity' && showsSpread(u) ? { uDisplay: uncertaintyText(v, u, sig) } : {}) } : j;
  if (unc.u !== undefined) Object.assign(out, spread(json, value, unc.u));
  if (unc.fields && json.fields && value.kind === 'record') {
    const fields: Record<string, ValueJson> = { ...json.fields };
    for (const [k, f] of unc.fields) if (fields[k]) fields[k] = spread(fields[k]!, value.fields.get(k)?.value, f.u);
    out.fields = fields;
  }
  return out;
}

/** Lists longer than this leave out their items in JSON (the display still tells). */
export const JSON_ITEMS_MAX = 10_000;

// Values are immutable and reused across runs, so their JSON is too.
const jsonCache = new WeakMap<Value, { key: string; json: ValueJson }>();

export function valueJson(v: Value, sig: number): ValueJson {
  const key = displayKey(sig);
  const hit = jsonCache.get(v);
  if (hit && hit.key === key) return hit.json;
  const json = computeJson(v, sig);
  jsonCache.set(v, { key, json });
  return json;
}

function computeJson(v: Value, sig: number): ValueJson {
  const display = displayText(v, sig);
  switch (v.kind) {
    case 'quantity':
      return v.interval ? { si: v.si, unit: unitLabel(v.dims), display, interval: true } : { si: v.si, unit: unitLabel(v.dims), display };
    case 'list': {
      if (v.items.length > JSON_ITEMS_MAX) return { si: null, unit: '', display };
      const json: ValueJson = { si: null, unit: '', display, items: v.items.map((i) => valueJson(i, sig)) };
      if (v.items.length > 0 && v.items.every((i) => i.kind === 'record')) json.table = recordListJson(v, sig);
      return json;
    }
    case 'table': {
      const json: ValueJson = { si: null, unit: '', display, table: { columns: [...v.columns], rows: v.rows.map((row) => row.map((c) => valueJson(c, sig))) } };
      if (v.warnings?.length) json.warnings = [...v.warnings];
      if (v.remarks?.length) json.remarks = [...v.remarks];
      return json;
    }
    case 'record': {
      const fields: Record<string, ValueJson> = {};
      for (const [k, f] of v.fields) fields[k] = valueJson(f.value, sig);
      const json: ValueJson = { si: null, unit: '', display, fields };
      if (v.warnings.length) json.warnings = [...v.warnings];
      if (v.remarks.length) json.remarks = [...v.remarks];
      return json;
    }
    default:
      return { si: null, unit: '', display };
  }
}


/** A list of records as columns and rows: the swept inputs (or the item number), then the fields. */
function recordListJson(list: ListValue, sig: number): { columns: string[]; rows: ValueJson[][] } {
  const records = list.items as readonly RecordValue[];
  const fields: string[] = [];
  for (const r of records) for (const [k, f] of r.fields) if (!fields.includes(k) && f.value.kind !== 'figure') fields.push(k);
  const inputs = list.sweep?.map((s) => s.name) ?? ['#'];
  const empty: ValueJson = { si: null, unit: '', display: '' };
  const rows = records.map((r, i) => [
    ...(list.sweep ? list.sweep.map((s) => valueJson(s.values[i]!, sig)) : [{ si: i + 1, unit: '', display: String(i + 1) }]),
    ...fields.map((k) => {
      const f = r.fields.get(k);
      return f ? valueJson(f.value, sig) : empty;
    }),
  ]);
  return { columns: [...inputs, ...fields], rows };
}
