// `use "inputs.md"` or `use "inputs.md" (U_inf, L_ref)`: another sheet's
// definitions brought into this one, read-only. A line of its own kind, not
// a statement: the pipeline resolves it before the sheet is evaluated.
import { SheetError, type Span } from '../diagnostics.js';
import { lex } from './lexer.js';

export interface UseLine {
  readonly kind: 'use';
  /** The other sheet, relative to this one. */
  readonly path: string;
  readonly pathSpan: Span;
  /** The names brought in; all the sheet defines when absent. */
  readonly names?: ReadonlyArray<{ name: string; span: Span }>;
  readonly line: number;
  readonly source: string;
}

/** A `use` line, or null when the line is something else. Throws SheetError when it starts as one but is malformed. */
export function parseUse(text: string, line: number, col0 = 1): UseLine | null {
  const tokens = lex(text, line, col0).filter((t) => t.type !== 'comment');
  const [head, path] = tokens;
  if (!head || head.type !== 'ident' || head.text !== 'use' || !path || path.type !== 'string') return null;
  let i = 2;
  let names: Array<{ name: string; span: Span }> | undefined;
  if (tokens[i]?.text === '(') {
    names = [];
    i++;
    while (tokens[i] && tokens[i]!.text !== ')') {
      const t = tokens[i]!;
      if (t.type !== 'ident') throw new SheetError('syntax', `expected a name in the list of names to use, found "${t.text || 'the end of the line'}"`, t.span);
      names.push({ name: t.text, span: t.span });
      i++;
      if (tokens[i]?.text === ',') i++;
      else if (tokens[i]?.text !== ')') throw new SheetError('syntax', 'expected "," or ")" in the list of names to use', tokens[i]?.span ?? t.span);
    }
    if (!tokens[i]) throw new SheetError('syntax', 'the list of names to use has no closing ")"', head.span);
    if (names.length === 0) throw new SheetError('syntax', 'the list of names to use is empty; leave out the brackets to use every name', tokens[i]!.span);
    i++;
  }
  if (tokens[i] && tokens[i]!.type !== 'eof') throw new SheetError('syntax', `expected the end of the line after the use of "${path.value}", found "${tokens[i]!.text}"`, tokens[i]!.span);
  const comment = text.indexOf('#');
  const source = (comment >= 0 ? text.slice(0, comment) : text).trim();
  return { kind: 'use', path: path.value as string, pathSpan: path.span, ...(names ? { names } : {}), line, source };
}
