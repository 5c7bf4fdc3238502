// Splits one statement line into tokens. Lines are lexed one at a time: a
// statement never spans lines, so every token knows its file line directly.
import { SheetError } from '../diagnostics.js';
import type { Span } from './ast.js';
import { checkLiteral, lineTooLong, MAX_LINE_CHARS } from './limits.js';

export type TokenType = 'number' | 'ident' | 'string' | 'op' | 'comment' | 'eof';

export interface Token {
  readonly type: TokenType;
  readonly text: string;
  /** Parsed number for numbers, unescaped text for strings. */
  readonly value?: number | string;
  readonly span: Span;
  /** Whitespace stood right before this token. */
  readonly spaced: boolean;
}

// `+-` is the ASCII spelling of `±` (an input's uncertainty); both lex as `±`.
const OPS = ['±', '+-', '<=', '>=', '==', '!=', '+', '-', '*', '/', '^', '(', ')', '[', ']', ',', ':', '.', '=', '<', '>', '%', '·'];
const NUMBER = /^(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/;
const IDENT = /^[A-Za-z_µμ\u0370-\u03ff][A-Za-z0-9_\u0370-\u03ff]*/;

/** Tokens of `text`, which sits on file line `line` starting at column `col0` (1-based). */
export function lex(text: string, line: number, col0 = 1): Token[] {
  const out: Token[] = [];
  let i = 0;
  const span = (start: number, end: number): Span => ({ line, col: col0 + start, end: col0 + end });
  while (i < text.length) {
    const start = i;
    while (i < text.length && (text[i] === ' ' || text[i] === '\t')) i++;
    const spaced = i > start;
    if (i >= text.length) break;
    // A comment may run on; the statement before it may not (checked as it goes, so a huge line costs little).
    if (i >= MAX_LINE_CHARS && text[i] !== '#') throw lineTooLong(text.length, span(0, text.length));
    const rest = text.slice(i);
    const ch = text[i]!;
    if (ch === '#') {
      out.push({ type: 'comment', text: rest.slice(1).trim(), span: span(i, text.length), spaced });
      i = text.length;
      break;
    }
    const num = NUMBER.exec(rest);
    if (num && !(ch === '.' && out.length > 0 && !spaced && out[out.length - 1]!.type === 'ident')) {
      const value = Number(num[0]);
      checkLiteral(num[0], value, span(i, i + num[0].length));
      out.push({ type: 'number', text: num[0], value, span: span(i, i + num[0].length), spaced });
      i += num[0].length;
      continue;
    }
    const id = IDENT.exec(rest);
    if (id) {
      out.push({ type: 'ident', text: id[0], span: span(i, i + id[0].length), spaced });
      i += id[0].length;
      continue;
    }
    if (ch === '"') {
      let j = i + 1;
      let value = '';
      while (j < text.length && text[j] !== '"') {
        if (text[j] === '\\' && j + 1 < text.length) j++;
        value += text[j];
        j++;
      }
      if (j >= text.length) throw new SheetError('syntax', 'this text has no closing double quote', span(i, text.length));
      out.push({ type: 'string', text: text.slice(i, j + 1), value, span: span(i, j + 1), spaced });
      i = j + 1;
      continue;
    }
    const op = OPS.find((o) => rest.startsWith(o));
    if (op) {
      out.push({ type: 'op', text: op === '+-' ? '±' : op, span: span(i, i + op.length), spaced });
      i += op.length;
      continue;
    }
    throw new SheetError('syntax', `unexpected character "${ch}"`, span(i, i + 1));
  }
  const last = out[out.length - 1];
  if (last && last.type !== 'comment' && last.span.end - col0 > MAX_LINE_CHARS) throw lineTooLong(text.length, span(0, text.length));
  out.push({ type: 'eof', text: '', span: span(text.length, text.length), spaced: false });
  return out;
}
