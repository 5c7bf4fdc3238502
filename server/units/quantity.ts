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
  /** A temperature difference (interval): never an absolute temperature, shown as Δ°C or Δ°F. */
  readonly interval?: boolean;
  /** The unit was asked for with `to`: show exactly it, no automatic prefix. */
  readonly pinned?: boolean;
}

export function quantity(si: number, dims: Dims = DIMENSIONLESS, unit?: Unit, absolute?: boolean, interval?: boolean): Quantity {
  // Whole literals, not properties added afterwards: V8 then stores each
  // quantity in one compact object (a list of 100,000 takes a third less memory).
  if (absolute) return unit ? { kind: 'quantity', si, dims, unit, absolute: true } : { kind: 'quantity', si, dims, absolute: true };
  if (interval) return unit ? { kind: 'quantity', si, dims, unit, interval: true } : { kind: 'quantity', si, dims, interval: true };
  return unit ? { kind: 'quantity', si, dims, unit } : { kind: 'quantity', si, dims };
}

export function plain(x: number): Quantity {
  return quantity(x);
}

/** A quantity like `q` (its dimension, unit and temperature sense) with another SI value. */
export function withSi(q: Quantity, si: number): Quantity {
  return quantity(si, q.dims, q.unit, q.absolute, q.interval);
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
  return quantity(si, u.dims, u.text ? u : undefined, absolute, u.interval);
}

/** SI number of `q` in `unit` (offset-aware). */
export function inUnit(q: Quantity, u: Unit): number {
  if (!dimsEqual(q.dims, u.dims)) throw new UnitError(`cannot convert ${describe(q.dims)} to ${describeUnit(u)}`);
  return q.si / u.factor - u.offset;
}

/** The interval unit of the same degree as a temperature unit: degC → delta_degC, degF → delta_degF, K stays K. */
export function intervalUnit(u: Unit): Unit {
  if (u.offset === 0) return u;
  return parseUnit(Math.abs(u.factor - 1) < 1e-12 ? 'delta_degC' : Math.abs(u.factor * 1.8 - 1) < 1e-12 ? 'delta_degF' : 'K');
}

export function convert(q: Quantity, u: Unit): Quantity {
  if (!dimsEqual(q.dims, u.dims)) throw new UnitError(`cannot convert ${describe(q.dims)} to ${describeUnit(u)}`);
  if (q.interval || u.interval) {
    // A difference stays a difference: in degC or degF it is scaled, never offset.
    if (q.absolute) {
      throw new UnitError('an absolute temperature cannot be shown as a temperature difference; subtract a reference first, e.g. (T - 0 degC) to delta_degC');
    }
    return { ...quantity(q.si, q.dims, intervalUnit(u), false, true), pinned: true };
  }
  return { ...quantity(q.si, q.dims, u, q.absolute || u.offset !== 0), pinned: true };
}

export function describe(d: Dims): string {
  return isDimensionless(d) ? 'a plain number' : unitLabel(d);
}

function describeUnit(u: Unit): string {
  return u.text || 'a plain number';
}

/** The unit a sum keeps: the left operand's, else the right's. */
function sumUnit(a: Quantity, b: Quantity): Unit | undefined {
  return a.unit ?? b.unit;
}

export function add(a: Quantity, b: Quantity): Quantity {
  if (!dimsEqual(a.dims, b.dims)) throw new UnitError(`cannot add ${describe(a.dims)} to ${describe(b.dims)}`);
  if (a.absolute && b.absolute) {
    throw new UnitError('cannot add two absolute temperatures; subtract them for a difference, or add a difference in K');
  }
  if (a.absolute || b.absolute) return quantity(a.si + b.si, a.dims, a.absolute ? a.unit : b.unit, true);
  return quantity(a.si + b.si, a.dims, sumUnit(a, b), false, a.interval || b.interval);
}

export function subtract(a: Quantity, b: Quantity): Quantity {
  if (!dimsEqual(a.dims, b.dims)) throw new UnitError(`cannot subtract ${describe(b.dims)} from ${describe(a.dims)}`);
  if (a.absolute && b.absolute) {
    // A difference of two temperatures is a temperature difference, in the degree the left one was written in.
    return quantity(a.si - b.si, TEMPERATURE, a.unit ? intervalUnit(a.unit) : parseUnit('K'), false, true);
  }
  if (b.absolute && !a.absolute) throw new UnitError('cannot subtract an absolute temperature from a temperature difference');
  if (a.absolute) return quantity(a.si - b.si, a.dims, a.unit, true);
  return quantity(a.si - b.si, a.dims, sumUnit(a, b), false, a.interval || b.interval);
}

/** A plain number, not a percentage: multiplying by it keeps the other side's unit. */
function plainFactor(q: Quantity): boolean {
  return isDimensionless(q.dims) && !q.unit?.text.includes('%');
}

export function multiply(a: Quantity, b: Quantity): Quantity {
  const dims = dimsMul(a.dims, b.dims);
  // A plain factor keeps the other side's unit: 2 * 12 km/h is 24 km/h.
  const unit = plainFactor(a) ? keepUnit(b) : plainFactor(b) ? keepUnit(a) : undefined;
  // Half a temperature difference is still a difference.
  const interval = (a.interval && isDimensionless(b.dims)) || (b.interval && isDimensionless(a.dims));
  return quantity(a.si * b.si, dims, unit, false, interval);
}

export function divide(a: Quantity, b: Quantity): Quantity {
  if (b.si === 0) throw new UnitError('division by zero');
  const dims = dimsMul(a.dims, b.dims, -1);
  const unit = plainFactor(b) ? keepUnit(a) : undefined;
  return quantity(a.si / b.si, dims, unit, false, a.interval && isDimensionless(b.dims));
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
  return quantity(-a.si, a.dims, a.unit, false, a.interval);
}

export function compare(a: Quantity, b: Quantity): number {
  if (!dimsEqual(a.dims, b.dims)) throw new UnitError(`cannot compare ${describe(a.dims)} with ${describe(b.dims)}`);
  if ((a.absolute && b.interval) || (a.interval && b.absolute)) {
    throw new UnitError('cannot compare an absolute temperature with a temperature difference');
  }
  return a.si - b.si;
}

export { UnitError, parseUnit };
export type { Unit };
