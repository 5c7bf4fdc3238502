// The pipeline's public surface.
export { SheetPipeline, type PipelineOptions } from './pipeline.js';
export { renderSheet, standalonePage, withPage } from './library.js';
export { emptyReport } from './report.js';
export type * from './types.js';
export { typesetProgress } from './report.js';
