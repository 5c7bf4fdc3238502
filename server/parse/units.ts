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

/** "1/s": a reciprocal unit written with a leading 1, as the page itself prints it. */
function reciprocalAhead(c: TokenCursor, at = 0): boolean {
  const one = c.peek(at);
  return one.type === 'number' && one.value === 1 && c.peek(at + 1).text === '/' && (isUnitToken(c.peek(at + 2), c.peek(at + 3)) || c.peek(at + 2).text === '(');
}

/** Does a unit expression start here (after a number or a list)? */
export function unitStarts(c: TokenCursor): boolean {
  return isUnitToken(c.peek(), c.peek(1)) || reciprocalAhead(c);
}

/** Does a conversion target start here? A unit, or 1 for a plain number (`10 % to 1`). */
export function targetStarts(c: TokenCursor): boolean {
  return unitStarts(c) || (c.peek().type === 'number' && c.peek().value === 1);
}

/** "s2" for "s^2": a unit name with a power written without "^". */
export function powerTypo(name: string): string | undefined {
  const m = /^([A-Za-zµμ]+?)(\d+)$/.exec(name);
  return m && isUnitName(m[1]!) && !isUnitName(name) ? `${m[1]}^${m[2]}` : undefined;
}

function powerTypoError(t: Token, before: string): SheetError {
  return new SheetError('unknown-unit', `"${t.text}" is not a unit: a power of a unit is written with "^", as in ${before}${powerTypo(t.text)}`, t.span);
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
  if (c.peek().type === 'number' && into.length === 0) {
    c.next(); // the 1 of 1/s
    return;
  }
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
    } else if (c.peek().type === 'ident' && powerTypo(c.peek().text)) {
      throw powerTypoError(c.peek(), '');
    } else return;
  }
}

/** Parse a unit expression: groups of juxtaposed names separated by "/". */
export function parseUnitExpr(c: TokenCursor): UnitNode {
  const first = c.peek();
  const num: UnitFactor[] = [];
  const den: UnitFactor[] = [];
  group(c, num);
  for (;;) {
    const slash = c.peek();
    if (slash.text !== '/') break;
    const next = c.peek(1);
    if (isUnitToken(next, c.peek(2)) || (next.text === '(' && unitGroupAheadAt(c))) {
      c.next();
      group(c, den);
      continue;
    }
    // "m/s2", written tight as a unit, means m/s^2; spaced, "m / s2" divides by a name.
    if (next.type === 'ident' && !slash.spaced && !next.spaced && powerTypo(next.text)) {
      throw powerTypoError(next, `${unitText(num, den)}/`);
    }
    break;
  }
  const span: Span = { line: first.span.line, col: first.span.col, end: c.last().span.end };
  try {
    return { unit: combineUnit(num, den, unitText(num, den)), num, den, span };
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
  const top = num.length ? num.map(factorText).join(' ') : '1';
  if (den.length === 0) return top;
  const bottom = den.map(factorText).join(' ');
  return `${top}/${den.length > 1 ? `(${bottom})` : bottom}`;
}
