// The library entry: `renderSheet` evaluates and renders a sheet in this
// process (interpreter limits apply); the server and CLI run the same
// pipeline inside the sandbox child instead.
import { withPage } from './page.js';
import { SheetPipeline } from './pipeline.js';
import { typesetProgress } from './report-basics.js';
import type { RunOptions, SheetResult } from './types.js';

export { standalonePage, withPage } from './page.js';

export async function renderSheet(text: string, opts: RunOptions = {}): Promise<SheetResult> {
  const pipeline = new SheetPipeline();
  let report = pipeline.run(text, opts);
  // A run that ran out of time while typesetting goes on where it stopped, while that gets somewhere.
  for (let before = Infinity; report.untypeset > 0 && typesetProgress(before, report.untypeset); ) {
    before = report.untypeset;
    report = pipeline.run(text, opts);
  }
  return withPage(report);
}
