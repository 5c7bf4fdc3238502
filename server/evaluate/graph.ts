// Which names each statement uses, the order that respects them, and cycles.
import type { Expr, Span, Statement } from '../parse/ast.js';

export interface NameUse {
  name: string;
  span: Span;
}

/** Names an expression reads (function names live in the registry, not here). */
export function namesUsed(e: Expr, out: NameUse[] = []): NameUse[] {
  switch (e.type) {
    case 'name':
      out.push({ name: e.name, span: e.span });
      break;
    case 'unary':
      namesUsed(e.arg, out);
      break;
    case 'binary':
      namesUsed(e.left, out);
      namesUsed(e.right, out);
      break;
    case 'compare':
      e.operands.forEach((o) => namesUsed(o, out));
      break;
    case 'call':
      e.args.forEach((a) => namesUsed(a.value, out));
      break;
    case 'field':
      namesUsed(e.object, out);
      break;
    case 'index':
      namesUsed(e.object, out);
      namesUsed(e.index, out);
      break;
    case 'list':
      e.items.forEach((i) => namesUsed(i, out));
      break;
    case 'convert':
    case 'paren':
      namesUsed(e.expr, out);
      break;
    case 'number':
    case 'string':
    case 'bool':
      break;
  }
  return out;
}

/**
 * Definition order by depth-first search. Returns the order and, for each
 * name caught in a cycle, the cycle as a list of names.
 */
export function orderDefinitions(
  defs: ReadonlyMap<string, Statement>,
  deps: ReadonlyMap<string, readonly string[]>,
): { order: string[]; cycles: Map<string, string[]> } {
  const order: string[] = [];
  const cycles = new Map<string, string[]>();
  const state = new Map<string, 'active' | 'done'>();
  const stack: string[] = [];
  const visit = (name: string) => {
    const s = state.get(name);
    if (s === 'done') return;
    if (s === 'active') {
      const cycle = stack.slice(stack.indexOf(name));
      for (const n of cycle) if (!cycles.has(n)) cycles.set(n, [...cycle, name]);
      return;
    }
    state.set(name, 'active');
    stack.push(name);
    for (const d of deps.get(name) ?? []) if (defs.has(d)) visit(d);
    stack.pop();
    state.set(name, 'done');
    order.push(name);
  };
  for (const name of defs.keys()) visit(name);
  return { order, cycles };
}
