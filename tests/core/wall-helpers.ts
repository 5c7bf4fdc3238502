// Shared pieces for the near-wall tests: a fluid record, a call context
// whose data files come from a map, and readers for record fields.
import { record, si, type Args, type CallContext, type TradeFunction, type Quantity, type RecordValue, type Value } from '../../server/core/index.js';
import { wallEntries } from '../../server/core/wall/entries.js';

/** Sea-level air of the U.S. Standard Atmosphere 1976: rho 1.2250 kg/m³, mu 1.7894e-5 Pa s. */
export const ISA_RHO = 1.225;
export const ISA_MU = 1.7894e-5;
export const isaAir = record([
  ['rho', si(ISA_RHO, 'kg/m^3')],
  ['mu', si(ISA_MU, 'Pa s')],
]);

export function entry(name: string): TradeFunction {
  const f = wallEntries.find((e) => e.name === name);
  if (!f) throw new Error(`no wall function ${name}`);
  return f;
}

export interface StubContext extends CallContext {
  warnings: string[];
}

export function stubContext(files: Record<string, string> = {}): StubContext {
  const warnings: string[] = [];
  return {
    warnings,
    readData(path) {
      const text = files[path];
      if (text === undefined) throw new Error(`test stub has no file ${path}`);
      return text;
    },
    warn(message) {
      warnings.push(message);
    },
  };
}

export function call(name: string, args: Args, ctx: CallContext = stubContext()): Value {
  return entry(name).compute(args, ctx);
}

export function asRecord(v: Value): RecordValue {
  if (v.kind !== 'record') throw new Error(`expected a record, got ${v.kind}`);
  return v;
}

export function siField(r: RecordValue, name: string): number {
  const f = r.fields.get(name);
  if (!f) throw new Error(`record has no field ${name}`);
  return asQuantity(f.value).si;
}

export function asQuantity(v: Value): Quantity {
  if (v.kind !== 'quantity') throw new Error(`expected a quantity, got ${v.kind}`);
  return v;
}

export function textField(r: RecordValue, name: string): string {
  const f = r.fields.get(name);
  if (!f || f.value.kind !== 'string') throw new Error(`record has no text field ${name}`);
  return f.value.value;
}

/** Relative closeness, for values computed from a published formula. */
export function relErr(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}
