// The registry of every trade function, family by family. Add a family here.
import { Registry, type TradeFunction } from './registry.js';
import { mathsFunctions } from './maths.js';
import { fluidFunctions } from './fluids/index.js';
import { wallFunctions } from './wall/index.js';

export const families: ReadonlyArray<readonly TradeFunction[]> = [mathsFunctions, fluidFunctions, wallFunctions];

export function createRegistry(): Registry {
  return new Registry(families.flat());
}

export { Registry, TradeError } from './registry.js';
export type { TradeFunction, ParamSpec, CallContext, Args } from './registry.js';
export type * from './values.js';
