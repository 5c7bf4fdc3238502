// The trade-function registry: each entry declares its parameters (with their
// dimension and default), the fields or the one value it returns, a one-line
// doc, its published source and an example call. The function guide is
// generated from these declarations (scripts/function-guide.ts).
import type { Value } from './values.js';

export type ParamType = 'quantity' | 'string' | 'bool' | 'list' | 'record' | 'fluid' | 'any';

export interface ParamSpec {
  readonly name: string;
  readonly type: ParamType;
  /**
   * The dimension a quantity (or list of quantities) must have, as unit text
   * ("m/s", "Pa s", "1" for a plain number), or "any" for any dimension.
   * Every quantity parameter says which.
   */
  readonly unit?: string;
  /** Default as worksheet source text ("101325 Pa", "\"schlichting\"", "[0.5, 5]"). */
  readonly default?: string;
  /** May be left out with no default: the function sees undefined. */
  readonly optional?: boolean;
  /** For string parameters: the accepted words. */
  readonly choices?: readonly string[];
  readonly doc: string;
}

/** A field of the record a trade function returns. */
export interface FieldSpec {
  readonly name: string;
  /** The field's mathematical symbol, in LaTeX ("\\delta^{*}", "u_{\\tau}"). */
  readonly symbol: string;
  /** Its dimension as unit text ("m", "1"), "text" for words, "list" or "table". */
  readonly unit: string;
  readonly doc: string;
}

/** What a trade function returns when it is one value rather than a record. */
export interface ResultSpec {
  /** Its mathematical symbol in LaTeX, or "" where it has none. */
  readonly symbol: string;
  /** Its dimension as unit text ("Pa", "1"), "any" when it follows the arguments, or "list". */
  readonly unit: string;
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
  /** The fields of the returned record, when it returns one. */
  readonly fields?: readonly FieldSpec[];
  /** The returned value, when it is one value: every entry declares either this or fields. */
  readonly returns?: ResultSpec;
  /** One line: what it returns. */
  readonly doc: string;
  /** Method and published source, e.g. "Sutherland's law, U.S. Standard Atmosphere 1976, Eq. 51". */
  readonly source: string;
  /**
   * A call that evaluates, used by the registry test and the function guide
   * (worksheets/guide/functions.md): data paths are relative to that guide's folder.
   */
  readonly example: string;
  compute(args: Args, ctx: CallContext): Value;
}

/** Unit text of a parameter that takes a quantity of any dimension. */
export const ANY_DIMENSION = 'any';

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
