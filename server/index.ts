// The package's public surface. Scripts and tests import from here.
export { renderSheet, standalonePage } from './sheet.js';
export { SheetSession } from './session.js';
export { Sandbox, SandboxError } from './evaluate/sandbox.js';
export { createRegistry } from './core/index.js';
export { ERROR_CODES } from './diagnostics.js';
export type { RenderOptions, SheetResult, SheetPart, SheetSummary, ValueJson, CheckJson, ErrorJson } from './sheet-types.js';
export type { TradeFunction, ParamSpec, CallContext } from './core/index.js';
