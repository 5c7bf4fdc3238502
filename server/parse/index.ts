export { parseStatement, parseExpression } from './parser.js';
export type { Expr, Statement, Span, Arg, UnitNode, BinaryOp, CompareOp } from './ast.js';
