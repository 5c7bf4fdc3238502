// The values a worksheet computes with. Trade functions take and return these.
import type { Quantity } from '../units/quantity.js';

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
  /** What kind of record this is, e.g. "fluid"; used for display and checks. */
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
