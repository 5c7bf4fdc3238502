// The trade library: every family's entries in one registry. A family is a
// folder of pure maths files and one entries.ts; add a new family here.
import { boundaryEntries } from './boundaries/entries.js';
import { domainEntries } from './domain/entries.js';
import { convergenceEntries } from './convergence/entries.js';
import { fluidEntries } from './fluids/entries.js';
import { mathsEntries } from './maths/entries.js';
import { Registry, type TradeFunction } from './shared/registry.js';
import { wallEntries } from './wall/entries.js';

export const families: ReadonlyArray<readonly TradeFunction[]> = [mathsEntries, fluidEntries, wallEntries, domainEntries, boundaryEntries, convergenceEntries];

export function createRegistry(): Registry {
  return new Registry(families.flat());
}

export { Registry, ANY_DIMENSION } from './shared/registry.js';
export { TradeError } from './shared/trade-error.js';
export type { TradeFunction, ParamSpec, FieldSpec, CallContext, Args } from './shared/registry.js';
export type * from './shared/values.js';
export { escapeHtml } from './shared/escape.js';
export { countText, nearestWord, nounFor, numberText } from './shared/words.js';
export { bool, describeValue, figure, list, num, record, shown, si, str, table } from './shared/values.js';
export { fieldRecord, withDeclaredSymbols } from './shared/records.js';
export { linePlot } from './shared/plot.js';
