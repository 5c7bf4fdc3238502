// Records built from a trade function's declared field list, so that the
// order, symbols and notes shown are the ones the entry declares.
import type { FieldSpec } from './registry.js';
import { record, type RecordField, type RecordInit, type RecordValue, type Value } from './values.js';

/**
 * A record whose fields follow a trade function's declared field list: order,
 * symbols and notes come from the list (a note given in `notes` replaces the
 * declared one); fields without a value are left out.
 */
export function fieldRecord(
  specs: readonly FieldSpec[],
  values: Readonly<Record<string, Value | undefined>>,
  init: RecordInit = {},
  notes: Readonly<Record<string, string>> = {},
): RecordValue {
  const fields = new Map<string, RecordField>();
  for (const spec of specs) {
    const value = values[spec.name];
    if (value !== undefined) fields.set(spec.name, { value, note: notes[spec.name] ?? spec.doc, symbol: spec.symbol });
  }
  for (const name of Object.keys(values)) {
    if (!fields.has(name) && values[name] !== undefined) throw new Error(`field ${name} is not in the declared field list`);
  }
  return { ...record([], init), fields };
}

