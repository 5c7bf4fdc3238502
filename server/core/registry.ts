// The trade-function registry: each entry declares its parameters with units
// and defaults, a one-line doc, its published source and an example call.
import type { Value } from './values.js';

export type ParamType = 'quantity' | 'string' | 'bool' | 'list' | 'record' | 'fluid' | 'any';

export interface ParamSpec {
  readonly name: string;
  readonly type: ParamType;
  /** Expected dimension, as unit text ("m/s", "Pa s", "1" for a plain number). */
  readonly unit?: string;
  /** Default as worksheet source text ("101325 Pa", "\"schlichting\"", "[0.5, 5]"). */
  readonly default?: string;
  /** May be left out with no default: the function sees undefined. */
  readonly optional?: boolean;
  /** For string parameters: the accepted words. */
  readonly choices?: readonly string[];
  readonly doc: string;
}

export interface CallContext {
  /** Text of a data file, by path relative to the project folder (checked by the reader). */
  readData(relativePath: string): string;
  /** A visible warning attached to the calling statement. */
  warn(message: string): void;
}

export type Args = Readonly<Record<string, Value | undefined>>;

export interface TradeFunction {
  readonly name: string;
  readonly params: readonly ParamSpec[];
  /** One line: what it returns. */
  readonly doc: string;
  /** Method and published source, e.g. "Sutherland's law, U.S. Standard Atmosphere 1976, Eq. 51". */
  readonly source: string;
  /** A call that evaluates, used by the registry test and the guide. */
  readonly example: string;
  compute(args: Args, ctx: CallContext): Value;
}

/** Thrown by trade functions for bad input; shown in the sheet in these words. */
export class TradeError extends Error {}

export class Registry {
  private readonly table = new Map<string, TradeFunction>();

  constructor(entries: Iterable<TradeFunction> = []) {
    for (const e of entries) this.add(e);
  }

  add(entry: TradeFunction): void {
    if (this.table.has(entry.name)) throw new Error(`trade function ${entry.name} registered twice`);
    this.table.set(entry.name, entry);
  }

  get(name: string): TradeFunction | undefined {
    return this.table.get(name);
  }

  has(name: string): boolean {
    return this.table.has(name);
  }

  list(): TradeFunction[] {
    return [...this.table.values()];
  }
}
