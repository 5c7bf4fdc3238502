export { parseStatement, parseExpression } from './parser.js';
export { parseLine, isBroken, isStatement, isStackOverflow, isUse, asSheetError, type BrokenLine, type ParsedLine } from './line.js';
export { MAX_LINE_CHARS, MAX_NESTING } from './limits.js';
export type { UseLine } from './use.js';
export type { Expr, Statement, Span, Arg, UnitNode, BinaryOp, CompareOp, UncertaintyNode } from './ast.js';
export { isLiteral, literalArguments, literalText } from './literals.js';
