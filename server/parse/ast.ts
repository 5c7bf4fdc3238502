// The statement and expression trees of a `basis` block. Every node carries
// its place in the worksheet file (1-based line, 1-based columns).
import type { Span } from '../diagnostics.js';
import type { Unit, UnitFactor } from '../units/unit-expr.js';

export type { Span };

export interface UnitNode {
  readonly unit: Unit;
  /** The unit's names with their powers as written: above and below the "/". */
  readonly num: readonly UnitFactor[];
  readonly den: readonly UnitFactor[];
  readonly span: Span;
}

export type Expr =
  | { readonly type: 'number'; readonly value: number; readonly unit?: UnitNode; readonly span: Span }
  | { readonly type: 'string'; readonly value: string; readonly span: Span }
  | { readonly type: 'bool'; readonly value: boolean; readonly span: Span }
  | { readonly type: 'name'; readonly name: string; readonly span: Span }
  | { readonly type: 'unary'; readonly op: '-' | '+' | 'not'; readonly arg: Expr; readonly span: Span }
  | { readonly type: 'binary'; readonly op: BinaryOp; readonly left: Expr; readonly right: Expr; readonly span: Span }
  | { readonly type: 'compare'; readonly ops: readonly CompareOp[]; readonly operands: readonly Expr[]; readonly span: Span }
  | { readonly type: 'call'; readonly callee: string; readonly calleeSpan: Span; readonly args: readonly Arg[]; readonly span: Span }
  | { readonly type: 'field'; readonly object: Expr; readonly field: string; readonly span: Span }
  /** An item of a list: by position, `c[2]` (counting from 1), or by a swept input's value, `c[U: 20 m/s]`. */
  | { readonly type: 'index'; readonly object: Expr; readonly index: Expr; readonly by?: string; readonly span: Span }
  | { readonly type: 'list'; readonly items: readonly Expr[]; readonly unit?: UnitNode; readonly span: Span }
  | { readonly type: 'convert'; readonly expr: Expr; readonly unit: UnitNode; readonly span: Span }
  | { readonly type: 'paren'; readonly expr: Expr; readonly span: Span };

export type BinaryOp = '+' | '-' | '*' | '/' | '^' | 'and' | 'or';
export type CompareOp = '<' | '<=' | '>' | '>=' | '==' | '!=';

export interface Arg {
  readonly name?: string;
  readonly value: Expr;
  readonly span: Span;
}

/**
 * The uncertainty of an input, `± 1 m/s`, `± 5 %`, `+- 0.2 m (uniform)`: a
 * standard uncertainty (normal, the default) or the half-width of a
 * rectangular distribution (uniform). A `%` alone is relative to the value.
 */
export interface UncertaintyNode {
  /** The number as written (not negative). */
  readonly value: number;
  readonly unit?: UnitNode;
  readonly relative: boolean;
  readonly distribution: 'normal' | 'uniform';
  readonly span: Span;
}

export type Statement =
  | { readonly type: 'define'; readonly name: string; readonly nameSpan: Span; readonly expr: Expr; readonly uncertainty?: UncertaintyNode; readonly description?: string; readonly line: number; readonly source: string }
  | { readonly type: 'check'; readonly expr: Expr; readonly label?: string; readonly line: number; readonly source: string }
  | { readonly type: 'expr'; readonly expr: Expr; readonly description?: string; readonly line: number; readonly source: string };

export type StatementType = Statement['type'];
