// Argument helpers shared by the wall-function registry entries: they turn
// the pure functions' RangeErrors into sheet-visible TradeErrors and read
// the word-valued parameters.
import { stringArg } from '../build.js';
import { type Args, type CallContext, TradeError } from '../registry.js';
import type { Value } from '../values.js';
import { CsvProblem } from './wall-csv.js';
import { SKIN_FRICTION_METHODS, type SkinFrictionMethod } from './skin-friction.js';
import { PLACEMENTS, type Placement } from './first-cell.js';

/** Runs a compute body; bad-input errors from the maths reach the sheet in their own words. */
export function guarded(body: (args: Args, ctx: CallContext) => Value): (args: Args, ctx: CallContext) => Value {
  return (args, ctx) => {
    try {
      return body(args, ctx);
    } catch (e) {
      if (e instanceof RangeError || e instanceof CsvProblem) throw new TradeError(e.message);
      throw e;
    }
  };
}

export function choiceArg<T extends string>(args: Args, name: string, choices: readonly T[]): T {
  const v = stringArg(args, name);
  if (!(choices as readonly string[]).includes(v)) {
    throw new TradeError(`${name} "${v}" is not one of ${choices.map((c) => `"${c}"`).join(', ')}`);
  }
  return v as T;
}

export function methodArg(args: Args): SkinFrictionMethod {
  return choiceArg(args, 'method', SKIN_FRICTION_METHODS);
}

export function placementArg(args: Args): Placement {
  return choiceArg(args, 'placement', PLACEMENTS);
}

export const METHOD_PARAM = {
  name: 'method',
  type: 'string',
  default: '"schlichting"',
  choices: SKIN_FRICTION_METHODS,
  doc: 'skin-friction correlation: blasius, schlichting, power, ittc1957 or white',
} as const;

export const PLACEMENT_PARAM = {
  name: 'placement',
  type: 'string',
  default: '"centroid"',
  choices: PLACEMENTS,
  doc: 'where y+ is measured: at the first cell centre (cell-centred solvers) or at its top',
} as const;
