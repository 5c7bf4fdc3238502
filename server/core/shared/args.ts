// Readers for a trade function's arguments: each turns a worksheet value into
// the plain SI number, text or record the maths needs, or throws TradeError
// in words that name the argument.
import { inUnit, parseUnit } from '../../units/quantity.js';
import { dimsEqual, TEMPERATURE } from '../../units/dims.js';
import { unitLabel } from '../../units/labels.js';
import type { Args } from './registry.js';
import { TradeError } from './trade-error.js';
import { describeValue, type RecordValue, type Value } from './values.js';
import { numberText, quotedList } from './words.js';

function present(args: Args, name: string): Value {
  const v = args[name];
  if (v === undefined) throw new TradeError(`missing argument ${name}`);
  return v;
}

/** The SI number of argument `name`, checked against `unit` ("K", "m/s", "1"). */
export function siArg(args: Args, name: string, unit = '1'): number {
  return siOf(present(args, name), unit, name);
}

export function siOf(v: Value, unit: string, name: string): number {
  if (v.kind !== 'quantity') throw new TradeError(`${name} must be ${unit === '1' ? 'a number' : `a quantity in ${unit}`}, not ${describeValue(v)}`);
  const u = parseUnit(unit);
  if (!dimsEqual(v.dims, u.dims)) {
    throw new TradeError(`${name} must be ${unit === '1' ? 'a plain number' : `in ${unitLabel(u.dims)}`}, not ${describeValue(v)}`);
  }
  // A parameter in K takes a temperature; a difference of two is not one.
  if (v.interval && dimsEqual(u.dims, TEMPERATURE)) {
    throw new TradeError(
      `${name} is a temperature difference (${numberText(v.si, { digits: 4 })} K), not a temperature; give an absolute temperature such as 20 degC or 293.15 K`,
    );
  }
  return u.offset ? inUnit(v, u) : v.si / u.factor;
}

/** A plain number written without a unit (60, not 60 %): worth a hint when it is out of range. */
export function bareNumber(args: Args, name: string): boolean {
  const v = args[name];
  return v?.kind === 'quantity' && v.unit === undefined && v.dims.every((d) => d === 0);
}

export function optionalSi(args: Args, name: string, unit = '1'): number | undefined {
  const v = args[name];
  return v === undefined ? undefined : siOf(v, unit, name);
}

export function stringArg(args: Args, name: string): string {
  const v = present(args, name);
  if (v.kind !== 'string') throw new TradeError(`${name} must be text in double quotes, not ${describeValue(v)}`);
  return v.value;
}

/** A text argument that must be one of `choices`. */
export function choiceArg<T extends string>(args: Args, name: string, choices: readonly T[]): T {
  const v = stringArg(args, name);
  if (!(choices as readonly string[]).includes(v)) throw new TradeError(`${name} "${v}" is not one of ${quotedList(choices)}`);
  return v as T;
}

export function boolArg(args: Args, name: string): boolean {
  const v = present(args, name);
  if (v.kind !== 'bool') throw new TradeError(`${name} must be true or false, not ${describeValue(v)}`);
  return v.value;
}

export function recordArg(args: Args, name: string): RecordValue {
  const v = present(args, name);
  if (v.kind !== 'record') throw new TradeError(`${name} must be a record, not ${describeValue(v)}`);
  return v;
}

export function optionalRecord(args: Args, name: string): RecordValue | undefined {
  return args[name] === undefined ? undefined : recordArg(args, name);
}

/** SI numbers of a list argument (a single quantity counts as a list of one). */
export function siListArg(args: Args, name: string, unit = '1'): number[] {
  const v = present(args, name);
  const items = v.kind === 'list' ? v.items : [v];
  return items.map((item, i) => siOf(item, unit, `${name}[${i + 1}]`));
}

/** A field of a record as an SI number, or undefined when the record lacks it. */
export function fieldSi(r: RecordValue, field: string, unit: string): number | undefined {
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

/** The argument as the sheet wrote it (it keeps its display unit). */
export function passThrough(args: Args, name: string): Value {
  return present(args, name);
}
