// The package's public surface. Scripts and tests import from here.
export { renderSheet, standalonePage, SheetPipeline } from './pipeline/index.js';
export { Sandbox, SandboxError } from './sandbox/sandbox.js';
export { createRegistry } from './core/index.js';
export { ERROR_CODES } from './diagnostics.js';
export type { RunOptions, SheetReport, SheetResult, SheetPart, SheetSummary, ValueJson, CheckJson, ErrorJson } from './pipeline/index.js';
export type { TradeFunction, ParamSpec, FieldSpec, CallContext } from './core/index.js';
