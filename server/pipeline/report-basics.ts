// What a report is without the engine: an empty one, for a run that could
// not happen, and the rule for running again to typeset more. The command
// line's parent process needs these and nothing of the engine, so they load
// nothing of it.
import { sheetHeaderHtml } from '../render/page.js';
import type { SheetReport } from './types.js';

/**
 * A run that left `after` of `before` statements untypeset did enough to be
 * worth another run of the same text (which goes on where it stopped). A
 * sheet too large to typeset in any run stops after one.
 */
export function typesetProgress(before: number, after: number): boolean {
  return after <= 0.9 * before;
}

/** A report with nothing in it but what `fields` says: for a run that could not happen (the sandbox failed) and for stand-ins. */
export function emptyReport(fields: Partial<SheetReport> = {}): SheetReport {
  const title = fields.title ?? '';
  const meta = fields.meta ?? {};
  return {
    title,
    meta,
    headerHtml: sheetHeaderHtml(title, meta, false),
    parts: [],
    summaryHtml: '',
    summary: { inputs: 0, results: 0, checksPassed: 0, checksFailed: 0, checksNotRun: 0, errors: 0 },
    values: {},
    inputs: [],
    arguments: [],
    checks: [],
    errors: [],
    reads: [],
    elapsedMs: 0,
    caution: false,
    freshStatements: 0,
    untypeset: 0,
    usedSheets: [],
    overrides: [],
    overridesMatched: [],
    ...fields,
  };
}
