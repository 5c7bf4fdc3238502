// Errors are values with a place and plain words. The codes are listed here,
// in one place, and documented in worksheets/guide/language.md.

/** A place in a worksheet file: 1-based line, 1-based columns. */
export interface Span {
  readonly line: number;
  readonly col: number;
  /** Column just past the node. */
  readonly end: number;
}

export const ERROR_CODES = {
  syntax: 'the line cannot be read as a statement',
  'unknown-name': 'a name is used but never defined',
  'unknown-function': 'a call names no trade function',
  'unknown-unit': 'a unit name is not known',
  'ambiguous-unit': 'a word after a number is both a unit and a name defined on the sheet',
  'unit-mismatch': 'the dimensions of two operands do not fit',
  'bad-argument': 'a trade function was given a wrong or missing argument',
  redefined: 'a name is defined a second time',
  cycle: 'definitions depend on each other in a circle',
  type: 'a value of the wrong kind (text where a number belongs, …)',
  'not-evaluated': 'depends on a name that failed',
  limit: 'the sheet went past a step, size or time limit',
  'data-file': 'a data file could not be read or is outside the project',
  'check-failed': 'a check evaluated to false',
  internal: 'a fault inside Wakesheet itself (please report it)',
} as const;

export type ErrorCode = keyof typeof ERROR_CODES;

export class SheetError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly span?: Span,
  ) {
    super(message);
  }
}

export interface Diagnostic {
  readonly code: ErrorCode;
  readonly message: string;
  readonly line: number;
  readonly column: number;
  /** Lines of other places the message refers to (the first definition …). */
  readonly related?: readonly number[];
}

export function diagnostic(err: SheetError, fallbackLine: number): Diagnostic {
  return {
    code: err.code,
    message: err.message,
    line: err.span?.line ?? fallbackLine,
    column: err.span?.col ?? 1,
  };
}

/** "van.md:12:7: unit-mismatch: cannot add Pa to m/s" */
export function formatDiagnostic(file: string, d: Diagnostic): string {
  return `${file}:${d.line}:${d.column}: ${d.code}: ${d.message}`;
}
