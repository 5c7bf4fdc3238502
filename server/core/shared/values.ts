// The values a worksheet computes with, and their constructors. Trade
// functions take and return these; the constructors fix each result's unit
// in one place so that the maths works on plain SI numbers.
import { fromUnit, parseUnit, quantity, type Quantity } from '../../units/quantity.js';
import { isDimensionless } from '../../units/dims.js';
import { unitLabel } from '../../units/labels.js';

export type Value = Quantity | BoolValue | StringValue | ListValue | RecordValue | TableValue | FigureValue;

export interface BoolValue {
  readonly kind: 'bool';
  readonly value: boolean;
}

export interface StringValue {
  readonly kind: 'string';
  readonly value: string;
}

export interface ListValue {
  readonly kind: 'list';
  readonly items: readonly Value[];
}

export interface RecordField {
  readonly value: Value;
  /** Short description shown in the record's table. */
  readonly note?: string;
  /** The field's symbol in LaTeX, from its trade function's field list. */
  readonly symbol?: string;
}

export interface RecordValue {
  readonly kind: 'record';
  /** Field order is the order shown. A Map: sheet names never reach object properties. */
  readonly fields: ReadonlyMap<string, RecordField>;
  /** Plain-words flags raised while computing (range warnings, rules of thumb). */
  readonly warnings: readonly string[];
  /** Remarks shown under the table (method, what is neglected). */
  readonly remarks: readonly string[];
  readonly figure?: FigureValue;
  /** What kind of record this is, e.g. "fluid"; "caution" asks for the planning caution. */
  readonly tag?: string;
}

export interface TableValue {
  readonly kind: 'table';
  readonly columns: readonly string[];
  readonly rows: readonly (readonly Value[])[];
}

export interface FigureValue {
  readonly kind: 'figure';
  /** Self-contained SVG markup made by our own code (never from sheet text). */
  readonly svg: string;
  readonly caption?: string;
}

export type { Quantity };

/** A quantity from an SI number, e.g. si(1.225, 'kg/m^3'); the unit fixes the dimension. */
export function si(value: number, unit = '1'): Quantity {
  const u = parseUnit(unit);
  if (u.offset !== 0) throw new Error(`si() takes SI units, not ${unit}`);
  return quantity(value * u.factor, u.dims);
}

/** A quantity shown in a chosen unit: shown(15, 'degC'). */
export function shown(value: number, unit: string): Quantity {
  return fromUnit(value, unit);
}

export function num(x: number): Quantity {
  return quantity(x);
}

export function str(value: string): StringValue {
  return { kind: 'string', value };
}

export function bool(value: boolean): BoolValue {
  return { kind: 'bool', value };
}

export function list(items: Value[]): ListValue {
  return { kind: 'list', items };
}

export function table(columns: string[], rows: Value[][]): TableValue {
  return { kind: 'table', columns, rows };
}

export function figure(svg: string, caption?: string): FigureValue {
  return caption ? { kind: 'figure', svg, caption } : { kind: 'figure', svg };
}

export interface RecordInit {
  warnings?: string[];
  remarks?: string[];
  figure?: FigureValue;
  tag?: string;
}

/** Build a record from [name, value, note?] entries, in display order. */
export function record(entries: Array<[string, Value, string?]>, init: RecordInit = {}): RecordValue {
  const fields = new Map<string, RecordField>();
  for (const [name, value, note] of entries) fields.set(name, note ? { value, note } : { value });
  const r: { -readonly [K in keyof RecordValue]: RecordValue[K] } = {
    kind: 'record',
    fields,
    warnings: init.warnings ?? [],
    remarks: init.remarks ?? [],
  };
  if (init.figure) r.figure = init.figure;
  if (init.tag) r.tag = init.tag;
  return r;
}

/** A value's kind as messages name it: "a quantity in m/s", "a plain number", "text", "a record". */
export function describeValue(v: Value): string {
  switch (v.kind) {
    case 'quantity':
      return isDimensionless(v.dims) ? 'a plain number' : `a quantity in ${unitLabel(v.dims)}`;
    case 'bool':
      return 'true/false';
    case 'string':
      return 'text';
    case 'list':
      return 'a list';
    case 'record':
      return 'a record';
    case 'table':
      return 'a table';
    case 'figure':
      return 'a figure';
  }
}
