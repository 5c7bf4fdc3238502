// Shared helpers for the fluid-property tests: calling registry entries the
// way the engine will (every argument given), and reading record fields.
import { expect } from 'vitest';
import { fluidEntries } from '../../server/core/fluids/entries.js';
import { type Args, type CallContext, type TradeFunction, type RecordValue, type Value } from '../../server/core/index.js';

export function entry(name: string): TradeFunction {
  const f = fluidEntries.find((e) => e.name === name);
  if (!f) throw new Error(`no trade function ${name}`);
  return f;
}

export interface Call {
  value: Value;
  warnings: string[];
}

export function call(name: string, args: Args): Call {
  const warnings: string[] = [];
  const ctx: CallContext = { readData: () => '', warn: (m) => warnings.push(m) };
  return { value: entry(name).compute(args, ctx), warnings };
}

export function asRecord(v: Value): RecordValue {
  if (v.kind !== 'record') throw new Error(`expected a record, got ${v.kind}`);
  return v;
}

/** SI number of a record field. */
export function field(v: Value, name: string): number {
  const f = asRecord(v).fields.get(name);
  if (!f) throw new Error(`record has no field ${name}`);
  if (f.value.kind !== 'quantity') throw new Error(`field ${name} is not a quantity`);
  return f.value.si;
}

export function siOfValue(v: Value): number {
  if (v.kind !== 'quantity') throw new Error(`expected a quantity, got ${v.kind}`);
  return v.si;
}

/**
 * |actual − expected| ≤ tol, with the numbers in the failure message. A value
 * exactly half a unit off (101325 Pa against 1.0133 bar) must pass despite
 * floating-point noise, hence the tiny relative slack.
 */
export function near(actual: number, expected: number, tol: number): void {
  expect(Math.abs(actual - expected), `${actual} vs ${expected} (± ${tol})`).toBeLessThanOrEqual(tol * (1 + 1e-9));
}

/** Relative agreement within rel. */
export function nearRel(actual: number, expected: number, rel: number): void {
  near(actual, expected, Math.abs(expected) * rel);
}
