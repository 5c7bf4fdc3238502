// The pipeline's public surface.
export { SheetPipeline, type PipelineOptions } from './pipeline.js';
export { renderSheet, standalonePage, withPage } from './library.js';
export { emptyReport, typesetProgress } from './report-basics.js';
export type * from './types.js';
