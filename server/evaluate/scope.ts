// What an expression is evaluated against: how names resolve, the registry,
// the step budget, and the context trade functions see.
import type { Span } from '../diagnostics.js';
import type { CallContext, Registry, TradeFunction, Value } from '../core/index.js';
import { quantity } from '../units/quantity.js';
import type { Budget } from './limits.js';

export interface Scope {
  /** A sheet name's value; throws SheetError when it is unknown or failed. */
  lookup(name: string, span: Span): Value;
  readonly registry: Registry;
  readonly budget: Budget;
  /** Context handed to trade functions (data files, warnings). */
  readonly context: CallContext;
  /** Values of parameter defaults, parsed and evaluated once per registry. */
  defaultOf(entry: TradeFunction, param: string): Value;
}

/** Names every sheet has unless it defines them itself. */
export const CONSTANTS: ReadonlyMap<string, Value> = new Map([['pi', quantity(Math.PI)]]);
