// Small constructors and readers that trade functions use, so each function
// works on plain SI numbers and declares its result units in one place.
import { fromUnit, inUnit, parseUnit, quantity, type Quantity } from '../units/quantity.js';
import { dimsEqual, isDimensionless } from '../units/dims.js';
import { unitLabel } from '../units/labels.js';
import { type Args, TradeError } from './registry.js';
import type { FigureValue, ListValue, RecordField, RecordValue, StringValue, Value, BoolValue } from './values.js';

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

export function figure(svg: string, caption?: string): FigureValue {
  return caption ? { kind: 'figure', svg, caption } : { kind: 'figure', svg };
}

export interface FieldInit {
  value: Value;
  note?: string;
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

// ---- reading arguments ----

function describeValue(v: Value): string {
  if (v.kind === 'quantity') return isDimensionless(v.dims) ? 'a plain number' : `a quantity in ${unitLabel(v.dims)}`;
  return `a ${v.kind}`;
}

/** The SI number of argument `name`, checked against `unit` ("K", "m/s", "1"). */
export function siArg(args: Args, name: string, unit = '1'): number {
  const v = args[name];
  if (v === undefined) throw new TradeError(`missing argument ${name}`);
  return siOf(v, unit, name);
}

export function siOf(v: Value, unit: string, name: string): number {
  if (v.kind !== 'quantity') throw new TradeError(`${name} must be ${unit === '1' ? 'a number' : `a quantity in ${unit}`}, not ${describeValue(v)}`);
  const u = parseUnit(unit);
  if (!dimsEqual(v.dims, u.dims)) {
    throw new TradeError(`${name} must be ${unit === '1' ? 'a plain number' : `in ${unitLabel(u.dims)}`}, not ${describeValue(v)}`);
  }
  return u.offset ? inUnit(v, u) : v.si / u.factor;
}

export function optionalSi(args: Args, name: string, unit = '1'): number | undefined {
  const v = args[name];
  return v === undefined ? undefined : siOf(v, unit, name);
}

export function stringArg(args: Args, name: string): string {
  const v = args[name];
  if (v === undefined) throw new TradeError(`missing argument ${name}`);
  if (v.kind !== 'string') throw new TradeError(`${name} must be text in double quotes, not ${describeValue(v)}`);
  return v.value;
}

export function recordArg(args: Args, name: string): RecordValue {
  const v = args[name];
  if (v === undefined) throw new TradeError(`missing argument ${name}`);
  if (v.kind !== 'record') throw new TradeError(`${name} must be a record, not ${describeValue(v)}`);
  return v;
}

/** SI numbers of a list argument (a single quantity counts as a list of one). */
export function siListArg(args: Args, name: string, unit = '1'): number[] {
  const v = args[name];
  if (v === undefined) throw new TradeError(`missing argument ${name}`);
  const items = v.kind === 'list' ? v.items : [v];
  return items.map((item, i) => siOf(item, unit, `${name}[${i + 1}]`));
}

/** A field of a record as an SI number, or undefined when the record lacks it. */
export function fieldSi(r: RecordValue, field: string, unit = '1'): number | undefined {
  const f = r.fields.get(field);
  return f ? siOf(f.value, unit, field) : undefined;
}

export interface FluidProps {
  rho: number;
  mu: number;
  nu: number;
  /** Speed of sound when the record has one (gases). */
  a?: number;
}

/** Any record with rho and mu (or nu) serves as a fluid. */
export function fluidArg(args: Args, name = 'fluid'): FluidProps {
  const r = recordArg(args, name);
  const rho = fieldSi(r, 'rho', 'kg/m^3');
  const mu = fieldSi(r, 'mu', 'Pa s');
  const nuField = fieldSi(r, 'nu', 'm^2/s');
  if (rho === undefined) throw new TradeError(`${name} has no density field rho`);
  if (mu === undefined && nuField === undefined) throw new TradeError(`${name} has neither mu nor nu`);
  const muV = mu ?? nuField! * rho;
  const fluid: FluidProps = { rho, mu: muV, nu: nuField ?? muV / rho };
  const a = fieldSi(r, 'a', 'm/s');
  if (a !== undefined) fluid.a = a;
  return fluid;
}
