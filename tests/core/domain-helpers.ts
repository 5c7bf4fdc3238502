// Shared pieces for the domain-family tests: calling an entry with its
// declared defaults filled in, as a sheet would.
import { bool, num, si, str, type Args, type TradeFunction, type Value } from '../../server/core/index.js';
import { domainEntries } from '../../server/core/domain/entries.js';
import { stubContext, type StubContext } from './wall-helpers.js';

export { asRecord, relErr, siField, stubContext, textField } from './wall-helpers.js';

export function entry(name: string): TradeFunction {
  const f = domainEntries.find((e) => e.name === name);
  if (!f) throw new Error(`no domain function ${name}`);
  return f;
}

/** The defaults of the domain entries, as the values the engine would fill in. */
const DEFAULTS: Record<string, Record<string, Value>> = {
  domain: { rule: str('three-lengths'), ground: bool(true) },
  domain_study: { tol: num(0.01) },
  zone: { ground: bool(true) },
  cell_budget: {
    volumes: str('nested'),
    tet_per_hex: num(5.5),
    tet_per_poly: num(4.5),
    memory_per_million: num(2),
    cpu_per_million: si(7200, 's'),
    iterations: num(1000),
  },
};

export function call(name: string, args: Args, ctx: StubContext = stubContext()): Value {
  return entry(name).compute({ ...(DEFAULTS[name] ?? {}), ...args }, ctx);
}

export function metres(...xs: number[]): Value {
  return { kind: 'list', items: xs.map((x) => si(x, 'm')) };
}
