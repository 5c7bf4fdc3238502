// The near-wall family: skin friction, boundary layer, first-cell height,
// wall-layer stacks, the law of the wall and the y+ report of a run.
import type { TradeFunction } from '../registry.js';
import { frictionFunctions } from './friction-entries.js';
import { yplus_report } from './report-entry.js';
import { layer_stack } from './stack-entry.js';

export const wallFunctions: TradeFunction[] = [...frictionFunctions, layer_stack, yplus_report];
