// The evaluate stage's public surface.
export { evaluateSheet, EvalCache, type EvalOptions, type ImportedValue, type SheetEvaluation, type StatementResult } from './sheet-eval.js';
export { type InlineExpr, type InlineResult } from './inline.js';
export { DEFAULT_LIMITS, type Limits } from './limits.js';
export { CONSTANTS } from './scope.js';
export { sameItems } from './memo.js';
export { namesUsed } from './graph.js';
export { literalValue } from './literal-value.js';
export { type CarriedSpread, type CarriedSource } from './uncertainty.js';
