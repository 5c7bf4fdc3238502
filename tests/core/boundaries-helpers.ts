// Shared pieces for the boundary-family tests: a call written as worksheet
// text and run through the engine's own binding (defaults, dimension checks,
// list sweeps), with sheet names supplied by the test; and readers of results.
import { createRegistry, record, si, type RecordValue, type Value } from '../../server/core/index.js';
import { evaluate } from '../../server/evaluate/interpreter.js';
import { Budget, DEFAULT_LIMITS } from '../../server/evaluate/limits.js';
import { makeScope } from '../../server/evaluate/make-scope.js';
import { parseExpression } from '../../server/parse/parser.js';
import { asQuantity, asRecord, ISA_MU, ISA_RHO } from './wall-helpers.js';

export { asQuantity, asRecord, ISA_MU, ISA_RHO, relErr, siField, textField } from './wall-helpers.js';

/** Sea-level air of the U.S. Standard Atmosphere 1976 (rho 1.2250 kg/m³, mu 1.7894e-5 Pa s). */
export const isa = record([
  ['rho', si(ISA_RHO, 'kg/m^3')],
  ['mu', si(ISA_MU, 'Pa s')],
]);
export const ISA_NU = ISA_MU / ISA_RHO;

const registry = createRegistry();

export interface Run {
  value: Value;
  /** Warnings the call raised through its context (quantity results). */
  warnings: string[];
}

/** Evaluate `text` (a call as a sheet writes it) with `names` in scope. */
export function run(text: string, names: Record<string, Value> = {}): Run {
  const warnings: string[] = [];
  const scope = makeScope({
    registry,
    budget: new Budget(DEFAULT_LIMITS),
    context: { readData: () => { throw new Error('no data files in these tests'); }, warn: (m) => warnings.push(m) },
    lookup(name) {
      const v = names[name] ?? (name === 'isa' ? isa : undefined);
      if (!v) throw new Error(`test gives no value for ${name}`);
      return v;
    },
    defaults: new Map(),
  });
  return { value: evaluate(parseExpression(text), scope), warnings };
}

export function runRecord(text: string, names: Record<string, Value> = {}): RecordValue {
  return asRecord(run(text, names).value);
}

export function runSi(text: string, names: Record<string, Value> = {}): number {
  return asQuantity(run(text, names).value).si;
}

/** The rows of a record's table field, each cell as display-free data: SI numbers or text. */
export function tableRows(r: RecordValue, field = 'table'): Array<Array<number | string>> {
  const f = r.fields.get(field);
  if (!f || f.value.kind !== 'table') throw new Error(`record has no table field ${field}`);
  return f.value.rows.map((row) => row.map((cell) => (cell.kind === 'quantity' ? cell.si : cell.kind === 'string' ? cell.value : `(${cell.kind})`)));
}

export function tableColumns(r: RecordValue, field = 'table'): readonly string[] {
  const f = r.fields.get(field);
  if (!f || f.value.kind !== 'table') throw new Error(`record has no table field ${field}`);
  return f.value.columns;
}

/** SI items of a list field. */
export function listField(r: RecordValue, name: string): number[] {
  const f = r.fields.get(name);
  if (!f || f.value.kind !== 'list') throw new Error(`record has no list field ${name}`);
  return f.value.items.map((i) => asQuantity(i).si);
}
