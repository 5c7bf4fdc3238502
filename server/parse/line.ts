// One line of a basis block as the later stages see it: a statement, a line
// that does not parse (with the name it was meant to define, so that its users
// wait on it rather than call it undefined), or nothing (blank, comment).
import { diagnostic, SheetError, type Diagnostic } from '../diagnostics.js';
import type { Span, Statement } from './ast.js';
import { parseStatement } from './parser.js';
import { parseUse, type UseLine } from './use.js';

export interface BrokenLine extends Diagnostic {
  /** The name the line defines, when its head `name =` can still be read. */
  readonly name?: string;
  /** The line's text, shown under the error. */
  readonly source: string;
}

export type ParsedLine = Statement | BrokenLine | UseLine;

const DEFINE_HEAD = /^\s*([A-Za-z_µμ\u0370-\u03ff][A-Za-z0-9_\u0370-\u03ff]*)\s*=(?!=)/;

/** A broken line is shown under its error; past this many characters it is shown cut. */
const SHOWN_SOURCE_CHARS = 200;

export function parseLine(text: string, line: number, col: number): ParsedLine | null {
  try {
    return parseUse(text, line, col) ?? parseStatement(text, line, col);
  } catch (e) {
    const err = asSheetError(e, { line, col, end: col + text.length });
    const name = DEFINE_HEAD.exec(text.slice(0, SHOWN_SOURCE_CHARS))?.[1];
    const source = text.trim();
    return { ...diagnostic(err, line), ...(name ? { name } : {}), source: source.length > SHOWN_SOURCE_CHARS ? `${source.slice(0, SHOWN_SOURCE_CHARS)} …` : source };
  }
}

/**
 * The parser's limits keep its recursion shallow; should a line still run
 * out of stack, it is that line's error, never the sheet's.
 */
export function asSheetError(e: unknown, span: Span): SheetError {
  if (e instanceof SheetError) return e;
  if (isStackOverflow(e)) return new SheetError('limit', 'this line is nested too deeply to work through; split it into named steps', span);
  throw e;
}

export function isStackOverflow(e: unknown): boolean {
  return e instanceof RangeError && /call stack/i.test(e.message);
}

export function isStatement(item: ParsedLine): item is Statement {
  return 'type' in item;
}

export function isUse(item: ParsedLine): item is UseLine {
  return 'kind' in item && item.kind === 'use';
}

export function isBroken(item: ParsedLine): item is BrokenLine {
  return !isStatement(item) && !isUse(item);
}
