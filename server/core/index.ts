// The trade library: every family's entries in one registry. A family is a
// folder of pure maths files and one entries.ts; add a new family here.
import { boundaryEntries } from './boundaries/entries.js';
import { domainEntries } from './domain/entries.js';
import { convergenceEntries } from './convergence/entries.js';
import { fluidEntries } from './fluids/entries.js';
import { mathsEntries } from './maths/entries.js';
import { Registry, type TradeFunction } from './shared/registry.js';
import { wallEntries } from './wall/entries.js';

/** A family as the function guide presents it: a heading, one line on what it is for, its entries. */
export interface TradeFamily {
  readonly title: string;
  readonly about: string;
  readonly entries: readonly TradeFunction[];
}

export const tradeFamilies: readonly TradeFamily[] = [
  { title: 'Basic maths', about: 'Roots, logarithms, trigonometry and lists, with units kept where they make sense.', entries: mathsEntries },
  { title: 'Fluids and similarity numbers', about: 'Fluid properties as records, and the numbers that say what kind of flow it is.', entries: fluidEntries },
  { title: 'Near-wall resolution', about: 'Skin friction, the boundary layer, the first cell, wall-layer stacks and the y+ of a run.', entries: wallEntries },
  { title: 'Domain and mesh budget', about: 'The box around the body, refinement levels and zones, and what the mesh will cost.', entries: domainEntries },
  { title: 'Boundary conditions and time', about: 'Inlet turbulence, the atmospheric boundary layer, patch conditions, time steps and force coefficients.', entries: boundaryEntries },
  { title: 'Convergence and grid studies', about: 'Residual histories, monitored quantities, under-relaxation and the grid convergence index.', entries: convergenceEntries },
];

export const families: ReadonlyArray<readonly TradeFunction[]> = tradeFamilies.map((f) => f.entries);

export function createRegistry(): Registry {
  return new Registry(families.flat());
}

export { Registry, ANY_DIMENSION } from './shared/registry.js';
export { TradeError } from './shared/trade-error.js';
export type { TradeFunction, ParamSpec, FieldSpec, ResultSpec, CallContext, Args } from './shared/registry.js';
export type * from './shared/values.js';
export { escapeHtml } from './shared/escape.js';
export { countText, nearestWord, nounFor, numberText } from './shared/words.js';
export { bool, describeValue, figure, list, num, record, shown, si, str, table } from './shared/values.js';
export { fieldRecord, withDeclaredSymbols } from './shared/records.js';
export { linePlot } from './shared/plot.js';
