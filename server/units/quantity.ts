// Quantities are held in SI with a dimension vector; the display unit travels
// along as a hint. mathjs is used only to resolve unit names: its own
// arithmetic drops temperature offsets inside products (see DEVELOPERS.md).
import { type Dims, DIMENSIONLESS, TEMPERATURE, dimsEqual, dimsMul, dimsPow, isDimensionless } from './dims.js';
import { parseUnit, type Unit, UnitError } from './unit-expr.js';
import { unitLabel } from './labels.js';

export interface Quantity {
  readonly kind: 'quantity';
  readonly si: number;
  readonly dims: Dims;
  /** Unit the value should be shown in, when the sheet chose one. */
  readonly unit?: Unit;
  /** An absolute temperature read from degC/degF: two of them never add. */
  readonly absolute?: boolean;
  /** The unit was asked for with `to`: show exactly it, no automatic prefix. */
  readonly pinned?: boolean;
}

export function quantity(si: number, dims: Dims = DIMENSIONLESS, unit?: Unit, absolute?: boolean): Quantity {
  // Whole literals, not properties added afterwards: V8 then stores each
  // quantity in one compact object (a list of 100,000 takes a third less memory).
  if (!unit) return absolute ? { kind: 'quantity', si, dims, absolute: true } : { kind: 'quantity', si, dims };
  return absolute ? { kind: 'quantity', si, dims, unit, absolute: true } : { kind: 'quantity', si, dims, unit };
}

export function plain(x: number): Quantity {
  return quantity(x);
}

/** `value` expressed in `unitText` (e.g. 15, "degC"). */
export function fromUnit(value: number, unitText: string): Quantity {
  const u = parseUnit(unitText);
  return withUnit(value, u);
}

export function withUnit(value: number, u: Unit): Quantity {
  const si = (value + u.offset) * u.factor;
  const absolute = u.offset !== 0;
  // A percentage stays a plain fraction but remembers to show as %.
  return quantity(si, u.dims, u.text ? u : undefined, absolute);
}

/** SI number of `q` in `unit` (offset-aware). */
export function inUnit(q: Quantity, u: Unit): number {
  if (!dimsEqual(q.dims, u.dims)) throw new UnitError(`cannot convert ${describe(q.dims)} to ${u.text}`);
  return q.si / u.factor - u.offset;
}

export function convert(q: Quantity, u: Unit): Quantity {
  if (!dimsEqual(q.dims, u.dims)) throw new UnitError(`cannot convert ${describe(q.dims)} to ${u.text}`);
  return { ...quantity(q.si, q.dims, u, q.absolute || u.offset !== 0), pinned: true };
}

export function describe(d: Dims): string {
  return isDimensionless(d) ? 'a plain number' : unitLabel(d);
}


/** The unit a sum keeps: the left operand's, unless it is an offset unit. */
function sumUnit(a: Quantity, b: Quantity): Unit | undefined {
  return a.unit ?? b.unit;
}

export function add(a: Quantity, b: Quantity): Quantity {
  if (!dimsEqual(a.dims, b.dims)) throw new UnitError(`cannot add ${describe(a.dims)} to ${describe(b.dims)}`);
  if (a.absolute && b.absolute) {
    throw new UnitError('cannot add two absolute temperatures; subtract them for a difference, or add a difference in K');
  }
  const absolute = a.absolute || b.absolute;
  const unit = absolute ? (a.absolute ? a.unit : b.unit) : sumUnit(a, b);
  return quantity(a.si + b.si, a.dims, unit, absolute);
}

export function subtract(a: Quantity, b: Quantity): Quantity {
  if (!dimsEqual(a.dims, b.dims)) throw new UnitError(`cannot subtract ${describe(b.dims)} from ${describe(a.dims)}`);
  if (a.absolute && b.absolute) {
    // A difference of two temperatures is a temperature difference in kelvin.
    return quantity(a.si - b.si, TEMPERATURE, parseUnit('K'));
  }
  if (b.absolute && !a.absolute) throw new UnitError('cannot subtract an absolute temperature from a temperature difference');
  const unit = a.absolute ? a.unit : sumUnit(a, b);
  return quantity(a.si - b.si, a.dims, unit, a.absolute);
}

export function multiply(a: Quantity, b: Quantity): Quantity {
  const dims = dimsMul(a.dims, b.dims);
  // A plain factor keeps the other side's unit: 2 * 12 km/h is 24 km/h.
  const unit = isDimensionless(a.dims) && !a.unit?.text.includes('%') ? keepUnit(b) : isDimensionless(b.dims) && !b.unit?.text.includes('%') ? keepUnit(a) : undefined;
  return quantity(a.si * b.si, dims, unit);
}

export function divide(a: Quantity, b: Quantity): Quantity {
  if (b.si === 0) throw new UnitError('division by zero');
  const dims = dimsMul(a.dims, b.dims, -1);
  const unit = isDimensionless(b.dims) && !b.unit?.text.includes('%') ? keepUnit(a) : undefined;
  return quantity(a.si / b.si, dims, unit);
}

/** Scaling keeps a unit only when it has no offset (2 * 15 degC is not 30 degC). */
function keepUnit(q: Quantity): Unit | undefined {
  return q.unit && q.unit.offset === 0 ? q.unit : undefined;
}

export function power(a: Quantity, b: Quantity): Quantity {
  if (!isDimensionless(b.dims)) throw new UnitError(`an exponent must be a plain number, not ${describe(b.dims)}`);
  const n = b.si;
  if (!isDimensionless(a.dims) && !Number.isFinite(n)) throw new UnitError('an exponent of a quantity with units must be finite');
  return quantity(Math.pow(a.si, n), dimsPow(a.dims, n));
}

export function negate(a: Quantity): Quantity {
  if (a.absolute) throw new UnitError('cannot negate an absolute temperature');
  return quantity(-a.si, a.dims, a.unit);
}

export function compare(a: Quantity, b: Quantity): number {
  if (!dimsEqual(a.dims, b.dims)) throw new UnitError(`cannot compare ${describe(a.dims)} with ${describe(b.dims)}`);
  return a.si - b.si;
}

export { UnitError, parseUnit };
export type { Unit };
