// Literal inputs: a number (with its unit), a list of them, text, true/false.
// The sheet's inputs are the names defined by one; a record lists them with
// the literal arguments of calls, written back as the sheet wrote them.
import type { Expr } from './ast.js';

export function isLiteral(e: Expr): boolean {
  if (e.type === 'number' || e.type === 'string' || e.type === 'bool') return true;
  if (e.type === 'unary' && e.op === '-') return isLiteral(e.arg);
  if (e.type === 'list') return e.items.every(isLiteral);
  return false;
}

/** A literal as source text: `12 m/s`, `[0.5, 5]`, `"log"`, `-3 degC`. Undefined for anything else. */
export function literalText(e: Expr): string | undefined {
  switch (e.type) {
    case 'number':
      return e.unit ? `${e.value} ${e.unit.unit.text}` : String(e.value);
    case 'string':
      return JSON.stringify(e.value);
    case 'bool':
      return String(e.value);
    case 'unary': {
      const inner = e.op === '-' ? literalText(e.arg) : undefined;
      return inner === undefined ? undefined : `-${inner}`;
    }
    case 'list': {
      const items = e.items.map(literalText);
      if (items.some((t) => t === undefined)) return undefined;
      return `[${items.join(', ')}]${e.unit ? ` ${e.unit.unit.text}` : ''}`;
    }
    default:
      return undefined;
  }
}

/** The literal arguments of every call in an expression, by name (positional ones by their place). */
export function literalArguments(e: Expr, out: Array<{ fn: string; arg: string; text: string }> = []): Array<{ fn: string; arg: string; text: string }> {
  const visit = (x: Expr): void => {
    switch (x.type) {
      case 'call':
        x.args.forEach((a, i) => {
          const text = literalText(a.value);
          if (text !== undefined) out.push({ fn: x.callee, arg: a.name ?? `#${i + 1}`, text });
          else visit(a.value);
        });
        return;
      case 'unary':
        return visit(x.arg);
      case 'binary':
        visit(x.left);
        return visit(x.right);
      case 'compare':
        return x.operands.forEach(visit);
      case 'field':
        return visit(x.object);
      case 'index':
        visit(x.object);
        return visit(x.index);
      case 'list':
        return x.items.forEach(visit);
      case 'convert':
      case 'paren':
        return visit(x.expr);
      default:
        return;
    }
  };
  visit(e);
  return out;
}
