// How long and how deep one statement line may be. A line past these is an
// error on that line with the limit in its words; the rest of the sheet
// evaluates. They also bound every walk over a parsed tree: nesting is at most
// MAX_NESTING deep, and a chain of operators (a + b + c …) at most as long as
// the line allows.
import { SheetError } from '../diagnostics.js';
import type { Span } from './ast.js';

/** Characters in one statement line or inline value. Long data belongs in a CSV file. */
export const MAX_LINE_CHARS = 4000;
/** Brackets, lists, calls, signs, `not`, powers and fractions open inside each other. */
export const MAX_NESTING = 200;

export function lineTooLong(length: number, span: Span): SheetError {
  return new SheetError(
    'limit',
    `this line is ${length.toLocaleString('en')} characters long; a statement may have at most ${MAX_LINE_CHARS.toLocaleString('en')} (put long lists of numbers in a CSV file)`,
    span,
  );
}

export function nestedTooDeep(span: Span): SheetError {
  return new SheetError('limit', `this line nests brackets, signs, powers or fractions more than ${MAX_NESTING} deep (a / b / c counts as two fractions); split it into named steps`, span);
}

/** A number literal past what a double holds would silently become infinity or zero. */
export function checkLiteral(text: string, value: number, span: Span): void {
  if (!Number.isFinite(value)) {
    throw new SheetError('limit', `${text} is beyond the largest number a sheet can hold, about 1.8e308`, span);
  }
  if (value === 0 && /[1-9]/.test(text.replace(/[eE].*$/, ''))) {
    throw new SheetError('limit', `${text} is below the smallest number a sheet can hold, about 5e-324`, span);
  }
}
