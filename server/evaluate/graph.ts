// Which names each statement uses, the order that respects them, and cycles.
import type { Expr, Span, Statement } from '../parse/ast.js';

export interface NameUse {
  name: string;
  span: Span;
}

/**
 * Names an expression reads (function names live in the registry, not here),
 * in order of appearance. Iterative: a long chain such as a + b + c + … is a
 * tree as deep as it is long.
 */
export function namesUsed(root: Expr, out: NameUse[] = []): NameUse[] {
  const todo: Expr[] = [root];
  const push = (items: readonly Expr[]) => {
    for (let i = items.length - 1; i >= 0; i--) todo.push(items[i]!);
  };
  while (todo.length > 0) {
    const e = todo.pop()!;
    switch (e.type) {
      case 'name':
        out.push({ name: e.name, span: e.span });
        break;
      case 'unary':
        todo.push(e.arg);
        break;
      case 'binary':
        todo.push(e.right, e.left);
        break;
      case 'compare':
        push(e.operands);
        break;
      case 'call':
        push(e.args.map((a) => a.value));
        break;
      case 'field':
        todo.push(e.object);
        break;
      case 'index':
        todo.push(e.index, e.object);
        break;
      case 'list':
        push(e.items);
        break;
      case 'convert':
      case 'paren':
        todo.push(e.expr);
        break;
      case 'number':
      case 'string':
      case 'bool':
        break;
    }
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
