// Expression trees as LaTeX, twice: symbolically, and with every name
// replaced by its value and unit, so a reader can redo the arithmetic.
import type { Expr } from '../parse/ast.js';
import type { Value } from '../core/index.js';
import { fieldLatex, symbolLatex, textLatex } from './symbols.js';
import { shownLatex, showQuantity, unitLatex, formatNumber } from './numbers.js';

export interface LatexContext {
  sig: number;
  /** Present for the substituted form: the value of a name or field path. */
  valueFor?: (e: Expr) => Value | undefined;
  /** The declared symbol of a record field (`wr.tau_w` → \tau_{w}), where the record is known. */
  fieldSymbol?: (e: Extract<Expr, { type: 'field' }>) => string | undefined;
}

// A Map, not an object: callee names come from sheet text ("hasOwnProperty" …).
const FUNCS = new Map<string, (args: string[]) => string>(Object.entries({
  sqrt: ([a]) => `\\sqrt{${a}}`,
  abs: ([a]) => `\\left|${a}\\right|`,
  exp: ([a]) => `e^{${a}}`,
  ln: ([a]) => `\\ln\\left(${a}\\right)`,
  log10: ([a]) => `\\log_{10}\\left(${a}\\right)`,
  sin: ([a]) => `\\sin\\left(${a}\\right)`,
  cos: ([a]) => `\\cos\\left(${a}\\right)`,
  tan: ([a]) => `\\tan\\left(${a}\\right)`,
} satisfies Record<string, (args: string[]) => string>));

const REL: Record<string, string> = { '<': '<', '<=': '\\le', '>': '>', '>=': '\\ge', '==': '=', '!=': '\\ne' };
// The relation that does hold when a comparison fails: "1.8 ≯ 2", never a false "1.8 > 2".
const NOT_REL: Record<string, string> = { '<': '\\nless', '<=': '\\nleq', '>': '\\ngtr', '>=': '\\ngeq', '==': '\\ne', '!=': '=' };

/** A field path as a name: air.nu → ["air", "nu"]. */
function pathOf(e: Expr): string[] | null {
  if (e.type === 'name') return [e.name];
  if (e.type === 'field') {
    const p = pathOf(e.object);
    return p ? [...p, e.field] : null;
  }
  return null;
}

export function literalLatex(e: Extract<Expr, { type: 'number' }>, sig: number): string {
  const { mantissa, exponent } = formatNumber(e.value, Math.max(sig, significantDigits(e.value)));
  const n = exponent === 0 ? mantissa : `${mantissa}\\times 10^{${exponent}}`;
  return e.unit ? `${n}\\,${unitLatex(e.unit.unit.text)}` : n;
}

function significantDigits(x: number): number {
  // Literals keep the digits the engineer typed (up to 15).
  const s = String(Math.abs(x)).replace(/e.*$/, '').replace('.', '').replace(/^0+/, '');
  return Math.min(15, Math.max(1, s.length));
}

/** LaTeX of a value, for substitution. Records and long lists fall back to null. */
export function valueLatex(v: Value, sig: number): string | null {
  switch (v.kind) {
    case 'quantity':
      return shownLatex(showQuantity(v, sig));
    case 'bool':
      return textLatex(v.value ? 'true' : 'false');
    case 'string':
      return textLatex(`“${v.value}”`);
    case 'list': {
      if (v.items.length === 0 || !v.items.every((i) => i.kind === 'quantity')) return null;
      // A long list folds to its first and last items; the statement shows all of them below.
      const long = v.items.length > 6;
      const shown = long ? [...v.items.slice(0, 3), ...v.items.slice(-2)] : v.items;
      const texts = shown.map((i) => valueLatex(i, sig)!);
      if (long) texts.splice(3, 0, '\\ldots');
      return `\\left[${texts.join(',\\ ')}\\right]${long ? `\\ (${v.items.length}\\text{ values})` : ''}`;
    }
    default:
      return null;
  }
}

/** Does this expression need brackets when it sits inside a product or power? */
function compound(e: Expr, ctx: LatexContext): boolean {
  if (e.type === 'binary' || e.type === 'compare' || e.type === 'unary') return true;
  if (e.type === 'number') return !!e.unit || e.value < 0;
  if (ctx.valueFor && (e.type === 'name' || e.type === 'field')) {
    const v = ctx.valueFor(e);
    return !!v && v.kind === 'quantity' && (!!showQuantity(v, ctx.sig).unit || v.si < 0 || showQuantity(v, ctx.sig).exponent !== 0);
  }
  return false;
}

function bracket(s: string): string {
  return `\\left(${s}\\right)`;
}

/**
 * A single comparison that came out false, written with the negated relation
 * so that the line states what is true (`1.8 × 10⁵ ≯ 2 × 10⁵`); anything
 * else (a chain, a compound condition) is null and keeps its own form.
 */
export function failedComparisonLatex(e: Expr, ctx: LatexContext): string | null {
  if (e.type !== 'compare' || e.ops.length !== 1) return null;
  return `${exprLatex(e.operands[0]!, ctx)} ${NOT_REL[e.ops[0]!]} ${exprLatex(e.operands[1]!, ctx)}`;
}

export function exprLatex(e: Expr, ctx: LatexContext): string {
  const sub = (x: Expr) => exprLatex(x, ctx);
  switch (e.type) {
    case 'number':
      return literalLatex(e, ctx.sig);
    case 'string':
      return textLatex(`“${e.value}”`);
    case 'bool':
      return textLatex(e.value ? 'true' : 'false');
    case 'name':
    case 'field': {
      const path = pathOf(e);
      if (ctx.valueFor) {
        const v = ctx.valueFor(e);
        const tex = v ? valueLatex(v, ctx.sig) : null;
        if (tex) return tex;
      }
      if (path) {
        if (path.length === 1) return symbolLatex(path[0]!);
        return fieldLatex(path.slice(0, -1).join('_'), path[path.length - 1]!, ctx.fieldSymbol?.(e as Extract<Expr, { type: 'field' }>));
      }
      return `${sub((e as Extract<Expr, { type: 'field' }>).object)}.\\mathrm{${(e as Extract<Expr, { type: 'field' }>).field}}`;
    }
    case 'paren':
      return bracket(sub(e.expr));
    case 'unary':
      if (e.op === 'not') return `\\lnot ${sub(e.arg)}`;
      return `${e.op}${compound(e.arg, ctx) && e.arg.type !== 'unary' ? bracket(sub(e.arg)) : sub(e.arg)}`;
    case 'binary': {
      // Each side is typeset once: a fraction or a power shows a bracketed side
      // without its brackets, and typesetting it twice would double the work
      // at every level of nesting.
      const left = sides(e.left, ctx);
      const right = sides(e.right, ctx);
      const l = left.shown;
      const r = right.shown;
      switch (e.op) {
        case '+':
          return `${l} + ${r}`;
        case '-':
          return `${l} - ${wrapIfSum(e.right, r)}`;
        case '*':
          return `${wrapIfSum(e.left, l, ctx)} \\cdot ${wrapIfSum(e.right, r, ctx)}`;
        case '/':
          return `\\frac{${left.bare}}{${right.bare}}`;
        case '^':
          return `{${compound(e.left, ctx) && e.left.type !== 'paren' ? bracket(l) : l}}^{${right.bare}}`;
        case 'and':
          return `${l} \\land ${r}`;
        case 'or':
          return `${l} \\lor ${r}`;
      }
      break;
    }
    case 'compare':
      return e.operands.map((o, i) => (i === 0 ? sub(o) : ` ${REL[e.ops[i - 1]!]} ${sub(o)}`)).join('');
    case 'call': {
      const args = e.args.map((a) => (a.name ? `${symbolLatex(a.name)}{=}${sub(a.value)}` : sub(a.value)));
      const special = FUNCS.get(e.callee);
      if (special && e.args.every((a) => !a.name)) return special(args);
      const name = `\\operatorname{${e.callee.replace(/_/g, '\\_')}}`;
      // Plain brackets let a long call wrap after a comma; tall arguments need growing ones.
      if (args.some((a) => a.includes('\\frac'))) return `${name}\\left(${args.join(',\\ ')}\\right)`;
      return `${name}(${args.join(',\\allowbreak\\ ')})`;
    }
    case 'list': {
      const items = e.items.map(sub).join(',\\ ');
      return `\\left[${items}\\right]${e.unit ? `\\,${unitLatex(e.unit.unit.text)}` : ''}`;
    }
    case 'convert':
      return sub(e.expr);
    case 'index': {
      // The list itself is never substituted: its name and the index say which item.
      const symbolic: LatexContext = ctx.fieldSymbol ? { sig: ctx.sig, fieldSymbol: ctx.fieldSymbol } : { sig: ctx.sig };
      const by = e.by === undefined ? '' : `${symbolLatex(e.by)}{:}\\,`;
      const object = exprLatex(e.object, symbolic);
      return `${compound(e.object, symbolic) ? bracket(object) : object}\\lbrack ${by}${exprLatex(e.index, symbolic)}\\rbrack`;
    }
  }
  return '';
}

/** A side of a binary operator as shown in line (`shown`) and with its own brackets taken off (`bare`). */
function sides(e: Expr, ctx: LatexContext): { shown: string; bare: string } {
  if (e.type !== 'paren') {
    const tex = exprLatex(e, ctx);
    return { shown: tex, bare: tex };
  }
  const bare = exprLatex(e.expr, ctx);
  return { shown: bracket(bare), bare };
}

function wrapIfSum(e: Expr, tex: string, ctx?: LatexContext): string {
  if (e.type === 'binary' && (e.op === '+' || e.op === '-')) return bracket(tex);
  if (ctx?.valueOf && (e.type === 'name' || e.type === 'field') && compound(e, ctx)) return bracket(tex);
  return tex;
}
