// Unit expressions inside sheet expressions: after a number, after a list
// literal, and after `to`. Names here live in the unit namespace only.
import { SheetError } from '../diagnostics.js';
import { combineUnit, isUnitName, type UnitFactor, UnitError } from '../units/unit-expr.js';
import type { Span, UnitNode } from './ast.js';
import type { Token } from './lexer.js';

export const KEYWORDS = new Set(['and', 'or', 'not', 'to', 'check', 'true', 'false']);

export interface TokenCursor {
  peek(offset?: number): Token;
  next(): Token;
  /** The token consumed last. */
  last(): Token;
}

function isUnitToken(t: Token, after: Token): boolean {
  if (t.type === 'op' && t.text === '%') return true;
  return t.type === 'ident' && !KEYWORDS.has(t.text) && after.text !== '(' && isUnitName(t.text);
}

/** Does a unit expression start here? */
export function unitStarts(c: TokenCursor): boolean {
  return isUnitToken(c.peek(), c.peek(1));
}

function factor(c: TokenCursor): UnitFactor {
  const t = c.next();
  let power = 1;
  if (c.peek().text === '^') {
    c.next();
    let sign = 1;
    if (c.peek().text === '-') {
      c.next();
      sign = -1;
    }
    const n = c.next();
    if (n.type !== 'number') throw new SheetError('syntax', `expected a number after "^" in the unit`, n.span);
    power = sign * (n.value as number);
  }
  return { name: t.text, power };
}

/** True when a "(" opens a group of unit names only, as in J/(kg K). */
function unitGroupAhead(c: TokenCursor): boolean {
  let i = 1;
  if (!isUnitToken(c.peek(i), c.peek(i + 1))) return false;
  while (c.peek(i).text !== ')') {
    const t = c.peek(i);
    if (t.type === 'eof') return false;
    const ok = isUnitToken(t, c.peek(i + 1)) || t.text === '^' || t.text === '-' || t.type === 'number' || t.text === '·' || t.text === '*';
    if (!ok) return false;
    i++;
  }
  return true;
}

function group(c: TokenCursor, into: UnitFactor[]): void {
  if (c.peek().text === '(') {
    c.next();
    while (c.peek().text !== ')') {
      if (c.peek().text === '·' || c.peek().text === '*') c.next();
      else into.push(factor(c));
    }
    c.next();
    return;
  }
  into.push(factor(c));
  for (;;) {
    if (c.peek().text === '·' && isUnitToken(c.peek(1), c.peek(2))) {
      c.next();
      into.push(factor(c));
    } else if (isUnitToken(c.peek(), c.peek(1)) && c.peek().text !== '%') {
      into.push(factor(c));
    } else return;
  }
}

/** Parse a unit expression: groups of juxtaposed names separated by "/". */
export function parseUnitExpr(c: TokenCursor): UnitNode {
  const first = c.peek();
  const num: UnitFactor[] = [];
  const den: UnitFactor[] = [];
  group(c, num);
  while (c.peek().text === '/' && (isUnitToken(c.peek(1), c.peek(2)) || (c.peek(1).text === '(' && unitGroupAheadAt(c)))) {
    c.next();
    group(c, den);
  }
  const span: Span = { line: first.span.line, col: first.span.col, end: c.last().span.end };
  try {
    return { unit: combineUnit(num, den, unitText(num, den)), span };
  } catch (e) {
    if (e instanceof UnitError) throw new SheetError('unknown-unit', e.message, span);
    throw e;
  }
}

function unitGroupAheadAt(c: TokenCursor): boolean {
  // Look past the "/" at the parenthesised group.
  const shifted: TokenCursor = { peek: (o = 0) => c.peek(o + 1), next: () => c.next(), last: () => c.last() };
  return unitGroupAhead(shifted);
}

function factorText(f: UnitFactor): string {
  return f.power === 1 ? f.name : `${f.name}^${f.power}`;
}

/** Canonical text: "kg/m^3", "J/(kg K)", "Pa s". */
export function unitText(num: UnitFactor[], den: UnitFactor[]): string {
  const top = num.map(factorText).join(' ');
  if (den.length === 0) return top;
  const bottom = den.map(factorText).join(' ');
  return `${top}/${den.length > 1 ? `(${bottom})` : bottom}`;
}
