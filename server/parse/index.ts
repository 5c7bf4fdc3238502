export { parseStatement, parseExpression } from './parser.js';
export { parseLine, isStatement, type BrokenLine, type ParsedLine } from './line.js';
export type { Expr, Statement, Span, Arg, UnitNode, BinaryOp, CompareOp } from './ast.js';
export { isLiteral, literalArguments, literalText } from './literals.js';
