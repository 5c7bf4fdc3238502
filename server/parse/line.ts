// One line of a basis block as the later stages see it: a statement, a line
// that does not parse (with the name it was meant to define, so that its users
// wait on it rather than call it undefined), or nothing (blank, comment).
import { diagnostic, SheetError, type Diagnostic } from '../diagnostics.js';
import type { Statement } from './ast.js';
import { parseStatement } from './parser.js';

export interface BrokenLine extends Diagnostic {
  /** The name the line defines, when its head `name =` can still be read. */
  readonly name?: string;
  /** The line's text, shown under the error. */
  readonly source: string;
}

export type ParsedLine = Statement | BrokenLine;

const DEFINE_HEAD = /^\s*([A-Za-z_µμ\u0370-\u03ff][A-Za-z0-9_\u0370-\u03ff]*)\s*=(?!=)/;

export function parseLine(text: string, line: number, col: number): ParsedLine | null {
  try {
    return parseStatement(text, line, col);
  } catch (e) {
    if (!(e instanceof SheetError)) throw e;
    const name = DEFINE_HEAD.exec(text)?.[1];
    return { ...diagnostic(e, line), ...(name ? { name } : {}), source: text.trim() };
  }
}

export function isStatement(item: ParsedLine): item is Statement {
  return 'type' in item;
}
