// Recursive-descent parser for one statement line. Precedence, loosest first:
// or, and, not, comparison (chainable), `to`, + -, * /, unary -, ^, postfix
// (call, .field), atoms. Units after numbers are parsed in their own namespace.
import { SheetError } from '../diagnostics.js';
import type { Arg, CompareOp, Expr, Span, Statement, UncertaintyNode, UnitNode } from './ast.js';
import { parseUnit } from '../units/unit-expr.js';
import { lex, type Token } from './lexer.js';
import { MAX_NESTING, nestedTooDeep } from './limits.js';
import { KEYWORDS, parseUnitExpr, powerTypo, targetStarts, unitStarts, type TokenCursor } from './units.js';

const COMPARE = new Set(['<', '<=', '>', '>=', '==', '!=']);

class Cursor implements TokenCursor {
  private i = 0;
  /** Constructs open around the current token: bounds the recursion here and in every later walk. */
  private depth = 0;
  constructor(private readonly tokens: Token[]) {}
  /** Opens one level of nesting at `t` (a bracket, a sign, a power, a fraction). */
  nest(t: Token): void {
    if (++this.depth > MAX_NESTING) throw nestedTooDeep(t.span);
  }
  unnest(): void {
    this.depth--;
  }
  peek(offset = 0): Token {
    return this.tokens[Math.min(this.i + offset, this.tokens.length - 1)]!;
  }
  next(): Token {
    const t = this.peek();
    if (this.i < this.tokens.length - 1) this.i++;
    return t;
  }
  last(): Token {
    return this.tokens[Math.max(0, this.i - 1)]!;
  }
  at(text: string): boolean {
    const t = this.peek();
    return (t.type === 'op' || t.type === 'ident') && t.text === text;
  }
  /** The next `count` tokens as a cursor of their own, ending in an end of line; consumed here. */
  take(count: number): Cursor {
    const part = this.tokens.slice(this.i, this.i + count);
    this.i += count;
    const at = this.peek().span;
    return new Cursor([...part, { type: 'eof', text: '', span: { line: at.line, col: at.col, end: at.col }, spaced: false }]);
  }
  expect(text: string, what: string): Token {
    if (!this.at(text)) throw unexpected(this.peek(), what);
    return this.next();
  }
}

function unexpected(t: Token, expected: string): SheetError {
  const found = t.type === 'eof' ? 'the end of the line' : `"${t.text}"`;
  return new SheetError('syntax', `expected ${expected}, found ${found}`, t.span);
}

function join(a: Span, b: Span): Span {
  return { line: a.line, col: a.col, end: b.end };
}

/** Parse one statement line; returns null for blank and comment lines. */
export function parseStatement(text: string, line: number, col0 = 1): Statement | null {
  const tokens = lex(text, line, col0);
  const comment = tokens.find((t) => t.type === 'comment');
  const body = tokens.filter((t) => t.type !== 'comment');
  if (body.length === 1) return null; // only eof: blank or comment line
  const c = new Cursor(body);
  const source = (comment ? text.slice(0, comment.span.col - col0) : text).trim();
  const description = comment?.text || undefined;
  const first = c.peek();
  if (first.type === 'ident' && first.text === 'check' && c.peek(1).text !== '=') {
    c.next();
    const expr = parseExpr(c);
    let label: string | undefined;
    if (c.peek().type === 'string') label = c.next().value as string;
    end(c);
    return withOptional<Statement>({ type: 'check', expr, line, source }, 'label', label ?? description);
  }
  if (first.type === 'ident' && c.peek(1).text === '=' ) {
    if (KEYWORDS.has(first.text)) throw new SheetError('syntax', `"${first.text}" is a keyword and cannot be a name`, first.span);
    c.next();
    c.next();
    if (c.peek().type === 'eof') throw unexpected(c.peek(), `a value after "${first.text} ="`);
    const expr = parseExpr(c);
    const uncertainty = c.at('±') ? parseUncertainty(c, expr) : undefined;
    end(c);
    const stmt = withOptional<Statement>({ type: 'define', name: first.text, nameSpan: first.span, expr, line, source }, 'description', description);
    return uncertainty ? { ...stmt, uncertainty } as Statement : stmt;
  }
  const expr = parseExpr(c);
  end(c);
  return withOptional<Statement>({ type: 'expr', expr, line, source }, 'description', description);
}

function withOptional<T extends object>(obj: T, key: string, value: string | undefined): T {
  if (value !== undefined) (obj as Record<string, unknown>)[key] = value;
  return obj;
}

/** `± 1 m/s`, `± 5 %`, `± 0.2 m (uniform)` after an input's value. */
function parseUncertainty(c: Cursor, value: Expr): UncertaintyNode {
  const pm = c.next();
  if (!isSingleNumber(value)) {
    throw new SheetError('syntax', `"±" gives the uncertainty of an input: only a name defined by a single number (with its unit) can carry one, as in U = 12 m/s ± 1 m/s`, pm.span);
  }
  const n = c.peek();
  if (n.type !== 'number') throw unexpected(n, 'a number after "±" (the uncertainty, as in ± 1 m/s or ± 5 %)');
  c.next();
  // A distribution ends the line, `(uniform)`: the unit before it is read on its own (a unit name before "(" would read as a call).
  let tail = 0;
  while (c.peek(tail).type !== 'eof') tail++;
  const named = tail >= 3 && c.peek(tail - 3).text === '(' && c.peek(tail - 2).type === 'ident' && c.peek(tail - 1).text === ')';
  const unitCursor = named ? c.take(tail - 3) : c;
  const unit = unitStarts(unitCursor) ? parseUnitExpr(unitCursor) : undefined;
  if (named) end(unitCursor);
  const relative = unit !== undefined && unit.num.length === 1 && unit.num[0]!.name === '%' && unit.den.length === 0;
  let distribution: 'normal' | 'uniform' = 'normal';
  let last = unit?.span ?? n.span;
  if (named) {
    c.next();
    const word = c.next();
    if (word.text !== 'normal' && word.text !== 'uniform') throw new SheetError('syntax', `an uncertainty's distribution is (normal) or (uniform), not (${word.text})`, word.span);
    distribution = word.text;
    last = c.next().span;
  }
  const node = { value: n.value as number, relative, distribution, span: join(pm.span, last) };
  return unit ? { ...node, unit } : node;
}

/** A number with or without its unit, signed or not: what may carry an uncertainty. */
function isSingleNumber(e: Expr): boolean {
  return e.type === 'number' || (e.type === 'unary' && e.op === '-' && isSingleNumber(e.arg));
}

function end(c: Cursor): void {
  const t = c.peek();
  if (t.type === 'op' && t.text === '±') {
    throw new SheetError('syntax', '"±" (or "+-") gives the uncertainty of an input, after its value on a line of its own: U = 12 m/s ± 1 m/s; for a sum with a negative number write a + (-b)', t.span);
  }
  if (t.type !== 'eof') {
    if (t.type === 'ident' && c.last().type === 'number') {
      const power = powerTypo(t.text);
      throw new SheetError('unknown-unit', `"${t.text}" is not a known unit${power ? `; a power of a unit is written with "^", as in ${power}` : ''}`, t.span);
    }
    throw unexpected(t, 'an operator or the end of the line');
  }
}

/** Parse a standalone expression (inline `=…` values, defaults of parameters). */
export function parseExpression(text: string, line = 1, col0 = 1): Expr {
  const c = new Cursor(lex(text, line, col0).filter((t) => t.type !== 'comment'));
  const e = parseExpr(c);
  end(c);
  return e;
}

function parseExpr(c: Cursor): Expr {
  return parseOr(c);
}

function parseOr(c: Cursor): Expr {
  let left = parseAnd(c);
  while (c.at('or')) {
    c.next();
    const right = parseAnd(c);
    left = { type: 'binary', op: 'or', left, right, span: join(left.span, right.span) };
  }
  return left;
}

function parseAnd(c: Cursor): Expr {
  let left = parseNot(c);
  while (c.at('and')) {
    c.next();
    const right = parseNot(c);
    left = { type: 'binary', op: 'and', left, right, span: join(left.span, right.span) };
  }
  return left;
}

function parseNot(c: Cursor): Expr {
  if (c.at('not')) {
    const t = c.next();
    c.nest(t);
    const arg = parseNot(c);
    c.unnest();
    return { type: 'unary', op: 'not', arg, span: join(t.span, arg.span) };
  }
  return parseCompare(c);
}

function parseCompare(c: Cursor): Expr {
  const first = parseConvert(c);
  const ops: CompareOp[] = [];
  const operands: Expr[] = [first];
  while (c.peek().type === 'op' && COMPARE.has(c.peek().text)) {
    ops.push(c.next().text as CompareOp);
    operands.push(parseConvert(c));
  }
  if (ops.length === 0) return first;
  return { type: 'compare', ops, operands, span: join(first.span, operands[operands.length - 1]!.span) };
}

function parseConvert(c: Cursor): Expr {
  let e = parseAdditive(c);
  while (c.at('to')) {
    c.next();
    if (!targetStarts(c)) throw unexpected(c.peek(), 'a unit after "to"');
    const unit = unitStarts(c) ? parseUnitExpr(c) : plainTarget(c);
    e = { type: 'convert', expr: e, unit, span: join(e.span, unit.span) };
  }
  return e;
}

/** `to 1`: shown as a plain number. */
function plainTarget(c: Cursor): UnitNode {
  const t = c.next();
  return { unit: parseUnit('1'), num: [], den: [], span: t.span };
}

function parseAdditive(c: Cursor): Expr {
  let left = parseMultiplicative(c);
  while (c.at('+') || c.at('-')) {
    const op = c.next().text as '+' | '-';
    const right = parseMultiplicative(c);
    left = { type: 'binary', op, left, right, span: join(left.span, right.span) };
  }
  return left;
}

function parseMultiplicative(c: Cursor): Expr {
  let left = parseUnary(c);
  // a / b / c is typeset as a fraction inside a fraction: each "/" nests.
  let fractions = 0;
  while (c.at('*') || c.at('/') || c.at('·')) {
    const t = c.next();
    const op = t.text === '/' ? '/' : '*';
    if (op === '/') {
      c.nest(t);
      fractions++;
    }
    const right = parseUnary(c);
    left = { type: 'binary', op, left, right, span: join(left.span, right.span) };
  }
  for (; fractions > 0; fractions--) c.unnest();
  return left;
}

function parseUnary(c: Cursor): Expr {
  if (c.at('-') || c.at('+')) {
    const t = c.next();
    c.nest(t);
    const arg = parseUnary(c);
    c.unnest();
    // A signed literal is one number: -5 degC is minus five degrees, not the negation of 278.15 K.
    if (arg.type === 'number') return { ...arg, value: t.text === '-' ? -arg.value : arg.value, span: join(t.span, arg.span) };
    return { type: 'unary', op: t.text as '-' | '+', arg, span: join(t.span, arg.span) };
  }
  return parsePower(c);
}

function parsePower(c: Cursor): Expr {
  const base = parsePostfix(c);
  if (c.at('^')) {
    c.nest(c.next());
    const exponent = parseUnary(c); // right-associative; 2^-1 allowed
    c.unnest();
    return { type: 'binary', op: '^', left: base, right: exponent, span: join(base.span, exponent.span) };
  }
  return base;
}

function parsePostfix(c: Cursor): Expr {
  let e = parseAtom(c);
  for (;;) {
    if (c.at('.')) {
      c.next();
      const t = c.next();
      if (t.type !== 'ident') throw unexpected(t, 'a field name after "."');
      e = { type: 'field', object: e, field: t.text, span: join(e.span, t.span) };
    } else if (c.at('[') && !c.peek().spaced) {
      c.next();
      let by: string | undefined;
      if (c.peek().type === 'ident' && c.peek(1).text === ':') {
        by = c.next().text;
        c.next();
      }
      const index = parseExpr(c);
      const close = c.expect(']', 'a closing "]" after the index');
      e = by === undefined ? { type: 'index', object: e, index, span: join(e.span, close.span) } : { type: 'index', object: e, index, by, span: join(e.span, close.span) };
    } else return e;
  }
}

function parseAtom(c: Cursor): Expr {
  const t = c.peek();
  if (t.type === 'number') {
    c.next();
    if (unitStarts(c)) {
      const unit = parseUnitExpr(c);
      return { type: 'number', value: t.value as number, unit, span: join(t.span, unit.span) };
    }
    return { type: 'number', value: t.value as number, span: t.span };
  }
  if (t.type === 'string') {
    c.next();
    return { type: 'string', value: t.value as string, span: t.span };
  }
  if (t.type === 'ident') {
    if (t.text === 'true' || t.text === 'false') {
      c.next();
      return { type: 'bool', value: t.text === 'true', span: t.span };
    }
    if (KEYWORDS.has(t.text)) throw unexpected(t, 'a value');
    c.next();
    if (c.at('(')) return parseCall(c, t);
    return { type: 'name', name: t.text, span: t.span };
  }
  if (c.at('(')) {
    c.nest(c.next());
    const inner = parseExpr(c);
    const close = c.expect(')', 'a closing ")"');
    c.unnest();
    return { type: 'paren', expr: inner, span: join(t.span, close.span) };
  }
  if (c.at('[')) {
    c.nest(c.next());
    const items: Expr[] = [];
    while (!c.at(']')) {
      items.push(parseExpr(c));
      if (!c.at(']')) c.expect(',', 'a "," or "]" in the list');
    }
    const close = c.next();
    c.unnest();
    const span = join(t.span, close.span);
    if (unitStarts(c)) {
      const unit = parseUnitExpr(c);
      return { type: 'list', items, unit, span: join(span, unit.span) };
    }
    return { type: 'list', items, span };
  }
  throw unexpected(t, 'a value');
}

function parseCall(c: Cursor, callee: Token): Expr {
  c.nest(c.next()); // (
  const args: Arg[] = [];
  let named = false;
  while (!c.at(')')) {
    const start = c.peek();
    if (start.type === 'eof') throw unexpected(start, `")" to close ${callee.text}(`);
    if (start.type === 'ident' && c.peek(1).text === ':') {
      c.next();
      c.next();
      const value = parseExpr(c);
      args.push({ name: start.text, value, span: join(start.span, value.span) });
      named = true;
    } else {
      const value = parseExpr(c);
      if (named) throw new SheetError('syntax', 'a positional argument cannot follow a named one', value.span);
      args.push({ value, span: value.span });
    }
    if (!c.at(')')) c.expect(',', `"," or ")" in the call to ${callee.text}`);
  }
  const close = c.next();
  c.unnest();
  return { type: 'call', callee: callee.text, calleeSpan: callee.span, args, span: join(callee.span, close.span) };
}
